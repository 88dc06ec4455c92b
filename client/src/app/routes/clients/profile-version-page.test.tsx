import type { ProfileVersion, Role } from '@keyloom/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { trialRecord } from '@/features/keyboard/testing/trial-data';
import { profileVersion, reportFixture, VERSION_1_ID } from '@/features/profiles/testing/profile-data';
import { ASHBY_ID, clientRecord, sessionUser } from '@/testing/data';
import { type MockRoutes, mockFetch, sessionRoutes } from '@/testing/mock-fetch';
import { expectErrorSummary } from '@/testing/error-summary';
import { renderApp } from '@/testing/render-app';

const versionUrl = `/api/profile-versions/${VERSION_1_ID}`;

const openVersion = async (
  role: Role,
  version: ProfileVersion | (() => ProfileVersion),
  routes: MockRoutes = {},
) => {
  const api = mockFetch({
    ...sessionRoutes(sessionUser(role)),
    [`GET /api/clients/${ASHBY_ID}`]: { body: clientRecord() },
    [`GET ${versionUrl}`]: () => ({ body: typeof version === 'function' ? version() : version }),
    [`GET ${versionUrl}/trials`]: { body: [] },
    ...routes,
  });
  const app = renderApp(`/clients/${ASHBY_ID}/profiles/${VERSION_1_ID}`);
  await screen.findByRole('heading', { level: 1, name: 'Version 1 of R. Ashby’s profile' });
  return { ...app, api };
};

const cellValue = (cell: HTMLElement) => cell.lastChild?.textContent;
// A cell's text without the column name that cards show above it (its first child).
const cellText = (cell: HTMLElement) =>
  [...cell.childNodes]
    .slice(1)
    .map((node) => node.textContent)
    .join('');

describe('Profile version page', () => {
  it('a base-only version says it is general English only, has no samples and is measured by trial', async () => {
    await openVersion(
      'clinician',
      profileVersion({ baseOnly: true, samples: [], metrics: null, baseWeight: 1 }),
    );
    expect(screen.getByText('General English only')).toBeInTheDocument();
    expect(screen.getByText(/This version learns nothing from the client’s writing/)).toHaveTextContent(
      /the trial on the test keyboard measures it/,
    );
    expect(screen.queryByRole('heading', { name: 'Results' })).not.toBeInTheDocument();
    expect(screen.getByText('No samples: general English only.')).toBeInTheDocument();
    expect(screen.getByText('1 (general English alone)')).toBeInTheDocument();
    expect(screen.queryByText('Context order')).not.toBeInTheDocument();
    expect(screen.queryByRole('list', { name: 'Samples in this version' })).not.toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Try version 1 on the test keyboard' })).toBeInTheDocument();
  });

  it('says a training whose worker stopped is being retried, then moves on when the retry runs', async () => {
    const answers = [
      profileVersion({ status: 'training', progress: 0, stage: 'interrupted', metrics: null }),
      profileVersion({ status: 'training', progress: 0.4, stage: 'training', metrics: null }),
    ];
    let asked = 0;
    await openVersion('clinician', () => answers[Math.min(asked++, answers.length - 1)]!);

    const bar = screen.getByRole('progressbar');
    expect(bar).toHaveAccessibleName('Interrupted, retrying…');
    expect(bar).toHaveAttribute('aria-valuetext', '0%: Interrupted, retrying');
    expect(
      screen.getByText(
        'The job worker stopped during training. Keyloom is training this version again from the start.',
      ),
    ).toBeInTheDocument();

    await waitFor(() => expect(screen.getByRole('progressbar')).toHaveAccessibleName('Training the model…'), {
      timeout: 3000,
    });
    expect(screen.queryByText(/The job worker stopped during training/)).not.toBeInTheDocument();
  }, 12_000);

  it('polls a version in training every second and moves the progress bar and the stage', async () => {
    const answers = [
      profileVersion({ status: 'training', progress: 0.2, stage: 'preparing', metrics: null }),
      profileVersion({ status: 'training', progress: 0.6, stage: 'simulating', metrics: null }),
      profileVersion(),
    ];
    let asked = 0;
    const { api } = await openVersion('clinician', () => answers[Math.min(asked++, answers.length - 1)]!);

    const bar = screen.getByRole('progressbar');
    expect(bar).toHaveAttribute('aria-valuenow', '20');
    expect(bar).toHaveAccessibleName('Preparing the text…');
    expect(screen.getByRole('button', { name: 'Cancel training' })).toBeInTheDocument();

    await waitFor(() => expect(screen.getByRole('progressbar')).toHaveAttribute('aria-valuenow', '60'), {
      timeout: 3000,
    });
    expect(screen.getByRole('progressbar')).toHaveAttribute(
      'aria-valuetext',
      '60%: Simulating typing with suggestions',
    );
    // Trained: the bar goes, the results come, and polling stops.
    expect(await screen.findByRole('heading', { name: 'Results' }, { timeout: 3000 })).toBeInTheDocument();
    expect(screen.queryByRole('progressbar')).not.toBeInTheDocument();
    const polls = api.requestsTo(`GET ${versionUrl}`).length;
    await new Promise((resolve) => setTimeout(resolve, 1300));
    expect(api.requestsTo(`GET ${versionUrl}`)).toHaveLength(polls);
  }, 12_000);

  it('links clinicians and supervisors to the version’s vocabulary and says what it was trained with', async () => {
    await openVersion(
      'clinician',
      profileVersion({ metrics: reportFixture({ vocabulary: { added: 3, blocked: 2 } }) }),
    );
    expect(screen.getByText('Trained with 3 added and 2 blocked words.')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: /^Vocabulary of version 1/ })).toHaveAttribute(
      'href',
      `/clients/${ASHBY_ID}/profiles/${VERSION_1_ID}/vocabulary`,
    );
  });

  it('shows carers no vocabulary link, and no trained-with line for a report without one', async () => {
    await openVersion('carer', profileVersion());
    expect(screen.queryByRole('link', { name: /^Vocabulary of version/ })).not.toBeInTheDocument();
    expect(screen.queryByText(/^Trained with/)).not.toBeInTheDocument();
  });

  it('cancels a running job', async () => {
    const training = profileVersion({ status: 'training', progress: 0.3, stage: 'training', metrics: null });
    const { user, api } = await openVersion('clinician', training, {
      [`POST ${versionUrl}/cancel`]: {
        body: { ...training, status: 'draft', error: 'Cancelled by Dr. Tomasz Reyes.' },
      },
    });
    await user.click(screen.getByRole('button', { name: 'Cancel training' }));
    await waitFor(() => expect(api.requestsTo(`POST ${versionUrl}/cancel`)).toHaveLength(1));
    expect(await screen.findByText('Asked training of version 1 to stop.')).toBeInTheDocument();
  });

  it('shows why training failed and retries it', async () => {
    const failed = profileVersion({
      status: 'failed',
      metrics: null,
      error: 'These samples hold 312 characters; a profile needs at least 500.',
    });
    let current = failed;
    const { user, api } = await openVersion('clinician', () => current, {
      [`POST ${versionUrl}/train`]: () => {
        current = { ...failed, status: 'training', progress: 0, stage: 'queued', error: null };
        return { body: current };
      },
    });
    expect(
      screen.getByText('These samples hold 312 characters; a profile needs at least 500.'),
    ).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Retry training' }));
    await waitFor(() => expect(api.requestsTo(`POST ${versionUrl}/train`)).toHaveLength(1));
    expect(await screen.findByText('Waiting for a free worker…')).toBeInTheDocument();
  });

  it('shows the results: bits with spread, KS and KSPC tables, scan steps, wpm with the caution, curve, early words', async () => {
    await openVersion('clinician', profileVersion());
    const bpc = within(screen.getByRole('table', { name: /Bits per character, mean over folds/ }));
    expect(bpc.getByRole('row', { name: /Ideal/ }).textContent).toContain('2.412');
    const coded = bpc.getByRole('row', { name: /Coded/ });
    expect(within(coded).getAllByRole('cell').map(cellValue)).toEqual(['2.419', '2.318', '2.561', '0.091']);
    expect(bpc.getByRole('row', { name: /General English model alone/ }).textContent).toContain('2.980');

    // The KS chart's text alternative: ten rows, this version and the base model alone.
    const ks = within(
      screen.getByRole('table', { name: /^Keystroke savings for 1 to 10 suggestion slots: the figures/ }),
    );
    expect(ks.getAllByRole('row')).toHaveLength(11);
    expect(
      within(ks.getByRole('row', { name: /^5 / }))
        .getAllByRole('cell')
        .map(cellValue),
    ).toEqual(['36.7%', '27.1%']);
    expect(
      within(ks.getByRole('row', { name: /^10 / }))
        .getAllByRole('cell')
        .map(cellValue),
    ).toEqual(['41.3%', '31.0%']);
    const kspc = within(screen.getByRole('table', { name: /^Keystrokes per character .*: the figures/ }));
    expect(
      within(kspc.getByRole('row', { name: /^1 / }))
        .getAllByRole('cell')
        .map(cellValue),
    ).toEqual(['0.812', '0.871']);
    expect(screen.getByText(/At 5 slots this version saves/)).toHaveTextContent(
      'At 5 slots this version saves 36.7% of keystrokes; the general English model alone saves 27.1%.',
    );

    // One row per key order of the test keyboard, named as its setting names them; the fixed 6×7
    // grid and the binary code (6.80 and 3.90 in the stored report) are no longer shown.
    const scan = within(screen.getByRole('table', { name: 'Scan steps per character for a switch user' }));
    expect(
      scan
        .getAllByRole('row')
        .slice(1)
        .map((row) => [
          cellValue(within(row).getByRole('rowheader')),
          cellValue(within(row).getByRole('cell')),
        ]),
    ).toEqual([
      ['Typewriter order', '7.42'],
      ['Alphabetical order', '8.15'],
      ['Ordered by the model', '5.37'],
    ]);
    expect(scan.queryByText(/6\.80|3\.90/)).toBeNull();
    expect(screen.getByText(/the suggestion row is not counted/)).toBeInTheDocument();

    expect(screen.getByText('6.1 words per minute')).toBeInTheDocument();
    expect(screen.getByText('7.4 words per minute')).toBeInTheDocument();
    expect(
      screen.getByText('Keystroke savings are not time savings: reading the list costs time.'),
    ).toBeInTheDocument();

    // 2.60 → 2.45 from half to all the text: still helping.
    expect(
      screen.getByText(
        /^More text still helps: going from 50% to 100% of the text lowered bits per character by 0\.15/,
      ),
    ).toBeInTheDocument();
    // The stored curve was measured on one fold (a report from before the spread): said so.
    expect(
      screen.getByText(/^Measured on one fold only, so the spread between folds is not known/),
    ).toBeInTheDocument();
    const early = within(screen.getByRole('list', { name: 'Words offered early' }));
    expect(early.getAllByRole('listitem').map((item) => item.textContent)).toEqual([
      'Pepper × 14',
      'harbour × 9',
    ]);
    expect(screen.getByRole('list', { name: 'History' })).toHaveTextContent('Ready for trial');
  });

  it("opens with the figures in the clinic's words; the engine's terms wait under Engine details", async () => {
    await openVersion('clinician', profileVersion());
    const glance = within(screen.getByRole('table', { name: 'The version’s figures at 5 suggestion slots' }));
    const rows = glance
      .getAllByRole('row')
      .slice(1)
      .map((row) => [
        cellValue(within(row).getByRole('rowheader')),
        cellText(within(row).getAllByRole('cell')[0]),
      ]);
    // Values from the fixture: KSPC 0.657 at 5 slots, 24,180 characters in 4,836 words, hit rate 0.65,
    // 6.1 → 7.4 words a minute (1.3 more, 21% faster: worked by hand).
    expect(rows).toEqual([
      ['Suggestion slots', '5'],
      ['Keystroke savings', '36.7%'],
      ['Keystrokes per character (KSPC)', '0.66 (1.00 without suggestions)'],
      ['Selections per word', '3.3 (5.0 without suggestions)'],
      ['Hit rate', '65% of words'],
      ['Estimated words per minute', '6.1 without suggestions, 7.4 with 5'],
      ['What the suggestions change', 'About 1.3 more words a minute than without suggestions (21% faster).'],
      ['Scan steps per character', '7.42 (typewriter key order)'],
    ]);
    const bpcTable = screen.getByRole('table', { name: /Bits per character, mean over folds/ });
    const details = bpcTable.closest('details');
    expect(details).not.toBeNull();
    expect(details).not.toHaveAttribute('open');
    expect(within(details as HTMLElement).getByText('Engine details')).toBeInTheDocument();
    // The engine settings of the version page sit under their own Engine details.
    expect(screen.getByText('Context order').closest('details')).not.toHaveAttribute('open');
  });

  it('shows a carer what to try, not the measures', async () => {
    await openVersion('carer', profileVersion());
    expect(screen.getByRole('heading', { name: 'What to try with version 1' })).toBeInTheDocument();
    const words = within(screen.getByRole('list', { name: 'Words to try' }));
    expect(words.getAllByRole('listitem').map((item) => item.textContent)).toEqual(['Pepper', 'harbour']);
    expect(screen.queryByRole('heading', { name: 'Results' })).not.toBeInTheDocument();
    expect(screen.queryByText(/Bits per character|Keystroke savings/)).not.toBeInTheDocument();
    expect(screen.queryByText('Engine details')).not.toBeInTheDocument();
    expect(screen.queryByText('Context order')).not.toBeInTheDocument();
  });

  it('shows "cannot be shown" instead of results when the stored report does not parse', async () => {
    // A report missing most of its figures (and with bits per character as text).
    await openVersion('clinician', profileVersion({ metrics: { bpcIdeal: '2.4', order: 5 } }));
    expect(screen.getByText('The results of this version cannot be shown.')).toBeInTheDocument();
    expect(screen.queryByRole('heading', { name: 'Results' })).not.toBeInTheDocument();
  });

  it('says so instead of scan figures for a version trained before they were measured per key order', async () => {
    await openVersion(
      'clinician',
      profileVersion({ metrics: reportFixture({ scanStepsByLayout: undefined }) }),
    );
    await screen.findByRole('heading', { name: 'Scan steps per character' });
    expect(
      screen.getByText(
        'Trained before scan steps were measured per keyboard layout; train a new version to see them.',
      ),
    ).toBeInTheDocument();
    expect(screen.queryByRole('table', { name: 'Scan steps per character for a switch user' })).toBeNull();
  });

  it('offers the clinician an export link on a trained version, and no sign-off or approval', async () => {
    await openVersion('clinician', profileVersion());
    expect(screen.getByRole('link', { name: 'Export version 1' })).toHaveAttribute(
      'href',
      `${versionUrl}/export`,
    );
    expect(screen.queryByRole('button', { name: 'Sign off' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Approve' })).not.toBeInTheDocument();
  });

  it('lets the assigned carer sign off a trained version only with a comment, and never offers export', async () => {
    const trained = profileVersion();
    let current = trained;
    const { user, api } = await openVersion('carer', () => current, {
      [`GET ${versionUrl}/trials`]: { body: [trialRecord()] },
      [`POST ${versionUrl}/sign-off`]: () => {
        current = { ...trained, status: 'signed_off' };
        return { body: current };
      },
    });
    await waitFor(() => expect(screen.getByRole('button', { name: 'Sign off' })).toBeEnabled());
    expect(screen.queryByRole('link', { name: /Export/ })).not.toBeInTheDocument();
    expect(screen.queryByRole('heading', { name: 'Check an exported file' })).not.toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Sign off' }));
    const dialog = within(await screen.findByRole('dialog', { name: 'Sign off version 1?' }));
    await user.click(dialog.getByRole('button', { name: 'Sign off' }));
    // Message from signOffSchema (shared/src/schemas/profile-versions.schema.ts).
    await expectErrorSummary(screen.getByRole('dialog'), 'One field needs attention', [
      'How did the try-outs go?: Add a comment about the trial.',
    ]);
    expect(api.requestsTo(`POST ${versionUrl}/sign-off`)).toHaveLength(0);

    await user.type(dialog.getByLabelText('How did the try-outs go?'), 'Used it for a week; he liked it.');
    await user.click(dialog.getByRole('button', { name: 'Sign off' }));
    await waitFor(() => expect(api.requestsTo(`POST ${versionUrl}/sign-off`)).toHaveLength(1));
    expect(api.requestsTo(`POST ${versionUrl}/sign-off`)[0]?.body).toEqual({
      comment: 'Used it for a week; he liked it.',
    });
    expect(
      await screen.findByText('You signed off version 1. A supervisor will review it.'),
    ).toBeInTheDocument();
    // Nothing is left for the carer to do here: focus goes to the page's heading, above the message.
    await waitFor(() =>
      expect(
        screen.getByRole('heading', { level: 1, name: 'Version 1 of R. Ashby’s profile' }),
      ).toHaveFocus(),
    );
  }, 15_000); // typing in a dialog: slow on a shared test machine

  it('offers a carer nothing on a version that is already signed off', async () => {
    await openVersion('carer', profileVersion({ status: 'signed_off' }));
    expect(screen.queryByRole('button', { name: 'Sign off' })).not.toBeInTheDocument();
    expect(screen.queryByRole('group', { name: 'Actions on this version' })).not.toBeInTheDocument();
  });

  it('lets a supervisor approve a signed-off version, and shows the server’s refusal in the dialog', async () => {
    const signed = profileVersion({ status: 'signed_off' });
    let approvals = 0;
    const { user, api } = await openVersion('supervisor', signed, {
      [`POST ${versionUrl}/approve`]: () =>
        approvals++ === 0
          ? { status: 409, body: { statusCode: 409, message: 'This version is already approved.' } }
          : { body: { ...signed, status: 'active' } },
    });
    await user.click(screen.getByRole('button', { name: 'Approve' }));
    const dialog = within(await screen.findByRole('dialog', { name: 'Approve version 1?' }));
    await user.click(dialog.getByRole('button', { name: 'Approve' }));
    expect(await dialog.findByText('Add a comment for the record.')).toBeInTheDocument();
    await user.type(dialog.getByLabelText('Comment for the record'), 'Trials and figures agree.');
    await user.click(dialog.getByRole('button', { name: 'Approve' }));
    expect(await dialog.findByText('This version is already approved.')).toBeInTheDocument();
    await user.click(dialog.getByRole('button', { name: 'Approve' }));
    expect(await screen.findByText('Version 1 is now the active profile.')).toBeInTheDocument();
    expect(api.requestsTo(`POST ${versionUrl}/approve`)[1]?.body).toEqual({
      comment: 'Trials and figures agree.',
    });
  });

  it('lets a supervisor send a signed-off version back with a reason', async () => {
    const signed = profileVersion({ status: 'signed_off' });
    const { user, api } = await openVersion('supervisor', signed, {
      [`POST ${versionUrl}/send-back`]: { body: { ...signed, status: 'sent_back' } },
    });
    await user.click(screen.getByRole('button', { name: 'Send back' }));
    const dialog = within(await screen.findByRole('dialog', { name: 'Send version 1 back?' }));
    await user.click(dialog.getByRole('button', { name: 'Send back' }));
    expect(await dialog.findByText('Say what needs to change.')).toBeInTheDocument();
    await user.type(dialog.getByLabelText('What needs to change'), 'Too few try-outs logged.');
    await user.click(dialog.getByRole('button', { name: 'Send back' }));
    await waitFor(() =>
      expect(api.requestsTo(`POST ${versionUrl}/send-back`)[0]?.body).toEqual({
        reason: 'Too few try-outs logged.',
      }),
    );
    expect(await screen.findByText('Version 1 was sent back to the clinician.')).toBeInTheDocument();
  });

  it('offers a supervisor no approval before a carer has signed off, but the export', async () => {
    await openVersion('supervisor', profileVersion());
    expect(screen.queryByRole('button', { name: 'Approve' })).not.toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Export version 1' })).toHaveAttribute(
      'href',
      `${versionUrl}/export`,
    );
  });

  it('offers no export of a version without a model', async () => {
    await openVersion(
      'clinician',
      profileVersion({ status: 'draft', metrics: null, error: 'Cancelled by Dr. Tomasz Reyes.' }),
    );
    expect(screen.queryByRole('link', { name: /Export/ })).not.toBeInTheDocument();
    expect(screen.getByText('Cancelled by Dr. Tomasz Reyes.')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Train' })).toBeInTheDocument();
  });

  it('a refused training says why and keeps focus beside the message, not on the page body', async () => {
    const { user } = await openVersion('clinician', profileVersion({ status: 'draft', metrics: null }), {
      [`POST ${versionUrl}/train`]: {
        status: 400,
        body: { statusCode: 400, message: 'A profile needs at least 500 characters of writing.' },
      },
    });
    await user.click(screen.getByRole('button', { name: 'Train' }));
    expect(
      await screen.findByText('A profile needs at least 500 characters of writing.'),
    ).toBeInTheDocument();
    await waitFor(() => expect(screen.getByRole('group', { name: 'Actions on this version' })).toHaveFocus());
  });

  it('shows the supervisor’s reason on a version sent back', async () => {
    const base = profileVersion();
    await openVersion(
      'clinician',
      profileVersion({
        status: 'sent_back',
        history: [
          ...base.history,
          {
            status: 'sent_back',
            at: '2026-09-26T10:00:00.000Z',
            by: 'Priya Okonkwo',
            comment: 'Too few try-outs.',
          },
        ],
      }),
    );
    expect(
      screen.getByText('A supervisor sent this version back.').closest('div')?.parentElement,
    ).toHaveTextContent('Too few try-outs.');
  });

  // The answer of POST /api/profile-exports/verify for a readable file (shared profileFileCheckSchema).
  const fileCheck = (authenticity: 'this-clinic' | 'unsigned' | 'other') => ({
    valid: authenticity === 'this-clinic',
    intact: true,
    authenticity,
    fileName: 'ashby-v1.klp',
    bytes: 5120,
    checksum: '1a2b3c4d',
    modelBytes: 4000,
    modelOrder: 5,
    modelContexts: 812,
    vocabularyWords: 1234,
    header: { client: { pseudonym: 'R. Ashby' }, version: { number: 1, status: 'active' } },
  });

  /** Chooses a file and presses "Check file"; the answer is whatever `answer` gives. */
  async function checkFile(answer: { status?: number; body: unknown }) {
    const { user, api } = await openVersion('clinician', profileVersion(), {
      'POST /api/profile-exports/verify': answer,
    });
    await user.upload(screen.getByLabelText('Exported profile file'), new File(['KLPF…'], 'ashby-v1.klp'));
    await user.click(screen.getByRole('button', { name: 'Check file' }));
    return { user, api };
  }

  it('checks an exported file and shows what it holds', async () => {
    const { user, api } = await openVersion('clinician', profileVersion(), {
      'POST /api/profile-exports/verify': { body: fileCheck('this-clinic') },
    });
    await user.click(screen.getByRole('button', { name: 'Check file' }));
    expect(await screen.findByText('Choose a file to check.')).toBeInTheDocument();
    await user.upload(screen.getByLabelText('Exported profile file'), new File(['KLPF…'], 'ashby-v1.klp'));
    await user.click(screen.getByRole('button', { name: 'Check file' }));
    expect(await screen.findByText('Made by this clinic and not damaged.')).toBeInTheDocument();
    expect(screen.getByText('Damage:').nextSibling).toHaveTextContent(/^Not damaged/);
    expect(screen.getByText('Made by:').nextSibling).toHaveTextContent(
      'Made by this clinic and unchanged since it was exported.',
    );
    expect(screen.getByText('Client pseudonym').nextSibling).toHaveTextContent('R. Ashby');
    expect(screen.getByText('Version number').nextSibling).toHaveTextContent('1');
    // The client's vocabulary carried by the file (its word model), in words.
    expect(screen.getByText('Vocabulary words').nextSibling).toHaveTextContent('1234');
    const sent = api.requestsTo('POST /api/profile-exports/verify')[0]?.formData?.get('file');
    expect(sent instanceof File ? sent.name : null).toBe('ashby-v1.klp');
  });

  it('says in words when a readable file was not signed by this clinic (changed, foreign or unsigned)', async () => {
    await checkFile({ body: fileCheck('other') });
    expect(
      await screen.findByText('Not signed by this clinic: do not rely on this file.'),
    ).toBeInTheDocument();
    expect(screen.getByText('Damage:').nextSibling).toHaveTextContent(/^Not damaged/);
    expect(screen.getByText('Made by:').nextSibling).toHaveTextContent(
      /^Not signed by this clinic: the signature does not match/,
    );
    expect(screen.queryByText('Made by this clinic and not damaged.')).not.toBeInTheDocument();
  });

  it('says a damaged file is damaged, and that who made it cannot be checked', async () => {
    await checkFile({
      status: 400,
      body: { statusCode: 400, message: 'The checksum does not match (stored 00000000, computed 1a2b3c4d).' },
    });
    expect(await screen.findByText('The file is damaged or is not a Keyloom profile.')).toBeInTheDocument();
    expect(screen.getByText('Damage:').nextSibling).toHaveTextContent(/^The checksum does not match/);
    expect(screen.getByText('Made by:').nextSibling).toHaveTextContent(
      'Cannot be checked on a damaged file.',
    );
  });

  it('keeps the carer’s sign-off and problem report shut until the version has a trial, and points to the keyboard', async () => {
    const { api } = await openVersion('carer', profileVersion());
    await waitFor(() => expect(api.requestsTo(`GET ${versionUrl}/trials`)).toHaveLength(1));
    expect(await screen.findByText('Try this version on the test keyboard first.')).toBeInTheDocument();
    const signOff = screen.getByRole('button', { name: 'Sign off' });
    expect(signOff).toBeDisabled();
    expect(signOff).toHaveAccessibleDescription(/Try this version on the test keyboard first\./);
    expect(screen.getByRole('button', { name: 'Report a problem' })).toBeDisabled();
    expect(screen.getByRole('link', { name: 'Open the test keyboard' })).toHaveAttribute(
      'href',
      `/clients/${ASHBY_ID}/keyboard?version=${VERSION_1_ID}`,
    );
    expect(screen.getByText('No trials of version 1 yet.', { exact: false })).toBeInTheDocument();
  });

  it('lists the trials with measured figures beside the simulated ones', async () => {
    await openVersion('clinician', profileVersion(), {
      [`GET ${versionUrl}/trials`]: {
        body: [
          trialRecord(),
          trialRecord({
            id: 'e1f2a3b4-c5d6-4e7f-8a9b-0c1d2e3f4a72',
            measures: { ...trialRecord().measures, keystrokeSavings: -0.1, wpm: null },
          }),
        ],
      },
    });
    const table = within(await screen.findByRole('table', { name: 'Trials of version 1, newest first' }));
    const rows = table.getAllByRole('row');
    expect(rows).toHaveLength(3);
    const first = within(rows[1]!).getAllByRole('cell').map(cellText);
    expect(first).toEqual([
      'Hannah Ashbycarer',
      'Direct',
      '20',
      '12',
      '40.0% (36.7% at 5 slots)',
      '2.4 (7.4)',
      '0.0%',
    ]);
    expect(within(rows[2]!).getAllByRole('cell').map(cellText)).toContain('-10.0% (36.7% at 5 slots)');
    expect(screen.getByRole('link', { name: 'Try version 1 on the test keyboard' })).toHaveAttribute(
      'href',
      `/clients/${ASHBY_ID}/keyboard?version=${VERSION_1_ID}`,
    );
  });

  it('lets the carer report a problem after a trial, with a reason', async () => {
    const trained = profileVersion();
    const { user, api } = await openVersion('carer', trained, {
      [`GET ${versionUrl}/trials`]: { body: [trialRecord()] },
      [`POST ${versionUrl}/report-problem`]: { body: { ...trained, status: 'sent_back' } },
    });
    await waitFor(() => expect(screen.getByRole('button', { name: 'Report a problem' })).toBeEnabled());
    await user.click(screen.getByRole('button', { name: 'Report a problem' }));
    const dialog = within(await screen.findByRole('dialog', { name: 'Report a problem with version 1?' }));
    await user.click(dialog.getByRole('button', { name: 'Report the problem' }));
    expect(await dialog.findByText('Say what went wrong in the trial.')).toBeInTheDocument();
    await user.type(
      dialog.getByLabelText('What went wrong in the trials?'),
      'It kept offering sailing words.',
    );
    await user.click(dialog.getByRole('button', { name: 'Report the problem' }));
    await waitFor(() =>
      expect(api.requestsTo(`POST ${versionUrl}/report-problem`)[0]?.body).toEqual({
        reason: 'It kept offering sailing words.',
      }),
    );
    expect(
      await screen.findByText('You reported a problem with version 1. It went back to the clinician.'),
    ).toBeInTheDocument();
  });
});
