import { createTrialSchema, partialWord, replayTrial, type Role } from '@keyloom/shared';
import { act, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { practicePhrases, trialRecord } from '@/features/keyboard/testing/trial-data';
import { profileVersion, VERSION_1_ID, VERSION_2_ID } from '@/features/profiles/testing/profile-data';
import { ASHBY_ID, clientRecord, sessionUser } from '@/testing/data';
import { type MockRoutes, mockFetch, sessionRoutes } from '@/testing/mock-fetch';
import { renderApp } from '@/testing/render-app';

// The engine is replaced by a fixed word list, so the page is tested on its own: the row offers
// the listed words that start with the word being typed, in list order.
const WORDS = ['the', 'tea', 'garden', 'go', 'good', 'pepper', 'harbour'];
const requests: { text: string; seq: number }[] = [];
let resets = 0;

vi.mock('@/features/keyboard/engine/use-keyboard-engine', async () => {
  const React = await import('react');
  const shared = await import('@keyloom/shared');
  return {
    useKeyboardEngine: (versionId: string | null) => {
      const [suggestions, setSuggestions] = React.useState<{
        seq: number;
        text: string;
        words: string[];
        letters: { char: string; p: number }[];
        engineMs: number;
      } | null>(null);
      const request = React.useCallback((text: string, seq: number, slots = 5) => {
        requests.push({ text, seq });
        const typed = shared.partialWord(text);
        const words = WORDS.filter((word) => word.startsWith(typed) && word !== typed).slice(0, slots);
        // After an "e" the likeliest letters change (r, in both cases, then s).
        const letters = text.endsWith('e')
          ? [
              { char: 'R', p: 0.3 },
              { char: 'r', p: 0.3 },
              { char: 's', p: 0.2 },
            ]
          : [
              { char: 'e', p: 0.5 },
              { char: 'a', p: 0.2 },
              { char: 'o', p: 0.1 },
              { char: 'x', p: 0.01 },
            ];
        setSuggestions({ seq, text, words, letters, engineMs: 0.2 });
      }, []);
      return {
        status: versionId ? 'ready' : 'idle',
        error: null,
        info: versionId
          ? {
              versionBytes: 90_000,
              versionCompressedBytes: 30_000,
              baseBytes: 0,
              baseCompressedBytes: 0,
              baseWordsBytes: 0,
              baseWordsCompressedBytes: 0,
              loadMs: 12,
              order: 5,
              contexts: 1234,
            }
          : null,
        slots: 5,
        caseFold: false,
        suggestions,
        request,
        resetLearning: () => {
          resets++;
        },
      };
    },
  };
});

const versionsUrl = `/api/clients/${ASHBY_ID}/profile-versions`;
const trialsUrl = (id: string) => `/api/profile-versions/${id}/trials`;

const openKeyboard = async (role: Role, query = '', routes: MockRoutes = {}, autoCapital = false) => {
  const api = mockFetch({
    ...sessionRoutes(sessionUser(role)),
    [`GET /api/clients/${ASHBY_ID}`]: { body: clientRecord() },
    [`GET ${versionsUrl}`]: {
      body: [
        profileVersion({ id: VERSION_2_ID, number: 2, status: 'trained' }),
        profileVersion({ status: 'active' }),
      ],
    },
    [`GET /api/clients/${ASHBY_ID}/practice-phrases`]: { body: practicePhrases() },
    [`POST ${trialsUrl(VERSION_1_ID)}`]: (request) => {
      const input = createTrialSchema.parse(request.body);
      return { status: 201, body: trialRecord({ localTrialId: input.localTrialId, text: input.text }) };
    },
    [`GET ${trialsUrl(VERSION_1_ID)}`]: { body: [] },
    ...routes,
  });
  const app = renderApp(`/clients/${ASHBY_ID}/keyboard${query}`);
  await screen.findByRole('heading', { level: 1, name: 'Test keyboard' });
  await screen.findByRole('group', { name: 'Keys' });
  // Most tests type the lower-case practice phrases: the automatic capital (on by default) is turned off.
  const capitals = screen.getByRole('checkbox', { name: 'Capital after a full stop' });
  expect(capitals).toBeChecked();
  if (!autoCapital) await app.user.click(capitals);
  return { ...app, api };
};

const output = () => screen.getByRole('textbox', { name: 'Text typed so far' });
const pauseDialog = () => screen.getByRole('dialog', { name: 'Trial paused' });

/** Pauses the running trial with Escape and finishes it from the pause dialog. */
const finishFromPause = async (user: {
  keyboard: (keys: string) => Promise<void>;
  click: (e: Element) => Promise<void>;
}) => {
  await user.keyboard('{Escape}');
  await user.click(within(pauseDialog()).getByRole('button', { name: 'Finish trial' }));
};
const key = (name: string) =>
  within(screen.getByRole('group', { name: 'Keys' })).getByRole('button', { name });

beforeEach(() => {
  requests.length = 0;
  localStorage.clear();
});
afterEach(() => {
  vi.useRealTimers();
});

describe('Test keyboard page', () => {
  it('opens the active version by default with the cautions, and offers the versions with a model', async () => {
    await openKeyboard('carer');
    expect(screen.getByText(/Suggestions are offered, never inserted on their own/)).toBeInTheDocument();
    expect(screen.getByText(/not a communication aid for emergencies/)).toBeInTheDocument();
    const select = screen.getByLabelText('Profile version to try');
    expect(select).toHaveValue(VERSION_1_ID);
    expect(
      within(select)
        .getAllByRole('option')
        .map((o) => o.textContent),
    ).toEqual(['Version 2 — Ready for trial', 'Version 1 — Active profile']);
    expect(screen.getByText('30 kB downloaded (90 kB unpacked)')).toBeInTheDocument();
    // A head-pointer client starts in direct mode; the slot count is the version's.
    expect(screen.getByLabelText('Selection mode')).toHaveValue('direct');
    expect(within(screen.getByRole('group', { name: 'Suggestions' })).getAllByRole('button')).toHaveLength(5);
  });

  it('types with the keys, keeps empty slots in place, and inserts a word only when it is picked', async () => {
    const { user } = await openKeyboard('carer', `?version=${VERSION_2_ID}`);
    expect(screen.getByLabelText('Profile version to try')).toHaveValue(VERSION_2_ID);
    await user.click(key('g'));
    expect(output()).toHaveTextContent(/^g$/);
    const row = within(screen.getByRole('group', { name: 'Suggestions' }));
    await waitFor(() => expect(row.getByRole('button', { name: 'garden (suggestion 1)' })).toBeEnabled());
    expect(row.getByRole('button', { name: 'good (suggestion 3)' })).toBeEnabled();
    // Five slots stay on screen: the last two are empty and cannot be picked.
    expect(row.getByRole('button', { name: 'Suggestion 4: empty' })).toBeDisabled();
    expect(row.getByRole('button', { name: 'Suggestion 5: empty' })).toBeDisabled();
    expect(output()).toHaveTextContent(/^g$/);

    await user.click(row.getByRole('button', { name: 'garden (suggestion 1)' }));
    expect(output().textContent).toBe('garden ');
    await user.click(key('delete last letter'));
    expect(output().textContent).toBe('garden');
    // Each selection asked the engine about the text it made, with a growing number.
    const asked = requests.slice(-3);
    expect(asked.map((r) => r.text)).toEqual(['g', 'garden ', 'garden']);
    expect(asked[1]!.seq).toBeGreaterThan(asked[0]!.seq);
    expect(partialWord(output().textContent ?? '')).toBe('garden');
  });

  it('announces the row politely once it has settled, and only when it changed', async () => {
    const { user } = await openKeyboard('carer');
    const live = () =>
      screen
        .getAllByRole('status')
        .find(
          (element) =>
            element.textContent?.startsWith('Suggestions') || element.textContent === 'No suggestions.',
        );
    await waitFor(() => expect(live()?.textContent).toBe('Suggestions: the, tea, garden, go, good.'), {
      timeout: 2000,
    });
    await user.click(key('t'));
    await user.click(key('e'));
    // Not yet: the row must rest for 700 ms first.
    expect(live()?.textContent).toBe('Suggestions: the, tea, garden, go, good.');
    await waitFor(() => expect(live()?.textContent).toBe('Suggestions: tea.'), { timeout: 2000 });
  });

  it('tints the likeliest keys with a border cue when asked', async () => {
    const { user } = await openKeyboard('clinician');
    expect(key('e').className).not.toMatch(/border-4/);
    await user.click(screen.getByLabelText('Tint likely next keys'));
    await waitFor(() => expect(key('e').className).toMatch(/border-4/));
    expect(key('a').className).toMatch(/border-4/);
    expect(key('x').className).not.toMatch(/border-4/);
    expect(key('e').style.backgroundColor).not.toBe(key('x').style.backgroundColor);
  });

  it('runs a trial on a practice phrase, shows the measured figures beside the simulated ones, and uploads it', async () => {
    const { user, api } = await openKeyboard('carer');
    await user.selectOptions(screen.getByLabelText('Practice phrase'), 'kl-11');
    expect(screen.getByText('the soup is too hot', { selector: '[data-target-phrase]' })).toBeInTheDocument();
    const resetsBefore = resets;
    await user.click(screen.getByRole('button', { name: 'Start trial' }));
    // Each trial starts from the version as trained.
    expect(resets).toBe(resetsBefore + 1);
    // The Start button is gone; focus lands on the message window, not on the page.
    expect(output()).toHaveFocus();
    await user.click(key('t'));
    await user.click(key('e'));
    await user.click(await screen.findByRole('button', { name: 'tea (suggestion 1)' }));
    expect(output().textContent).toBe('tea ');
    await finishFromPause(user);

    expect(await screen.findByText('The trial is saved.')).toBeInTheDocument();
    // The view has closed: focus is on the results' heading.
    expect(screen.getByRole('heading', { name: 'This trial' })).toHaveFocus();
    expect(screen.getByText('Paused time is left out of words per minute.')).toBeInTheDocument();
    const posted = createTrialSchema.parse(api.requestsTo(`POST ${trialsUrl(VERSION_1_ID)}`)[0]?.body);
    expect(replayTrial(posted.events)).toBe('tea ');
    expect(posted).toMatchObject({ phraseId: 'kl-11', targetPhrase: 'the soup is too hot', text: 'tea ' });
    expect(posted.settings).toMatchObject({
      selectionMode: 'direct',
      slots: 5,
      dwellMs: null,
      scanIntervalMs: null,
    });
    // 3 selections for 4 characters: KS = 1 − 3/4 = 25% (the definition; derived).
    const results = within(screen.getByRole('region', { name: 'This trial' }));
    expect(results.getByText(/^25\.0% measured; 36\.7% simulated at 5 slots$/)).toBeInTheDocument();
    expect(results.getByText('7.4 estimated', { exact: false })).toBeInTheDocument();
  });

  it('shift, caps lock, the symbols layer, Enter, delete word, undo pick and the automatic capital; the posted log replays to the text', async () => {
    const { user, api } = await openKeyboard('carer', '', {}, true);
    await user.click(screen.getByRole('button', { name: 'Start trial' }));
    // The message's start: the letters show capitals, and a capital is logged as the letter it is.
    expect(
      within(screen.getByRole('group', { name: 'Keys' })).queryByRole('button', { name: 'i' }),
    ).toBeNull();
    await user.click(key('I'));
    await user.click(key('space'));
    await user.click(key('g'));
    const undo = key('undo pick');
    expect(undo).toHaveAttribute('aria-disabled', 'true');
    await user.click(await screen.findByRole('button', { name: 'garden (suggestion 1)' }));
    expect(output().textContent).toBe('I garden ');
    expect(undo).not.toHaveAttribute('aria-disabled');
    await user.click(undo);
    expect(output().textContent).toBe('I g');
    expect(undo).toHaveAttribute('aria-disabled', 'true');
    await user.click(undo); // nothing left to undo: nothing happens
    expect(output().textContent).toBe('I g');
    await user.click(key('o'));
    await user.click(key('space'));

    // Shift: one press for the next letter, two for caps lock, a third for off.
    expect(key('shift')).toHaveAttribute('aria-pressed', 'false');
    await user.click(key('shift'));
    expect(key('shift: next capital')).toHaveAttribute('aria-pressed', 'true');
    await user.click(key('W'));
    expect(key('shift')).toHaveAttribute('aria-pressed', 'false');
    await user.click(key('shift'));
    await user.click(key('shift: next capital'));
    expect(key('caps lock')).toHaveAttribute('aria-pressed', 'true');
    await user.click(key('E'));
    await user.click(key('T'));
    expect(output().textContent).toBe('I go WET');
    await user.click(key('caps lock'));
    await user.click(key('delete word'));
    expect(output().textContent).toBe('I go ');

    await user.click(key('123 numbers and symbols'));
    expect(
      within(screen.getByRole('group', { name: 'Keys' })).queryByRole('button', { name: 'q' }),
    ).toBeNull();
    await user.click(key('4'));
    await user.click(key('exclamation mark'));
    await user.click(key('ABC letters'));
    await user.click(key('Enter new line'));
    expect(output().textContent).toBe('I go 4!\n');
    // After a line break the capital comes again.
    expect(key('Y')).toBeInTheDocument();
    await finishFromPause(user);

    expect(await screen.findByText('The trial is saved.')).toBeInTheDocument();
    const posted = createTrialSchema.parse(api.requestsTo(`POST ${trialsUrl(VERSION_1_ID)}`)[0]?.body);
    expect(posted.text).toBe('I go 4!\n');
    expect(replayTrial(posted.events)).toBe(posted.text);
    expect(
      screen.getByText(/the simulation types lower-case letters with no shift or layer keys/),
    ).toBeInTheDocument();
    const types = posted.events.map((e) => e.type);
    for (const type of ['shift', 'layer', 'newline', 'delete_word', 'undo_pick'] as const) {
      expect(types).toContain(type);
    }
    // The refused second undo logged nothing.
    expect(types.filter((type) => type === 'undo_pick')).toHaveLength(1);
    expect(posted.events.filter((e) => e.type === 'letter').map((e) => e.value)).toEqual([
      'I',
      'g',
      'o',
      'W',
      'E',
      'T',
      '4',
    ]);
  }, 30_000); // many clicks: slow on a shared test machine

  it('takes a physical keyboard in direct mode: letters, punctuation, Space, Backspace, Enter, number keys picking', async () => {
    const { user, api } = await openKeyboard('carer');
    expect(
      within(screen.getByLabelText('Selection mode')).getByRole('option', {
        name: 'Direct (pointer, touch or keyboard)',
      }),
    ).toBeInTheDocument();
    // Before a trial runs, a physical key types nothing.
    await user.click(output());
    await user.keyboard('x');
    expect(output().textContent).toBe('');
    const numberKeys = screen.getByRole('checkbox', { name: 'Number keys pick suggestions' });
    expect(numberKeys).not.toBeChecked();
    await user.click(numberKeys);
    await user.click(screen.getByRole('button', { name: 'Start trial' }));
    expect(output()).toHaveFocus();
    await user.keyboard('Hi, g');
    expect(output().textContent).toBe('Hi, g');
    await screen.findByRole('button', { name: 'go (suggestion 2)' });
    await user.keyboard('2');
    expect(output().textContent).toBe('Hi, go ');
    await user.keyboard('{Backspace}{Enter}!');
    expect(output().textContent).toBe('Hi, go\n!');
    // Tab still moves focus.
    output().focus();
    await user.keyboard('{Tab}');
    expect(output()).not.toHaveFocus();
    // The note (in the pause dialog) keeps its keys.
    await user.keyboard('{Escape}');
    const note = screen.getByLabelText('Note about this trial (optional)');
    await user.type(note, 'ok 1');
    expect(note).toHaveValue('ok 1');
    expect(output().textContent).toBe('Hi, go\n!');
    await user.click(within(pauseDialog()).getByRole('button', { name: 'Finish trial' }));

    expect(await screen.findByText('The trial is saved.')).toBeInTheDocument();
    const posted = createTrialSchema.parse(api.requestsTo(`POST ${trialsUrl(VERSION_1_ID)}`)[0]?.body);
    expect(posted.text).toBe('Hi, go\n!');
    expect(screen.queryByText(/the simulation types lower-case letters/)).toBeNull();
    expect(replayTrial(posted.events)).toBe(posted.text);
    expect(posted.events.filter((e) => e.type !== 'offer').map((e) => e.type)).toEqual([
      'letter',
      'letter',
      'punctuation',
      'space',
      'letter',
      'suggestion',
      'backspace',
      'newline',
      'punctuation',
      'pause', // finished from the pause dialog
    ]);
    expect(posted.events.find((e) => e.type === 'suggestion')).toMatchObject({ value: 'go', slot: 1 });
  }, 30_000);

  it('scans rows then keys at the scan interval and selects with the switch (Space)', async () => {
    const { user } = await openKeyboard('carer');
    await user.selectOptions(screen.getByLabelText('Selection mode'), 'scanning');
    const interval = screen.getByLabelText('Scan interval (ms)');
    await user.clear(interval);
    await user.type(interval, '200');
    // Fake timers from here (user-event waits on real ones, so plain events drive the page).
    vi.useFakeTimers();
    fireEvent.click(screen.getByRole('button', { name: 'Start scanning' }));
    expect(screen.getByRole('button', { name: 'Stop scanning (Escape)' })).toBeInTheDocument();
    const suggestions = screen.getByRole('group', { name: 'Suggestions' });
    const keyRowsOnScreen = () => [...screen.getByRole('group', { name: 'Keys' }).children];
    // Rows first: the suggestion row, then each key row, one per interval.
    expect(suggestions).toHaveAttribute('data-scan-row', 'on');
    act(() => vi.advanceTimersByTime(200));
    expect(suggestions).not.toHaveAttribute('data-scan-row');
    expect(keyRowsOnScreen()[0]).toHaveAttribute('data-scan-row', 'on');
    act(() => vi.advanceTimersByTime(200));
    expect(keyRowsOnScreen()[1]).toHaveAttribute('data-scan-row', 'on');
    // The switch enters the home row: its keys are highlighted one by one (a, s, d…).
    act(() => {
      fireEvent.keyDown(document, { key: ' ' });
    });
    expect(key('a')).toHaveAttribute('data-scanned', 'on');
    act(() => vi.advanceTimersByTime(200));
    expect(key('s')).toHaveAttribute('data-scanned', 'on');
    expect(key('a')).not.toHaveAttribute('data-scanned');
    act(() => {
      fireEvent.keyDown(document, { key: 'Enter' });
    });
    expect(output().textContent).toBe('s');
    act(() => {
      fireEvent.keyDown(document, { key: 'Escape' });
    });
    expect(screen.getByRole('button', { name: 'Start scanning' })).toBeInTheDocument();
  });

  it('scans with the pattern and suggestion place chosen in the settings, and logs them with the trial', async () => {
    const { user, api } = await openKeyboard('carer');
    await user.selectOptions(screen.getByLabelText('Selection mode'), 'scanning');
    const pattern = screen.getByLabelText('Scanning pattern');
    expect(pattern).toHaveAccessibleDescription('Space is the switch (Enter works too).');
    await user.selectOptions(pattern, 'step-two-switch');
    expect(pattern).toHaveAccessibleDescription('Space moves one step; Enter chooses.');
    await user.selectOptions(screen.getByLabelText('Suggestions scanned'), 'last');
    expect(
      screen.getByText(
        'Two switches: Space moves the highlight one step, Enter chooses what is highlighted.',
      ),
    ).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Start trial' }));
    const suggestions = screen.getByRole('group', { name: 'Suggestions' });
    const keyRowsOnScreen = () => [...screen.getByRole('group', { name: 'Keys' }).children];
    const down = (k: string) =>
      act(() => {
        fireEvent.keyDown(document, { key: k });
      });
    // Suggestions last: the first key row is highlighted first, and no timer moves it.
    expect(keyRowsOnScreen()[0]).toHaveAttribute('data-scan-row', 'on');
    expect(suggestions).not.toHaveAttribute('data-scan-row');
    await act(() => new Promise((resolve) => setTimeout(resolve, 300)));
    expect(keyRowsOnScreen()[0]).toHaveAttribute('data-scan-row', 'on');
    down(' '); // move: the home row
    expect(keyRowsOnScreen()[1]).toHaveAttribute('data-scan-row', 'on');
    down('Enter'); // select: its keys
    expect(key('a')).toHaveAttribute('data-scanned', 'on');
    down(' ');
    expect(key('s')).toHaveAttribute('data-scanned', 'on');
    down('Enter');
    expect(output().textContent).toBe('s');
    // Escape pauses; in the pause dialog the switches scan its buttons: Space moves to Finish, Enter takes it.
    down('Escape');
    const choice = (name: string) => within(pauseDialog()).getByRole('button', { name });
    expect(choice('Resume trial')).toHaveAttribute('data-scanned', 'on');
    down(' ');
    expect(choice('Finish trial')).toHaveAttribute('data-scanned', 'on');
    expect(choice('Resume trial')).not.toHaveAttribute('data-scanned');
    down('Enter');
    expect(await screen.findByText('The trial is saved.')).toBeInTheDocument();
    const posted = createTrialSchema.parse(api.requestsTo(`POST ${trialsUrl(VERSION_1_ID)}`)[0]?.body);
    expect(posted.settings).toMatchObject({
      selectionMode: 'scanning',
      scanPattern: 'step-two-switch',
      suggestionsScanned: 'last',
    });
    expect(posted.settings.scanAcceptMs).toBeUndefined();
    expect(posted.events.filter((e) => e.type === 'switch').map((e) => e.value)).toEqual([
      'move',
      'select',
      'move',
      'select',
    ]);
  });

  it('group–row–key outlines the groups in turn: the suggestions, then key rows 1–3, then 4–5', async () => {
    const { user } = await openKeyboard('carer');
    await user.selectOptions(screen.getByLabelText('Selection mode'), 'scanning');
    await user.selectOptions(screen.getByLabelText('Scanning pattern'), 'auto-group-row-key');
    const interval = screen.getByLabelText('Scan interval (ms)');
    await user.clear(interval);
    await user.type(interval, '200');
    vi.useFakeTimers();
    fireEvent.click(screen.getByRole('button', { name: 'Start scanning' }));
    const suggestions = screen.getByRole('group', { name: 'Suggestions' });
    const group = () => document.querySelector('[data-scan-group]')?.getAttribute('data-scan-group') ?? null;
    expect(suggestions).toHaveAttribute('data-scan-row', 'on');
    expect(group()).toBeNull();
    act(() => vi.advanceTimersByTime(200));
    expect(suggestions).not.toHaveAttribute('data-scan-row');
    // Five key rows (letters in three, space and punctuation, shift and the editing keys): 3 + 2.
    expect(group()).toBe('1 2 3');
    act(() => vi.advanceTimersByTime(200));
    expect(group()).toBe('4 5');
    // The switch enters the group: its first row (key row 4) is highlighted alone.
    act(() => {
      fireEvent.keyDown(document, { key: ' ' });
    });
    expect(group()).toBeNull();
    expect(screen.getByRole('group', { name: 'Keys' }).children[3]).toHaveAttribute('data-scan-row', 'on');
  });

  it('lets the owning clinician add a practice phrase from the keyboard', async () => {
    const { user, api } = await openKeyboard('clinician', '', {
      [`POST /api/clients/${ASHBY_ID}/practice-phrases`]: {
        status: 201,
        body: {
          id: 'a0a0a0a0-b1b1-4c2c-8d3d-e4e4e4e4e4e4',
          text: 'jazz on friday',
          source: 'client',
          addedBy: 'Dr. Tomasz Reyes',
          createdAt: '2026-10-01T10:00:00.000Z',
        },
      },
    });
    await user.click(screen.getByText('Add a phrase of R. Ashby’s own'));
    await user.type(screen.getByLabelText('New practice phrase'), 'jazz on friday');
    await user.click(screen.getByRole('button', { name: 'Add phrase' }));
    expect(await screen.findByText('Added the practice phrase “jazz on friday”.')).toBeInTheDocument();
    expect(api.requestsTo(`POST /api/clients/${ASHBY_ID}/practice-phrases`)[0]?.body).toEqual({
      text: 'jazz on friday',
    });
  });
  it('keeps the text when a setting changes', async () => {
    const { user } = await openKeyboard('carer');
    await user.click(key('h'));
    await user.click(key('i'));
    await user.selectOptions(screen.getByLabelText('Key order'), 'alphabetical');
    await user.click(screen.getByLabelText('Large targets'));
    await user.selectOptions(screen.getByLabelText('Text size'), '2');
    expect(output().textContent).toBe('hi');
    // The alphabetical order starts a, b, c… on the first row.
    const firstRow = within(screen.getByRole('group', { name: 'Keys' }))
      .getAllByRole('button')
      .slice(0, 3);
    expect(firstRow.map((button) => button.getAttribute('aria-label'))).toEqual(['a', 'b', 'c']);
  });

  it('orders the letters by the model when asked, and re-orders them after every letter', async () => {
    const { user } = await openKeyboard('carer');
    const order = screen.getByLabelText('Key order');
    expect(order).toHaveAccessibleDescription(/moves the letters after every letter typed/);
    await user.selectOptions(order, 'model-ordered');
    const firstKeys = () =>
      within(screen.getByRole('group', { name: 'Keys' }))
        .getAllByRole('button')
        .slice(0, 4)
        .map((button) => button.getAttribute('aria-label'));
    // e 0.5, a 0.2, o 0.1, x 0.01, then the rest alphabetically: e (1,1), a (1,2), o (2,1), x (1,3),
    // b (2,2), c (3,1), d (1,4) — so the first row starts e, a, x, d.
    expect(firstKeys()).toEqual(['e', 'a', 'x', 'd']);
    await user.click(key('e'));
    // After "e": r 0.6 (R and r together), s 0.2, then a, b, c … : r (1,1), s (1,2), a (2,1), b (1,3),
    // c (2,2), d (3,1), e (1,4).
    await waitFor(() => expect(firstKeys()).toEqual(['r', 's', 'b', 'e']));
    await user.click(key('r'));
    expect(output().textContent).toBe('er');
    // The other keys stay where they are.
    expect(key('space')).toBeInTheDocument();
  });

  it('keeps a finished trial on the device while the network is down, and says so', async () => {
    const { user } = await openKeyboard('carer', '', {
      [`POST ${trialsUrl(VERSION_1_ID)}`]: () => {
        throw new TypeError('Failed to fetch');
      },
    });
    await user.click(screen.getByRole('button', { name: 'Start trial' }));
    await user.click(key('g'));
    await user.click(key('o'));
    await finishFromPause(user);
    expect(
      await screen.findByText(
        'Waiting for the network — the trial will upload when it is back (1 trial waiting on this device).',
      ),
    ).toBeInTheDocument();
    expect(screen.getByText('1 trial is waiting to upload.')).toBeInTheDocument();
    // 2 letters for 2 characters: no savings (derived from the definition).
    expect(screen.getByText(/^0\.0% measured; 36\.7% simulated at 5 slots$/)).toBeInTheDocument();
  });
});

describe('Trial view', () => {
  const trialView = () => screen.getByRole('dialog', { name: 'Trial' });
  const posted = (api: Awaited<ReturnType<typeof openKeyboard>>['api']) =>
    createTrialSchema.parse(api.requestsTo(`POST ${trialsUrl(VERSION_1_ID)}`)[0]?.body);
  const steps = (events: { type: string }[]) =>
    events.filter((e) => e.type !== 'offer' && e.type !== 'switch').map((e) => e.type);

  it('Start trial opens the keyboard alone in a full-window layer (no Fullscreen API in jsdom), the page behind hidden and inert', async () => {
    const { user } = await openKeyboard('carer');
    expect(screen.queryByRole('dialog', { name: 'Trial' })).toBeNull();
    const heading = screen.getByRole('heading', { level: 1, name: 'Test keyboard' });
    await user.click(screen.getByRole('button', { name: 'Start trial' }));
    const view = trialView();
    expect(view).toHaveAttribute('aria-modal', 'true');
    expect(view).toHaveAttribute('data-trial-view', 'layer');
    expect(view).toContainElement(screen.getByRole('group', { name: 'Keys' }));
    expect(view).toContainElement(output());
    expect(output()).toHaveFocus();
    // The page behind: hidden and inert, with its settings and version picker.
    expect(heading.closest('[inert]')).not.toBeNull();
    expect(heading).not.toBeVisible();
    // The Pause key is a row of its own, the last, under the function row.
    const rows = [...within(view).getByRole('group', { name: 'Keys' }).children];
    expect(rows).toHaveLength(6);
    const lastRow = within(rows.at(-1) as HTMLElement).getAllByRole('button');
    expect(lastRow.map((button) => button.getAttribute('aria-label'))).toEqual(['Pause']);
  });

  it('Escape pauses: the dialog opens with focus on Resume; Resume closes it and logs resume', async () => {
    const { user, api } = await openKeyboard('carer');
    await user.click(screen.getByRole('button', { name: 'Start trial' }));
    await user.click(key('g'));
    await user.keyboard('{Escape}');
    const dialog = pauseDialog();
    expect(dialog).toHaveAttribute('aria-modal', 'true');
    expect(within(dialog).getByRole('button', { name: 'Resume trial' })).toHaveFocus();
    expect(within(dialog).getByText(/Paused time is left out of words per minute/)).toBeInTheDocument();
    await user.click(within(dialog).getByRole('button', { name: 'Resume trial' }));
    expect(screen.queryByRole('dialog', { name: 'Trial paused' })).toBeNull();
    expect(output()).toHaveFocus();
    await user.click(key('o'));
    expect(output().textContent).toBe('go');
    await finishFromPause(user);
    await screen.findByText('The trial is saved.');
    expect(steps(posted(api).events)).toEqual(['letter', 'pause', 'resume', 'letter', 'pause']);
  });

  it('the Pause key pauses; while paused no key, physical key or suggestion types', async () => {
    const { user, api } = await openKeyboard('carer');
    await user.click(screen.getByRole('button', { name: 'Start trial' }));
    await user.click(key('t'));
    await user.click(key('Pause'));
    expect(within(pauseDialog()).getByRole('button', { name: 'Resume trial' })).toHaveFocus();
    // The keyboard behind the dialog is inert; even an event reaching a key types nothing.
    expect(screen.getByRole('group', { name: 'Keys', hidden: true }).closest('[inert]')).not.toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'e', hidden: true }));
    fireEvent.click(screen.getByRole('button', { name: 'the (suggestion 1)', hidden: true }));
    fireEvent.keyDown(document.body, { key: 'x' });
    expect(screen.getByRole('textbox', { name: 'Text typed so far', hidden: true }).textContent).toBe('t');
    await user.click(within(pauseDialog()).getByRole('button', { name: 'Finish trial' }));
    await screen.findByText('The trial is saved.');
    expect(posted(api).text).toBe('t');
    expect(steps(posted(api).events)).toEqual(['letter', 'pause']);
  });

  it('Discard from the pause dialog keeps nothing and returns focus to Start trial', async () => {
    const { user, api } = await openKeyboard('carer');
    await user.click(screen.getByRole('button', { name: 'Start trial' }));
    await user.click(key('t'));
    await user.keyboard('{Escape}');
    await user.click(within(pauseDialog()).getByRole('button', { name: 'Discard trial' }));
    expect(screen.queryByRole('dialog', { name: 'Trial' })).toBeNull();
    expect(screen.getByRole('button', { name: 'Start trial' })).toHaveFocus();
    expect(api.requestsTo(`POST ${trialsUrl(VERSION_1_ID)}`)).toHaveLength(0);
  });

  it('scanning: holding the switch 2 s pauses, the scan waits where it was, and goes on after Resume', async () => {
    const { user, api } = await openKeyboard('carer');
    await user.selectOptions(screen.getByLabelText('Selection mode'), 'scanning');
    await user.selectOptions(screen.getByLabelText('Scanning pattern'), 'step-two-switch');
    await user.click(screen.getByRole('button', { name: 'Start trial' }));
    vi.useFakeTimers();
    const keyRowsOnScreen = () => [...screen.getByRole('group', { name: 'Keys', hidden: true }).children];
    const down = (k: string) => act(() => void fireEvent.keyDown(document, { key: k }));
    // The Pause row is scanned like the key rows (the last of them): reachable by the switches.
    expect(keyRowsOnScreen()).toHaveLength(6);
    const up = (k: string) => act(() => void fireEvent.keyUp(document, { key: k }));
    // Suggestions first: Space moves to key row 1.
    down(' ');
    up(' ');
    expect(keyRowsOnScreen()[0]).toHaveAttribute('data-scan-row', 'on');
    // A short press is a move; a press held 1 999 ms is not yet a long press.
    down(' ');
    act(() => vi.advanceTimersByTime(1999));
    expect(screen.queryByRole('dialog', { name: 'Trial paused' })).toBeNull();
    act(() => vi.advanceTimersByTime(1));
    expect(pauseDialog()).toBeInTheDocument();
    up(' ');
    // The press itself moved the highlight to key row 2; paused, it stays there.
    expect(keyRowsOnScreen()[1]).toHaveAttribute('data-scan-row', 'on');
    act(() => vi.advanceTimersByTime(10_000));
    expect(keyRowsOnScreen()[1]).toHaveAttribute('data-scan-row', 'on');
    // Enter takes the highlighted choice, Resume: the scan goes on from key row 2.
    down('Enter');
    up('Enter');
    expect(screen.queryByRole('dialog', { name: 'Trial paused' })).toBeNull();
    down('Enter'); // key row 2: its first key, a
    down('Enter'); // a
    expect(output().textContent).toBe('a');
    down('Escape');
    down(' '); // Finish
    down('Enter');
    vi.useRealTimers();
    await screen.findByText('The trial is saved.');
    expect(steps(posted(api).events)).toEqual(['pause', 'resume', 'letter', 'pause']);
  });

  it('dwell: resting on the Pause key pauses, and resting on Resume resumes', async () => {
    const { user, api } = await openKeyboard('carer');
    await user.selectOptions(screen.getByLabelText('Selection mode'), 'dwell');
    await user.click(screen.getByRole('button', { name: 'Start trial' }));
    vi.useFakeTimers();
    const dwellOn = (element: Element) => {
      act(() => void fireEvent.pointerEnter(element));
      act(() => vi.advanceTimersByTime(2000));
      act(() => void fireEvent.pointerLeave(element));
    };
    dwellOn(key('h'));
    dwellOn(key('Pause'));
    expect(pauseDialog()).toBeInTheDocument();
    dwellOn(within(pauseDialog()).getByRole('button', { name: 'Resume trial' }));
    expect(screen.queryByRole('dialog', { name: 'Trial paused' })).toBeNull();
    dwellOn(key('i'));
    expect(output().textContent).toBe('hi');
    act(() => void fireEvent.keyDown(document, { key: 'Escape' }));
    vi.useRealTimers();
    await user.click(within(pauseDialog()).getByRole('button', { name: 'Finish trial' }));
    await screen.findByText('The trial is saved.');
    expect(steps(posted(api).events)).toEqual(['letter', 'pause', 'resume', 'letter', 'pause']);
  });

  it('in browser full screen, leaving it pauses the trial', async () => {
    const original = HTMLElement.prototype.requestFullscreen;
    let fullscreen: Element | null = null;
    Object.defineProperty(document, 'fullscreenElement', { configurable: true, get: () => fullscreen });
    HTMLElement.prototype.requestFullscreen = () => {
      fullscreen = document.querySelector('[data-trial-view]');
      document.dispatchEvent(new Event('fullscreenchange'));
      return Promise.resolve();
    };
    try {
      const { user } = await openKeyboard('carer');
      await user.click(screen.getByRole('button', { name: 'Start trial' }));
      await waitFor(() => expect(trialView()).toHaveAttribute('data-trial-view', 'fullscreen'));
      expect(fullscreen).toBe(trialView());
      // The browser leaves full screen (its own Escape or control).
      act(() => {
        fullscreen = null;
        document.dispatchEvent(new Event('fullscreenchange'));
      });
      expect(within(pauseDialog()).getByRole('button', { name: 'Resume trial' })).toHaveFocus();
      // Resume asks for full screen again.
      await user.click(within(pauseDialog()).getByRole('button', { name: 'Resume trial' }));
      await waitFor(() => expect(fullscreen).toBe(trialView()));
    } finally {
      HTMLElement.prototype.requestFullscreen = original;
      Reflect.deleteProperty(document, 'fullscreenElement');
    }
  });
});
