import { type CanActivate, type ExecutionContext, ForbiddenException, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Request } from 'express';
import { CsrfService } from '../csrf.service';
import { SKIP_CSRF_KEY } from '../decorators/skip-csrf.decorator';
import { CSRF_FAILED_MESSAGE } from '../session-user';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Global guard: state-changing requests (sign-in included) must carry the session's CSRF token,
 * except on the routes marked @SkipCsrf() (public, secret in the URL).
 */
@Injectable()
export class CsrfGuard implements CanActivate {
  constructor(
    private readonly csrf: CsrfService,
    private readonly reflector: Reflector,
  ) {}

  canActivate(context: ExecutionContext): boolean {
    const req = context.switchToHttp().getRequest<Request>();
    if (SAFE_METHODS.has(req.method) || this.csrf.isValid(req)) return true;
    const skip = this.reflector.getAllAndOverride<boolean | undefined>(SKIP_CSRF_KEY, [
      context.getHandler(),
      context.getClass(),
    ]);
    if (skip) return true;
    throw new ForbiddenException(CSRF_FAILED_MESSAGE);
  }
}
