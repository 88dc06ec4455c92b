import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { clientRecord, clientSummary, sessionUser } from '@/testing/data';
import { type MockRoutes, mockFetch, sessionRoutes } from '@/testing/mock-fetch';
import { expectErrorSummary } from '@/testing/error-summary';
import { currentUrl, renderApp } from '@/testing/render-app';

const ashby = clientSummary();
const brennan = clientSummary({
  id: '1e2d3c4b-5a69-4788-9a6b-5c4d3e2f1a02',
  pseudonym: 'M. Brennan',
  accessMethod: 'switch',
  consentStatus: 'none',
  trainingConsent: false,
  sampleCount: 0,
  updatedAt: '2026-10-02T08:00:00.000Z',
});
const calloway = clientSummary({
  id: '2f3e4d5c-6b7a-4899-8a7b-6d5e4f3a2b03',
  pseudonym: 'J. Calloway',
  accessMethod: 'eye_gaze',
  consentStatus: 'withdrawn',
  trainingConsent: false,
  sampleCount: 7,
  updatedAt: '2026-08-11T08:00:00.000Z',
});

const openCaseload = async (
  routes: MockRoutes = {},
  url = '/caseload',
  role: 'clinician' | 'supervisor' = 'clinician',
) => {
  const api = mockFetch({
    ...sessionRoutes(sessionUser(role)),
    'GET /api/clients': { body: [brennan, ashby, calloway] },
    ...routes,
  });
  const app = renderApp(url);
  await screen.findByRole('table', { name: /clients/i });
  return { ...app, api };
};

const pseudonyms = () =>
  within(screen.getByRole('table'))
    .getAllByRole('rowheader')
    .map((cell) => cell.querySelector('a')?.textContent);

describe('Caseload', () => {
  it('sorts by pseudonym first and by any column from its header button, with aria-sort', async () => {
    const { user } = await openCaseload();
    expect(pseudonyms()).toEqual(['J. Calloway', 'M. Brennan', 'R. Ashby']);
    const pseudonymHeader = screen.getByRole('columnheader', { name: /Pseudonym/ });
    expect(pseudonymHeader).toHaveAttribute('aria-sort', 'ascending');

    await user.click(screen.getByRole('button', { name: /Samples/ }));
    expect(pseudonyms()).toEqual(['M. Brennan', 'R. Ashby', 'J. Calloway']); // 0, 3, 7
    expect(screen.getByRole('columnheader', { name: /Samples/ })).toHaveAttribute('aria-sort', 'ascending');
    expect(pseudonymHeader).toHaveAttribute('aria-sort', 'none');

    await user.click(screen.getByRole('button', { name: /Samples/ }));
    expect(pseudonyms()).toEqual(['J. Calloway', 'R. Ashby', 'M. Brennan']);
    expect(screen.getByRole('columnheader', { name: /Samples/ })).toHaveAttribute('aria-sort', 'descending');

    // Last change: newest first on the first press.
    await user.click(screen.getByRole('button', { name: /Last change/ }));
    expect(pseudonyms()).toEqual(['M. Brennan', 'R. Ashby', 'J. Calloway']);

    // Consent: active, expired, withdrawn, none.
    await user.click(screen.getByRole('button', { name: /Consent/ }));
    expect(pseudonyms()).toEqual(['R. Ashby', 'J. Calloway', 'M. Brennan']);

    // Access method, by its words: Eye gaze < Head pointer < Switch scanning.
    await user.click(screen.getByRole('button', { name: /Access method/ }));
    expect(pseudonyms()).toEqual(['J. Calloway', 'R. Ashby', 'M. Brennan']);
  });

  it('searches by pseudonym, ignoring case, and says how many match', async () => {
    const { user } = await openCaseload();
    await user.type(screen.getByRole('searchbox', { name: 'Search by pseudonym' }), 'ASH');
    expect(pseudonyms()).toEqual(['R. Ashby']);
    expect(screen.getByText('1 of 3 clients match “ASH”.')).toBeInTheDocument();
    expect(screen.getByRole('table', { name: 'Your clients (1)' })).toBeInTheDocument();
  });

  it('validates a new client with the shared schema and offers the timing that fits the method', async () => {
    const { user, api } = await openCaseload();
    await user.click(screen.getByRole('button', { name: 'New client' }));
    const form = within(await screen.findByRole('dialog', { name: 'New client' }));

    // Direct touch first: time per key with the default from defaultAccessTiming.
    expect(form.getByLabelText('Time per key (ms)')).toHaveValue(1500);
    await user.selectOptions(form.getByLabelText('Access method'), 'Switch scanning');
    expect(form.queryByLabelText('Time per key (ms)')).not.toBeInTheDocument();
    const scan = form.getByLabelText('Scan interval (ms)');
    expect(scan).toHaveValue(1000);
    expect(scan).toHaveAccessibleDescription(/each scan step stays highlighted/);

    await user.clear(scan);
    await user.type(scan, '50');
    await user.click(form.getByRole('button', { name: 'Create client' }));
    // Messages from shared/src/schemas/clients.schema.ts.
    expect(await form.findByText('Enter a pseudonym.')).toBeInTheDocument();
    expect(form.getByText('The scan interval must be at least 100 ms.')).toBeInTheDocument();
    expect(form.getByLabelText('Pseudonym')).toHaveAttribute('aria-invalid', 'true');
    expect(api.requestsTo('POST /api/clients')).toHaveLength(0);
  });

  it('creates the client with only the matching timing and opens its page', async () => {
    const created = clientRecord({
      id: '3a4b5c6d-7e8f-4a0b-9c1d-2e3f4a5b6c04',
      pseudonym: 'T. Marsh',
      accessMethod: 'eye_gaze',
      dwellMs: 700,
      keyTimeMs: null,
    });
    const { user, api, router } = await openCaseload({
      'POST /api/clients': { status: 201, body: created },
      [`GET /api/clients/${created.id}`]: { body: created },
    });
    await user.click(screen.getByRole('button', { name: 'New client' }));
    const form = within(await screen.findByRole('dialog', { name: 'New client' }));
    await user.type(form.getByLabelText('Pseudonym'), 'T. Marsh');
    expect(form.getByLabelText('Preferred name (optional)')).toHaveAccessibleDescription(
      'What the family calls them in e-mails; the app keeps using the pseudonym.',
    );
    await user.type(form.getByLabelText('Preferred name (optional)'), '  Tam ');
    await user.selectOptions(form.getByLabelText('Access method'), 'Eye gaze with dwell');
    await user.clear(form.getByLabelText('Dwell time (ms)'));
    await user.type(form.getByLabelText('Dwell time (ms)'), '700');
    await user.click(form.getByRole('button', { name: 'Create client' }));

    await screen.findByRole('heading', { level: 1, name: 'T. Marsh' });
    expect(currentUrl(router)).toBe(`/clients/${created.id}/overview`);
    expect(api.requestsTo('POST /api/clients')[0]?.body).toEqual({
      pseudonym: 'T. Marsh',
      preferredName: 'Tam',
      accessMethod: 'eye_gaze',
      scanIntervalMs: null,
      dwellMs: 700,
      keyTimeMs: null,
      goals: null,
      notes: null,
    });
  });

  it('submits when a hidden timing field (of a method not chosen) holds an invalid value', async () => {
    const created = clientRecord({
      id: '3a4b5c6d-7e8f-4a0b-9c1d-2e3f4a5b6c05',
      pseudonym: 'H. Hidden',
      accessMethod: 'switch',
      scanIntervalMs: 1000,
      keyTimeMs: null,
    });
    const { user, api } = await openCaseload({
      'POST /api/clients': { status: 201, body: created },
      [`GET /api/clients/${created.id}`]: { body: created },
    });
    await user.click(screen.getByRole('button', { name: 'New client' }));
    const form = within(await screen.findByRole('dialog', { name: 'New client' }));
    await user.type(form.getByLabelText('Pseudonym'), 'H. Hidden');
    // Direct touch first: a time per key out of range, then another method hides that field.
    await user.clear(form.getByLabelText('Time per key (ms)'));
    await user.type(form.getByLabelText('Time per key (ms)'), '5');
    await user.selectOptions(form.getByLabelText('Access method'), 'Switch scanning');
    expect(form.queryByLabelText('Time per key (ms)')).not.toBeInTheDocument();
    await user.click(form.getByRole('button', { name: 'Create client' }));

    await screen.findByRole('heading', { level: 1, name: 'H. Hidden' });
    expect(api.requestsTo('POST /api/clients')[0]?.body).toMatchObject({
      accessMethod: 'switch',
      scanIntervalMs: 1000,
      dwellMs: null,
      keyTimeMs: null,
    });
  });

  it('lists what a refused new client lacks at the top and moves focus there', async () => {
    const { user, api } = await openCaseload();
    await user.click(screen.getByRole('button', { name: 'New client' }));
    const form = within(await screen.findByRole('dialog', { name: 'New client' }));
    await user.clear(form.getByLabelText('Time per key (ms)'));
    await user.type(form.getByLabelText('Time per key (ms)'), '5');
    await user.click(form.getByRole('button', { name: 'Create client' }));
    await expectErrorSummary(screen.getByRole('dialog', { name: 'New client' }), '2 fields need attention', [
      'Pseudonym: Enter a pseudonym.',
      'Time per key (ms): The time per key must be at least 100 ms.',
    ]);
    expect(api.requestsTo('POST /api/clients')).toHaveLength(0);
  });

  it('shows a supervisor every client with the clinician and no "New client"', async () => {
    await openCaseload({}, '/clients', 'supervisor');
    expect(screen.getByRole('heading', { level: 1, name: 'Clients' })).toBeInTheDocument();
    expect(screen.getByRole('columnheader', { name: 'Clinician' })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'New client' })).not.toBeInTheDocument();
  });

  it('says what went wrong when the list cannot be loaded', async () => {
    mockFetch({
      ...sessionRoutes(sessionUser('clinician')),
      'GET /api/clients': {
        status: 503,
        body: { statusCode: 503, message: 'The database is not answering.' },
      },
    });
    renderApp('/caseload');
    await waitFor(() =>
      expect(screen.getByRole('alert')).toHaveTextContent('The database is not answering.'),
    );
  });
});
