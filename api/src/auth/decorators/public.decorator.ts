import { SetMetadata } from '@nestjs/common';

export const IS_PUBLIC_KEY = 'keyloom:isPublic';

/** The only way out of the global SessionGuard: the route works without a signed-in user. */
export const Public = () => SetMetadata(IS_PUBLIC_KEY, true);
