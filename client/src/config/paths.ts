import type { Role } from '@keyloom/shared';

// Every client route in one place, so links and redirects never drift apart.
export const paths = {
  home: '/',
  signIn: '/sign-in',
  staff: '/admin/staff',
  caseload: '/caseload',
  reviews: '/reviews',
  myClients: '/my-clients',
} as const;

// Where each role lands after signing in (foundation contract, "Role home pages").
export const roleHome: Record<Role, string> = {
  admin: paths.staff,
  clinician: paths.caseload,
  supervisor: paths.reviews,
  carer: paths.myClients,
};

export type NavItem = { label: string; to: string };

// The header navigation per role; later features add their pages here.
export const roleNavigation: Record<Role, readonly NavItem[]> = {
  admin: [{ label: 'Staff', to: paths.staff }],
  clinician: [{ label: 'Caseload', to: paths.caseload }],
  supervisor: [{ label: 'Reviews', to: paths.reviews }],
  carer: [{ label: 'My clients', to: paths.myClients }],
};

/**
 * The sign-in URL that brings the reader back to `returnTo` afterwards.
 * @param returnTo an in-app path with its query string, e.g. "/admin/staff?page=2"
 */
export const signInPath = (returnTo?: string): string =>
  returnTo && returnTo !== paths.home ? `${paths.signIn}?next=${encodeURIComponent(returnTo)}` : paths.signIn;

/**
 * A `next` value safe to navigate to: an in-app absolute path only, never another origin
 * ("//evil.example", "https://…", "/\\evil") and never the sign-in page itself.
 */
export const safeNextPath = (next: string | null): string | null => {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return null;
  if (next === paths.signIn || next.startsWith(`${paths.signIn}?`)) return null;
  return next;
};
