import { UnauthorizedException } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Request } from 'express';
import { Public } from '../decorators/public.decorator';
import { httpContext } from './guards.spec-helpers';
import { SessionGuard } from './session.guard';

class Mixed {
  @Public() open() {}
  closed() {}
}
@Public()
class AllOpen {
  anything() {}
}

const signedIn = {
  isAuthenticated: () => true,
  user: { id: 'u1', email: 'a@b.c', name: 'A', role: 'carer' },
};
const anonymous = { isAuthenticated: () => false, user: undefined };

describe(SessionGuard.name, () => {
  const guard = new SessionGuard(new Reflector());

  it('lets @Public() handlers and classes through without a session', () => {
    expect(guard.canActivate(httpContext(Mixed, 'open', anonymous as unknown as Request))).toBe(true);
    expect(guard.canActivate(httpContext(AllOpen, 'anything', anonymous as unknown as Request))).toBe(true);
  });

  it('refuses every other route without a session (401 with a message)', () => {
    const run = () => guard.canActivate(httpContext(Mixed, 'closed', anonymous as unknown as Request));
    expect(run).toThrow(UnauthorizedException);
    expect(run).toThrow('Sign in to continue.');
    // A request that passport never touched (no isAuthenticated) is refused too.
    expect(() => guard.canActivate(httpContext(Mixed, 'closed', {}))).toThrow(UnauthorizedException);
  });

  it('admits a signed-in session', () => {
    expect(guard.canActivate(httpContext(Mixed, 'closed', signedIn as unknown as Request))).toBe(true);
  });
});
