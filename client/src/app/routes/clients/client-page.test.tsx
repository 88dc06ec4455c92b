import type { Role } from '@keyloom/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import {
  ASHBY_ID,
  clientRecord,
  consentRecord,
  contactRecord,
  sampleSummary,
  sessionUser,
} from '@/testing/data';
import { CSRF_TOKEN, type MockRoutes, mockFetch, sessionRoutes } from '@/testing/mock-fetch';
import { expectErrorSummary } from '@/testing/error-summary';
import { currentUrl, renderApp } from '@/testing/render-app';

const base = `/api/clients/${ASHBY_ID}`;

const openClient = async (role: Role, tab: string, routes: MockRoutes = {}) => {
  const api = mockFetch({
    ...sessionRoutes(sessionUser(role)),
    [`GET ${base}`]: {
      body: role === 'carer' ? clientRecord({ notes: null, preferredName: null }) : clientRecord(),
    },
    [`GET ${base}/carers-available`]: { body: [] },
    [`GET ${base}/consents`]: { body: [consentRecord()] },
    [`GET ${base}/contacts`]: { body: [contactRecord()] },
    [`GET ${base}/samples`]: { body: [sampleSummary()] },
    [`GET ${base}/profile-versions`]: { body: [] },
    ...routes,
  });
  const app = renderApp(`/clients/${ASHBY_ID}/${tab}`);
  await screen.findByRole('heading', { level: 1, name: 'R. Ashby' });
  return { ...app, api };
};

const tabNames = () => screen.getAllByRole('tab').map((tab) => tab.textContent);

describe('Client page', () => {
  it('gives clinicians every tab, keeps the tab in the address, and moves between tabs', async () => {
    const { user, router } = await openClient('clinician', 'overview');
    expect(tabNames()).toEqual([
      'Overview',
      'Consent & family',
      'Writing samples',
      'Profile versions',
      'Try-outs',
      'Family updates',
    ]);
    expect(screen.getByRole('tab', { name: 'Overview' })).toHaveAttribute('aria-selected', 'true');
    // The client's page belongs to the caseload in the header.
    const nav = within(screen.getByRole('navigation', { name: 'Main' }));
    expect(nav.getByRole('link', { name: 'Caseload' })).toHaveAttribute('aria-current', 'page');
    expect(screen.getByRole('button', { name: 'Edit details' })).toBeInTheDocument();
    expect(screen.getByText('Tires after about twenty minutes of typing.')).toBeInTheDocument();
    // The family's name for the client, beside the pseudonym (carers never get it).
    expect(screen.getByText('Preferred name').nextElementSibling).toHaveTextContent('Robbie');

    await user.click(screen.getByRole('tab', { name: 'Consent & family' }));
    await waitFor(() => expect(currentUrl(router)).toBe(`/clients/${ASHBY_ID}/consent`));
    // Days read as CLDR's en-GB medium date, pattern "d MMM y" with September as "Sept" (Unicode CLDR).
    expect(await screen.findByRole('heading', { name: 'Consent given on 14 Sept 2026' })).toBeInTheDocument();

    await user.click(screen.getByRole('tab', { name: 'Profile versions' }));
    expect(await screen.findByRole('heading', { name: 'No profile versions yet.' })).toBeInTheDocument();

    // WAI-ARIA tabs pattern: the arrow keys move between tabs and the address follows, while focus
    // stays on the tab (not the page heading).
    await user.keyboard('{ArrowRight}');
    await waitFor(() => expect(currentUrl(router)).toBe(`/clients/${ASHBY_ID}/trials`));
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(screen.getByRole('tab', { name: 'Try-outs' })).toHaveFocus();
    await user.keyboard('{ArrowLeft}');
    await waitFor(() => expect(currentUrl(router)).toBe(`/clients/${ASHBY_ID}/profiles`));
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(screen.getByRole('tab', { name: 'Profile versions' })).toHaveFocus();
  }, 15_000);

  it('shows carers the overview, profile versions and try-outs only, without notes or edit controls, and never asks for consent or samples', async () => {
    const { api } = await openClient('carer', 'overview');
    expect(tabNames()).toEqual(['Overview', 'Profile versions', 'Try-outs']);
    expect(screen.queryByRole('button', { name: 'Edit details' })).not.toBeInTheDocument();
    expect(screen.queryByText('Notes')).not.toBeInTheDocument();
    expect(screen.queryByText('Preferred name')).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Assign carer' })).not.toBeInTheDocument();
    expect(api.requestsTo(`GET ${base}/consents`)).toHaveLength(0);
    expect(api.requestsTo(`GET ${base}/samples`)).toHaveLength(0);
  });

  it('sends a carer who types the consent tab address back to the overview', async () => {
    const { router } = await openClient('carer', 'consent');
    await waitFor(() => expect(currentUrl(router)).toBe(`/clients/${ASHBY_ID}/overview`));
  });

  it('lets a supervisor read consent and samples with no buttons that would be refused', async () => {
    const { user } = await openClient('supervisor', 'consent');
    expect(await screen.findByRole('heading', { name: 'Consent given on 14 Sept 2026' })).toBeInTheDocument();
    expect(screen.getByRole('rowheader', { name: /Hannah Ashby/ })).toBeInTheDocument();
    for (const name of [
      'Record consent',
      'Withdraw consent',
      'Void (recorded in error)',
      'Add family contact',
      'Delete',
      'Upload form',
    ]) {
      expect(screen.queryByRole('button', { name })).not.toBeInTheDocument();
    }
    expect(screen.queryByRole('button', { name: /Edit Hannah/ })).not.toBeInTheDocument();

    await user.click(screen.getByRole('tab', { name: 'Writing samples' }));
    expect(await screen.findByRole('link', { name: 'Messages to the sailing club' })).toBeInTheDocument();
    expect(screen.queryByLabelText(/Choose files/)).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Upload files' })).not.toBeInTheDocument();

    await user.click(screen.getByRole('tab', { name: 'Overview' }));
    await screen.findByRole('heading', { name: 'Details' });
    expect(screen.queryByRole('button', { name: 'Edit details' })).not.toBeInTheDocument();
  });

  it('asks for the representative’s name and relationship only when a representative gave consent', async () => {
    const created = consentRecord({
      id: '7a2b3c4d-5e6f-4a8b-9c0d-1e2f3a4b5c62',
      givenBy: 'representative',
      representativeName: 'Marguerite Ashby',
      representativeRelationship: 'Mother',
      scopes: ['training'],
      givenOn: '2026-10-01',
    });
    const { user, api } = await openClient('clinician', 'consent', {
      [`POST ${base}/consents`]: { status: 201, body: created },
    });
    await user.click(await screen.findByRole('button', { name: 'Record consent' }));
    const form = within(await screen.findByRole('dialog', { name: 'Record consent for R. Ashby' }));
    expect(form.queryByLabelText('Representative’s name')).not.toBeInTheDocument();

    await user.click(form.getByLabelText('A representative on the client’s behalf'));
    await user.click(form.getByLabelText(/Training a personal model/));
    await user.type(form.getByLabelText('Date consent was given'), '2026-10-01');
    await user.click(form.getByRole('button', { name: 'Record consent' }));
    // Messages from shared/src/schemas/consents.schema.ts.
    expect(await form.findByText('Enter the representative’s name.')).toBeInTheDocument();
    expect(form.getByText('Enter how the representative is related to the client.')).toBeInTheDocument();
    expect(api.requestsTo(`POST ${base}/consents`)).toHaveLength(0);

    await user.type(form.getByLabelText('Representative’s name'), 'Marguerite Ashby');
    await user.type(form.getByLabelText('Relationship to the client'), 'Mother');
    await user.click(form.getByRole('button', { name: 'Record consent' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());

    const [post] = api.requestsTo(`POST ${base}/consents`);
    expect(post?.headers.get('X-CSRF-Token')).toBe(CSRF_TOKEN);
    expect(post?.body).toEqual({
      givenBy: 'representative',
      representativeName: 'Marguerite Ashby',
      representativeRelationship: 'Mother',
      scopes: ['training'],
      givenOn: '2026-10-01',
      expiresOn: null,
      notes: null,
    });
    expect(screen.getByRole('status')).toHaveTextContent('Consent given on 1 Oct 2026 is recorded.');
  });

  it('opens the consent dialog empty and refuses an empty submit, focus on the list of what is missing', async () => {
    const { user, api } = await openClient('clinician', 'consent');
    await user.click(await screen.findByRole('button', { name: 'Record consent' }));
    const form = within(await screen.findByRole('dialog'));
    // Nothing chosen for the clinician: no giver, no scope, no date.
    expect(form.getByLabelText('The client, R. Ashby')).not.toBeChecked();
    expect(form.getByLabelText('A representative on the client’s behalf')).not.toBeChecked();
    expect(form.getByLabelText(/Training a personal model/)).not.toBeChecked();
    expect(form.getByLabelText(/Sending progress summaries/)).not.toBeChecked();
    expect(form.getByLabelText('Date consent was given')).toHaveValue('');
    await user.click(form.getByRole('button', { name: 'Record consent' }));
    // One link per refused field, in the order of the form, each naming its field and the problem.
    const summary = await expectErrorSummary(screen.getByRole('dialog'), '3 fields need attention', [
      'Who gave consent: Say who gave consent.',
      'What the consent covers: Choose at least one thing the consent covers.',
      'Date consent was given: Enter a date with its day, month and year (YYYY-MM-DD).',
    ]);
    expect(form.getByText('Choose at least one thing the consent covers.')).toBeInTheDocument();
    await user.click(within(summary).getByRole('link', { name: /^Date consent was given/ }));
    expect(form.getByLabelText('Date consent was given')).toHaveFocus();
    expect(api.requestsTo(`POST ${base}/consents`)).toHaveLength(0);
  });

  it('refuses a consent given in the future before sending it', async () => {
    const { user, api } = await openClient('clinician', 'consent');
    await user.click(await screen.findByRole('button', { name: 'Record consent' }));
    const form = within(await screen.findByRole('dialog'));
    await user.click(form.getByLabelText('The client, R. Ashby'));
    await user.click(form.getByLabelText(/Training a personal model/));
    const next = new Date();
    next.setDate(next.getDate() + 1);
    const tomorrow = `${next.getFullYear()}-${String(next.getMonth() + 1).padStart(2, '0')}-${String(next.getDate()).padStart(2, '0')}`;
    await user.type(form.getByLabelText('Date consent was given'), tomorrow);
    await user.click(form.getByRole('button', { name: 'Record consent' }));
    const summary = await form.findByRole('group', { name: 'One field needs attention' });
    expect(summary).toHaveTextContent(
      'Date consent was given: The date consent was given cannot be in the future.',
    );
    expect(api.requestsTo(`POST ${base}/consents`)).toHaveLength(0);
  });

  it('lists what a withdrawal will delete before asking for a reason, then reports what was deleted', async () => {
    const consent = consentRecord();
    const report = {
      samplesDeleted: 3,
      derived: { sampleFlags: 0, profileVersions: 2, trials: 7, practicePhrases: 1 },
      cancelled: { summaryEmails: 1 },
      keptScopes: [],
    };
    const withdrawn = consentRecord({
      status: 'withdrawn',
      withdrawnAt: '2026-10-05T10:00:00.000Z',
      withdrawalReason: 'He asked by e-mail.',
      withdrawal: report,
    });
    const { user, api } = await openClient('clinician', 'consent', {
      [`GET ${base}/consents/${consent.id}/withdrawal-preview`]: {
        body: {
          consentId: consent.id,
          report,
          scopes: [
            { scope: 'training', coveredBy: [] },
            { scope: 'summaries', coveredBy: [] },
          ],
        },
      },
      [`POST ${base}/consents/${withdrawn.id}/withdraw`]: { body: withdrawn },
    });
    await user.click(await screen.findByRole('button', { name: 'Withdraw consent given on 14 Sept 2026' }));
    const dialog = await screen.findByRole('dialog', { name: 'Withdraw consent for R. Ashby?' });
    await waitFor(() =>
      expect(dialog).toHaveAccessibleDescription(
        /permanently delete what this consent alone allowed for R\. Ashby.*This cannot be undone\./,
      ),
    );
    const form = within(dialog);
    const deletes = within(form.getByRole('region', { name: 'Will be deleted' }));
    expect(deletes.getAllByRole('listitem').map((item) => item.textContent)).toEqual([
      '3 language samples',
      '2 profile versions (their models and measures)',
      '7 test keyboard trials',
      '1 practice phrase of the client’s own',
    ]);
    expect(
      within(form.getByRole('region', { name: 'Will not be sent' })).getByRole('listitem'),
    ).toHaveTextContent('1 queued summary e-mail');
    await user.click(form.getByRole('button', { name: 'Withdraw and delete 3 language samples' }));
    expect(await form.findByText('Say why consent was withdrawn (for the record).')).toBeInTheDocument();
    expect(api.requestsTo(`POST ${base}/consents/${withdrawn.id}/withdraw`)).toHaveLength(0);

    await user.type(form.getByLabelText('Reason for the withdrawal'), 'He asked by e-mail.');
    await user.click(form.getByRole('button', { name: 'Withdraw and delete 3 language samples' }));
    await waitFor(() =>
      expect(screen.getByRole('status')).toHaveTextContent(
        'Consent withdrawn. Deleted: 3 language samples, 2 profile versions (their models and measures), 7 test keyboard trials, 1 practice phrase of the client’s own. Not sent: 1 queued summary e-mail.',
      ),
    );
    // The button that opened the dialog is gone with the withdrawal: focus lands on the records' heading.
    await waitFor(() => expect(screen.getByRole('heading', { name: 'Consent records' })).toHaveFocus());
    expect(api.requestsTo(`POST ${base}/consents/${withdrawn.id}/withdraw`)[0]?.body).toEqual({
      reason: 'He asked by e-mail.',
    });
  });

  it('says nothing will be deleted when another consent still covers training, and names it', async () => {
    const older = consentRecord({ id: '7a2b3c4d-5e6f-4a8b-9c0d-1e2f3a4b5c62', scopes: ['training'] });
    const newer = consentRecord({ givenOn: '2026-10-01', scopes: ['training'] });
    const { user } = await openClient('clinician', 'consent', {
      [`GET ${base}/consents`]: { body: [newer, older] },
      [`GET ${base}/consents/${newer.id}/withdrawal-preview`]: {
        body: {
          consentId: newer.id,
          report: {
            samplesDeleted: 0,
            derived: { profileVersions: 0, trials: 0 },
            cancelled: {},
            keptScopes: ['training'],
          },
          scopes: [
            { scope: 'training', coveredBy: [{ id: older.id, givenOn: '2026-09-14', expiresOn: null }] },
          ],
        },
      },
    });
    await user.click(await screen.findByRole('button', { name: 'Withdraw consent given on 1 Oct 2026' }));
    const dialog = await screen.findByRole('dialog', { name: 'Withdraw consent for R. Ashby?' });
    await waitFor(() =>
      expect(dialog).toHaveAccessibleDescription(
        /Nothing will be deleted for R\. Ashby\. The consent given on 14 Sept 2026 still covers training a personal model on the client’s writing, so nothing it allows is deleted\./,
      ),
    );
    const form = within(dialog);
    expect(form.queryByRole('region', { name: 'Will be deleted' })).not.toBeInTheDocument();
    expect(form.getByRole('button', { name: 'Withdraw consent' })).toBeInTheDocument();
  });

  it('shows the stored report of a withdrawn consent in plain words', async () => {
    await openClient('supervisor', 'consent', {
      [`GET ${base}/consents`]: {
        body: [
          consentRecord({
            status: 'withdrawn',
            withdrawnAt: '2026-10-05T10:00:00.000Z',
            withdrawal: {
              samplesDeleted: 0,
              derived: { trials: 0 },
              cancelled: {},
              keptScopes: ['training'],
            },
          }),
        ],
      },
    });
    expect(await screen.findByText('Nothing was deleted.')).toBeInTheDocument();
  });

  it('lets the owner assign an available carer', async () => {
    const { user, api } = await openClient('clinician', 'overview', {
      [`GET ${base}/carers-available`]: {
        body: [{ id: '4b5c6d7e-8f9a-4b1c-8d2e-3f4a5b6c7d05', name: 'Orla Pennick' }],
      },
      [`POST ${base}/assignments`]: { status: 201, body: {} },
    });
    const picker = screen.getByLabelText('Carer to assign to R. Ashby');
    await waitFor(() =>
      expect(within(picker).getByRole('option', { name: 'Orla Pennick' })).toBeInTheDocument(),
    );
    await user.selectOptions(picker, 'Orla Pennick');
    await user.click(screen.getByRole('button', { name: 'Assign carer' }));
    await waitFor(() =>
      expect(screen.getByRole('status')).toHaveTextContent('Orla Pennick is now assigned to R. Ashby.'),
    );
    expect(api.requestsTo(`POST ${base}/assignments`)[0]?.body).toEqual({
      userId: '4b5c6d7e-8f9a-4b1c-8d2e-3f4a5b6c7d05',
    });
  });

  it('voids a record made in error: says what stays covered, asks a reason, shows it struck through', async () => {
    const right = consentRecord({ id: '7a2b3c4d-5e6f-4a8b-9c0d-1e2f3a4b5c62', givenOn: '2026-09-01' });
    const wrong = consentRecord({ givenOn: '2026-09-14', scopes: ['training'] });
    const report = {
      samplesDeleted: 0,
      derived: { profileVersions: 0 },
      cancelled: {},
      keptScopes: ['training' as const],
    };
    const voided = consentRecord({
      ...wrong,
      status: 'voided',
      voidedAt: '2026-10-06T09:00:00.000Z',
      voidedBy: 'Dana Clinician',
      voidReason: 'Typed for the wrong client.',
      voidReport: report,
    });
    let consents = [wrong, right];
    const { user, api } = await openClient('clinician', 'consent', {
      [`GET ${base}/consents`]: () => ({ body: consents }),
      [`GET ${base}/consents/${wrong.id}/withdrawal-preview`]: {
        body: {
          consentId: wrong.id,
          report,
          scopes: [
            { scope: 'training', coveredBy: [{ id: right.id, givenOn: '2026-09-01', expiresOn: null }] },
          ],
        },
      },
      [`POST ${base}/consents/${wrong.id}/void`]: () => {
        consents = [voided, right];
        return { body: voided };
      },
    });
    await user.click(
      await screen.findByRole('button', { name: 'Void (recorded in error): consent given on 14 Sept 2026' }),
    );
    const dialog = await screen.findByRole('dialog', { name: 'Void this consent record for R. Ashby?' });
    await waitFor(() =>
      expect(dialog).toHaveAccessibleDescription(
        /Nothing will be deleted for R\. Ashby\. The consent given on 1 Sept 2026 still covers training/,
      ),
    );
    const form = within(dialog);
    expect(form.queryByRole('region', { name: 'Will be deleted' })).not.toBeInTheDocument();
    await user.click(form.getByRole('button', { name: 'Void the record' }));
    const summary = await form.findByRole('group', { name: 'One field needs attention' });
    await waitFor(() => expect(summary).toHaveFocus());
    expect(api.requestsTo(`POST ${base}/consents/${wrong.id}/void`)).toHaveLength(0);

    await user.type(form.getByLabelText('Why this record is wrong'), 'Typed for the wrong client.');
    await user.click(form.getByRole('button', { name: 'Void the record' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
    expect(api.requestsTo(`POST ${base}/consents/${wrong.id}/void`)[0]?.body).toEqual({
      reason: 'Typed for the wrong client.',
    });
    // Focus goes to the records' heading (the button that opened the dialog is gone).
    await waitFor(() => expect(screen.getByRole('heading', { name: 'Consent records' })).toHaveFocus());
    expect(screen.getByRole('status')).toHaveTextContent('Consent record voided. Nothing was deleted.');
    const record = screen.getByRole('article', { name: 'Consent given on 14 Sept 2026' });
    expect(within(record).getByRole('heading', { name: 'Consent given on 14 Sept 2026' })).toHaveClass(
      'line-through',
    );
    expect(record).toHaveTextContent(/Voided on .* — Typed for the wrong client\./);
    expect(within(record).queryByRole('button')).not.toBeInTheDocument();
  });

  it('deletes a family contact after saying what goes and what stays; focus on the contacts heading', async () => {
    const contact = contactRecord();
    let contacts = [contact];
    const { user, api } = await openClient('clinician', 'consent', {
      [`GET ${base}/contacts`]: () => ({ body: contacts }),
      [`DELETE ${base}/contacts/${contact.id}`]: () => {
        contacts = [];
        return { status: 204 };
      },
    });
    await user.click(await screen.findByRole('button', { name: 'Delete Hannah Ashby' }));
    const dialog = await screen.findByRole('dialog', { name: 'Delete Hannah Ashby?' });
    expect(dialog).toHaveAccessibleDescription(
      /address \(hannah\.ashby@family\.example\) are removed.*Summaries already sent to them keep their record/,
    );
    // The safe choice first.
    expect(within(dialog).getByRole('button', { name: 'Cancel' })).toHaveFocus();
    await user.click(within(dialog).getByRole('button', { name: 'Delete Hannah Ashby' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
    expect(api.requestsTo(`DELETE ${base}/contacts/${contact.id}`)).toHaveLength(1);
    await waitFor(() => expect(screen.getByRole('heading', { name: 'Family contacts' })).toHaveFocus());
    expect(await screen.findByText('No family contacts yet.')).toBeInTheDocument();
  });

  it('keeps a stopped contact’s agreement box read-only with the reason, and records the family’s new consent', async () => {
    const stopped = contactRecord({ unsubscribedAt: '2026-10-20T08:00:00.000Z' });
    const renewed = contactRecord({
      unsubscribedAt: null,
      summariesConsentGivenOn: '2026-11-02',
      summariesConsentGivenBy: 'Hannah Ashby',
    });
    let contacts = [stopped];
    const { user, api } = await openClient('clinician', 'consent', {
      [`GET ${base}/contacts`]: () => ({ body: contacts }),
      [`PATCH ${base}/contacts/${stopped.id}`]: { body: stopped },
      [`POST ${base}/contacts/${stopped.id}/summaries-consent`]: () => {
        contacts = [renewed];
        return { body: renewed };
      },
    });
    await user.click(await screen.findByRole('button', { name: 'Edit Hannah Ashby' }));
    const edit = within(await screen.findByRole('dialog', { name: 'Edit Hannah Ashby' }));
    const box = edit.getByLabelText('Agreed to receive progress summaries');
    expect(box).toBeDisabled();
    expect(box).not.toBeChecked();
    expect(box).toHaveAccessibleDescription(/Cannot be ticked: this address used the stop link/);
    await user.click(edit.getByRole('button', { name: 'Cancel' }));

    await user.click(
      screen.getByRole('button', { name: 'Record the family’s new consent to summaries for Hannah Ashby' }),
    );
    const dialog = within(
      await screen.findByRole('dialog', { name: 'Record the family’s new consent to summaries' }),
    );
    // Nothing pre-filled: an empty submit is refused and listed.
    expect(dialog.getByLabelText('Date the family gave consent')).toHaveValue('');
    await user.click(dialog.getByRole('button', { name: 'Record consent and send summaries again' }));
    expect(await dialog.findByRole('group', { name: '2 fields need attention' })).toHaveFocus();
    await user.type(dialog.getByLabelText('Date the family gave consent'), '2026-11-02');
    await user.type(dialog.getByLabelText('Who gave it'), 'Hannah Ashby');
    await user.click(dialog.getByRole('button', { name: 'Record consent and send summaries again' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
    expect(api.requestsTo(`POST ${base}/contacts/${stopped.id}/summaries-consent`)[0]?.body).toEqual({
      givenOn: '2026-11-02',
      givenBy: 'Hannah Ashby',
    });
    await waitFor(() => expect(screen.getByRole('heading', { name: 'Family contacts' })).toHaveFocus());
    expect(api.requestsTo(`PATCH ${base}/contacts/${stopped.id}`)).toHaveLength(0);
  });

  it('attaches a scanned consent form as multipart field "file" and refuses one over 10 MB first', async () => {
    const consent = consentRecord();
    const { user, api } = await openClient('clinician', 'consent', {
      [`PUT ${base}/consents/${consent.id}/document`]: {
        body: {
          ...consent,
          document: { fileName: 'consent-form.pdf', mimeType: 'application/pdf', byteSize: 2048 },
        },
      },
    });
    const input = await screen.findByLabelText('Attach the scanned form');
    await user.upload(
      input,
      new File([new Uint8Array(10 * 1024 * 1024 + 1)], 'huge.pdf', { type: 'application/pdf' }),
    );
    await user.click(screen.getByRole('button', { name: 'Upload form' }));
    expect(await screen.findByText(/larger than 10 MB/)).toBeInTheDocument();
    expect(api.requestsTo(`PUT ${base}/consents/${consent.id}/document`)).toHaveLength(0);

    await user.upload(input, new File(['%PDF-1.4 scanned'], 'consent-form.pdf', { type: 'application/pdf' }));
    await user.click(screen.getByRole('button', { name: 'Upload form' }));
    await waitFor(() =>
      expect(screen.getByRole('status')).toHaveTextContent(
        'Attached consent-form.pdf to the consent record.',
      ),
    );
    const [put] = api.requestsTo(`PUT ${base}/consents/${consent.id}/document`);
    expect((put?.formData?.get('file') as File).name).toBe('consent-form.pdf');
  });

  it('says so when the client is not in the caseload', async () => {
    mockFetch({
      ...sessionRoutes(sessionUser('clinician')),
      [`GET ${base}`]: {
        status: 404,
        body: { statusCode: 404, message: 'There is no client with that id in your caseload.' },
      },
    });
    renderApp(`/clients/${ASHBY_ID}/overview`);
    await waitFor(() =>
      expect(screen.getByRole('alert')).toHaveTextContent(
        'There is no client with that id in your caseload.',
      ),
    );
  });
});
