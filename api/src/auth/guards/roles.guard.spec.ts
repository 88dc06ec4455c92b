import { ForbiddenException, UnauthorizedException } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Role } from '@keyloom/shared';
import type { Request } from 'express';
import { Roles } from '../decorators/roles.decorator';
import { httpContext } from './guards.spec-helpers';
import { RolesGuard } from './roles.guard';

@Roles('admin')
class AdminOnly {
  list() {}
  @Roles('supervisor', 'clinician') review() {}
}
class Unmarked {
  anything() {}
}

const as = (role: Role) => ({ user: { id: 'u1', email: 'a@b.c', name: 'A', role } }) as unknown as Request;

describe(RolesGuard.name, () => {
  const guard = new RolesGuard(new Reflector());

  it('admits any signed-in role on routes without @Roles', () => {
    expect(guard.canActivate(httpContext(Unmarked, 'anything', as('carer')))).toBe(true);
  });

  it('admits only the listed roles from the class decorator', () => {
    expect(guard.canActivate(httpContext(AdminOnly, 'list', as('admin')))).toBe(true);
    for (const role of ['clinician', 'supervisor', 'carer'] as const) {
      expect(() => guard.canActivate(httpContext(AdminOnly, 'list', as(role)))).toThrow(ForbiddenException);
    }
  });

  it('lets a handler decorator override the class decorator', () => {
    expect(guard.canActivate(httpContext(AdminOnly, 'review', as('clinician')))).toBe(true);
    expect(() => guard.canActivate(httpContext(AdminOnly, 'review', as('admin')))).toThrow(
      'Your role does not allow this.',
    );
  });

  it('answers 401, not 403, when there is no user at all', () => {
    expect(() => guard.canActivate(httpContext(AdminOnly, 'list', {}))).toThrow(UnauthorizedException);
  });
});
