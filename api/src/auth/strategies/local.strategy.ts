import { Injectable } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import type { SessionUser } from '@keyloom/shared';
import type { Request } from 'express';
import { Strategy } from 'passport-local';
import { AuthService } from '../auth.service';

/** E-mail + password sign-in. Returning false makes LocalAuthGuard answer 401. */
@Injectable()
export class LocalStrategy extends PassportStrategy(Strategy) {
  constructor(private readonly auth: AuthService) {
    super({ usernameField: 'email', passwordField: 'password', passReqToCallback: true });
  }

  async validate(req: Request, email: string, password: string): Promise<SessionUser | false> {
    return (await this.auth.validateUser(email, password, req.ip ?? null)) ?? false;
  }
}
