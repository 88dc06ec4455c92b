import { type CreateTrialInput, type Trial } from '@keyloom/shared';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { type MockResponse, mockFetch, sessionRoutes } from '@/testing/mock-fetch';
import { trialKeys } from '../api/keys';
import { directTrialSettings } from '../testing/trial-data';
import {
  PENDING_RETRY_MS,
  PENDING_TRIALS_KEY,
  reloadPendingTrials,
  usePendingTrials,
} from './use-pending-trials';

const VERSION = '6f1c2b3a-4d5e-4f60-8a1b-2c3d4e5f6a7b';
const POST_KEY = `POST /api/profile-versions/${VERSION}/trials`;

const trialInput = (localTrialId: string): CreateTrialInput => ({
  localTrialId,
  startedAt: '2026-12-02T10:00:00.000Z',
  finishedAt: '2026-12-02T10:01:00.000Z',
  phraseId: null,
  targetPhrase: null,
  text: 'hi',
  events: [
    { t: 0, type: 'letter', value: 'h' },
    { t: 400, type: 'letter', value: 'i' },
  ],
  settings: directTrialSettings,
  note: '',
});

const storedTrial = (input: CreateTrialInput): Trial => ({
  id: 'a1b2c3d4-e5f6-4a7b-8c9d-0e1f2a3b4c5d',
  localTrialId: input.localTrialId,
  versionId: VERSION,
  versionNumber: 1,
  clientId: 'b2c3d4e5-f6a7-4b8c-9d0e-1f2a3b4c5d6e',
  by: { id: null, name: 'Carer', role: 'carer' },
  startedAt: input.startedAt,
  finishedAt: input.finishedAt,
  phraseId: null,
  targetPhrase: null,
  text: input.text,
  settings: input.settings,
  note: '',
  measures: {
    characters: 2,
    keystrokes: 2,
    switchActivations: 0,
    suggestionsOffered: 0,
    suggestionsTaken: 0,
    charactersFromSuggestions: 0,
    errorsCorrected: 0,
    durationMs: 400,
    keystrokeSavings: 0,
    kspc: 1,
    wpm: 30,
    errorRate: null,
  },
  simulated: { keystrokeSavings: 0.4, wpm: 9, slots: 5 },
  createdAt: input.finishedAt,
});

/** A server that stores each localTrialId once; `mode` decides how it answers. */
function server() {
  const stored = new Map<string, Trial>();
  let mode: 'offline' | 'up' | 'error500' | 'refuse' = 'up';
  const offlineGuard = (answer: () => MockResponse) => () => {
    if (mode === 'offline') throw new TypeError('Failed to fetch');
    return answer();
  };
  const routes = {
    ...sessionRoutes(null),
    'GET /api/auth/csrf': offlineGuard(() => ({ body: { token: 'csrf-token-for-tests-0001' } })),
    [POST_KEY]: (request: { body: unknown }) => {
      if (mode === 'offline') throw new TypeError('Failed to fetch');
      if (mode === 'error500')
        return { status: 503, body: { statusCode: 503, message: 'Down for a moment.' } };
      if (mode === 'refuse') {
        return { status: 409, body: { statusCode: 409, message: 'This version has no trained model yet.' } };
      }
      const input = request.body as CreateTrialInput;
      const existing = stored.get(input.localTrialId);
      if (existing) return { status: 200, body: existing };
      const trial = storedTrial(input);
      stored.set(input.localTrialId, trial);
      return { status: 201, body: trial };
    },
  };
  const fetch = mockFetch(routes);
  return {
    stored,
    fetch,
    setMode: (m: typeof mode) => {
      mode = m;
    },
  };
}

function renderQueue() {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const invalidate = vi.spyOn(queryClient, 'invalidateQueries');
  const wrapper = ({ children }: { children: ReactNode }) => (
    <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>
  );
  return { ...renderHook(() => usePendingTrials(), { wrapper }), invalidate };
}

describe('usePendingTrials', () => {
  beforeEach(() => {
    localStorage.clear();
    reloadPendingTrials();
  });
  afterEach(() => vi.useRealTimers());

  it('sends at once when the server answers', async () => {
    const s = server();
    const { result, invalidate } = renderQueue();
    let outcome: Awaited<ReturnType<typeof result.current.submit>> | null = null;
    await act(async () => {
      outcome = await result.current.submit(VERSION, trialInput('11111111-1111-4111-8111-111111111111'));
    });
    expect(outcome).toMatchObject({
      outcome: 'sent',
      trial: { localTrialId: '11111111-1111-4111-8111-111111111111' },
    });
    expect(result.current.pending).toBe(0);
    expect(localStorage.getItem(PENDING_TRIALS_KEY)).toBeNull();
    expect(invalidate).toHaveBeenCalledWith({ queryKey: trialKeys.list(VERSION) });
    expect(s.fetch.requestsTo(POST_KEY)[0].headers.get('X-CSRF-Token')).toBe('csrf-token-for-tests-0001');
  });

  it('offline → queued → online → sent once', async () => {
    const s = server();
    s.setMode('offline');
    const { result, invalidate } = renderQueue();
    const id = '22222222-2222-4222-8222-222222222222';
    let outcome: Awaited<ReturnType<typeof result.current.submit>> | null = null;
    await act(async () => {
      outcome = await result.current.submit(VERSION, trialInput(id));
    });
    expect(outcome).toEqual({ outcome: 'queued' });
    expect(result.current.pending).toBe(1);
    expect(JSON.parse(localStorage.getItem(PENDING_TRIALS_KEY) ?? '[]')).toHaveLength(1);
    expect(s.stored.size).toBe(0);

    s.setMode('up');
    // Two 'online' events in a row still send the trial once.
    act(() => {
      window.dispatchEvent(new Event('online'));
      window.dispatchEvent(new Event('online'));
    });
    await waitFor(() => expect(result.current.pending).toBe(0));
    expect(s.stored.size).toBe(1);
    // Offline, the request never left (the CSRF token could not be fetched): one POST in all.
    expect(
      s.fetch.requestsTo(POST_KEY).filter((r) => (r.body as CreateTrialInput).localTrialId === id),
    ).toHaveLength(1);
    expect(invalidate).toHaveBeenCalledWith({ queryKey: trialKeys.list(VERSION) });
    expect(localStorage.getItem(PENDING_TRIALS_KEY)).toBeNull();
  });

  it('a 5xx queues; the 15 s retry sends it; a trial left from an earlier visit goes on opening', async () => {
    vi.useFakeTimers();
    const s = server();
    s.setMode('error500');
    const { result } = renderQueue();
    await act(async () => {
      await result.current.submit(VERSION, trialInput('33333333-3333-4333-8333-333333333333'));
    });
    expect(result.current.pending).toBe(1);
    s.setMode('up');
    await act(async () => {
      await vi.advanceTimersByTimeAsync(PENDING_RETRY_MS);
    });
    expect(result.current.pending).toBe(0);
    expect(s.stored.has('33333333-3333-4333-8333-333333333333')).toBe(true);

    // Left over in storage (e.g. the tab was closed offline): sent when the page opens.
    localStorage.setItem(
      PENDING_TRIALS_KEY,
      JSON.stringify([
        { versionId: VERSION, input: trialInput('44444444-4444-4444-8444-444444444444'), failed: null },
      ]),
    );
    reloadPendingTrials();
    const second = renderQueue();
    await act(async () => {
      await vi.advanceTimersByTimeAsync(10);
    });
    expect(second.result.current.pending).toBe(0);
    expect(s.stored.has('44444444-4444-4444-8444-444444444444')).toBe(true);
  });

  it('a trial queued by an earlier release under the old field names is still sent, with the new names', async () => {
    const s = server();
    const id = '77777777-7777-4777-8777-777777777777';
    const { localTrialId, settings, ...rest } = trialInput(id);
    const { selectionMode, ...otherSettings } = settings;
    localStorage.setItem(
      PENDING_TRIALS_KEY,
      JSON.stringify([
        {
          versionId: VERSION,
          input: {
            ...rest,
            clientTrialId: localTrialId,
            settings: { ...otherSettings, method: selectionMode },
          },
          failed: null,
        },
      ]),
    );
    reloadPendingTrials();
    const { result } = renderQueue();
    await waitFor(() => expect(s.stored.has(id)).toBe(true));
    expect(result.current.pending).toBe(0);
    const [posted] = s.fetch.requestsTo(POST_KEY).map((r) => r.body as Record<string, unknown>);
    expect(posted).toMatchObject({ localTrialId: id, settings: { selectionMode: 'direct' } });
    expect(posted).not.toHaveProperty('clientTrialId');
    expect(posted.settings).not.toHaveProperty('method');
  });

  it('a refusal (4xx): rejects on submit; a queued trial moves to failed with the API message', async () => {
    const s = server();
    s.setMode('refuse');
    const { result } = renderQueue();
    await act(async () => {
      await expect(
        result.current.submit(VERSION, trialInput('55555555-5555-4555-8555-555555555555')),
      ).rejects.toThrow('This version has no trained model yet.');
    });
    expect(result.current.pending).toBe(0);
    expect(result.current.failed).toEqual([]);

    s.setMode('offline');
    await act(async () => {
      await result.current.submit(VERSION, trialInput('66666666-6666-4666-8666-666666666666'));
    });
    s.setMode('refuse');
    act(() => {
      window.dispatchEvent(new Event('online'));
    });
    await waitFor(() =>
      expect(result.current.failed).toEqual([
        {
          localTrialId: '66666666-6666-4666-8666-666666666666',
          message: 'This version has no trained model yet.',
        },
      ]),
    );
    expect(result.current.pending).toBe(0);
    act(() => result.current.dismiss('66666666-6666-4666-8666-666666666666'));
    expect(result.current.failed).toEqual([]);
  });
});
