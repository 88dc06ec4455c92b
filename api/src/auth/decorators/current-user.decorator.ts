import { createParamDecorator, type ExecutionContext, UnauthorizedException } from '@nestjs/common';
import type { SessionUser } from '@keyloom/shared';
import type { Request } from 'express';
import { type Actor, NO_SESSION_MESSAGE } from '../session-user';

/** The signed-in user of the request. Only for routes behind the SessionGuard (not @Public). */
export const CurrentUser = createParamDecorator((_data: unknown, ctx: ExecutionContext): SessionUser => {
  const user = ctx.switchToHttp().getRequest<Request>().user;
  if (!user) throw new UnauthorizedException(NO_SESSION_MESSAGE);
  return user;
});

/**
 * The signed-in user and the request's address, as the services and the audit log take them.
 * Only for routes behind the SessionGuard (not @Public).
 */
export const CurrentActor = createParamDecorator((_data: unknown, ctx: ExecutionContext): Actor => {
  const request = ctx.switchToHttp().getRequest<Request>();
  if (!request.user) throw new UnauthorizedException(NO_SESSION_MESSAGE);
  return { ...request.user, ip: request.ip ?? null };
});
