import { screen, waitFor, within } from '@testing-library/react';
import { AUDIT_DATE_RANGE_MESSAGE } from '@keyloom/shared';
import { describe, expect, it } from 'vitest';
import { ASHBY_ID, auditEvent, clientSummary, sessionUser, staffUser } from '@/testing/data';
import { mockFetch, sessionRoutes } from '@/testing/mock-fetch';
import { currentUrl, renderApp } from '@/testing/render-app';

const clinician = staffUser('clinician');

const openAudit = async (role: 'admin' | 'supervisor', url = '/audit') => {
  const api = mockFetch({
    ...sessionRoutes(sessionUser(role)),
    'GET /api/clients': { body: [clientSummary()] },
    'GET /api/users': { body: [clinician, staffUser('admin')] },
    'GET /api/audit': (request) => {
      const page = Number(new URL(request.path, 'http://x').searchParams.get('page') ?? '1');
      return {
        body: {
          items: [
            auditEvent({ id: String(200 - page) }),
            auditEvent({ id: `${page}b`, action: 'consent.withdraw', details: { samplesDeleted: 3 } }),
          ],
          total: 120,
          page,
          pageSize: 50,
        },
      };
    },
  });
  const app = renderApp(url);
  await screen.findByRole('table', { name: /Events/ });
  return { ...app, api };
};

describe('Audit log', () => {
  it('lists events newest first with the action in plain words and a details summary', async () => {
    await openAudit('supervisor');
    expect(screen.getByRole('table', { name: 'Events 1–2 of 120, newest first' })).toBeInTheDocument();
    const table = within(screen.getByRole('table'));
    expect(table.getByText('Uploaded a language sample')).toBeInTheDocument();
    expect(table.getByText('Recorded a consent withdrawal')).toBeInTheDocument();
    expect(table.getByText('samplesDeleted: 3')).toBeInTheDocument();
    // When: CLDR's en-GB medium date and short time, "d MMM y, HH:mm" (Unicode CLDR); tests run in UTC.
    const when = table.getAllByRole('rowheader').map((cell) => cell.querySelector('time')?.textContent);
    expect(when).toEqual(['15 Sept 2026, 08:00', '15 Sept 2026, 08:00']);
    expect(screen.getByText('Page 1 of 3')).toBeInTheDocument();
  });

  it('builds the query string from the chosen filters and keeps them in the address', async () => {
    const { user, api, router } = await openAudit('admin');
    const form = within(screen.getByRole('form', { name: 'Filter the audit log' }));
    await waitFor(() =>
      expect(
        within(form.getByLabelText('Who')).getByRole('option', { name: /Dr\. Tomasz Reyes/ }),
      ).toBeInTheDocument(),
    );
    await user.selectOptions(form.getByLabelText('Client'), 'R. Ashby');
    await user.selectOptions(form.getByLabelText('Who'), 'Dr. Tomasz Reyes (clinician@willowmere.example)');
    await user.selectOptions(form.getByLabelText('Action'), 'All consent events');
    // The date boxes say the order of their parts (jsdom's browser language is en-US: month first).
    expect(form.getByLabelText('From')).toHaveAccessibleDescription('Month, day, year, e.g. 09/14/2026.');
    expect(form.getByLabelText('To')).toHaveAccessibleDescription('Month, day, year, e.g. 09/14/2026.');
    await user.type(form.getByLabelText('From'), '2026-09-01');
    await user.type(form.getByLabelText('To'), '2026-09-30');
    await user.click(form.getByRole('button', { name: 'Show events' }));

    const expected = `?clientId=${ASHBY_ID}&userId=${clinician.id}&action=consent.&from=2026-09-01&to=2026-09-30`;
    await waitFor(() => expect(api.requests.map((r) => r.path)).toContain(`/api/audit${expected}`));
    expect(currentUrl(router)).toBe(`/audit${expected}`);

    await user.click(screen.getByRole('button', { name: 'Older events' }));
    await waitFor(() => expect(api.requests.map((r) => r.path)).toContain(`/api/audit${expected}&page=2`));

    await user.click(screen.getByRole('button', { name: 'Clear filters' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/audit'));
    // The unfiltered first page is served from the cache; the form is empty again.
    expect(screen.getByLabelText('Client')).toHaveValue('');
    expect(screen.getByLabelText('Action')).toHaveValue('');
  });

  it('lets a supervisor filter by the people on the page without asking for the staff list', async () => {
    const { api } = await openAudit('supervisor');
    const who = screen.getByLabelText('Who');
    expect(within(who).getByRole('option', { name: 'clinician@willowmere.example' })).toBeInTheDocument();
    expect(api.requestsTo('GET /api/users')).toHaveLength(0);
  });

  it('is not offered to clinicians', async () => {
    mockFetch(sessionRoutes(sessionUser('clinician')));
    renderApp('/audit');
    expect(await screen.findByRole('heading', { level: 1, name: 'Not allowed' })).toBeInTheDocument();
  });

  it('shows each event in the API’s words and links the CSV of the filtered events', async () => {
    await openAudit('admin', `/audit?clientId=${ASHBY_ID}&action=consent.&page=2`);
    const table = within(screen.getByRole('table'));
    expect(table.getAllByText('Dr. Tomasz Reyes: Uploaded a language sample (R. Ashby)')).toHaveLength(2);
    // The CSV holds every page, so the page number is left out.
    expect(screen.getByRole('link', { name: 'Download CSV of these events' })).toHaveAttribute(
      'href',
      `/api/audit.csv?clientId=${ASHBY_ID}&action=consent.`,
    );
  });

  it('refuses a "To" day before the "From" day with the shared message, focusing the summary', async () => {
    const { user, api } = await openAudit('supervisor');
    const before = api.requestsTo('GET /api/audit').length;
    await user.type(screen.getByLabelText('From'), '2026-09-15');
    await user.type(screen.getByLabelText('To'), '2026-09-14');
    await user.click(screen.getByRole('button', { name: 'Show events' }));

    const summary = await screen.findByRole('group', { name: 'One field needs attention' });
    await waitFor(() => expect(summary).toHaveFocus());
    // The message of shared/src/schemas/audit.schema.ts, the one the API answers with.
    expect(
      within(summary).getByRole('link', { name: `To: ${AUDIT_DATE_RANGE_MESSAGE}` }),
    ).toBeInTheDocument();
    expect(api.requestsTo('GET /api/audit')).toHaveLength(before);
  });
});
