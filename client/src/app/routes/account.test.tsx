import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { sessionUser } from '@/testing/data';
import { mockFetch, sessionRoutes } from '@/testing/mock-fetch';
import { currentUrl, renderApp } from '@/testing/render-app';

const STRONG = 'Tulip-Harbour-Lantern-42';

describe('Your account: change password', () => {
  it('is reached from the user menu by any role', async () => {
    mockFetch({ ...sessionRoutes(sessionUser('carer')), 'GET /api/clients': { body: [] } });
    const { router, user } = renderApp('/my-clients');
    await user.click(await screen.findByRole('button', { name: /Hannah Ashby/ }));
    await user.click(await screen.findByRole('menuitem', { name: 'Change password' }));

    const heading = await screen.findByRole('heading', { level: 1, name: 'Your account' });
    expect(currentUrl(router)).toBe('/account');
    await waitFor(() => expect(heading).toHaveFocus());
    expect(screen.getByRole('heading', { level: 2, name: 'Change password' })).toBeInTheDocument();
  });

  it('shows the wrong current password on its field', async () => {
    mockFetch({
      ...sessionRoutes(sessionUser('admin')),
      'POST /api/auth/password': {
        status: 400,
        body: {
          statusCode: 400,
          message: 'Your current password is not right.',
          issues: [{ path: 'currentPassword', message: 'Your current password is not right.' }],
        },
      },
    });
    const { user } = renderApp('/account');
    await screen.findByRole('heading', { level: 1, name: 'Your account' });
    await user.type(screen.getByLabelText('Current password'), 'not my password');
    await user.type(screen.getByLabelText('New password'), STRONG);
    await user.type(screen.getByLabelText('New password again'), STRONG);
    await user.click(screen.getByRole('button', { name: 'Change password' }));

    await waitFor(() =>
      expect(screen.getByLabelText('Current password')).toHaveAccessibleDescription(
        'Your current password is not right.',
      ),
    );
  });

  it('says so after a change, moves focus to the message and empties the form', async () => {
    const api = mockFetch({
      ...sessionRoutes(sessionUser('supervisor')),
      'POST /api/auth/password': { body: sessionUser('supervisor') },
    });
    const { user } = renderApp('/account');
    await screen.findByRole('heading', { level: 1, name: 'Your account' });
    await user.type(screen.getByLabelText('Current password'), 'my old passphrase');
    await user.type(screen.getByLabelText('New password'), STRONG);
    await user.type(screen.getByLabelText('New password again'), STRONG);
    await user.click(screen.getByRole('button', { name: 'Change password' }));

    const status = await screen.findByRole('status');
    await waitFor(() => expect(status).toHaveTextContent('Your password is changed.'));
    await waitFor(() => expect(status).toHaveFocus());
    expect(screen.getByLabelText('Current password')).toHaveValue('');
    expect(api.requestsTo('POST /api/auth/password')[0].body).toEqual({
      currentPassword: 'my old passphrase',
      newPassword: STRONG,
      confirmPassword: STRONG,
    });
  });
});
