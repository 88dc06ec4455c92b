import type { Role } from '@keyloom/shared';

// Every client route in one place, so links and redirects never drift apart.
export const paths = {
  home: '/',
  signIn: '/sign-in',
  choosePassword: '/choose-password',
  account: '/account',
  staff: '/admin/staff',
  caseload: '/caseload',
  reviews: '/reviews',
  myClients: '/my-clients',
  clients: '/clients',
  audit: '/audit',
  assignments: '/admin/assignments',
  clinic: '/admin/clinic',
} as const;

// The client page's tabs, in order; each is part of the URL (/clients/:id/:tab).
export const clientTabs = ['overview', 'consent', 'samples', 'profiles', 'trials', 'summaries'] as const;
export type ClientTab = (typeof clientTabs)[number];

/**
 * A client's page, on one of its tabs.
 * @param clientId the client's id
 * @param tab the tab; the overview when omitted
 */
export const clientPath = (clientId: string, tab: ClientTab = 'overview'): string =>
  `${paths.clients}/${encodeURIComponent(clientId)}/${tab}`;

/** One language sample's review page. */
export const samplePath = (clientId: string, sampleId: string): string =>
  `${paths.clients}/${encodeURIComponent(clientId)}/samples/${encodeURIComponent(sampleId)}`;

/** One profile version's page (status, progress, results, actions). */
export const profileVersionPath = (clientId: string, versionId: string): string =>
  `${paths.clients}/${encodeURIComponent(clientId)}/profiles/${encodeURIComponent(versionId)}`;

/** The words of one profile version, and the client's added and blocked words for the next. */
export const vocabularyPath = (clientId: string, versionId: string): string =>
  `${profileVersionPath(clientId, versionId)}/vocabulary`;

/** One trained version's report, laid out for printing. */
export const versionReportPath = (clientId: string, versionId: string): string =>
  `${profileVersionPath(clientId, versionId)}/report`;

/** A client's report over a period, laid out for printing; the last 90 days without one. */
export const clientReportPath = (clientId: string, period?: { from: string; to: string }): string =>
  `${paths.clients}/${encodeURIComponent(clientId)}/report${
    period ? `?from=${encodeURIComponent(period.from)}&to=${encodeURIComponent(period.to)}` : ''
  }`;

/** Two or more versions of a client side by side. */
export const profileComparePath = (clientId: string, versionIds: readonly string[]): string =>
  `${paths.clients}/${encodeURIComponent(clientId)}/profiles/compare?ids=${versionIds.map(encodeURIComponent).join(',')}`;

/**
 * The test keyboard of a client (clinician and carer), running one profile version.
 * @param clientId the client's id
 * @param versionId the version to run; the page picks the active one (or the newest candidate) when omitted
 */
export const keyboardPath = (clientId: string, versionId?: string): string =>
  `${paths.clients}/${encodeURIComponent(clientId)}/keyboard${versionId ? `?version=${encodeURIComponent(versionId)}` : ''}`;

// Where each role lands after signing in (foundation contract, "Role home pages").
export const roleHome: Record<Role, string> = {
  admin: paths.staff,
  clinician: paths.caseload,
  supervisor: paths.reviews,
  carer: paths.myClients,
};

/** A header link; `alsoFor` lists other path prefixes that count as this page (e.g. a client's pages). */
export type NavItem = { label: string; to: string; alsoFor?: readonly string[] };

// The header navigation per role; later features add their pages here.
export const roleNavigation: Record<Role, readonly NavItem[]> = {
  admin: [
    { label: 'Staff', to: paths.staff },
    { label: 'Assignments', to: paths.assignments },
    { label: 'Clinic details', to: paths.clinic },
    { label: 'Audit log', to: paths.audit },
  ],
  clinician: [{ label: 'Caseload', to: paths.caseload, alsoFor: [`${paths.clients}/`] }],
  supervisor: [
    { label: 'Reviews', to: paths.reviews },
    { label: 'Clients', to: paths.clients },
    { label: 'Audit log', to: paths.audit },
  ],
  carer: [{ label: 'My clients', to: paths.myClients, alsoFor: [`${paths.clients}/`] }],
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
