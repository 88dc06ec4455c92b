import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { sessionUser } from '@/testing/data';
import { expectErrorSummary } from '@/testing/error-summary';
import { CSRF_TOKEN, mockFetch, sessionRoutes } from '@/testing/mock-fetch';
import { currentUrl, renderApp } from '@/testing/render-app';

// The expected messages are the shared loginSchema's own (shared/src/schemas/auth.schema.ts),
// so the form and the API cannot drift apart without this failing.
const EMAIL_MESSAGE = 'Enter a valid e-mail address.';
const PASSWORD_MESSAGE = 'Enter your password.';

const openSignIn = async (url = '/sign-in') => {
  const app = renderApp(url);
  await screen.findByRole('heading', { level: 1, name: 'Sign in to Keyloom' });
  return app;
};

describe('SignInForm', () => {
  it('shows the shared schema messages on an empty submit, linked to invalid fields', async () => {
    const api = mockFetch(sessionRoutes(null));
    const { user } = await openSignIn();

    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    const email = screen.getByLabelText('E-mail address');
    const password = screen.getByLabelText('Password');
    expect(await screen.findByText(EMAIL_MESSAGE)).toBeInTheDocument();
    expect(screen.getByText(PASSWORD_MESSAGE)).toBeInTheDocument();
    expect(email).toHaveAttribute('aria-invalid', 'true');
    expect(password).toHaveAttribute('aria-invalid', 'true');
    expect(email).toHaveAccessibleDescription(EMAIL_MESSAGE);
    expect(password).toHaveAccessibleDescription(PASSWORD_MESSAGE);
    // The refused submit is listed at the top of the form, focused, each entry a link to its field.
    const summary = await expectErrorSummary(document.body, '2 fields need attention', [
      `E-mail address: ${EMAIL_MESSAGE}`,
      `Password: ${PASSWORD_MESSAGE}`,
    ]);
    await user.click(within(summary).getByRole('link', { name: /^Password/ }));
    expect(password).toHaveFocus();
    // Invalid input never reaches the API.
    expect(api.requestsTo('POST /api/auth/login')).toHaveLength(0);
  });

  it('clears a message once the field is corrected and submitted again', async () => {
    mockFetch({
      ...sessionRoutes(null),
      'POST /api/auth/login': {
        status: 401,
        body: { statusCode: 401, message: 'Wrong e-mail or password.' },
      },
    });
    const { user } = await openSignIn();

    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    await screen.findByText(EMAIL_MESSAGE);
    await user.type(screen.getByLabelText('E-mail address'), 'carer@willowmere.example');
    await user.type(screen.getByLabelText('Password'), 'not-the-password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    await screen.findByText('Wrong e-mail or password.');
    expect(screen.queryByText(EMAIL_MESSAGE)).not.toBeInTheDocument();
    expect(screen.getByLabelText('E-mail address')).not.toHaveAttribute('aria-invalid');
  });

  it('shows the server message of a 401 in an alert, sending the CSRF token', async () => {
    const api = mockFetch({
      ...sessionRoutes(null),
      'POST /api/auth/login': {
        status: 401,
        body: { statusCode: 401, message: 'Wrong e-mail or password.' },
      },
    });
    const { user, router } = await openSignIn();

    await user.type(screen.getByLabelText('E-mail address'), 'Carer@Willowmere.example');
    await user.type(screen.getByLabelText('Password'), 'not-the-password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    await waitFor(() => expect(screen.getByRole('alert')).toHaveTextContent('Wrong e-mail or password.'));
    expect(currentUrl(router)).toBe('/sign-in');
    const [login] = api.requestsTo('POST /api/auth/login');
    expect(login?.headers.get('X-CSRF-Token')).toBe(CSRF_TOKEN);
    // The shared schema trims and lower-cases the address before it is sent.
    expect(login?.body).toEqual({ email: 'carer@willowmere.example', password: 'not-the-password' });
  });

  it('shows a 429 (too many attempts) the same way', async () => {
    mockFetch({
      ...sessionRoutes(null),
      'POST /api/auth/login': {
        status: 429,
        body: { statusCode: 429, message: 'Too many sign-in attempts. Wait a minute and try again.' },
      },
    });
    const { user } = await openSignIn();

    await user.type(screen.getByLabelText('E-mail address'), 'admin@willowmere.example');
    await user.type(screen.getByLabelText('Password'), 'keyloom-demo');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    await waitFor(() => expect(screen.getByRole('alert')).toHaveTextContent('Too many sign-in attempts'));
  });

  it('goes to the role home after signing in', async () => {
    const clinician = sessionUser('clinician');
    mockFetch({ ...sessionRoutes(null), 'POST /api/auth/login': { body: clinician } });
    const { user, router } = await openSignIn();

    await user.type(screen.getByLabelText('E-mail address'), clinician.email);
    await user.type(screen.getByLabelText('Password'), 'keyloom-demo');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Caseload' })).toBeInTheDocument();
    expect(currentUrl(router)).toBe('/caseload');
    expect(await screen.findByRole('button', { name: /Dr\. Tomasz Reyes/ })).toBeInTheDocument();
  });

  it('goes back to `next` after signing in, but never off the site', async () => {
    const admin = sessionUser('admin');
    mockFetch({
      ...sessionRoutes(null),
      'POST /api/auth/login': { body: admin },
      'GET /api/users': { body: [] },
    });
    const { user, router } = await openSignIn('/sign-in?next=%2Fadmin%2Fstaff');

    await user.type(screen.getByLabelText('E-mail address'), admin.email);
    await user.type(screen.getByLabelText('Password'), 'keyloom-demo');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Staff' })).toBeInTheDocument();
    expect(currentUrl(router)).toBe('/admin/staff');
  });

  it('ignores a `next` that points to another site', async () => {
    const carer = sessionUser('carer');
    mockFetch({ ...sessionRoutes(null), 'POST /api/auth/login': { body: carer } });
    const { user, router } = await openSignIn('/sign-in?next=%2F%2Fevil.example%2Fphish');

    await user.type(screen.getByLabelText('E-mail address'), carer.email);
    await user.type(screen.getByLabelText('Password'), 'keyloom-demo');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'My clients' })).toBeInTheDocument();
    expect(currentUrl(router)).toBe('/my-clients');
  });

  it('lets the reader show and hide the password', async () => {
    mockFetch(sessionRoutes(null));
    const { user } = await openSignIn();
    const password = screen.getByLabelText('Password');

    expect(password).toHaveAttribute('type', 'password');
    await user.click(screen.getByRole('checkbox', { name: 'Show password' }));
    expect(password).toHaveAttribute('type', 'text');
    await user.click(screen.getByRole('checkbox', { name: 'Show password' }));
    expect(password).toHaveAttribute('type', 'password');
  });
});
