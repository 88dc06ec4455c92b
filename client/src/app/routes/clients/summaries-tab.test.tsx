import type { Role, Summary, SummaryPreview } from '@keyloom/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { ASHBY_ID, clientRecord, contactRecord, sessionUser } from '@/testing/data';
import { type MockRoutes, mockFetch } from '@/testing/mock-fetch';
import { currentUrl, renderApp } from '@/testing/render-app';

const base = `/api/clients/${ASHBY_ID}`;
const SUMMARY_ID = '3e4f5a6b-7c8d-4e9f-8a0b-1c2d3e4f5a61';

// Invented family contacts of the demo client: one may receive summaries, one never agreed, one stopped.
const hannah = contactRecord();
const miles = contactRecord({
  id: '8b3c4d5e-6f7a-4b9c-8d1e-2f3a4b5c6d72',
  name: 'Miles Ashby',
  relationship: 'Brother',
  email: 'miles@family.example',
  consentToSummaries: false,
});
const june = contactRecord({
  id: '8b3c4d5e-6f7a-4b9c-8d1e-2f3a4b5c6d73',
  name: 'June Ashby',
  relationship: 'Mother',
  email: 'june@family.example',
  unsubscribedAt: '2026-11-20T08:00:00.000Z',
});

const recipient = (
  overrides: Partial<Summary['recipients'][number]> = {},
): Summary['recipients'][number] => ({
  id: '4f5a6b7c-8d9e-4f0a-9b1c-2d3e4f5a6b71',
  contactId: hannah.id,
  name: hannah.name,
  email: hannah.email,
  round: 1,
  status: 'sent',
  attempts: 1,
  lastError: null,
  sentAt: '2026-11-30T10:05:00.000Z',
  stopped: false,
  ...overrides,
});

const storedSummary = (overrides: Partial<Summary> = {}): Summary => ({
  id: SUMMARY_ID,
  clientId: ASHBY_ID,
  from: '2026-10-01',
  to: '2026-11-30',
  versionIds: [],
  note: '',
  subject: 'Progress summary for R. Ashby, 2026-10-01 to 2026-11-30',
  text: 'This is a summary of R. Ashby’s typing.',
  status: 'partly_failed',
  createdBy: null,
  createdAt: '2026-11-30T10:00:00.000Z',
  contactIds: [],
  includeComments: [],
  textEdited: false,
  availableComments: [],
  notes: [],
  sentAt: '2026-11-30T10:00:00.000Z',
  sentBy: 'Dr. Tomasz Reyes',
  recipients: [
    recipient(),
    recipient({
      id: '4f5a6b7c-8d9e-4f0a-9b1c-2d3e4f5a6b72',
      contactId: june.id,
      name: june.name,
      email: june.email,
      stopped: true,
    }),
    recipient({
      id: '4f5a6b7c-8d9e-4f0a-9b1c-2d3e4f5a6b73',
      contactId: null,
      name: 'Pat Ashby',
      email: 'pat@family.example',
      status: 'failed',
      sentAt: null,
      lastError: '550 mailbox unavailable',
    }),
  ],
  ...overrides,
});

// A 1×1 PNG is enough for the preview's <img>; the real charts are checked in the API's tests.
const PNG = 'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAAAAAA6fptVAAAACklEQVR4nGNgAAAAAgABSK+kcQAAAABJRU5ErkJggg==';
const preview = (overrides: Partial<SummaryPreview> = {}): SummaryPreview => ({
  subject: 'Progress summary for R. Ashby, 2026-10-01 to 2026-11-30',
  text: 'Version 1 (trained 2026-11-02): about 4 in 10 key presses saved.\n\nA note from the clinician:\nWell done.',
  versionIds: ['1a2b3c4d-5e6f-4a7b-8c9d-0e1f2a3b4c51'],
  charts: [
    {
      name: 'keystroke-savings.png',
      alt: 'Key presses saved by suggestions, by version: version 1: 42%.',
      pngBase64: PNG,
      width: 600,
      height: 349,
    },
    {
      name: 'typing-speed.png',
      alt: 'Estimated words a minute, by version: version 1: 2.7 with suggestions, 1.9 without suggestions.',
      pngBase64: PNG,
      width: 600,
      height: 380,
    },
  ],
  ...overrides,
});

const openTab = async (role: Role, routes: MockRoutes = {}, client = clientRecord()) => {
  const api = mockFetch({
    'GET /api/auth/me': { body: sessionUser(role) },
    'GET /api/auth/csrf': { body: { token: 'csrf-token-for-tests-0001' } },
    [`GET ${base}`]: { body: client },
    [`GET ${base}/summaries`]: { body: [] },
    [`GET ${base}/contacts`]: { body: [hannah, miles, june] },
    [`GET ${base}/profile-versions`]: { body: [] },
    ...routes,
  });
  const app = renderApp(`/clients/${ASHBY_ID}/summaries`);
  await screen.findByRole('heading', { level: 3, name: 'Progress summaries' });
  return { ...app, api };
};

// The key is a structured-field string (RFC 8941) holding a UUID, as the IETF Idempotency-Key draft sends it.
const QUOTED_UUID = /^"[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}"$/;
const keysOf = (requests: { headers: Headers }[]) => requests.map((r) => r.headers.get('Idempotency-Key'));

describe('Family updates tab', () => {
  it('lists each e-mail with its state in words: sent, stopped by the family member, refused by the mail server', async () => {
    await openTab('clinician', { [`GET ${base}/summaries`]: { body: [storedSummary()] } });
    const card = screen.getByRole('article', { name: '1 Oct 2026 to 30 Nov 2026' });
    expect(within(card).getByText('Some e-mails failed')).toBeInTheDocument();
    const rows = within(card).getAllByRole('row').slice(1);
    expect(rows.map((row) => within(row).getByRole('rowheader').textContent)).toEqual([
      'RecipientHannah Ashbyhannah.ashby@family.example',
      'RecipientJune Ashbyjune@family.example',
      'RecipientPat Ashbypat@family.example',
    ]);
    // Cells: round, status, sent, what happened.
    const cells = rows.map((row) =>
      within(row)
        .getAllByRole('cell')
        .map((cell) => cell.textContent),
    );
    expect(cells).toEqual([
      ['Round1', 'StatusSent', 'Sent30 Nov 2026, 10:05', 'What happenedHanded to the mail server.'],
      [
        'Round1',
        'StatusStopped summaries',
        'Sent30 Nov 2026, 10:05',
        'What happenedUsed the stop link: gets no more summaries.',
      ],
      [
        'Round1',
        'StatusNot delivered',
        'Sent—',
        'What happenedThe receiving mail server refused this e-mail for good (550 mailbox unavailable).',
      ],
    ]);
  });

  it('composes a draft, edits it, ticks a staff comment, previews the e-mail as sent, then sends it', async () => {
    const VERSION_ID = '1a2b3c4d-5e6f-4a7b-8c9d-0e1f2a3b4c51';
    const draft = storedSummary({
      status: 'draft',
      recipients: [],
      contactIds: [hannah.id],
      sentAt: null,
      sentBy: null,
      subject: 'Progress summary for R. Ashby, 1 October to 30 November 2026',
      text: 'Version 1 (approved, in use, 3 November 2026): about 4 in 10 key presses saved.',
      availableComments: [
        {
          versionId: VERSION_ID,
          kind: 'sign-off',
          versionNumber: 1,
          by: 'Hannah Ashby',
          text: 'He liked the sailing words.',
        },
      ],
      notes: ['Version 1: 1 trial shorter than 20 characters was left out of the trial figures.'],
    });
    // The list the API holds: the draft once written, then the sent summary.
    let stored: Summary[] = [];
    const edited = 'Dear Hannah,\n\nRory used the suggestions all month.';
    const { user, api } = await openTab('clinician', {
      [`GET ${base}/summaries`]: () => ({ body: stored }),
      [`POST ${base}/summaries/preview`]: { body: preview() },
      [`POST ${base}/summaries`]: () => {
        stored = [draft];
        return { status: 201, body: draft };
      },
      [`PATCH /api/summaries/${SUMMARY_ID}`]: () => {
        stored = [
          {
            ...draft,
            text: edited,
            textEdited: true,
            includeComments: [{ versionId: VERSION_ID, kind: 'sign-off' }],
          },
        ];
        return { body: stored[0] };
      },
      [`GET /api/summaries/${SUMMARY_ID}/message`]: {
        body: {
          subject: draft.subject,
          to: 'Hannah Ashby <hannah.ashby@family.example>',
          from: 'Keyloom at Willowmere <keyloom@willowmere.example>',
          text: `${edited}\n\nTo stop receiving these summaries, open this link: …`,
          html: `<!doctype html><html lang="en"><head><title>${draft.subject}</title></head><body><p>Dear Hannah,</p><img src="cid:savings-chart@keyloom" alt="x"></body></html>`,
          headers: { 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' },
          charts: [{ name: 'keystroke-savings.png', alt: 'x', pngBase64: PNG, width: 600, height: 349 }],
        },
      },
      [`POST /api/summaries/${SUMMARY_ID}/send`]: () => {
        stored = [
          storedSummary({ status: 'sending', recipients: [recipient({ status: 'queued', sentAt: null })] }),
        ];
        return { body: stored[0] };
      },
    });
    await user.click(screen.getByRole('button', { name: 'New progress summary' }));
    const form = await screen.findByRole('form', { name: 'New progress summary for R. Ashby' });
    expect(within(form).getByText(/figures are estimates/)).toBeInTheDocument();
    expect(within(form).getByText(/You get a draft to edit before anything is sent/)).toBeInTheDocument();
    // Contacts who cannot receive summaries are listed, switched off, with the reason tied to them.
    const miles = within(form).getByRole('checkbox', { name: 'Miles Ashby (Brother)' });
    expect(miles).toBeDisabled();
    expect(miles).toHaveAccessibleDescription('Has not agreed to receive summaries.');
    expect(within(form).getByRole('checkbox', { name: 'June Ashby (Mother)' })).toBeDisabled();
    await user.clear(within(form).getByLabelText('From'));
    await user.type(within(form).getByLabelText('From'), '2026-10-01');
    await user.clear(within(form).getByLabelText('To'));
    await user.type(within(form).getByLabelText('To'), '2026-11-30');
    await user.click(within(form).getByRole('checkbox', { name: 'Hannah Ashby (Sister)' }));
    await user.click(within(form).getByRole('button', { name: 'Preview the figures' }));
    const previewRegion = await within(form).findByRole('region', { name: 'Preview' });
    await waitFor(() =>
      expect(within(previewRegion).getByRole('heading', { name: 'Preview' })).toHaveFocus(),
    );
    const images = within(previewRegion).getAllByRole('img');
    expect(images.map((img) => img.getAttribute('alt'))).toEqual([
      'Key presses saved by suggestions, by version: version 1: 42%.',
      'Estimated words a minute, by version: version 1: 2.7 with suggestions, 1.9 without suggestions.',
    ]);
    expect(images[0]).toHaveAttribute('src', `data:image/png;base64,${PNG}`);
    // Shown at the CSS size the API gives (the PNG has twice the pixels).
    expect(images[1]).toHaveAttribute('width', '600');
    expect(images[1]).toHaveAttribute('height', '380');
    await user.click(within(form).getByRole('button', { name: 'Write the draft' }));
    await waitFor(() => expect(api.requestsTo(`POST ${base}/summaries`)).toHaveLength(1));
    expect(api.requestsTo(`POST ${base}/summaries`)[0]?.body).toEqual({
      from: '2026-10-01',
      to: '2026-11-30',
      versionIds: [],
      contactIds: [hannah.id],
      note: '',
      includeComments: [],
    });

    // The draft opens, its heading focused; nothing is sent yet.
    const heading = await screen.findByRole('heading', { name: 'Draft summary for R. Ashby, not sent' });
    await waitFor(() => expect(heading).toHaveFocus());
    expect(screen.getByText(/1 trial shorter than 20 characters was left out/)).toBeInTheDocument();
    const editor = screen.getByRole('form', { name: 'Edit the draft summary' });
    const comment = within(editor).getByRole('checkbox', { name: 'Quote Hannah Ashby on version 1' });
    expect(comment).not.toBeChecked();
    expect(comment).toHaveAccessibleDescription(
      'When signing off after the trial: “He liked the sailing words.”',
    );
    // Unsaved changes: Send is off until they are saved (it sends the saved draft).
    const text = within(editor).getByLabelText('Text of the e-mail');
    await user.clear(text);
    await user.type(text, edited);
    await user.click(comment);
    expect(within(editor).getByRole('button', { name: 'Send to Hannah Ashby' })).toBeDisabled();
    await user.click(within(editor).getByRole('button', { name: 'Save and preview' }));
    await waitFor(() => expect(api.requestsTo(`PATCH /api/summaries/${SUMMARY_ID}`)).toHaveLength(1));
    expect(api.requestsTo(`PATCH /api/summaries/${SUMMARY_ID}`)[0]?.body).toEqual({
      text: edited,
      includeComments: [{ versionId: VERSION_ID, kind: 'sign-off' }],
    });
    // The e-mail as the family gets it: the HTML part in a frame, its images shown from the charts.
    const frame = await screen.findByTitle(/as the family sees it/);
    expect(frame.getAttribute('srcdoc')).toContain(`src="data:image/png;base64,${PNG}"`);
    expect(frame).toHaveAttribute('sandbox', 'allow-same-origin');
    expect(
      screen.getByText(/Rory used the suggestions all month\./, { selector: 'pre' }),
    ).toBeInTheDocument();

    const send = await screen.findByRole('button', { name: 'Send to Hannah Ashby' });
    await waitFor(() => expect(send).toBeEnabled());
    await user.click(send);
    await waitFor(() => expect(api.requestsTo(`POST /api/summaries/${SUMMARY_ID}/send`)).toHaveLength(1));
    expect(keysOf(api.requestsTo(`POST /api/summaries/${SUMMARY_ID}/send`))[0]).toMatch(QUOTED_UUID);
    const status = await waitFor(() => {
      const found = screen.getAllByRole('status').find((el) => el.textContent?.includes('queued'));
      if (!found) throw new Error('no status yet');
      return found;
    });
    expect(status.textContent).toContain('The summary was sent: 1 e-mail queued.');
    expect(screen.queryByRole('form', { name: 'Edit the draft summary' })).not.toBeInTheDocument();
    // Focus lands on the summary just sent, where its state is read.
    await waitFor(() =>
      expect(screen.getByRole('article', { name: '1 Oct 2026 to 30 Nov 2026' })).toHaveFocus(),
    );
  });

  it('deletes a draft only after saying what goes, and nothing was sent', async () => {
    let stored: Summary[] = [
      storedSummary({ status: 'draft', recipients: [], contactIds: [hannah.id], sentAt: null, sentBy: null }),
    ];
    const { user, api } = await openTab('clinician', {
      [`GET ${base}/summaries`]: () => ({ body: stored }),
      [`DELETE /api/summaries/${SUMMARY_ID}`]: () => {
        stored = [];
        return { status: 204 };
      },
    });
    await user.click(await screen.findByRole('button', { name: /^Open the draft/ }));
    const editor = await screen.findByRole('form', { name: 'Edit the draft summary' });
    await user.click(within(editor).getByRole('button', { name: 'Delete draft' }));
    const dialog = await screen.findByRole('dialog', { name: 'Delete this draft?' });
    expect(dialog).toHaveAccessibleDescription(/Nothing was sent/);
    expect(api.requestsTo(`DELETE /api/summaries/${SUMMARY_ID}`)).toHaveLength(0);
    await user.click(within(dialog).getByRole('button', { name: 'Delete the draft' }));
    await waitFor(() => expect(api.requestsTo(`DELETE /api/summaries/${SUMMARY_ID}`)).toHaveLength(1));
    expect(await screen.findByText('The draft was deleted. Nothing was sent.')).toBeInTheDocument();
    await waitFor(() => expect(screen.getByRole('button', { name: 'New progress summary' })).toHaveFocus());
  });

  it('ties errors to their fields, asks to preview again after a change, and says when the period has no version', async () => {
    const { user, api } = await openTab('clinician', {
      [`POST ${base}/summaries/preview`]: {
        body: preview({ versionIds: [], charts: [], text: 'Only a note.' }),
      },
    });
    await user.click(screen.getByRole('button', { name: 'New progress summary' }));
    const form = await screen.findByRole('form', { name: 'New progress summary for R. Ashby' });
    await user.clear(within(form).getByLabelText('From'));
    await user.type(within(form).getByLabelText('From'), '2026-12-01');
    await user.clear(within(form).getByLabelText('To'));
    await user.type(within(form).getByLabelText('To'), '2026-11-01');
    await user.click(within(form).getByRole('button', { name: 'Preview the figures' }));
    const to = within(form).getByLabelText('To');
    await waitFor(() => expect(to).toHaveAttribute('aria-invalid', 'true'));
    // The box's hint (the order of its parts; jsdom's language is en-US), then the error.
    expect(to).toHaveAccessibleDescription(
      'Month, day, year, e.g. 09/14/2026. The period must end on or after its start.',
    );
    // A refused preview is listed at the top of the form like a refused submit, and focused.
    const refusedPreview = within(form).getByRole('group', { name: 'One field needs attention' });
    await waitFor(() => expect(refusedPreview).toHaveFocus());
    expect(refusedPreview).toHaveTextContent('To: The period must end on or after its start.');
    expect(api.requestsTo(`POST ${base}/summaries/preview`)).toHaveLength(0);

    await user.clear(to);
    await user.type(to, '2026-12-31');
    await user.click(within(form).getByRole('button', { name: 'Preview the figures' }));
    const previewRegion = await within(form).findByRole('region', { name: 'Preview' });
    expect(
      within(previewRegion).getByText(
        'No version was trained in this period; the summary will only carry your note.',
      ),
    ).toBeInTheDocument();
    expect(within(previewRegion).queryAllByRole('img')).toHaveLength(0);

    // A draft without a recipient: the error is announced with the recipients group.
    await user.click(within(form).getByRole('button', { name: 'Write the draft' }));
    const group = within(form).getByRole('group', { name: 'Recipients' });
    await waitFor(() => expect(group).toHaveAccessibleDescription(/Choose at least one family contact\./));
    const refusedSend = within(form).getByRole('group', { name: 'One field needs attention' });
    await waitFor(() => expect(refusedSend).toHaveFocus());
    // The link goes to the first box that can be ticked (contacts who cannot receive summaries are off).
    await user.click(
      within(refusedSend).getByRole('link', { name: 'Recipients: Choose at least one family contact.' }),
    );
    expect(within(group).getByRole('checkbox', { name: /Hannah/ })).toHaveFocus();
    expect(api.requestsTo(`POST ${base}/summaries`)).toHaveLength(0);

    // A change after the preview says the preview is out of date.
    await user.type(within(form).getByLabelText(/Your note to the family/), 'More.');
    expect(await within(form).findByText('The preview is out of date.')).toBeInTheDocument();
  });

  it('sends again only after confirmation', async () => {
    const { user, api } = await openTab('clinician', {
      [`GET ${base}/summaries`]: { body: [storedSummary()] },
      [`POST /api/summaries/${SUMMARY_ID}/resend`]: {
        body: storedSummary({
          recipients: [
            recipient(),
            recipient({
              id: '4f5a6b7c-8d9e-4f0a-9b1c-2d3e4f5a6b79',
              round: 2,
              status: 'queued',
              sentAt: null,
            }),
          ],
        }),
      },
    });
    await user.click(screen.getByRole('button', { name: /^Send again/ }));
    const dialog = await screen.findByRole('dialog', { name: 'Send this summary again?' });
    expect(api.requestsTo(`POST /api/summaries/${SUMMARY_ID}/resend`)).toHaveLength(0);
    await user.click(within(dialog).getByRole('button', { name: 'Send again' }));
    await waitFor(() => expect(api.requestsTo(`POST /api/summaries/${SUMMARY_ID}/resend`)).toHaveLength(1));
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
  });

  it('writes a draft with an Idempotency-Key, the same one when it is tried again after an error', async () => {
    let answers = 0;
    const draft = storedSummary({ status: 'draft', recipients: [], contactIds: [hannah.id], sentAt: null });
    let stored: Summary[] = [];
    const { user, api } = await openTab('clinician', {
      [`GET ${base}/summaries`]: () => ({ body: stored }),
      // The first answer is lost (the server may have stored it); the retry must carry the same key.
      [`POST ${base}/summaries`]: () => {
        if (++answers === 1)
          return {
            status: 503,
            body: { statusCode: 503, message: 'The database is not reachable right now.' },
          };
        stored = [draft];
        return { status: 201, body: draft };
      },
    });
    await user.click(screen.getByRole('button', { name: 'New progress summary' }));
    const form = await screen.findByRole('form', { name: 'New progress summary for R. Ashby' });
    await user.click(within(form).getByRole('checkbox', { name: 'Hannah Ashby (Sister)' }));
    const write = within(form).getByRole('button', { name: 'Write the draft' });
    await user.click(write);
    expect(await within(form).findByText('The database is not reachable right now.')).toBeInTheDocument();
    await user.click(write);
    await waitFor(() => expect(api.requestsTo(`POST ${base}/summaries`)).toHaveLength(2));
    const [first, second] = keysOf(api.requestsTo(`POST ${base}/summaries`));
    expect(first).toMatch(QUOTED_UUID);
    expect(second).toBe(first);
    const editor = await screen.findByRole('form', { name: 'Edit the draft summary' });

    // A new summary is a new action: a new key.
    await user.click(within(editor).getByRole('button', { name: 'Close the draft' }));
    await user.click(await screen.findByRole('button', { name: 'New progress summary' }));
    const again = await screen.findByRole('form', { name: 'New progress summary for R. Ashby' });
    await user.click(within(again).getByRole('checkbox', { name: 'Hannah Ashby (Sister)' }));
    await user.click(within(again).getByRole('button', { name: 'Write the draft' }));
    await waitFor(() => expect(api.requestsTo(`POST ${base}/summaries`)).toHaveLength(3));
    const third = keysOf(api.requestsTo(`POST ${base}/summaries`))[2];
    expect(third).toMatch(QUOTED_UUID);
    expect(third).not.toBe(first);
  });

  it('keeps the Idempotency-Key of a re-send while it is retried, disables the button while it runs, and uses a new one next time', async () => {
    let answers = 0;
    let release: () => void = () => undefined;
    const { user, api } = await openTab('clinician', {
      [`GET ${base}/summaries`]: { body: [storedSummary()] },
      [`POST /api/summaries/${SUMMARY_ID}/resend`]: async () => {
        answers += 1;
        if (answers === 1) return { status: 502, body: { statusCode: 502, message: 'Bad gateway.' } };
        if (answers === 2) await new Promise<void>((resolve) => (release = resolve));
        return { body: storedSummary() };
      },
    });
    await user.click(screen.getByRole('button', { name: /^Send again/ }));
    let dialog = await screen.findByRole('dialog', { name: 'Send this summary again?' });
    await user.click(within(dialog).getByRole('button', { name: 'Send again' }));
    expect(await within(dialog).findByText('Bad gateway.')).toBeInTheDocument();
    await user.click(within(dialog).getByRole('button', { name: 'Send again' }));
    // While the retry runs, the button is off: a second click cannot send a second round.
    expect(await within(dialog).findByRole('button', { name: 'Sending…' })).toBeDisabled();
    release();
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
    await user.click(screen.getByRole('button', { name: /^Send again/ }));
    dialog = await screen.findByRole('dialog', { name: 'Send this summary again?' });
    await user.click(within(dialog).getByRole('button', { name: 'Send again' }));
    await waitFor(() => expect(api.requestsTo(`POST /api/summaries/${SUMMARY_ID}/resend`)).toHaveLength(3));
    const [first, retry, next] = keysOf(api.requestsTo(`POST /api/summaries/${SUMMARY_ID}/resend`));
    expect(first).toMatch(QUOTED_UUID);
    expect(retry).toBe(first);
    expect(next).toMatch(QUOTED_UUID);
    expect(next).not.toBe(first);
  });

  it('switches composing off without a summaries consent and says why', async () => {
    await openTab('clinician', {}, clientRecord({ summariesConsent: false }));
    const button = screen.getByRole('button', { name: 'New progress summary' });
    expect(button).toBeDisabled();
    expect(button).toHaveAccessibleDescription(/no consent in force that covers sharing progress/);
  });

  it('lets a supervisor read the summaries with no composer or re-send, and never shows carers the tab', async () => {
    const { api } = await openTab('supervisor', { [`GET ${base}/summaries`]: { body: [storedSummary()] } });
    expect(screen.getByRole('article', { name: '1 Oct 2026 to 30 Nov 2026' })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'New progress summary' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /Send again/ })).not.toBeInTheDocument();
    expect(api.requestsTo(`GET ${base}/contacts`)).toHaveLength(0);
  });

  it('sends a carer who types the tab address back to the overview', async () => {
    mockFetch({
      'GET /api/auth/me': { body: sessionUser('carer') },
      'GET /api/auth/csrf': { body: { token: 'csrf-token-for-tests-0001' } },
      [`GET ${base}`]: { body: clientRecord({ notes: null }) },
      [`GET ${base}/carers-available`]: { body: [] },
    });
    const { router } = renderApp(`/clients/${ASHBY_ID}/summaries`);
    await waitFor(() => expect(currentUrl(router)).toBe(`/clients/${ASHBY_ID}/overview`));
  });
});
