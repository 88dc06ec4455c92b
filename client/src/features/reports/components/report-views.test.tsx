import { reportCautions } from '@keyloom/shared';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { profileVersion, VERSION_1_ID } from '@/features/profiles/testing/profile-data';
import { ASHBY_ID, clientRecord, sessionUser } from '@/testing/data';
import { expectErrorSummary } from '@/testing/error-summary';
import { mockFetch, sessionRoutes } from '@/testing/mock-fetch';
import { renderApp } from '@/testing/render-app';
import { clientReportData, versionReportData } from '../testing/report-data';

const versionReportUrl = `/api/profile-versions/${VERSION_1_ID}/report`;
const clientReportUrl = `/api/clients/${ASHBY_ID}/report`;

afterEach(() => {
  vi.restoreAllMocks();
});

describe('Version report (print view)', () => {
  const open = async () => {
    const report = versionReportData();
    const api = mockFetch({
      ...sessionRoutes(sessionUser('clinician')),
      [`GET ${versionReportUrl}`]: { body: report },
    });
    renderApp(`/clients/${ASHBY_ID}/profiles/${VERSION_1_ID}/report`);
    await screen.findByRole('heading', { level: 1, name: 'Version 1 report: R. Ashby' });
    return { api, report };
  };

  it('shows the letterhead, the trail, every figure with its explanation, the chart, trials, samples and cautions', async () => {
    const { report } = await open();
    const article = screen.getByRole('article', { name: 'Version 1 report' });
    expect(within(article).getByText('Willowmere Speech Clinic')).toBeInTheDocument();
    expect(within(article).getByText('Phone 01632 960 418')).toBeInTheDocument();
    const results = screen.getByRole('region', { name: 'Results' });
    // Every figure of the shared versionFigures, in its words and order.
    const terms = within(results)
      .getAllByRole('term')
      .map((term) => term.textContent);
    expect(terms).toEqual(report.figures.map((f) => f.label));
    expect(terms).toContain('Keystroke savings');
    expect(terms).toContain('Hit rate');
    for (const figure of report.figures) {
      expect(within(results).getByText(figure.value)).toBeInTheDocument();
      expect(within(results).getByText(figure.explanation)).toBeInTheDocument();
    }
    expect(within(results).getByRole('img', { name: report.chart?.alt })).toBeInTheDocument();
    const trail = screen.getByRole('region', { name: 'Approval trail' });
    expect(within(trail).getByText('24 Sept 2026 by Maya Lindqvist')).toBeInTheDocument();
    expect(within(trail).getByText('not yet')).toBeInTheDocument();
    expect(
      within(screen.getByRole('region', { name: 'Trials on the test keyboard' })).getByText(
        '2 trials; mean measured words per minute: 3.4.',
      ),
    ).toBeInTheDocument();
    const samples = screen.getByRole('region', { name: 'Samples it was trained on' });
    expect(
      within(samples)
        .getAllByRole('listitem')
        .map((li) => li.textContent),
    ).toEqual(['Sailing club diary: 12,040 characters', 'Messages to Hannah: 1,210 characters']);
    const cautions = screen.getByRole('region', { name: 'Please keep in mind' });
    expect(
      within(cautions)
        .getAllByRole('listitem')
        .map((li) => li.textContent),
    ).toEqual([...reportCautions]);
    expect(screen.getByText('Printed 4 Dec 2026')).toBeInTheDocument();
  });

  it('"Print" opens the browser’s printing; "Download PDF" points at the API’s PDF', async () => {
    await open();
    const print = vi.spyOn(window, 'print').mockImplementation(() => undefined);
    await userEvent.click(screen.getByRole('button', { name: 'Print' }));
    expect(print).toHaveBeenCalledTimes(1);
    expect(screen.getByRole('link', { name: 'Download PDF' })).toHaveAttribute(
      'href',
      `${versionReportUrl}.pdf`,
    );
  });

  it('a version with no report yet says why (the API’s 409 message)', async () => {
    mockFetch({
      ...sessionRoutes(sessionUser('clinician')),
      [`GET ${versionReportUrl}`]: {
        status: 409,
        body: {
          statusCode: 409,
          message: 'This version has not been trained, so it has no results to report yet.',
        },
      },
    });
    renderApp(`/clients/${ASHBY_ID}/profiles/${VERSION_1_ID}/report`);
    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('This version has not been trained, so it has no results to report yet.');
  });
});

describe('Client report (print view)', () => {
  it('the period, the versions’ table, trials and cautions; another period is asked of the API', async () => {
    const api = mockFetch({
      ...sessionRoutes(sessionUser('supervisor')),
      [`GET ${clientReportUrl}`]: (request) =>
        request.path.includes('from=2026-10-01')
          ? {
              body: clientReportData({
                period: { from: '2026-10-01', to: '2026-10-31', fromOn: '1 Oct 2026', toOn: '31 Oct 2026' },
                versions: [],
                charts: [],
                trials: [],
              }),
            }
          : { body: clientReportData() },
    });
    renderApp(`/clients/${ASHBY_ID}/report`);
    await screen.findByRole('heading', { level: 1, name: 'Client report: R. Ashby' });
    expect(api.requestsTo(`GET ${clientReportUrl}`)).toHaveLength(1);
    const table = screen.getByRole('table');
    const cells = within(table)
      .getAllByRole('row')
      .slice(1)
      .map((row) =>
        within(row)
          .getAllByRole('cell')
          .map((cell) => cell.lastChild?.textContent),
      );
    expect(cells).toEqual([
      [
        'Active profile',
        '21 Sept 2026',
        '25 Sept 2026',
        '38.0%',
        '64% of words',
        '3.1 without suggestions, 4.2 with 3',
      ],
    ]);
    expect(screen.getByText('6 Sept 2026 to 4 Dec 2026')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Download PDF' })).toHaveAttribute(
      'href',
      `${clientReportUrl}.pdf?from=2026-09-06&to=2026-12-04`,
    );
    expect(
      within(screen.getByRole('region', { name: 'Please keep in mind' }))
        .getAllByRole('listitem')
        .map((li) => li.textContent),
    ).toEqual([...reportCautions]);

    const form = screen.getByRole('form', { name: 'Period of the report' });
    const from = within(form).getByLabelText('From');
    const to = within(form).getByLabelText('To');
    await userEvent.clear(from);
    await userEvent.type(from, '2026-10-01');
    await userEvent.clear(to);
    await userEvent.type(to, '2026-10-31');
    await userEvent.click(within(form).getByRole('button', { name: 'Show this period' }));
    await screen.findByText('No version was trained or approved in this period.');
    expect(api.requestsTo(`GET ${clientReportUrl}?from=2026-10-01&to=2026-10-31`)).toHaveLength(1);
    expect(screen.getByRole('status')).toHaveTextContent('Showing 1 Oct 2026 to 31 Oct 2026.');
  });

  it('a period that ends before it starts is refused in the error summary, with no request', async () => {
    const api = mockFetch({
      ...sessionRoutes(sessionUser('clinician')),
      [`GET ${clientReportUrl}`]: { body: clientReportData() },
    });
    renderApp(`/clients/${ASHBY_ID}/report`);
    const form = await screen.findByRole('form', { name: 'Period of the report' });
    const to = within(form).getByLabelText('To');
    await userEvent.clear(to);
    await userEvent.type(to, '2026-01-01');
    await userEvent.click(within(form).getByRole('button', { name: 'Show this period' }));
    await expectErrorSummary(form, 'One field needs attention', [
      'To: The period must end on or after its start.',
    ]);
    await waitFor(() => expect(api.requestsTo(`GET ${clientReportUrl}`)).toHaveLength(1));
  });
});

describe('Links to the printed reports', () => {
  const openVersionPage = async (role: 'clinician' | 'carer', status: 'trained' | 'draft') => {
    mockFetch({
      ...sessionRoutes(sessionUser(role)),
      [`GET /api/clients/${ASHBY_ID}`]: { body: clientRecord() },
      [`GET /api/profile-versions/${VERSION_1_ID}`]: { body: profileVersion({ status }) },
      [`GET /api/profile-versions/${VERSION_1_ID}/trials`]: { body: [] },
    });
    renderApp(`/clients/${ASHBY_ID}/profiles/${VERSION_1_ID}`);
    await screen.findByRole('heading', { level: 1, name: 'Version 1 of R. Ashby’s profile' });
  };

  it('a trained version’s page links its report for clinicians; not for carers, not for a draft', async () => {
    await openVersionPage('clinician', 'trained');
    expect(screen.getByRole('link', { name: 'Report for printing' })).toHaveAttribute(
      'href',
      `/clients/${ASHBY_ID}/profiles/${VERSION_1_ID}/report`,
    );
  });

  it.each([
    ['carer', 'trained'],
    ['clinician', 'draft'],
  ] as const)('no report link for a %s on a %s version', async (role, status) => {
    await openVersionPage(role, status);
    expect(screen.queryByRole('link', { name: 'Report for printing' })).not.toBeInTheDocument();
  });
});
