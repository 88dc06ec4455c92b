import type { User } from '@keyloom/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { sessionUser, staffUser } from '@/testing/data';
import { CSRF_TOKEN, mockFetch, type RecordedRequest, sessionRoutes } from '@/testing/mock-fetch';
import { expectErrorSummary } from '@/testing/error-summary';
import { renderApp } from '@/testing/render-app';

const admin = staffUser('admin', { lastSignInAt: '2026-02-03T14:05:00.000Z' });
const supervisor = staffUser('supervisor');
const formerCarer = staffUser('carer', { active: false, lastSignInAt: '2026-01-20T08:30:00.000Z' });

const openStaffPage = async (users: User[], routes: Parameters<typeof mockFetch>[0] = {}) => {
  const api = mockFetch({
    ...sessionRoutes(sessionUser('admin')),
    'GET /api/users': { body: users },
    ...routes,
  });
  const app = renderApp('/admin/staff');
  await screen.findByRole('table', { name: /Staff accounts/ });
  return { ...app, api };
};

const rowOf = (name: string) => {
  const header = screen.getByRole('rowheader', { name: new RegExp(name) });
  const row = header.closest('tr');
  if (!row) throw new Error(`No row for ${name}`);
  return within(row);
};

describe('Staff page', () => {
  it('lists every account with role, status and last sign-in', async () => {
    await openStaffPage([supervisor, admin, formerCarer]);

    const table = screen.getByRole('table', { name: 'Staff accounts (3)' });
    const headers = within(table)
      .getAllByRole('columnheader')
      .map((header) => header.textContent);
    expect(headers).toEqual(['Name', 'E-mail', 'Role', 'Status', 'Last sign-in', 'Account']);
    // Sorted by name: Hannah, Imogen, Priya.
    const names = within(table)
      .getAllByRole('rowheader')
      .map((header) => header.textContent);
    expect(names).toEqual(['NameHannah Ashby', 'NameImogen Hale (you)', 'NamePriya Okonkwo']);

    expect(rowOf('Priya Okonkwo').getByRole('combobox', { name: 'Role for Priya Okonkwo' })).toHaveValue(
      'supervisor',
    );
    expect(rowOf('Priya Okonkwo').getByText('Active')).toBeInTheDocument();
    expect(rowOf('Priya Okonkwo').getByText('Never')).toBeInTheDocument();
    expect(rowOf('Hannah Ashby').getByText('Deactivated')).toBeInTheDocument();
    expect(rowOf('Hannah Ashby').getByRole('button', { name: 'Reactivate Hannah Ashby' })).toBeEnabled();
    expect(rowOf('Imogen Hale').getByText('3 Feb 2026, 14:05')).toBeInTheDocument();
  });

  it("switches off the admin's own role and deactivate controls, and says why", async () => {
    await openStaffPage([admin, supervisor]);

    const own = rowOf('Imogen Hale');
    const reason = /another administrator can change its role or deactivate it/;
    expect(own.getByRole('combobox', { name: 'Role for Imogen Hale' })).toBeDisabled();
    expect(own.getByRole('button', { name: 'Deactivate Imogen Hale' })).toBeDisabled();
    expect(own.getByRole('button', { name: 'Deactivate Imogen Hale' })).toHaveAccessibleDescription(reason);
    expect(rowOf('Priya Okonkwo').getByRole('button', { name: 'Deactivate Priya Okonkwo' })).toBeEnabled();
  });

  it('validates the new account with the shared schema before sending anything', async () => {
    const { user, api } = await openStaffPage([admin]);

    await user.click(screen.getByRole('button', { name: 'Add staff member' }));
    const dialog = await screen.findByRole('dialog', { name: 'Add staff member' });
    const form = within(dialog);
    expect(form.getByLabelText('First password')).toHaveAccessibleDescription(/At least 12 characters/);

    await user.type(form.getByLabelText('First password'), 'short pass');
    await user.click(form.getByRole('button', { name: 'Create account' }));

    // Messages from shared/src/schemas/users.schema.ts (PASSWORD_MIN_LENGTH = 12).
    expect(await form.findByText('Enter a name.')).toBeInTheDocument();
    expect(form.getByText('Enter a valid e-mail address.')).toBeInTheDocument();
    expect(form.getByText('Use at least 12 characters.')).toBeInTheDocument();
    expect(form.getByLabelText('Full name')).toHaveAttribute('aria-invalid', 'true');
    expect(form.getByLabelText('First password')).toHaveAccessibleDescription(/Use at least 12 characters\./);
    // The refused fields are listed at the top of the dialog, in the order of the form; focus is there.
    const summary = await expectErrorSummary(dialog, '3 fields need attention', [
      'Full name: Enter a name.',
      'E-mail address: Enter a valid e-mail address.',
      'First password: Use at least 12 characters.',
    ]);
    await user.click(within(summary).getByRole('link', { name: /^E-mail address/ }));
    expect(form.getByLabelText('E-mail address')).toHaveFocus();
    expect(api.requestsTo('POST /api/users')).toHaveLength(0);
  });

  it('creates an account with the CSRF header, announces it and refreshes the list', async () => {
    const created = staffUser('clinician', {
      id: '0d9f8e7c-6b5a-4c3d-8e2f-1a0b9c8d7e66',
      name: 'Ines Marlow',
      email: 'ines.marlow@willowmere.example',
    });
    let listed = [admin];
    const { user, api } = await openStaffPage([], {
      'GET /api/users': () => ({ body: listed }),
      'POST /api/users': () => {
        listed = [admin, created];
        return { status: 201, body: created };
      },
    });

    await user.click(screen.getByRole('button', { name: 'Add staff member' }));
    const form = within(await screen.findByRole('dialog', { name: 'Add staff member' }));
    await user.type(form.getByLabelText('Full name'), '  Ines Marlow ');
    await user.type(form.getByLabelText('E-mail address'), 'Ines.Marlow@Willowmere.example');
    await user.selectOptions(form.getByLabelText('Role'), 'Clinician');
    await user.type(form.getByLabelText('First password'), 'a loom of twelve');
    await user.click(form.getByRole('button', { name: 'Create account' }));

    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
    const [post] = api.requestsTo('POST /api/users') as RecordedRequest[];
    expect(post?.headers.get('X-CSRF-Token')).toBe(CSRF_TOKEN);
    expect(post?.body).toEqual({
      name: 'Ines Marlow',
      email: 'ines.marlow@willowmere.example',
      role: 'clinician',
      password: 'a loom of twelve',
    });
    expect(screen.getByRole('status')).toHaveTextContent('Added Ines Marlow as Clinician.');
    expect(await screen.findByRole('rowheader', { name: /Ines Marlow/ })).toBeInTheDocument();
  });

  it("shows the server's 409 message in the dialog and keeps what was typed", async () => {
    const { user } = await openStaffPage([admin], {
      'POST /api/users': {
        status: 409,
        body: {
          statusCode: 409,
          message: 'An account with the e-mail supervisor@willowmere.example already exists.',
        },
      },
    });

    await user.click(screen.getByRole('button', { name: 'Add staff member' }));
    const form = within(await screen.findByRole('dialog', { name: 'Add staff member' }));
    await user.type(form.getByLabelText('Full name'), 'Priya Okonkwo');
    await user.type(form.getByLabelText('E-mail address'), 'supervisor@willowmere.example');
    await user.type(form.getByLabelText('First password'), 'twelve letters at least');
    await user.click(form.getByRole('button', { name: 'Create account' }));

    await waitFor(() =>
      expect(form.getByRole('alert')).toHaveTextContent(
        'An account with the e-mail supervisor@willowmere.example already exists.',
      ),
    );
    expect(form.getByLabelText('Full name')).toHaveValue('Priya Okonkwo');
  });

  it("puts a 400's field issues on the fields they name", async () => {
    const { user } = await openStaffPage([admin], {
      'POST /api/users': {
        status: 400,
        body: {
          statusCode: 400,
          message: 'The request has invalid fields.',
          issues: [{ path: 'email', message: 'Use an address at the clinic’s own domain.' }],
        },
      },
    });

    await user.click(screen.getByRole('button', { name: 'Add staff member' }));
    const form = within(await screen.findByRole('dialog', { name: 'Add staff member' }));
    await user.type(form.getByLabelText('Full name'), 'Rowan Ellery');
    await user.type(form.getByLabelText('E-mail address'), 'rowan@elsewhere.example');
    await user.type(form.getByLabelText('First password'), 'twelve letters at least');
    await user.click(form.getByRole('button', { name: 'Create account' }));

    const email = form.getByLabelText('E-mail address');
    await waitFor(() => expect(email).toHaveAttribute('aria-invalid', 'true'));
    expect(email).toHaveAccessibleDescription('Use an address at the clin' + 'ic’s own domain.');
  });

  it('refreshes a stale CSRF token once and retries the change', async () => {
    let posts = 0;
    let tokens = 0;
    const { user, api } = await openStaffPage([admin, supervisor], {
      'GET /api/auth/csrf': () => ({ body: { token: `fresh-token-number-${++tokens}` } }),
      'PATCH /api/users/9c2d4e6f-1a3b-4c5d-8e7f-3b4c5d6e7f03': () =>
        ++posts === 1
          ? { status: 403, body: { statusCode: 403, message: 'Invalid CSRF token.' } }
          : { body: { ...supervisor, role: 'clinician' } },
    });

    await user.selectOptions(
      rowOf('Priya Okonkwo').getByRole('combobox', { name: 'Role for Priya Okonkwo' }),
      'Clinician',
    );
    await user.click(rowOf('Priya Okonkwo').getByRole('button', { name: 'Save role for Priya Okonkwo' }));

    await waitFor(() =>
      expect(screen.getByRole('status')).toHaveTextContent('Priya Okonkwo is now Clinician.'),
    );
    // The Save button turns off once saved: focus goes back to the row's role, not the page body.
    await waitFor(() =>
      expect(rowOf('Priya Okonkwo').getByRole('combobox', { name: 'Role for Priya Okonkwo' })).toHaveFocus(),
    );
    const patches = api.requests.filter((request) => request.method === 'PATCH');
    expect(patches.map((request) => request.headers.get('X-CSRF-Token'))).toEqual([
      'fresh-token-number-1',
      'fresh-token-number-2',
    ]);
    expect(patches[1]?.body).toEqual({ role: 'clinician' });
  });

  it('announces a refused role change with the server message', async () => {
    const { user } = await openStaffPage([admin, supervisor], {
      'PATCH /api/users/9c2d4e6f-1a3b-4c5d-8e7f-3b4c5d6e7f03': {
        status: 409,
        body: { statusCode: 409, message: 'The clinic must keep at least one active administrator.' },
      },
    });

    await user.selectOptions(
      rowOf('Priya Okonkwo').getByRole('combobox', { name: 'Role for Priya Okonkwo' }),
      'Carer',
    );
    await user.click(rowOf('Priya Okonkwo').getByRole('button', { name: 'Save role for Priya Okonkwo' }));

    await waitFor(() =>
      expect(screen.getByRole('status')).toHaveTextContent(
        'The clinic must keep at least one active administrator.',
      ),
    );
    expect(rowOf('Priya Okonkwo').getByRole('combobox', { name: 'Role for Priya Okonkwo' })).toHaveValue(
      'supervisor',
    );
  });

  it('asks before deactivating, naming the person, then sends active: false', async () => {
    const { user, api } = await openStaffPage([admin, supervisor], {
      'PATCH /api/users/9c2d4e6f-1a3b-4c5d-8e7f-3b4c5d6e7f03': { body: { ...supervisor, active: false } },
    });

    await user.click(rowOf('Priya Okonkwo').getByRole('button', { name: 'Deactivate Priya Okonkwo' }));
    const dialog = within(await screen.findByRole('dialog', { name: 'Deactivate Priya Okonkwo?' }));
    await user.click(dialog.getByRole('button', { name: 'Deactivate Priya Okonkwo' }));

    await waitFor(() => expect(screen.getByRole('status')).toHaveTextContent('Deactivated Priya Okonkwo.'));
    const [patch] = api.requests.filter((request) => request.method === 'PATCH');
    expect(patch?.body).toEqual({ active: false });
    expect(patch?.headers.get('X-CSRF-Token')).toBe(CSRF_TOKEN);
  });

  it('changes nothing when the confirmation is cancelled', async () => {
    const { user, api } = await openStaffPage([admin, supervisor]);

    await user.click(rowOf('Priya Okonkwo').getByRole('button', { name: 'Deactivate Priya Okonkwo' }));
    const dialog = within(await screen.findByRole('dialog', { name: 'Deactivate Priya Okonkwo?' }));
    await user.click(dialog.getByRole('button', { name: 'Cancel' }));

    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
    expect(api.requests.filter((request) => request.method === 'PATCH')).toHaveLength(0);
  });

  it('sets a new password only after the shared schema accepts it', async () => {
    const { user, api } = await openStaffPage([admin, supervisor], {
      'PATCH /api/users/9c2d4e6f-1a3b-4c5d-8e7f-3b4c5d6e7f03': { body: supervisor },
    });

    await user.click(
      rowOf('Priya Okonkwo').getByRole('button', { name: 'Set password for Priya Okonkwo' }),
    );
    const dialog = within(
      await screen.findByRole('dialog', { name: 'Set a new password for Priya Okonkwo' }),
    );
    await user.type(dialog.getByRole('textbox', { name: 'New password' }), 'too short');
    await user.click(dialog.getByRole('button', { name: 'Set password' }));
    expect(await dialog.findByText('Use at least 12 characters.')).toBeInTheDocument();
    expect(api.requests.filter((request) => request.method === 'PATCH')).toHaveLength(0);

    await user.clear(dialog.getByRole('textbox', { name: 'New password' }));
    await user.type(dialog.getByRole('textbox', { name: 'New password' }), 'a longer new passphrase');
    await user.click(dialog.getByRole('button', { name: 'Set password' }));

    await waitFor(() =>
      expect(screen.getByRole('status')).toHaveTextContent('New password set for Priya Okonkwo.'),
    );
    const [patch] = api.requests.filter((request) => request.method === 'PATCH');
    expect(patch?.body).toEqual({ password: 'a longer new passphrase' });
  });
});
