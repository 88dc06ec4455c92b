import { type ClinicSettings, DEFAULT_CLINIC_SETTINGS } from '@keyloom/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { sessionUser } from '@/testing/data';
import { CSRF_TOKEN, mockFetch, type MockRoutes, sessionRoutes } from '@/testing/mock-fetch';
import { renderApp } from '@/testing/render-app';

// Invented details; 01632 960xxx is the UK range Ofcom keeps for drama (it reaches nobody).
const admin = sessionUser('admin');
const saved: ClinicSettings = {
  configured: true,
  name: 'Willowmere Community Communication Clinic',
  phone: '01632 960 418',
  address: 'Unit 4, The Old Ropeworks\n27 Larkspur Lane\nWillowmere',
  email: null,
  website: null,
  updatedAt: '2026-11-20T09:15:00.000Z',
  updatedBy: { id: admin.id, name: admin.name },
};

const openClinicPage = async (settings: ClinicSettings, routes: MockRoutes = {}) => {
  const api = mockFetch({
    ...sessionRoutes(admin),
    'GET /api/clinic-settings': { body: settings },
    ...routes,
  });
  const app = renderApp('/admin/clinic');
  await screen.findByRole('form', { name: 'Clinic details' });
  return { ...app, api };
};

describe('Clinic details page', () => {
  it('shows the saved details in the form, and who changed them last', async () => {
    await openClinicPage(saved);
    expect(screen.getByRole('heading', { level: 1, name: 'Clinic details' })).toBeInTheDocument();
    expect(screen.getByLabelText('Clinic name')).toHaveValue(saved.name);
    expect(screen.getByLabelText('Phone')).toHaveValue('01632 960 418');
    expect(screen.getByLabelText('Address')).toHaveValue(saved.address);
    expect(screen.getByLabelText('E-mail (optional)')).toHaveValue('');
    expect(screen.getByText(/Last changed/)).toHaveTextContent(`by ${admin.name}`);
    expect(screen.getByRole('link', { name: 'Clinic details' })).toHaveAttribute('aria-current', 'page');
  });

  it('starts from empty fields and says what e-mails say until the details are set', async () => {
    await openClinicPage(DEFAULT_CLINIC_SETTINGS);
    expect(screen.getByLabelText('Clinic name')).toHaveValue('');
    expect(screen.getByText(/e-mails say “the clinic” and give no phone number/)).toBeInTheDocument();
  });

  it('refuses a bad phone and a missing address with the shared schema, listing them and sending nothing', async () => {
    const { user, api } = await openClinicPage(DEFAULT_CLINIC_SETTINGS);
    await user.type(screen.getByLabelText('Clinic name'), 'Willowmere');
    await user.type(screen.getByLabelText('Phone'), 'ring us');
    await user.click(screen.getByRole('button', { name: 'Save clinic details' }));

    const summary = await screen.findByRole('group', { name: '2 fields need attention' });
    expect(summary).toHaveFocus();
    // Messages from shared/src/schemas/clinic-settings.schema.ts.
    expect(within(summary).getByRole('link', { name: /^Phone: Enter a phone number/ })).toBeInTheDocument();
    expect(
      within(summary).getByRole('link', { name: 'Address: Enter the clinic’s address.' }),
    ).toBeInTheDocument();
    expect(screen.getByLabelText('Phone')).toHaveAttribute('aria-invalid', 'true');
    expect(api.requestsTo('PUT /api/clinic-settings')).toHaveLength(0);
  });

  it('saves every field with the CSRF header, then announces it and moves focus to the message', async () => {
    let current = DEFAULT_CLINIC_SETTINGS;
    const { user, api } = await openClinicPage(DEFAULT_CLINIC_SETTINGS, {
      'GET /api/clinic-settings': () => ({ body: current }),
      'PUT /api/clinic-settings': (request) => {
        current = { ...saved, ...(request.body as object), email: 'desk@willowmere.example' };
        return { body: current };
      },
    });
    await user.type(screen.getByLabelText('Clinic name'), `  ${saved.name}`);
    await user.type(screen.getByLabelText('Phone'), saved.phone);
    await user.type(screen.getByLabelText('Address'), 'Unit 4{Enter}Willowmere');
    await user.type(screen.getByLabelText('E-mail (optional)'), 'Desk@Willowmere.example');
    await user.click(screen.getByRole('button', { name: 'Save clinic details' }));

    const status = await screen.findByText('Clinic details saved. The next progress e-mails use them.');
    await waitFor(() => expect(status.closest('[role="status"]')).toHaveFocus());
    const [put] = api.requestsTo('PUT /api/clinic-settings');
    expect(put?.headers.get('X-CSRF-Token')).toBe(CSRF_TOKEN);
    // Trimmed and lower-cased by the shared schema; empty website sent as null.
    expect(put?.body).toEqual({
      name: saved.name,
      phone: saved.phone,
      address: 'Unit 4\nWillowmere',
      email: 'desk@willowmere.example',
      website: null,
    });
    // The form shows what was stored.
    expect(screen.getByLabelText('E-mail (optional)')).toHaveValue('desk@willowmere.example');
  });
});
