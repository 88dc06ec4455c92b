import type { Role, SessionUser, User } from '@keyloom/shared';

// The demo clinic's staff (foundation contract, "Demo accounts"); invented people.
const demoStaff: Record<Role, { id: string; name: string }> = {
  admin: { id: '2f0e7a52-5d0c-4c6e-9a51-0c1d5b7f9a01', name: 'Imogen Hale' },
  clinician: { id: '6b1c3d9e-8f2a-4b7c-9d1e-2a3b4c5d6e02', name: 'Dr. Tomasz Reyes' },
  supervisor: { id: '9c2d4e6f-1a3b-4c5d-8e7f-3b4c5d6e7f03', name: 'Priya Okonkwo' },
  carer: { id: 'a3e5f7b9-2c4d-4e6f-9a8b-4c5d6e7f8a04', name: 'Hannah Ashby' },
};

export const sessionUser = (role: Role): SessionUser => ({
  id: demoStaff[role].id,
  email: `${role}@willowmere.example`,
  name: demoStaff[role].name,
  role,
});

export const staffUser = (role: Role, overrides: Partial<User> = {}): User => ({
  ...sessionUser(role),
  active: true,
  createdAt: '2026-01-05T09:00:00.000Z',
  lastSignInAt: null,
  ...overrides,
});
