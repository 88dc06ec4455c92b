import type { SessionUser, User as UserDto } from '@keyloom/shared';
import type { User } from '../user.entity';

export type { UserDto };

/** Entity → the staff-account shape of the shared userSchema (dates as ISO strings, no hash). */
export function toUserDto(user: User): UserDto {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    active: user.active,
    createdAt: user.createdAt.toISOString(),
    lastSignInAt: user.lastSignInAt ? user.lastSignInAt.toISOString() : null,
  };
}

/** Entity → what the session and GET /api/auth/me expose. */
export function toSessionUser(
  user: Pick<User, 'id' | 'email' | 'name' | 'role'> & Partial<Pick<User, 'mustChangePassword'>>,
): SessionUser {
  const base = { id: user.id, email: user.email, name: user.name, role: user.role };
  return user.mustChangePassword ? { ...base, mustChangePassword: true } : base;
}
