import { type ExecutionContext, Injectable, UnauthorizedException } from '@nestjs/common';
import { AuthGuard } from '@nestjs/passport';
import { loginSchema, type SessionUser } from '@keyloom/shared';
import type { Request } from 'express';
import { parseOrThrow } from '../../common/pipes/zod-validation.pipe';
import { SIGN_IN_FAILED_MESSAGE } from '../session-user';

/**
 * Sign-in: validates the body with the shared loginSchema (400 with field messages), checks the
 * password through LocalStrategy (401, one message for every failure), then req.logIn(), which
 * in passport 0.7 regenerates the session id before storing the user in it.
 */
@Injectable()
export class LocalAuthGuard extends AuthGuard('local') {
  async canActivate(context: ExecutionContext): Promise<boolean> {
    const req = context.switchToHttp().getRequest<Request>();
    // Runs before pipes, so validate here; the parsed body has the e-mail trimmed and lower-cased.
    req.body = parseOrThrow(loginSchema, req.body);
    const ok = (await super.canActivate(context)) as boolean;
    await super.logIn(req);
    return ok;
  }

  handleRequest<TUser = SessionUser>(err: unknown, user: TUser | false): TUser {
    if (err instanceof Error) throw err;
    if (err || !user) throw new UnauthorizedException(SIGN_IN_FAILED_MESSAGE);
    return user;
  }
}
