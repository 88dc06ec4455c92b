import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { ASHBY_ID, clientSummary, sessionUser } from '@/testing/data';
import { mockFetch, sessionRoutes } from '@/testing/mock-fetch';
import { renderApp } from '@/testing/render-app';

const hannahId = sessionUser('carer').id;

describe('Assignments (admin)', () => {
  it('lists clients without links to clinical pages and removes a carer', async () => {
    let carers = clientSummary().carers;
    const api = mockFetch({
      ...sessionRoutes(sessionUser('admin')),
      'GET /api/clients': () => ({ body: [clientSummary({ carers })] }),
      [`GET /api/clients/${ASHBY_ID}/carers-available`]: { body: [] },
      [`DELETE /api/clients/${ASHBY_ID}/assignments/${hannahId}`]: () => {
        carers = [];
        return { status: 204 };
      },
    });
    const { user } = renderApp('/admin/assignments');
    const table = await screen.findByRole('table', { name: 'Clients of the clinic (1)' });
    expect(within(table).queryByRole('link')).not.toBeInTheDocument();
    expect(within(table).getByRole('rowheader', { name: /R\. Ashby/ })).toBeInTheDocument();

    await user.click(within(table).getByRole('button', { name: 'Remove Hannah Ashby from R. Ashby' }));
    await waitFor(() =>
      expect(screen.getByRole('status')).toHaveTextContent('Hannah Ashby is no longer assigned to R. Ashby.'),
    );
    expect(api.requestsTo(`DELETE /api/clients/${ASHBY_ID}/assignments/${hannahId}`)).toHaveLength(1);
    expect(await within(table).findByText('No carer is assigned yet.')).toBeInTheDocument();
  });

  it('offers admins the Assignments, Clinic details and Audit log links, and no client page', async () => {
    mockFetch({ ...sessionRoutes(sessionUser('admin')), 'GET /api/users': { body: [] } });
    const { user } = renderApp('/admin/staff');
    const nav = within(await screen.findByRole('navigation', { name: 'Main' }));
    expect(nav.getAllByRole('link').map((link) => link.textContent)).toEqual([
      'Staff',
      'Assignments',
      'Clinic details',
      'Audit log',
    ]);
    await user.click(nav.getByRole('link', { name: 'Assignments' }));
    await screen.findByRole('heading', { level: 1, name: 'Assignments' });

    mockFetch({ ...sessionRoutes(sessionUser('admin')) });
    renderApp(`/clients/${ASHBY_ID}/overview`);
    expect(await screen.findByRole('heading', { level: 1, name: 'Not allowed' })).toBeInTheDocument();
  });
});
