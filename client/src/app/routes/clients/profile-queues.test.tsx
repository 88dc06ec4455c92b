import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { profileVersion, VERSION_1_ID, VERSION_2_ID } from '@/features/profiles/testing/profile-data';
import { ASHBY_ID, clientSummary, sessionUser } from '@/testing/data';
import { mockFetch, sessionRoutes } from '@/testing/mock-fetch';
import { renderApp } from '@/testing/render-app';

const OTHER_ID = '5d1f3a7c-2b4e-4c6d-8e9f-0a1b2c3d4e52';
const VERSION_3_ID = 'c1a2b3c4-d5e6-4f70-8a9b-0c1d2e3f4a03';

const clinicRoutes = () => ({
  'GET /api/clients': {
    body: [clientSummary(), clientSummary({ id: OTHER_ID, pseudonym: 'M. Quill', accessMethod: 'switch' })],
  },
  [`GET /api/clients/${ASHBY_ID}/profile-versions`]: {
    body: [
      profileVersion({
        id: VERSION_2_ID,
        number: 2,
        status: 'signed_off',
        createdAt: '2026-09-25T09:00:00.000Z',
      }),
      profileVersion({ status: 'trained' }),
    ],
  },
  [`GET /api/clients/${OTHER_ID}/profile-versions`]: {
    body: [
      profileVersion({
        id: VERSION_3_ID,
        clientId: OTHER_ID,
        number: 4,
        status: 'signed_off',
        createdAt: '2026-09-22T09:00:00.000Z',
      }),
    ],
  },
});

describe('Version queues', () => {
  it('lists the clinic’s signed-off versions on the supervisor’s reviews page, oldest first', async () => {
    mockFetch({ ...sessionRoutes(sessionUser('supervisor')), ...clinicRoutes() });
    renderApp('/reviews');
    const table = within(
      await screen.findByRole('table', { name: 'Profile versions waiting for your approval, oldest first' }),
    );
    const rows = table.getAllByRole('row').slice(1);
    expect(rows.map((row) => within(row).getByRole('rowheader').lastChild?.textContent)).toEqual([
      'M. Quill',
      'R. Ashby',
    ]);
    expect(table.getByRole('link', { name: 'Version 2 of R. Ashby' })).toHaveAttribute(
      'href',
      `/clients/${ASHBY_ID}/profiles/${VERSION_2_ID}`,
    );
    expect(table.queryByRole('link', { name: 'Version 1 of R. Ashby' })).not.toBeInTheDocument();
    // The clinic's figures: keystroke savings and hit rate, not bits per character.
    expect(table.getAllByRole('columnheader').map((header) => header.textContent)).toEqual([
      'Client',
      'Version',
      'Waiting since',
      'Keystroke savings',
      'Hit rate',
    ]);
  });

  it('lists the versions waiting for the carer’s sign-off under their clients', async () => {
    mockFetch({ ...sessionRoutes(sessionUser('carer')), ...clinicRoutes() });
    renderApp('/my-clients');
    const table = within(
      await screen.findByRole('table', { name: 'Profile versions waiting for your sign-off, oldest first' }),
    );
    expect(table.getAllByRole('row')).toHaveLength(2);
    expect(table.getByRole('link', { name: 'Version 1 of R. Ashby' })).toHaveAttribute(
      'href',
      `/clients/${ASHBY_ID}/profiles/${VERSION_1_ID}`,
    );
    // A carer sees what to try, not the engine's figures.
    expect(table.queryByRole('columnheader', { name: 'Bits per character' })).not.toBeInTheDocument();
    expect(table.getByRole('columnheader', { name: 'What to try' })).toBeInTheDocument();
    expect(table.getByRole('link', { name: 'Try version 1 on the test keyboard' })).toHaveAttribute(
      'href',
      expect.stringContaining(VERSION_1_ID),
    );
  });
});
