import type { Role } from '@keyloom/shared';
import { screen, waitFor, within } from '@testing-library/react';
import axe from 'axe-core';
import { describe, expect, it } from 'vitest';
import { profileVersion, VERSION_1_ID } from '@/features/profiles/testing/profile-data';
import {
  misspellingList,
  vocabularyPage,
  vocabularyServer,
} from '@/features/vocabulary/testing/vocabulary-data';
import { ASHBY_ID, clientRecord, sessionUser } from '@/testing/data';
import { type MockRoutes, mockFetch, sessionRoutes } from '@/testing/mock-fetch';
import { renderApp } from '@/testing/render-app';

const listUrl = `/api/clients/${ASHBY_ID}/vocabulary`;
const wordsUrl = `/api/profile-versions/${VERSION_1_ID}/vocabulary`;
const misspellingsUrl = `/api/profile-versions/${VERSION_1_ID}/misspellings`;

const openPage = async (role: Role = 'clinician', routes: MockRoutes = {}, server = vocabularyServer()) => {
  const api = mockFetch({
    ...sessionRoutes(sessionUser(role)),
    [`GET /api/clients/${ASHBY_ID}`]: { body: clientRecord() },
    [`GET /api/profile-versions/${VERSION_1_ID}`]: {
      body: profileVersion({
        settings: {
          ...profileVersion().settings,
          vocabulary: { additions: [{ text: 'Okafor' }], blocks: [] },
        },
      }),
    },
    [`GET ${wordsUrl}`]: { body: vocabularyPage() },
    [`GET ${misspellingsUrl}`]: { body: misspellingList() },
    [`GET ${listUrl}`]: () => server.get(),
    [`PUT ${listUrl}`]: (request) => server.put(request),
    ...routes,
  });
  const app = renderApp(`/clients/${ASHBY_ID}/profiles/${VERSION_1_ID}/vocabulary`);
  await screen.findByRole('heading', { level: 1, name: 'Vocabulary of version 1' });
  return { ...app, api, server };
};

const wordRequests = (api: Awaited<ReturnType<typeof openPage>>['api']) =>
  api.requests.filter((request) => request.method === 'GET' && request.path.startsWith(`${wordsUrl}?`));
const lastWordQuery = (api: Awaited<ReturnType<typeof openPage>>['api']) =>
  new URLSearchParams(wordRequests(api).at(-1)?.path.split('?')[1]);
const puts = (api: Awaited<ReturnType<typeof openPage>>['api']) => api.requestsTo(`PUT ${listUrl}`);
const cellValue = (cell: HTMLElement) => cell.lastChild?.textContent;

describe('Vocabulary page', () => {
  it('lists the words: counts with separators, samples, dates, general English and status', async () => {
    await openPage();
    const table = within(
      await screen.findByRole('table', { name: 'Words of version 1: Words 1–3 of 6,467' }),
    );
    const pepper = table.getByRole('row', { name: /^Pepper/ });
    expect(within(pepper).getAllByRole('cell').map(cellValue).slice(0, 6)).toEqual([
      '1,204',
      'Messages to the sailing club, Diary, August, +2 more',
      '2 Mar 2026',
      '30 Aug 2026',
      'No',
      '—',
    ]);
    const recieve = table.getByRole('row', { name: /^recieve/ });
    expect(within(recieve).getAllByRole('cell').map(cellValue).slice(0, 6)).toEqual([
      '3',
      '—',
      '—',
      '—',
      'No',
      'Blocked → receive',
    ]);
    expect(screen.getByText('6,467 words shown of 6,467.')).toBeInTheDocument();
    // The version's own frozen list, beside the client's current one.
    expect(
      screen.getByText(/version 1 keeps the words it was trained with \(1 added, 0 blocked\)/),
    ).toBeInTheDocument();
  });

  it('pages on the server: Next asks for page 2, keeps focus, and says which words are shown', async () => {
    const { user, api } = await openPage('clinician', {
      [`GET ${wordsUrl}`]: (request) => {
        const page = Number(new URLSearchParams(request.path.split('?')[1]).get('page') ?? '1');
        return { body: vocabularyPage({ page, total: 130 }) };
      },
    });
    await screen.findByRole('table', { name: /Words 1–3 of 130/ });
    expect(screen.queryByRole('button', { name: 'Previous' })).not.toBeInTheDocument();
    const next = screen.getByRole('button', { name: 'Next' });
    await user.click(next);
    await screen.findByRole('table', { name: /Words 51–53 of 130/ });
    expect(lastWordQuery(api).get('page')).toBe('2');
    expect(screen.getByRole('button', { name: 'Next' })).toHaveFocus();
    // Page 3 is the last: Next goes away and focus moves to the table's region, named by its caption.
    await user.click(screen.getByRole('button', { name: 'Next' }));
    await screen.findByRole('table', { name: /Words 101–103 of 130/ });
    expect(screen.queryByRole('button', { name: 'Next' })).not.toBeInTheDocument();
    expect(screen.getByRole('region', { name: 'Words of version 1: Words 101–103 of 130' })).toHaveFocus();
  });

  it('finds words on submit and says when none match', async () => {
    const { user, api } = await openPage('clinician', {
      [`GET ${wordsUrl}`]: (request) => {
        const query = new URLSearchParams(request.path.split('?')[1]).get('query');
        return { body: query ? vocabularyPage({ total: 0, words: [] }) : vocabularyPage() };
      },
    });
    await screen.findByRole('table', { name: /Words 1–3/ });
    await user.type(screen.getByRole('searchbox', { name: 'Find a word' }), 'xyz');
    await user.click(screen.getByRole('button', { name: 'Find' }));
    expect(await screen.findByText('No words match “xyz”.')).toBeInTheDocument();
    expect(lastWordQuery(api).get('query')).toBe('xyz');
    expect(screen.getByText('0 words match “xyz”.')).toBeInTheDocument();
  });

  it('sorts and filters on the server, back on page 1', async () => {
    const { user, api } = await openPage();
    await screen.findByRole('table', { name: /Words 1–3/ });
    await user.selectOptions(screen.getByRole('combobox', { name: 'Sort' }), 'A to Z');
    await waitFor(() => expect(lastWordQuery(api).get('sort')).toBe('word'));
    await user.selectOptions(screen.getByRole('combobox', { name: 'Show' }), 'Not in general English');
    await waitFor(() => expect(lastWordQuery(api).get('show')).toBe('not_in_base'));
    expect(lastWordQuery(api).get('sort')).toBe('word');
    expect(lastWordQuery(api).get('page')).toBe('1');
  });

  it('adds a word: PUTs the whole list with the revision, shows it, and puts focus back in the empty field', async () => {
    const { user, api } = await openPage();
    const added = await screen.findByRole('list', { name: 'Added words and phrases' });
    const field = screen.getByRole('textbox', { name: 'Word or phrase' });
    await user.type(field, 'Dr Adeyemi');
    await user.type(screen.getByRole('spinbutton', { name: 'Weight (optional)' }), '20');
    await user.click(screen.getByRole('button', { name: 'Add' }));

    expect(await within(added).findByText('Dr Adeyemi')).toBeInTheDocument();
    expect(puts(api)).toHaveLength(1);
    expect(puts(api)[0]?.body).toEqual({
      revision: 4,
      vocabulary: {
        additions: [
          { text: 'Okafor' },
          { text: 'Willowmere Marina', weight: 10 },
          { text: 'Dr Adeyemi', weight: 20 },
        ],
        blocks: [{ word: 'lousy' }],
      },
      keptSpellings: [],
    });
    await waitFor(() => expect(screen.getByRole('textbox', { name: 'Word or phrase' })).toHaveFocus());
    expect(screen.getByRole('textbox', { name: 'Word or phrase' })).toHaveValue('');
    expect(screen.getByText('Added “Dr Adeyemi”.')).toBeInTheDocument();
  }, 15_000);

  it('says at the field when a word is already added, without sending it', async () => {
    const { user, api } = await openPage();
    await screen.findByRole('list', { name: 'Added words and phrases' });
    await user.type(screen.getByRole('textbox', { name: 'Word or phrase' }), 'okafor');
    await user.click(screen.getByRole('button', { name: 'Add' }));
    expect(await screen.findByText('"okafor" is already added.')).toBeInTheDocument();
    expect(screen.getByRole('textbox', { name: 'Word or phrase' })).toHaveAccessibleDescription(
      /"okafor" is already added\./,
    );
    expect(puts(api)).toHaveLength(0);
  });

  it('shows the server’s 400 message at the field', async () => {
    const { user } = await openPage('clinician', {
      [`PUT ${listUrl}`]: {
        status: 400,
        body: {
          statusCode: 400,
          message: 'The request is not valid.',
          issues: [
            { path: 'vocabulary.additions.2.text', message: 'Keep an addition to six words or fewer.' },
          ],
        },
      },
    });
    await screen.findByRole('list', { name: 'Added words and phrases' });
    await user.type(screen.getByRole('textbox', { name: 'Word or phrase' }), 'boats');
    await user.click(screen.getByRole('button', { name: 'Add' }));
    await waitFor(() =>
      expect(screen.getByRole('textbox', { name: 'Word or phrase' })).toHaveAccessibleDescription(
        /Keep an addition to six words or fewer\./,
      ),
    );
    expect(screen.getByRole('textbox', { name: 'Word or phrase' })).toHaveValue('boats');
  });

  it('on a 409 says someone else changed the list, reloads it and keeps what was typed', async () => {
    const server = vocabularyServer();
    const { user, api } = await openPage('clinician', {}, server);
    await screen.findByRole('list', { name: 'Added words and phrases' });
    server.changeElsewhere({
      vocabulary: { additions: [{ text: 'Okafor' }, { text: 'Kestrel Point' }], blocks: [] },
    });
    const gets = api.requestsTo(`GET ${listUrl}`).length;
    await user.type(screen.getByRole('textbox', { name: 'Word or phrase' }), 'boats');
    await user.click(screen.getByRole('button', { name: 'Add' }));

    expect(
      await screen.findByText(
        'Someone else changed this list. It has been reloaded; check it and try again.',
      ),
    ).toBeInTheDocument();
    expect(api.requestsTo(`GET ${listUrl}`).length).toBeGreaterThan(gets);
    expect(await screen.findByText('Kestrel Point')).toBeInTheDocument();
    expect(screen.getByRole('textbox', { name: 'Word or phrase' })).toHaveValue('boats');
    // The list on the server is the other person's, untouched.
    expect(server.current.vocabulary.additions.map((a) => a.text)).toEqual(['Okafor', 'Kestrel Point']);
  });

  it('undoes a change with another PUT of the list as it was', async () => {
    const { user, api, server } = await openPage();
    const blocked = await screen.findByRole('list', { name: 'Blocked words' });
    await user.click(within(blocked).getByRole('button', { name: 'Remove “lousy”' }));
    expect(await screen.findByText('No words blocked.')).toBeInTheDocument();
    expect(server.current.vocabulary.blocks).toEqual([]);

    await user.click(screen.getByRole('button', { name: 'Undo' }));
    expect(await screen.findByRole('list', { name: 'Blocked words' })).toHaveTextContent('lousy');
    expect(puts(api)).toHaveLength(2);
    expect(puts(api)[1]?.body).toMatchObject({ revision: 5, vocabulary: { blocks: [{ word: 'lousy' }] } });
    expect(screen.queryByRole('button', { name: 'Undo' })).not.toBeInTheDocument();
    expect(screen.getByRole('heading', { name: 'Changes for the next version' })).toHaveFocus();
  });

  it('moves focus to the next row’s Remove after a Remove', async () => {
    const { user } = await openPage();
    const added = await screen.findByRole('list', { name: 'Added words and phrases' });
    await user.click(within(added).getByRole('button', { name: 'Remove “Okafor”' }));
    await waitFor(() =>
      expect(screen.getByRole('button', { name: 'Remove “Willowmere Marina”' })).toHaveFocus(),
    );
    expect(screen.queryByText('Okafor', { selector: 'li span' })).not.toBeInTheDocument();
  });

  it('blocks a word of the listing through a prefilled dialog, then focus returns to its Block… button', async () => {
    const { user, api } = await openPage();
    const table = within(await screen.findByRole('table', { name: /Words 1–3/ }));
    await screen.findByRole('list', { name: 'Added words and phrases' });
    const opener = table.getByRole('button', { name: 'Block… harbour' });
    await user.click(opener);
    const dialog = within(await screen.findByRole('dialog', { name: 'Block “harbour”' }));
    expect(dialog.getByRole('textbox', { name: 'Word to block' })).toHaveValue('harbour');
    await user.type(dialog.getByRole('textbox', { name: 'Replacement (optional)' }), 'harbor');
    await user.click(dialog.getByRole('button', { name: 'Block' }));

    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
    expect(puts(api)[0]?.body).toMatchObject({
      vocabulary: { blocks: [{ word: 'lousy' }, { word: 'harbour', replacement: 'harbor' }] },
    });
    await waitFor(() => expect(opener).toHaveFocus());
    expect(screen.getByText('Blocked “harbour”; “harbor” is offered instead.')).toBeInTheDocument();
  });

  it('keeps a spelling, or offers a correction in its place', async () => {
    const { user, api } = await openPage();
    const candidates = within(await screen.findByRole('list', { name: 'Possible misspellings' }));
    expect(
      candidates.getByText(/written 3 times\. Maybe: tomorrow \(1 edit\), tomorrows \(2 edits\)/),
    ).toBeInTheDocument();
    await screen.findByRole('list', { name: 'Added words and phrases' });
    await user.click(candidates.getByRole('button', { name: 'Keep as the client’s spelling' }));
    await waitFor(() => expect(puts(api)).toHaveLength(1));
    expect(puts(api)[0]?.body).toMatchObject({ revision: 4, keptSpellings: ['tommorow'] });

    await user.click(await screen.findByRole('button', { name: 'Offer ‘tomorrow’ instead' }));
    await waitFor(() => expect(puts(api)).toHaveLength(2));
    expect(puts(api)[1]?.body).toMatchObject({
      revision: 5,
      vocabulary: { blocks: [{ word: 'lousy' }, { word: 'tommorow', replacement: 'tomorrow' }] },
      keptSpellings: ['tommorow'],
    });
  });

  it('links the three device files, with the caution', async () => {
    await openPage();
    expect(screen.getByRole('link', { name: 'Words with counts (CSV)' })).toHaveAttribute(
      'href',
      `${wordsUrl}.csv`,
    );
    expect(screen.getByRole('link', { name: 'Words, one a line (text)' })).toHaveAttribute(
      'href',
      `${wordsUrl}.txt`,
    );
    expect(screen.getByRole('link', { name: 'Word pairs (CSV)' })).toHaveAttribute(
      'href',
      `/api/profile-versions/${VERSION_1_ID}/word-pairs.csv`,
    );
    expect(
      screen.getByText(/These files hold the client’s personal words\. Store and send them as you would/),
    ).toBeInTheDocument();
  });

  it('has no serious or critical axe violations, with every section loaded', async () => {
    const { container } = await openPage();
    await screen.findByRole('table', { name: /Words 1–3/ });
    await screen.findByRole('list', { name: 'Added words and phrases' });
    await screen.findByRole('list', { name: 'Possible misspellings' });
    // Colour contrast needs a real layout (the browser suites check it); jsdom has none.
    const results = await axe.run(container, { rules: { 'color-contrast': { enabled: false } } });
    const serious = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
    expect(serious.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`)).toEqual([]);
  });

  it('shows a supervisor the lists without any way to change them', async () => {
    await openPage('supervisor');
    await screen.findByRole('table', { name: /Words 1–3/ });
    expect(await screen.findByRole('list', { name: 'Added words and phrases' })).toHaveTextContent('Okafor');
    expect(await screen.findByRole('list', { name: 'Possible misspellings' })).toHaveTextContent('tommorow');
    expect(
      screen.queryByRole('button', { name: /Block…|Remove|Keep as|Offer|^Add$|^Block$/ }),
    ).not.toBeInTheDocument();
    expect(screen.queryByRole('textbox', { name: 'Word or phrase' })).not.toBeInTheDocument();
  });
});
