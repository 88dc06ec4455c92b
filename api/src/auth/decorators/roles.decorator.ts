import { SetMetadata } from '@nestjs/common';
import type { Role } from '@keyloom/shared';

export const ROLES_KEY = 'keyloom:roles';

/** Restricts a route or controller to the given roles (checked by the global RolesGuard). */
export const Roles = (...roles: [Role, ...Role[]]) => SetMetadata(ROLES_KEY, roles);
