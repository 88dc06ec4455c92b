import { type CanActivate, type ExecutionContext, ForbiddenException, Injectable } from '@nestjs/common';
import type { Request } from 'express';
import { CsrfService } from '../csrf.service';
import { CSRF_FAILED_MESSAGE } from '../session-user';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Global guard: state-changing requests (sign-in included) must carry the session's CSRF token. */
@Injectable()
export class CsrfGuard implements CanActivate {
  constructor(private readonly csrf: CsrfService) {}

  canActivate(context: ExecutionContext): boolean {
    const req = context.switchToHttp().getRequest<Request>();
    if (SAFE_METHODS.has(req.method) || this.csrf.isValid(req)) return true;
    throw new ForbiddenException(CSRF_FAILED_MESSAGE);
  }
}
