import type { Role } from '@keyloom/shared';
import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { sessionUser } from '@/testing/data';
import { mockFetch, sessionRoutes } from '@/testing/mock-fetch';
import { currentUrl, renderApp } from '@/testing/render-app';

// Role homes as fixed by the foundation contract ("Role home pages").
const homes: Array<{ role: Role; path: string; heading: string; empty: string }> = [
  { role: 'admin', path: '/admin/staff', heading: 'Staff', empty: 'No staff accounts yet.' },
  { role: 'clinician', path: '/caseload', heading: 'Caseload', empty: 'Your caseload is empty.' },
  { role: 'supervisor', path: '/reviews', heading: 'Reviews', empty: 'Nothing is waiting for your review.' },
  { role: 'carer', path: '/my-clients', heading: 'My clients', empty: 'No clients are assigned to you yet.' },
];

describe('role-based routing', () => {
  it.each(homes)('sends a signed-in $role from / to $path', async ({ role, path, heading, empty }) => {
    mockFetch({
      ...sessionRoutes(sessionUser(role)),
      'GET /api/users': { body: [] },
      'GET /api/clients': { body: [] },
    });
    const { router } = renderApp('/');

    expect(await screen.findByRole('heading', { level: 1, name: heading })).toBeInTheDocument();
    expect(currentUrl(router)).toBe(path);
    expect(await screen.findByRole('heading', { name: empty })).toBeInTheDocument();
    await waitFor(() => expect(document.title).toBe(`${heading} — Keyloom`));
    // The header offers this role's own page, marked as the current one.
    const nav = screen.getByRole('navigation', { name: 'Main' });
    expect(nav).toContainElement(screen.getByRole('link', { name: heading, current: 'page' }));
  });

  it('shows a carer the not-allowed page at /admin/staff, with a way home, and never asks for the staff list', async () => {
    const api = mockFetch(sessionRoutes(sessionUser('carer')));
    const { router, user } = renderApp('/admin/staff');

    expect(await screen.findByRole('heading', { level: 1, name: 'Not allowed' })).toBeInTheDocument();
    expect(currentUrl(router)).toBe('/admin/staff');
    expect(api.requestsTo('GET /api/users')).toHaveLength(0);

    await user.click(screen.getByRole('link', { name: 'Go to your home page' }));
    expect(await screen.findByRole('heading', { level: 1, name: 'My clients' })).toBeInTheDocument();
  });

  it.each([
    ['clinician', '/reviews'],
    ['supervisor', '/caseload'],
    ['admin', '/my-clients'],
  ] as const)('shows a %s the not-allowed page at %s', async (role, path) => {
    mockFetch(sessionRoutes(sessionUser(role)));
    renderApp(path);
    expect(await screen.findByRole('heading', { level: 1, name: 'Not allowed' })).toBeInTheDocument();
  });

  it('sends a visitor without a session to sign in, remembering where they were going', async () => {
    mockFetch(sessionRoutes(null));
    const { router } = renderApp('/admin/staff?sort=name');

    expect(await screen.findByRole('heading', { level: 1, name: 'Sign in to Keyloom' })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(router.state.location.search).toBe(`?next=${encodeURIComponent('/admin/staff?sort=name')}`);
  });

  it('sends a visitor without a session from / to plain /sign-in', async () => {
    mockFetch(sessionRoutes(null));
    const { router } = renderApp('/');
    await screen.findByRole('heading', { level: 1, name: 'Sign in to Keyloom' });
    expect(currentUrl(router)).toBe('/sign-in');
  });

  it('sends a signed-in user away from /sign-in to their home', async () => {
    mockFetch(sessionRoutes(sessionUser('supervisor')));
    const { router } = renderApp('/sign-in');
    await screen.findByRole('heading', { level: 1, name: 'Reviews' });
    expect(currentUrl(router)).toBe('/reviews');
  });

  it('shows the not-found page for an unknown address', async () => {
    mockFetch(sessionRoutes(sessionUser('clinician')));
    renderApp('/no/such/page');
    expect(await screen.findByRole('heading', { level: 1, name: 'Page not found' })).toBeInTheDocument();
  });

  it('says so when the session cannot be checked, and tries again on request', async () => {
    let answers = 0;
    mockFetch({
      'GET /api/auth/me': () =>
        ++answers === 1
          ? { status: 503, body: { statusCode: 503, message: 'The database is not answering.' } }
          : { body: sessionUser('clinician') },
    });
    const { user } = renderApp('/caseload');

    await waitFor(() =>
      expect(screen.getByRole('alert')).toHaveTextContent('The database is not answering.'),
    );
    await user.click(screen.getByRole('button', { name: 'Try again' }));
    expect(await screen.findByRole('heading', { level: 1, name: 'Caseload' })).toBeInTheDocument();
  });

  it('signs out from the user menu and lands on the sign-in page without `next`', async () => {
    const api = mockFetch({
      ...sessionRoutes(sessionUser('clinician')),
      'POST /api/auth/logout': { status: 204 },
    });
    const { router, user } = renderApp('/caseload');

    await user.click(await screen.findByRole('button', { name: /Dr\. Tomasz Reyes/ }));
    await user.click(await screen.findByRole('menuitem', { name: 'Sign out' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Sign in to Keyloom' })).toBeInTheDocument();
    expect(currentUrl(router)).toBe('/sign-in');
    expect(api.requestsTo('POST /api/auth/logout')).toHaveLength(1);
    expect(screen.queryByRole('navigation', { name: 'Main' })).not.toBeInTheDocument();
  });

  it('moves focus to the new page heading after an in-app navigation', async () => {
    mockFetch(sessionRoutes(sessionUser('carer')));
    const { user } = renderApp('/admin/staff');
    await screen.findByRole('heading', { level: 1, name: 'Not allowed' });

    await user.click(screen.getByRole('link', { name: 'Go to your home page' }));
    const heading = await screen.findByRole('heading', { level: 1, name: 'My clients' });
    await waitFor(() => expect(heading).toHaveFocus());
  });

  it('puts the skip link first in the tab order and points it at main', async () => {
    mockFetch(sessionRoutes(sessionUser('carer')));
    const { user } = renderApp('/my-clients');
    await screen.findByRole('heading', { level: 1, name: 'My clients' });

    await user.tab();
    const skip = screen.getByRole('link', { name: 'Skip to main content' });
    expect(skip).toHaveFocus();
    await user.click(skip);
    expect(screen.getByRole('main')).toHaveFocus();
  });
});
