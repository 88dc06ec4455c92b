import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { sessionUser } from '@/testing/data';
import { CSRF_TOKEN, mockFetch, sessionRoutes } from '@/testing/mock-fetch';
import { currentUrl, renderApp } from '@/testing/render-app';

const STRONG = 'Tulip-Harbour-Lantern-42';
// The API's refusal of an easily guessed password (api/src/users/password-strength.ts).
const WEAK_MESSAGE =
  'That password is too easy to guess (a common password, a repeat or a simple pattern). Try three or four unrelated words.';

describe('Choose a new password (a password change is due)', () => {
  const dueUser = { ...sessionUser('clinician'), mustChangePassword: true as const };

  it('is where every page sends the account, with the heading focused and labelled fields', async () => {
    const api = mockFetch(sessionRoutes(dueUser));
    const { router } = renderApp('/caseload');

    const heading = await screen.findByRole('heading', { level: 1, name: 'Choose a new password' });
    expect(currentUrl(router)).toBe('/choose-password');
    await waitFor(() => expect(heading).toHaveFocus());
    expect(screen.getByLabelText('Temporary password')).toHaveAttribute('type', 'password');
    expect(screen.getByLabelText('New password')).toHaveAttribute('autocomplete', 'new-password');
    expect(screen.getByLabelText('New password again')).toBeInTheDocument();
    // The caseload's data is never asked for.
    expect(api.requestsTo('GET /api/clients')).toHaveLength(0);
  });

  it('shows the shared schema messages before sending anything', async () => {
    const api = mockFetch(sessionRoutes(dueUser));
    const { user } = renderApp('/choose-password');
    await screen.findByRole('heading', { level: 1, name: 'Choose a new password' });

    await user.type(screen.getByLabelText('Temporary password'), 'keyloom-demo');
    await user.type(screen.getByLabelText('New password'), STRONG);
    await user.type(screen.getByLabelText('New password again'), `${STRONG}?`);
    await user.click(screen.getByRole('button', { name: 'Save and continue' }));

    expect(await screen.findByText('The two new passwords are not the same.')).toBeInTheDocument();
    expect(screen.getByLabelText('New password again')).toHaveAttribute('aria-invalid', 'true');
    expect(api.requestsTo('POST /api/auth/password')).toHaveLength(0);
  });

  it("puts the API's refusal of a weak password on the new-password field", async () => {
    mockFetch({
      ...sessionRoutes(dueUser),
      'POST /api/auth/password': {
        status: 400,
        body: {
          statusCode: 400,
          message: WEAK_MESSAGE,
          issues: [{ path: 'newPassword', message: WEAK_MESSAGE }],
        },
      },
    });
    const { user } = renderApp('/choose-password');
    await screen.findByRole('heading', { level: 1, name: 'Choose a new password' });
    await user.type(screen.getByLabelText('Temporary password'), 'keyloom-demo');
    await user.type(screen.getByLabelText('New password'), 'password1234');
    await user.type(screen.getByLabelText('New password again'), 'password1234');
    await user.click(screen.getByRole('button', { name: 'Save and continue' }));

    await waitFor(() =>
      expect(screen.getByLabelText('New password')).toHaveAccessibleDescription(/too easy/),
    );
  });

  it('sends the change with the CSRF token and then goes to the home page', async () => {
    const api = mockFetch({
      ...sessionRoutes(dueUser),
      'POST /api/auth/password': { body: sessionUser('clinician') },
      'GET /api/clients': { body: [] },
    });
    const { router, user } = renderApp('/choose-password');
    await screen.findByRole('heading', { level: 1, name: 'Choose a new password' });

    await user.type(screen.getByLabelText('Temporary password'), 'keyloom-demo');
    await user.type(screen.getByLabelText('New password'), STRONG);
    await user.type(screen.getByLabelText('New password again'), STRONG);
    await user.keyboard('{Enter}');

    expect(await screen.findByRole('heading', { level: 1, name: 'Caseload' })).toBeInTheDocument();
    expect(currentUrl(router)).toBe('/caseload');
    const [sent] = api.requestsTo('POST /api/auth/password');
    expect(sent.body).toEqual({
      currentPassword: 'keyloom-demo',
      newPassword: STRONG,
      confirmPassword: STRONG,
    });
    expect(sent.headers.get('X-CSRF-Token')).toBe(CSRF_TOKEN);
  });

  it('sends an account with no change due on to its home page', async () => {
    mockFetch({ ...sessionRoutes(sessionUser('carer')), 'GET /api/clients': { body: [] } });
    const { router } = renderApp('/choose-password');
    await screen.findByRole('heading', { level: 1, name: 'My clients' });
    expect(currentUrl(router)).toBe('/my-clients');
  });
});

describe('a password change that becomes due while signed in', () => {
  it('takes the reader to "Choose a new password" when the API refuses a request with its code', async () => {
    let due = false;
    mockFetch({
      'GET /api/auth/me': () => ({
        body: due ? { ...sessionUser('clinician'), mustChangePassword: true } : sessionUser('clinician'),
      }),
      'GET /api/auth/csrf': { body: { token: CSRF_TOKEN } },
      'GET /api/clients': () => {
        due = true;
        return {
          status: 403,
          body: {
            statusCode: 403,
            message: 'Choose a new password before you continue.',
            code: 'password-change-required',
          },
        };
      },
    });
    const { router } = renderApp('/caseload');
    expect(
      await screen.findByRole('heading', { level: 1, name: 'Choose a new password' }),
    ).toBeInTheDocument();
    expect(currentUrl(router)).toBe('/choose-password');
  });
});
