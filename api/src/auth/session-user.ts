import type { SessionUser } from '@keyloom/shared';

// passport puts the deserialised user on req.user; in Keyloom that is always a SessionUser.
declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // Declaration merging needs an interface here.
    // eslint-disable-next-line @typescript-eslint/consistent-type-definitions, @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}

/** The signed-in user acting on a request, plus where the request came from (for the audit log). */
export type Actor = SessionUser & { ip: string | null };

export const SESSION_COOKIE = 'keyloom.sid';
export const SIGN_IN_FAILED_MESSAGE = 'E-mail or password is not right.';
export const CSRF_FAILED_MESSAGE = 'Missing or invalid CSRF token. Reload the page and try again.';
export const NO_SESSION_MESSAGE = 'Sign in to continue.';
export const WRONG_ROLE_MESSAGE = 'Your role does not allow this.';
export const PASSWORD_CHANGE_REQUIRED_MESSAGE = 'Choose a new password before you continue.';
