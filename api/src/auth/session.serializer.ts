import { Injectable } from '@nestjs/common';
import { PassportSerializer } from '@nestjs/passport';
import type { SessionUser } from '@keyloom/shared';
import { UsersService } from '../users/users.service';

/**
 * The session stores only the user id; every request reloads the user, so a role change applies at
 * once and a deactivated account's sessions stop working (deserialising to false = signed out).
 */
@Injectable()
export class SessionSerializer extends PassportSerializer {
  constructor(private readonly users: UsersService) {
    super();
  }

  serializeUser(user: SessionUser, done: (err: Error | null, id?: string) => void): void {
    done(null, user.id);
  }

  deserializeUser(id: string, done: (err: unknown, user?: SessionUser | false) => void): void {
    this.users.findActiveSessionUser(id).then(
      (user) => done(null, user ?? false),
      (error: unknown) => done(error),
    );
  }
}
