import {
  type CanActivate,
  type ExecutionContext,
  ForbiddenException,
  Injectable,
  UnauthorizedException,
} from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Role } from '@keyloom/shared';
import type { Request } from 'express';
import { ROLES_KEY } from '../decorators/roles.decorator';
import { NO_SESSION_MESSAGE, WRONG_ROLE_MESSAGE } from '../session-user';

/** Global guard: routes marked @Roles(...) admit only those roles (403 otherwise). */
@Injectable()
export class RolesGuard implements CanActivate {
  constructor(private readonly reflector: Reflector) {}

  canActivate(context: ExecutionContext): boolean {
    const roles = this.reflector.getAllAndOverride<Role[] | undefined>(ROLES_KEY, [
      context.getHandler(),
      context.getClass(),
    ]);
    if (!roles || roles.length === 0) return true;
    const user = context.switchToHttp().getRequest<Request>().user;
    if (!user) throw new UnauthorizedException(NO_SESSION_MESSAGE);
    if (roles.includes(user.role)) return true;
    throw new ForbiddenException(WRONG_ROLE_MESSAGE);
  }
}
