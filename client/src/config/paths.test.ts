import { describe, expect, it } from 'vitest';
import { safeNextPath, signInPath } from './paths';

describe('safeNextPath', () => {
  it.each([
    ['/admin/staff', '/admin/staff'],
    ['/caseload?client=7', '/caseload?client=7'],
  ])('keeps the in-app path %s', (next, expected) => {
    expect(safeNextPath(next)).toBe(expected);
  });

  // Open-redirect shapes (protocol-relative, absolute, backslash) per the OWASP
  // "Unvalidated Redirects and Forwards Cheat Sheet" (from memory).
  it.each([
    null,
    '',
    'admin/staff',
    '//evil.example',
    'https://evil.example',
    '/\\evil.example',
    '/sign-in',
    '/sign-in?next=/x',
  ])('rejects %s', (next) => {
    expect(safeNextPath(next)).toBeNull();
  });
});

describe('signInPath', () => {
  it('encodes where to come back to, and leaves it out for the home page', () => {
    expect(signInPath('/admin/staff?sort=name')).toBe('/sign-in?next=%2Fadmin%2Fstaff%3Fsort%3Dname');
    expect(signInPath('/')).toBe('/sign-in');
    expect(signInPath()).toBe('/sign-in');
  });
});
