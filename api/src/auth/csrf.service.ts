import { Injectable } from '@nestjs/common';
import { csrfSync } from 'csrf-sync';
import type { Request } from 'express';

/**
 * Synchronizer-token CSRF protection (csrf-sync): one token per session, stored in the session,
 * sent back by the client in the X-CSRF-Token header on POST/PUT/PATCH/DELETE.
 * The session is regenerated at sign-in and destroyed at sign-out, so the token changes then.
 */
@Injectable()
export class CsrfService {
  // 32 random bytes → 64 hex characters.
  private readonly sync = csrfSync({ size: 32 });

  /** The session's token, created on first use. */
  token(req: Request): string {
    return this.sync.generateToken(req);
  }

  /** True when the X-CSRF-Token header equals the session's token. */
  isValid(req: Request): boolean {
    return this.sync.isRequestValid(req);
  }
}
