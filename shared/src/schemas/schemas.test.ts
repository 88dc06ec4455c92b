import { describe, expect, it } from 'vitest';
import { createUserSchema, loginSchema, updateUserSchema } from '../index';

describe('loginSchema', () => {
  it('trims and lower-cases the e-mail before checking it', () => {
    const parsed = loginSchema.parse({ email: '  Admin@Willowmere.Example ', password: 'x' });
    expect(parsed.email).toBe('admin@willowmere.example');
  });

  it('names the problem of each empty field', () => {
    const result = loginSchema.safeParse({ email: '', password: '' });
    expect(result.success).toBe(false);
    const messages = result.error?.issues.map((issue) => `${issue.path.join('.')}: ${issue.message}`);
    expect(messages).toEqual(['email: Enter a valid e-mail address.', 'password: Enter your password.']);
  });
});

describe('createUserSchema', () => {
  it('refuses a short password and an unknown role', () => {
    const result = createUserSchema.safeParse({
      email: 'a@b.example',
      name: 'A',
      role: 'owner',
      password: 'short',
    });
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((issue) => issue.path[0]).sort()).toEqual(['password', 'role']);
  });
});

describe('updateUserSchema', () => {
  it('refuses an empty change', () => {
    expect(updateUserSchema.safeParse({}).success).toBe(false);
    expect(updateUserSchema.safeParse({ active: false }).success).toBe(true);
  });
});
