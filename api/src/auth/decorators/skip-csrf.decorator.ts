import { SetMetadata } from '@nestjs/common';

export const SKIP_CSRF_KEY = 'keyloom:skipCsrf';

/**
 * A state-changing route the global CsrfGuard lets through without the session's token. Only for
 * public routes whose URL carries its own secret (the summary stop link: mail programs POST to it
 * with no session, RFC 8058). Never on a route that acts for a signed-in user.
 */
export const SkipCsrf = () => SetMetadata(SKIP_CSRF_KEY, true);
