import type { ProfileVersion } from '@keyloom/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { profileVersion, VERSION_1_ID, VERSION_2_ID } from '@/features/profiles/testing/profile-data';
import { clientVocabularyState } from '@/features/vocabulary/testing/vocabulary-data';
import { ASHBY_ID, clientRecord, SAMPLE_ID, sampleSummary, sessionUser } from '@/testing/data';
import { type MockRoutes, mockFetch, sessionRoutes } from '@/testing/mock-fetch';
import { currentUrl, renderApp } from '@/testing/render-app';

// Correcting versions on the version page: retire the active version (supervisor), delete a draft
// (clinician). Invented versions of the Willowmere demo client.
const VERSION_3_ID = 'c1a2b3c4-d5e6-4f70-8a9b-0c1d2e3f4a03';
const base = `/api/clients/${ASHBY_ID}`;

const openPage = async (
  role: 'clinician' | 'supervisor',
  version: ProfileVersion,
  list: ProfileVersion[],
  routes: MockRoutes = {},
) => {
  const api = mockFetch({
    ...sessionRoutes(sessionUser(role)),
    [`GET ${base}`]: { body: clientRecord() },
    [`GET ${base}/profile-versions`]: { body: list },
    [`GET ${base}/samples`]: { body: [sampleSummary({ status: 'ready' })] },
    [`GET ${base}/vocabulary`]: { body: clientVocabularyState() },
    [`GET /api/profile-versions/${version.id}`]: { body: version },
    [`GET /api/profile-versions/${version.id}/trials`]: { body: [] },
    ...routes,
  });
  const app = renderApp(`/clients/${ASHBY_ID}/profiles/${version.id}`);
  await screen.findByRole('heading', { level: 1, name: `Version ${version.number} of R. Ashby’s profile` });
  return { ...app, api };
};

const approved = (id: string, number: number, approvedAt: string, extra: Partial<ProfileVersion> = {}) =>
  profileVersion({ id, number, status: 'retired', approvedBy: 'Dr. Mira Okafor', approvedAt, ...extra });

describe('Retire the active version', () => {
  it('names the version that becomes active again, sends the reason, then focuses the actions', async () => {
    const active = approved(VERSION_3_ID, 3, '2026-10-20T10:00:00.000Z', { status: 'active' });
    const list = [
      active,
      // Retired by hand: never active again.
      approved(VERSION_2_ID, 2, '2026-10-01T10:00:00.000Z', {
        retiredAt: '2026-10-10T10:00:00.000Z',
        retiredBy: 'Dr. Mira Okafor',
        retireReason: 'Worse on the keyboard.',
      }),
      approved(VERSION_1_ID, 1, '2026-09-20T10:00:00.000Z'),
    ];
    const { user, api } = await openPage('supervisor', active, list, {
      [`POST /api/profile-versions/${VERSION_3_ID}/retire`]: { body: { ...active, status: 'retired' } },
    });
    await user.click(await screen.findByRole('button', { name: 'Retire this version' }));
    const dialog = await screen.findByRole('dialog', { name: 'Retire version 3?' });
    expect(dialog).toHaveAccessibleDescription(
      'Version 3 stops being the active profile and version 1 becomes active again.',
    );
    const inDialog = within(dialog);
    await user.click(inDialog.getByRole('button', { name: 'Retire this version' }));
    expect(await inDialog.findByText('Say why this version is retired.')).toBeInTheDocument();
    expect(api.requestsTo(`POST /api/profile-versions/${VERSION_3_ID}/retire`)).toHaveLength(0);
    await user.type(inDialog.getByLabelText('Why is this version retired?'), 'Suggestions got worse.');
    await user.click(inDialog.getByRole('button', { name: 'Retire this version' }));
    expect(
      await screen.findByText('Version 3 is retired; version 1 is the active profile again.'),
    ).toBeInTheDocument();
    expect(api.requestsTo(`POST /api/profile-versions/${VERSION_3_ID}/retire`)[0]?.body).toEqual({
      reason: 'Suggestions got worse.',
    });
    await waitFor(() => expect(screen.getByRole('group', { name: 'Actions on this version' })).toHaveFocus());
  }, 15_000); // typing in a dialog: slow on a shared test machine

  it('says no version will be active when there is no earlier approved one', async () => {
    const active = approved(VERSION_1_ID, 1, '2026-09-20T10:00:00.000Z', { status: 'active' });
    const { user } = await openPage('supervisor', active, [active]);
    await user.click(await screen.findByRole('button', { name: 'Retire this version' }));
    expect(await screen.findByRole('dialog', { name: 'Retire version 1?' })).toHaveAccessibleDescription(
      'Version 1 stops being the active profile; no version will be active until a new one is approved.',
    );
  });

  it('offers retiring to no clinician, and only on the active version', async () => {
    const active = approved(VERSION_1_ID, 1, '2026-09-20T10:00:00.000Z', { status: 'active' });
    await openPage('clinician', active, [active]);
    expect(screen.queryByRole('button', { name: 'Retire this version' })).not.toBeInTheDocument();
  });
});

describe('Edit a draft', () => {
  it('opens the form filled from the draft, sends the changes, then focuses the settings', async () => {
    const DIARY_ID = '9c4d5e6f-7a8b-4c0d-9e2f-3a4b5c6d7e82';
    const draft = profileVersion({
      status: 'draft',
      metrics: null,
      modelBytes: null,
      note: 'First try',
      settings: { ...profileVersion().settings, order: 4 },
    });
    const { user, api } = await openPage('clinician', draft, [draft], {
      [`GET ${base}/samples`]: {
        body: [
          sampleSummary({ status: 'ready', characters: 24_180 }),
          sampleSummary({ id: DIARY_ID, title: 'Diary, August', status: 'ready', characters: 10_180 }),
        ],
      },
      [`PATCH /api/profile-versions/${VERSION_1_ID}`]: {
        body: { ...draft, note: 'With the diary', settings: { ...draft.settings, order: 6 } },
      },
    });
    await user.click(screen.getByRole('button', { name: 'Edit draft' }));
    const form = within(await screen.findByRole('form', { name: 'Edit draft version 1' }));
    await waitFor(() => expect(screen.getByRole('heading', { name: 'Edit draft version 1' })).toHaveFocus());
    // Filled from the draft: its order, note and its one sample ticked (the diary is not in it).
    expect(form.getByLabelText('Context order')).toHaveValue(4);
    expect(form.getByLabelText('Note (optional)')).toHaveValue('First try');
    expect(form.getByRole('checkbox', { name: 'Messages to the sailing club' })).toBeChecked();
    expect(form.getByRole('checkbox', { name: 'Diary, August' })).not.toBeChecked();
    await user.click(form.getByRole('checkbox', { name: 'Diary, August' }));
    await user.clear(form.getByLabelText('Context order'));
    await user.type(form.getByLabelText('Context order'), '6');
    await user.clear(form.getByLabelText('Note (optional)'));
    await user.type(form.getByLabelText('Note (optional)'), 'With the diary');
    await user.click(form.getByRole('button', { name: 'Save draft' }));
    expect(await screen.findByText('Draft version 1 was saved.')).toBeInTheDocument();
    const sent = api.requestsTo(`PATCH /api/profile-versions/${VERSION_1_ID}`)[0]?.body as {
      sampleIds: string[];
      note: string;
      settings: { order: number; vocabulary: unknown };
    };
    expect(sent.sampleIds).toEqual([SAMPLE_ID, DIARY_ID]);
    expect(sent.note).toBe('With the diary');
    expect(sent.settings.order).toBe(6);
    expect(sent.settings.vocabulary).toEqual(draft.settings.vocabulary);
    expect(api.requestsTo(`POST /api/profile-versions/${VERSION_1_ID}/train`)).toHaveLength(0);
    await waitFor(() => expect(screen.getByRole('heading', { name: 'Settings and samples' })).toHaveFocus());
  });
});

describe('Delete a draft', () => {
  it('says what is deleted, deletes it, and opens the version list with focus on it', async () => {
    const draft = profileVersion({ status: 'draft', metrics: null, modelBytes: null });
    const other = profileVersion({ id: VERSION_2_ID, number: 2, status: 'trained' });
    let deleted = false;
    const { user, api, router } = await openPage('clinician', draft, [], {
      [`GET ${base}/profile-versions`]: () => ({ body: deleted ? [other] : [other, draft] }),
      [`DELETE /api/profile-versions/${VERSION_1_ID}`]: () => {
        deleted = true;
        return { status: 204 };
      },
    });
    await user.click(screen.getByRole('button', { name: 'Delete draft' }));
    const dialog = await screen.findByRole('dialog', { name: 'Delete draft version 1?' });
    expect(dialog).toHaveAccessibleDescription(
      'Draft version 1 is deleted: its settings, its note and its choice of 1 sample. The samples themselves are kept.',
    );
    await user.click(within(dialog).getByRole('button', { name: 'Delete draft' }));
    await waitFor(() => expect(currentUrl(router)).toBe(`/clients/${ASHBY_ID}/profiles`));
    expect(api.requestsTo(`DELETE /api/profile-versions/${VERSION_1_ID}`)).toHaveLength(1);
    expect(await screen.findByText('Draft version 1 was deleted.')).toBeInTheDocument();
    await waitFor(() => expect(screen.getByRole('heading', { name: 'Versions' })).toHaveFocus());
  });

  it('shows the server’s refusal in the dialog and stays on the page', async () => {
    const draft = profileVersion({ status: 'draft', metrics: null, modelBytes: null });
    const { user, router } = await openPage('clinician', draft, [draft], {
      [`DELETE /api/profile-versions/${VERSION_1_ID}`]: {
        status: 409,
        body: {
          statusCode: 409,
          message: 'Only a draft can be edited or deleted; this version is training.',
        },
      },
    });
    await user.click(screen.getByRole('button', { name: 'Delete draft' }));
    const dialog = within(await screen.findByRole('dialog', { name: 'Delete draft version 1?' }));
    await user.click(dialog.getByRole('button', { name: 'Delete draft' }));
    expect(
      await dialog.findByText('Only a draft can be edited or deleted; this version is training.'),
    ).toBeInTheDocument();
    expect(currentUrl(router)).toBe(`/clients/${ASHBY_ID}/profiles/${VERSION_1_ID}`);
  });
});
