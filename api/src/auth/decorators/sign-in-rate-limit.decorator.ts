import { type ExecutionContext, SetMetadata } from '@nestjs/common';
import { Reflector } from '@nestjs/core';

export const SIGN_IN_RATE_LIMIT_KEY = 'keyloom:signInRateLimit';
/** Name of the throttler (configured in AppModule) that counts sign-in attempts per client address. */
export const SIGN_IN_THROTTLER = 'sign-in';

/**
 * Puts a route under the 'sign-in' throttler: LOGIN_RATE_LIMIT attempts per minute per address.
 * (A plain @Throttle() needs its limit at compile time; this one comes from validated config.)
 */
export const SignInRateLimit = () => SetMetadata(SIGN_IN_RATE_LIMIT_KEY, true);

const reflector = new Reflector();

/** True on routes marked with @SignInRateLimit(). */
export function isSignInRoute(context: ExecutionContext): boolean {
  return reflector.get<boolean | undefined>(SIGN_IN_RATE_LIMIT_KEY, context.getHandler()) === true;
}
