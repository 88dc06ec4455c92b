import { type CanActivate, type ExecutionContext, ForbiddenException, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { PASSWORD_CHANGE_REQUIRED_CODE } from '@keyloom/shared';
import type { Request } from 'express';
import { ALLOW_PENDING_PASSWORD_CHANGE_KEY } from '../decorators/allow-pending-password-change.decorator';
import { IS_PUBLIC_KEY } from '../decorators/public.decorator';
import { PASSWORD_CHANGE_REQUIRED_MESSAGE } from '../session-user';

/**
 * Global guard after SessionGuard: while the signed-in account must change its password, only
 * public routes (sign-out among them) and those marked @AllowPendingPasswordChange() answer; every
 * other route is a 403 whose `code` tells the client to show the "Choose a new password" page.
 */
@Injectable()
export class PasswordChangeGuard implements CanActivate {
  constructor(private readonly reflector: Reflector) {}

  canActivate(context: ExecutionContext): boolean {
    const req = context.switchToHttp().getRequest<Request>();
    if (req.user?.mustChangePassword !== true) return true;
    const targets = [context.getHandler(), context.getClass()];
    const open = [IS_PUBLIC_KEY, ALLOW_PENDING_PASSWORD_CHANGE_KEY].some(
      (key) => this.reflector.getAllAndOverride<boolean | undefined>(key, targets) === true,
    );
    if (open) return true;
    throw new ForbiddenException({
      message: PASSWORD_CHANGE_REQUIRED_MESSAGE,
      code: PASSWORD_CHANGE_REQUIRED_CODE,
    });
  }
}
