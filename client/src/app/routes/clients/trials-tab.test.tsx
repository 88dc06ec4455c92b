import type { Role } from '@keyloom/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { OWN_PHRASE_ID, practicePhrases, trialRecord } from '@/features/keyboard/testing/trial-data';
import { profileVersion, VERSION_1_ID, VERSION_2_ID } from '@/features/profiles/testing/profile-data';
import { ASHBY_ID, clientRecord, sessionUser } from '@/testing/data';
import { type MockRoutes, mockFetch, sessionRoutes } from '@/testing/mock-fetch';
import { renderApp } from '@/testing/render-app';

const base = `/api/clients/${ASHBY_ID}`;

const openTab = async (role: Role, routes: MockRoutes = {}) => {
  const api = mockFetch({
    ...sessionRoutes(sessionUser(role)),
    [`GET ${base}`]: { body: clientRecord() },
    [`GET ${base}/profile-versions`]: {
      body: [
        profileVersion({
          id: 'c1a2b3c4-d5e6-4f70-8a9b-0c1d2e3f4a03',
          number: 3,
          status: 'draft',
          metrics: null,
        }),
        profileVersion({ id: VERSION_2_ID, number: 2, status: 'trained' }),
        profileVersion({ status: 'active' }),
      ],
    },
    [`GET /api/profile-versions/${VERSION_1_ID}/trials`]: {
      body: [trialRecord(), trialRecord({ id: 'e1f2a3b4-c5d6-4e7f-8a9b-0c1d2e3f4a72' })],
    },
    [`GET /api/profile-versions/${VERSION_2_ID}/trials`]: { body: [] },
    [`GET ${base}/practice-phrases`]: { body: practicePhrases() },
    ...routes,
  });
  const app = renderApp(`/clients/${ASHBY_ID}/trials`);
  await screen.findByRole('heading', { level: 3, name: 'Versions to try' });
  return { ...app, api };
};

describe('Try-outs tab', () => {
  it('lists the versions with a model and their trial counts, and shows the active version’s trials', async () => {
    await openTab('carer');
    const table = within(screen.getByRole('table', { name: /^Trained versions of R\. Ashby’s profile/ }));
    const rows = table.getAllByRole('row').slice(1);
    expect(rows.map((row) => within(row).getByRole('rowheader').lastChild?.textContent)).toEqual([
      'Version 2',
      'Version 1',
    ]);
    await waitFor(() =>
      expect(within(rows[1]!).getAllByRole('cell').at(-1)?.lastChild?.textContent).toBe('2'),
    );
    expect(within(rows[0]!).getAllByRole('cell').at(-1)?.lastChild?.textContent).toBe('0');
    expect(screen.getByLabelText('Version to try or review')).toHaveValue(VERSION_1_ID);
    expect(screen.getByRole('link', { name: 'Open the test keyboard' })).toHaveAttribute(
      'href',
      `/clients/${ASHBY_ID}/keyboard?version=${VERSION_1_ID}`,
    );
    expect(
      await screen.findByRole('table', { name: 'Trials of version 1, newest first' }),
    ).toBeInTheDocument();
    // Carers read the phrases but neither add nor delete them.
    expect(await screen.findByRole('list', { name: 'R. Ashby’s own practice phrases' })).toHaveTextContent(
      'pepper wants her walk by the harbour',
    );
    expect(screen.queryByRole('button', { name: /^Delete the phrase/ })).not.toBeInTheDocument();
    expect(screen.queryByRole('form', { name: 'Add a practice phrase' })).not.toBeInTheDocument();
  });

  it('switches the history and the keyboard link to another version', async () => {
    const { user } = await openTab('clinician');
    await user.selectOptions(screen.getByLabelText('Version to try or review'), VERSION_2_ID);
    expect(await screen.findByText(/^No trials of version 2 yet\./)).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Open the test keyboard' })).toHaveAttribute(
      'href',
      `/clients/${ASHBY_ID}/keyboard?version=${VERSION_2_ID}`,
    );
  });

  it('gives supervisors the history but no keyboard', async () => {
    await openTab('supervisor');
    expect(
      await screen.findByRole('table', { name: 'Trials of version 1, newest first' }),
    ).toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'Open the test keyboard' })).not.toBeInTheDocument();
  });

  it('lets the owning clinician add a phrase (checked against the shared rule) and delete the client’s own', async () => {
    const { user, api } = await openTab('clinician', {
      [`POST ${base}/practice-phrases`]: {
        status: 201,
        body: {
          id: 'a0a0a0a0-b1b1-4c2c-8d3d-e4e4e4e4e4e4',
          text: 'jazz on friday',
          source: 'client',
          addedBy: 'Dr. Tomasz Reyes',
          createdAt: '2026-10-01T10:00:00.000Z',
        },
      },
      [`DELETE ${base}/practice-phrases/${OWN_PHRASE_ID}`]: { status: 204 },
    });
    const form = within(await screen.findByRole('form', { name: 'Add a practice phrase' }));
    await user.type(form.getByLabelText('New practice phrase'), 'j');
    await user.click(form.getByRole('button', { name: 'Add phrase' }));
    expect(await form.findByText('Write a phrase of at least 2 characters.')).toBeInTheDocument();
    expect(api.requestsTo(`POST ${base}/practice-phrases`)).toHaveLength(0);
    await user.type(form.getByLabelText('New practice phrase'), 'azz on friday');
    await user.click(form.getByRole('button', { name: 'Add phrase' }));
    expect(await screen.findByText('Added the practice phrase “jazz on friday”.')).toBeInTheDocument();
    expect(api.requestsTo(`POST ${base}/practice-phrases`)[0]?.body).toEqual({ text: 'jazz on friday' });

    await user.click(
      screen.getByRole('button', { name: 'Delete the phrase “pepper wants her walk by the harbour”' }),
    );
    await waitFor(() =>
      expect(api.requestsTo(`DELETE ${base}/practice-phrases/${OWN_PHRASE_ID}`)).toHaveLength(1),
    );
    expect(
      await screen.findByText('Deleted the practice phrase “pepper wants her walk by the harbour”.'),
    ).toBeInTheDocument();
  });
});
