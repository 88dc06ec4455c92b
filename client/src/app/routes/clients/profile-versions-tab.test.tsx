import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import {
  profileVersion,
  reportFixture,
  VERSION_1_ID,
  VERSION_2_ID,
} from '@/features/profiles/testing/profile-data';
import { clientVocabularyState } from '@/features/vocabulary/testing/vocabulary-data';
import { ASHBY_ID, clientRecord, sampleSummary, sessionUser } from '@/testing/data';
import { type MockRoutes, mockFetch } from '@/testing/mock-fetch';
import { sessionRoutes } from '@/testing/mock-fetch';
import { currentUrl, renderApp } from '@/testing/render-app';

const base = `/api/clients/${ASHBY_ID}`;
const DIARY_ID = '9c4d5e6f-7a8b-4c0d-9e2f-3a4b5c6d7e82';
const LEFT_OUT_ID = '9c4d5e6f-7a8b-4c0d-9e2f-3a4b5c6d7e83';

const samples = [
  sampleSummary({ status: 'ready', characters: 14_000 }),
  sampleSummary({ id: DIARY_ID, title: 'Diary, August', status: 'ready', characters: 10_180 }),
  sampleSummary({ id: LEFT_OUT_ID, title: 'Old emails', status: 'excluded' }),
];

// A cell's value without the column name it shows when rows become cards on narrow screens.
const cellValue = (cell: HTMLElement) => cell.lastChild?.textContent;

const openTab = async (routes: MockRoutes = {}, role: 'clinician' | 'supervisor' | 'carer' = 'clinician') => {
  const api = mockFetch({
    ...sessionRoutes(sessionUser(role)),
    [`GET ${base}`]: { body: clientRecord() },
    [`GET ${base}/samples`]: { body: samples },
    [`GET ${base}/profile-versions`]: { body: [] },
    [`GET ${base}/vocabulary`]: { body: clientVocabularyState() },
    ...routes,
  });
  const app = renderApp(`/clients/${ASHBY_ID}/profiles`);
  await screen.findByRole('heading', { level: 1, name: 'R. Ashby' });
  return { ...app, api };
};

describe('Profile versions tab', () => {
  it('shows a carer each version with what to try, no measures and no comparing', async () => {
    await openTab(
      {
        [`GET ${base}/profile-versions`]: {
          body: [
            profileVersion({ id: VERSION_2_ID, number: 2, status: 'training', progress: 0.4, metrics: null }),
            profileVersion(),
          ],
        },
      },
      'carer',
    );
    const table = within(await screen.findByRole('table', { name: 'Profile versions of R. Ashby' }));
    expect(table.getAllByRole('columnheader').map((header) => header.textContent)).toEqual([
      'Version',
      'Status',
      'Created',
      'What to try',
    ]);
    expect(table.getByRole('link', { name: 'Try version 1 on the test keyboard' })).toHaveAttribute(
      'href',
      expect.stringContaining(VERSION_1_ID),
    );
    expect(table.getAllByRole('row')[1]).toHaveTextContent('Nothing to try now');
    expect(screen.queryByRole('button', { name: /^Compare/ })).not.toBeInTheDocument();
    expect(screen.queryByText(/36\.7%|Keystroke savings/)).not.toBeInTheDocument();
  });

  it('lists versions with status and headline figures at their slots', async () => {
    await openTab({
      [`GET ${base}/profile-versions`]: {
        body: [
          profileVersion({ id: VERSION_2_ID, number: 2, status: 'training', progress: 0.4, metrics: null }),
          profileVersion(),
        ],
      },
    });
    const table = within(await screen.findByRole('table', { name: 'Profile versions of R. Ashby' }));
    const rows = table.getAllByRole('row').slice(1);
    expect(rows[0]).toHaveTextContent('Version 2');
    expect(rows[0]).toHaveTextContent('Training');
    expect(rows[1]).toHaveTextContent('Ready for trial');
    // KS 0.367 and hit rate 0.65 at 5 slots in the fixture; bits per character are not listed.
    expect(rows[1]).toHaveTextContent('36.7% at 5 slots');
    expect(rows[1]).toHaveTextContent('65%');
    expect(rows[1]).not.toHaveTextContent('2.412');
    expect(table.getByRole('link', { name: 'Version 1' })).toHaveAttribute(
      'href',
      `/clients/${ASHBY_ID}/profiles/${VERSION_1_ID}`,
    );
    // An untrained version cannot be compared.
    expect(table.getByRole('checkbox', { name: 'Compare version 2' })).toBeDisabled();
  });

  it('opens the form with the defaults: every ready sample, order 5, method C, 5 slots, the client’s timing', async () => {
    const { user } = await openTab();
    await user.click(await screen.findByRole('button', { name: 'New version' }));
    const form = within(screen.getByRole('form', { name: 'New profile version' }));
    expect(form.getByRole('checkbox', { name: 'Messages to the sailing club' })).toBeChecked();
    expect(form.getByRole('checkbox', { name: 'Diary, August' })).toBeChecked();
    expect(form.queryByRole('checkbox', { name: 'Old emails' })).not.toBeInTheDocument();
    expect(form.getByLabelText('Context order')).toHaveValue(5);
    expect(form.getByLabelText('Escape method')).toHaveValue('C');
    expect(form.getByLabelText('Escape method')).toHaveAccessibleDescription(/the usual default/);
    expect(form.getByRole('checkbox', { name: 'Exclusion' })).toBeChecked();
    expect(form.getByRole('checkbox', { name: 'Ignore capitals' })).not.toBeChecked();
    expect(form.getByRole('radio', { name: /Automatic/ })).toBeChecked();
    expect(form.getByLabelText('Suggestion slots')).toHaveValue(5);
    // The demo client uses a head pointer: his record's time per key is the timing.
    expect(form.getByLabelText('Access method for the speed estimate')).toHaveValue('head_pointer');
    expect(form.getByLabelText('Time per key (ms)')).toHaveValue(1800);
    expect(form.queryByLabelText('Dwell time (ms)')).not.toBeInTheDocument();
    expect(form.queryByLabelText('Scan interval (ms)')).not.toBeInTheDocument();
  });

  it('says the new version takes the client’s current list, with its counts and a link to it', async () => {
    const { user } = await openTab({ [`GET ${base}/profile-versions`]: { body: [profileVersion()] } });
    await user.click(await screen.findByRole('button', { name: 'New version' }));
    const form = within(screen.getByRole('form', { name: 'New profile version' }));
    // The fixture list: two additions and one block.
    expect(
      await form.findByText(/this version will use the client’s current list \(2 added, 1 blocked\)/),
    ).toBeInTheDocument();
    expect(form.getByRole('link', { name: 'Review the list on the vocabulary page' })).toHaveAttribute(
      'href',
      `/clients/${ASHBY_ID}/profiles/${VERSION_1_ID}/vocabulary`,
    );
  });

  it('says where the list is kept when the client has no version yet', async () => {
    const { user } = await openTab();
    await user.click(await screen.findByRole('button', { name: 'New version' }));
    const form = within(screen.getByRole('form', { name: 'New profile version' }));
    expect(await form.findByText(/\(2 added, 1 blocked\)/)).toBeInTheDocument();
    expect(form.getByText(/once the first version exists/)).toBeInTheDocument();
  });

  it('says how much writing is needed and how much the ticked samples hold, as samples are ticked', async () => {
    const short = [
      sampleSummary({ status: 'ready', characters: 29 }),
      sampleSummary({ id: DIARY_ID, title: 'Diary, August', status: 'ready', characters: 480 }),
    ];
    const { user } = await openTab({ [`GET ${base}/samples`]: { body: short } });
    await user.click(await screen.findByRole('button', { name: 'New version' }));
    const form = within(screen.getByRole('form', { name: 'New profile version' }));
    const group = form.getByRole('group', { name: 'Writing samples to learn from' });
    // Both ticked: 29 + 480 = 509 of the 500 needed.
    expect(group).toHaveAccessibleDescription(
      expect.stringContaining('Needed: at least 500 characters of writing. Chosen: 509 characters.'),
    );
    await user.click(form.getByRole('checkbox', { name: 'Diary, August' }));
    expect(group).toHaveAccessibleDescription(
      expect.stringContaining('Chosen: 29 characters (471 more needed).'),
    );
    await user.click(form.getByRole('checkbox', { name: 'Diary, August' }));
    expect(group).toHaveAccessibleDescription(expect.stringContaining('Chosen: 509 characters.'));
  });

  it('validates with the shared schema: order, slots, the weight and at least one sample', async () => {
    const { user, api } = await openTab();
    await user.click(await screen.findByRole('button', { name: 'New version' }));
    const form = within(screen.getByRole('form', { name: 'New profile version' }));
    expect(form.getByLabelText('Context order').closest('details')).not.toHaveAttribute('open');
    await user.clear(form.getByLabelText('Context order'));
    await user.type(form.getByLabelText('Context order'), '13');
    await user.clear(form.getByLabelText('Suggestion slots'));
    await user.type(form.getByLabelText('Suggestion slots'), '0');
    await user.click(form.getByRole('radio', { name: 'A fixed value' }));
    await user.clear(form.getByLabelText('Weight, 0 to 1'));
    await user.type(form.getByLabelText('Weight, 0 to 1'), '1.5');
    await user.click(form.getByRole('checkbox', { name: 'Messages to the sailing club' }));
    await user.click(form.getByRole('checkbox', { name: 'Diary, August' }));
    await user.click(form.getByRole('button', { name: 'Train this version' }));

    expect(await form.findByText('Choose a context order from 1 to 12.')).toBeInTheDocument();
    expect(form.getByText('Choose 1 to 10 suggestion slots.')).toBeInTheDocument();
    expect(form.getByText('Enter a base-model weight from 0 to 1, or choose automatic.')).toBeInTheDocument();
    expect(form.getByText('Choose at least one sample.')).toBeInTheDocument();
    expect(form.getByLabelText('Context order')).toHaveAttribute('aria-invalid', 'true');
    // The context order sits under Engine details, closed at first: a refused value opens them.
    expect(form.getByLabelText('Context order').closest('details')).toHaveAttribute('open');
    // The refused fields are listed at the top, and focus moves to that list.
    const summary = await form.findByRole('group', { name: /fields need attention/ });
    await waitFor(() => expect(summary).toHaveFocus());
    const listed = within(summary)
      .getAllByRole('link')
      .map((link) => link.textContent);
    expect(listed).toEqual(
      expect.arrayContaining([
        'Context order: Choose a context order from 1 to 12.',
        'Suggestion slots: Choose 1 to 10 suggestion slots.',
        'Writing samples to learn from: Choose at least one sample.',
      ]),
    );
    expect(api.requestsTo(`POST ${base}/profile-versions`)).toHaveLength(0);
  });

  it('creates the version with the chosen settings, starts training and opens its page', async () => {
    const created = profileVersion({
      id: VERSION_2_ID,
      number: 2,
      status: 'draft',
      progress: 0,
      metrics: null,
    });
    const training = { ...created, status: 'training' as const, stage: 'queued' };
    const { user, api, router } = await openTab({
      [`POST ${base}/profile-versions`]: { status: 201, body: created },
      [`POST /api/profile-versions/${VERSION_2_ID}/train`]: { body: training },
      [`GET /api/profile-versions/${VERSION_2_ID}`]: {
        body: { ...training, progress: 0.1, stage: 'preparing' },
      },
    });
    await user.click(await screen.findByRole('button', { name: 'New version' }));
    const form = within(screen.getByRole('form', { name: 'New profile version' }));
    await user.click(form.getByRole('checkbox', { name: 'Diary, August' }));
    await user.clear(form.getByLabelText('Context order'));
    await user.type(form.getByLabelText('Context order'), '6');
    await user.selectOptions(form.getByLabelText('Escape method'), 'D');
    await user.click(form.getByRole('radio', { name: 'A fixed value' }));
    await user.clear(form.getByLabelText('Weight, 0 to 1'));
    await user.type(form.getByLabelText('Weight, 0 to 1'), '0.25');
    await user.click(form.getByRole('button', { name: 'Train this version' }));

    await waitFor(() => expect(currentUrl(router)).toBe(`/clients/${ASHBY_ID}/profiles/${VERSION_2_ID}`));
    // No `vocabulary` in the settings: the API then freezes the client's current list into the version
    // (an empty list sent from the form's defaults would replace it).
    expect(api.requestsTo(`POST ${base}/profile-versions`)[0]?.body).toEqual({
      sampleIds: [samples[0]?.id],
      settings: {
        order: 6,
        escape: 'D',
        exclusion: true,
        baseWeight: 0.25,
        slots: 5,
        caseFold: false,
        access: { method: 'head_pointer', keyTimeMs: 1800 },
      },
    });
    expect(api.requestsTo(`POST /api/profile-versions/${VERSION_2_ID}/train`)).toHaveLength(1);
    // The version's page says so in its live region, and shows the progress bar.
    expect(await screen.findByText('Version 2 is training.')).toBeInTheDocument();
    await waitFor(() => expect(screen.getByRole('progressbar')).toHaveAttribute('aria-valuenow', '10'));
  });

  it('sends a list of sample ids even when only one sample is ready', async () => {
    const created = profileVersion({
      id: VERSION_2_ID,
      number: 2,
      status: 'draft',
      progress: 0,
      metrics: null,
    });
    const { user, api } = await openTab({
      [`GET ${base}/samples`]: { body: [sampleSummary({ status: 'ready', characters: 14_000 })] },
      [`POST ${base}/profile-versions`]: { status: 201, body: created },
      [`POST /api/profile-versions/${VERSION_2_ID}/train`]: { body: { ...created, status: 'training' } },
      [`GET /api/profile-versions/${VERSION_2_ID}`]: { body: { ...created, status: 'training' } },
    });
    await user.click(await screen.findByRole('button', { name: 'New version' }));
    await user.click(screen.getByRole('button', { name: 'Train this version' }));
    await waitFor(() => expect(api.requestsTo(`POST ${base}/profile-versions`)).toHaveLength(1));
    expect(api.requestsTo(`POST ${base}/profile-versions`)[0]?.body).toMatchObject({
      sampleIds: [samples[0]?.id],
    });
  });

  it('with too little writing, the form starts base-only: samples and weight hidden, none sent', async () => {
    const created = profileVersion({
      id: VERSION_2_ID,
      number: 2,
      status: 'draft',
      progress: 0,
      metrics: null,
      samples: [],
      baseOnly: true,
    });
    const { user, api } = await openTab({
      [`GET ${base}/samples`]: { body: [sampleSummary({ status: 'ready', characters: 29 })] },
      [`POST ${base}/profile-versions`]: { status: 201, body: created },
      [`POST /api/profile-versions/${VERSION_2_ID}/train`]: { body: { ...created, status: 'training' } },
      [`GET /api/profile-versions/${VERSION_2_ID}`]: { body: { ...created, status: 'training' } },
    });
    await user.click(await screen.findByRole('button', { name: 'New version' }));
    const form = within(screen.getByRole('form', { name: 'New profile version' }));
    const personal = form.getByRole('radio', { name: 'The client’s own writing' });
    expect(personal).toBeDisabled();
    expect(personal).toHaveAccessibleDescription(
      'Needs at least 500 characters of ready writing; there are 29.',
    );
    expect(form.getByRole('radio', { name: 'General English only (base-only)' })).toBeChecked();
    expect(form.queryByRole('group', { name: 'Writing samples to learn from' })).not.toBeInTheDocument();
    expect(
      form.queryByRole('group', { name: 'Weight of the general English model' }),
    ).not.toBeInTheDocument();
    expect(form.queryByLabelText('Context order')).not.toBeInTheDocument();
    await user.click(form.getByRole('button', { name: 'Train this version' }));
    await waitFor(() => expect(api.requestsTo(`POST ${base}/profile-versions`)).toHaveLength(1));
    const body = api.requestsTo(`POST ${base}/profile-versions`)[0]?.body as Record<string, unknown>;
    expect(body).toMatchObject({ baseOnly: true, settings: { baseWeight: 1 } });
    expect(body).not.toHaveProperty('sampleIds');
  });

  it('with enough writing a clinician can still choose base-only; switching back shows the samples', async () => {
    const { user } = await openTab();
    await user.click(await screen.findByRole('button', { name: 'New version' }));
    // Focus lands on the form it opened.
    await waitFor(() => expect(screen.getByRole('heading', { name: 'New profile version' })).toHaveFocus());
    const form = within(screen.getByRole('form', { name: 'New profile version' }));
    expect(form.getByRole('radio', { name: 'The client’s own writing' })).toBeChecked();
    await user.click(form.getByRole('radio', { name: 'General English only (base-only)' }));
    expect(form.queryByRole('group', { name: 'Writing samples to learn from' })).not.toBeInTheDocument();
    await user.click(form.getByRole('radio', { name: 'The client’s own writing' }));
    expect(form.getByRole('checkbox', { name: 'Diary, August' })).toBeChecked();
    // Cancel: back to the button that opened it.
    await user.click(form.getByRole('button', { name: 'Cancel' }));
    await waitFor(() => expect(screen.getByRole('button', { name: 'New version' })).toHaveFocus());
  });

  it('with no ready sample, New version is still offered (base-only), and base-only rows say so', async () => {
    await openTab({
      [`GET ${base}/samples`]: { body: [] },
      [`GET ${base}/profile-versions`]: {
        body: [profileVersion({ baseOnly: true, samples: [], metrics: null, baseWeight: 1 })],
      },
    });
    const button = await screen.findByRole('button', { name: 'New version' });
    expect(button).toBeEnabled();
    expect(button).toHaveAccessibleDescription(/can only use general English \(base-only\)/);
    const table = within(await screen.findByRole('table', { name: 'Profile versions of R. Ashby' }));
    const row = table.getAllByRole('row')[1];
    expect(row).toHaveTextContent('General English only');
    expect(row).toHaveTextContent('Not measured (trial only)');
  });

  it('compares two ticked versions in a table with the base model alone and one chart series per version', async () => {
    // Version 1 was trained before scan steps were measured per keyboard layout.
    const second = profileVersion({
      id: VERSION_2_ID,
      number: 2,
      metrics: reportFixture({ order: 6, bpcIdeal: 2.301 }),
    });
    const first = profileVersion({ metrics: reportFixture({ scanStepsByLayout: undefined }) });
    const { user, router } = await openTab({
      [`GET ${base}/profile-versions`]: { body: [second, first] },
      [`GET /api/profile-versions/${VERSION_1_ID}`]: { body: first },
      [`GET /api/profile-versions/${VERSION_2_ID}`]: { body: second },
    });
    const compare = await screen.findByRole('button', { name: 'Compare selected' });
    expect(compare).toBeDisabled();
    await user.click(screen.getByRole('checkbox', { name: 'Compare version 2' }));
    await user.click(screen.getByRole('checkbox', { name: 'Compare version 1' }));
    await user.click(screen.getByRole('button', { name: 'Compare 2 versions' }));
    await waitFor(() =>
      expect(currentUrl(router)).toBe(
        `/clients/${ASHBY_ID}/profiles/compare?ids=${VERSION_2_ID},${VERSION_1_ID}`,
      ),
    );

    const table = within(await screen.findByRole('table', { name: 'Versions compared' }));
    const headers = table.getAllByRole('columnheader').map((cell) => cell.textContent);
    expect(headers).toEqual(['Measure', 'Version 2', 'Version 1', 'General English alone']);
    // The clinic's words first; the engine's terms only under "Engine details".
    expect(table.queryByRole('row', { name: /Bits per character/ })).not.toBeInTheDocument();
    const hits = table.getByRole('row', { name: /Hit rate at 5 slots/ });
    expect(within(hits).getAllByRole('cell').map(cellValue)).toEqual(['65%', '65%', '53%']);
    const engineTable = screen.getByRole('table', { name: 'Engine settings and bits per character' });
    expect(engineTable.closest('details')).not.toHaveAttribute('open');
    const engine = within(engineTable);
    const bpc = engine.getByRole('row', { name: /Bits per character \(ideal\)/ });
    expect(within(bpc).getAllByRole('cell').map(cellValue)).toEqual(['2.301', '2.412', '2.980']);
    const order = engine.getByRole('row', { name: /Context order/ });
    expect(within(order).getAllByRole('cell').map(cellValue)).toEqual(['6', '5', '—']);
    // Scan steps: one row per key order of the test keyboard, named as its setting names them.
    const scanRows = table
      .getAllByRole('rowheader')
      .filter((header) => /^Scan steps per character/.test(cellValue(header) ?? ''))
      .map((header) => header.closest('tr') as HTMLElement);
    expect(
      scanRows.map((row) => [
        cellValue(within(row).getByRole('rowheader')),
        ...within(row).getAllByRole('cell').map(cellValue),
      ]),
    ).toEqual([
      ['Scan steps per character, Typewriter order', '7.42', 'Not measured', '—'],
      ['Scan steps per character, Alphabetical order', '8.15', 'Not measured', '—'],
      ['Scan steps per character, Ordered by the model', '5.37', 'Not measured', '—'],
    ]);
    expect(screen.getByText(/Not measured: Trained before scan steps were measured/)).toBeInTheDocument();

    // The chart's text alternative: one column per series, a row per list size.
    const figures = within(screen.getByRole('table', { name: /by version: the figures/ }));
    expect(figures.getAllByRole('columnheader').map((cell) => cell.textContent)).toEqual([
      'Slots',
      'Version 2',
      'Version 1',
      'General English alone',
    ]);
    expect(figures.getAllByRole('row')).toHaveLength(11);
  });

  it('lists the added and blocked words that differ between compared versions', async () => {
    const settings = profileVersion().settings;
    const first = profileVersion({
      settings: {
        ...settings,
        vocabulary: { additions: [{ text: 'Okafor' }], blocks: [{ word: 'lousy', replacement: undefined }] },
      },
    });
    const second = profileVersion({
      id: VERSION_2_ID,
      number: 2,
      settings: {
        ...settings,
        vocabulary: {
          additions: [{ text: 'Okafor' }, { text: 'Kestrel Point', weight: 10 }],
          blocks: [{ word: 'tommorow', replacement: 'tomorrow' }],
        },
      },
    });
    mockFetch({
      ...sessionRoutes(sessionUser('clinician')),
      [`GET ${base}`]: { body: clientRecord() },
      [`GET /api/profile-versions/${VERSION_1_ID}`]: { body: first },
      [`GET /api/profile-versions/${VERSION_2_ID}`]: { body: second },
    });
    renderApp(`/clients/${ASHBY_ID}/profiles/compare?ids=${VERSION_1_ID},${VERSION_2_ID}`);
    const section = within(
      (await screen.findByRole('heading', { name: 'Added and blocked words' })).closest('section')!,
    );
    expect(section.getByRole('heading', { name: 'Version 2 against version 1' })).toBeInTheDocument();
    const items = section.getAllByRole('listitem').map((item) => item.textContent);
    expect(items).toEqual([
      'Words added: Kestrel Point (weight 10)',
      'Words blocked: tommorow → tomorrow',
      'Blocks lifted: lousy',
    ]);
  });
});
