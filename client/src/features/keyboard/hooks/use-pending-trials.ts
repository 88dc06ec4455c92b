// Offline-safe trial upload. A finished trial is first written to localStorage, then posted; if
// the server cannot be reached (or answers 5xx) it stays queued and is retried when the browser
// comes back online and every 15 s. The upload is idempotent by localTrialId, so a retry after
// a lost answer never makes a second trial. A queued trial the API refuses (4xx) moves to `failed`.
import { createTrialSchema, type CreateTrialInput, type Trial } from '@keyloom/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useSyncExternalStore } from 'react';
import { z } from 'zod';
import { isApiError } from '@/lib/api-client';
import { postTrial } from '../api/post-trial';
import { trialKeys } from '../api/keys';
import { withCurrentNames } from '../logic/pending-trial-names';

/** Where queued trials wait (survives a reload or a closed tab). */
export const PENDING_TRIALS_KEY = 'keyloom.pending-trials.v1';
/** Retry period while trials wait, ms. */
export const PENDING_RETRY_MS = 15_000;

const pendingTrialSchema = z.object({
  versionId: z.string(),
  input: createTrialSchema,
  /** The API's refusal, once refused; a failed trial is not retried. */
  failed: z.string().nullable(),
});
type PendingTrial = { versionId: string; input: CreateTrialInput; failed: string | null };

// ---- The queue: one per browser tab, shared by every hook instance --------------------------

let memoryFallback: PendingTrial[] = [];
let snapshot: PendingTrial[] | null = null;
const listeners = new Set<() => void>();
const inFlight = new Set<string>();

function readQueue(): PendingTrial[] {
  try {
    const raw = localStorage.getItem(PENDING_TRIALS_KEY);
    if (raw === null) return [];
    const parsed = z.array(pendingTrialSchema).safeParse(withCurrentNames(JSON.parse(raw)));
    return parsed.success ? parsed.data : [];
  } catch {
    return memoryFallback;
  }
}

function queue(): PendingTrial[] {
  snapshot ??= readQueue();
  return snapshot;
}

function writeQueue(next: PendingTrial[]): void {
  snapshot = next;
  memoryFallback = next;
  try {
    if (next.length === 0) localStorage.removeItem(PENDING_TRIALS_KEY);
    else localStorage.setItem(PENDING_TRIALS_KEY, JSON.stringify(next));
  } catch {
    // Storage full or blocked: the queue lives in memory for this tab.
  }
  for (const listener of listeners) listener();
}

const withoutTrial = (id: string) => queue().filter((p) => p.input.localTrialId !== id);

const subscribe = (listener: () => void) => {
  listeners.add(listener);
  return () => listeners.delete(listener);
};

/** Whether an upload error means "try again later" (no answer, or the server failed). */
const isTransient = (error: unknown) => !isApiError(error) || error.status === 0 || error.status >= 500;

const messageOf = (error: unknown) => (error instanceof Error ? error.message : String(error));

/** Re-reads the queue from storage (tests; another tab may have changed it). */
export function reloadPendingTrials(): void {
  snapshot = null;
  for (const listener of listeners) listener();
}

/**
 * Posts every queued trial that is not failed and not already being sent, oldest first; stops at
 * the first transient error (the network is probably down).
 * @param onSent called with each trial the API stored
 */
export async function flushPendingTrials(onSent: (versionId: string, trial: Trial) => void): Promise<void> {
  for (const item of queue()) {
    const id = item.input.localTrialId;
    if (item.failed !== null || inFlight.has(id)) continue;
    inFlight.add(id);
    try {
      const trial = await postTrial(item.versionId, item.input);
      writeQueue(withoutTrial(id));
      onSent(item.versionId, trial);
    } catch (error) {
      if (isTransient(error)) return;
      writeQueue(queue().map((p) => (p.input.localTrialId === id ? { ...p, failed: messageOf(error) } : p)));
    } finally {
      inFlight.delete(id);
    }
  }
}

export type SubmitOutcome = { outcome: 'sent'; trial: Trial } | { outcome: 'queued' };

/**
 * The pending-upload queue.
 * - `submit` stores the trial, then posts it: `sent` with the stored trial, or `queued` when the
 *   server could not be reached or failed (5xx). A refusal (4xx) rejects with the ApiError (its
 *   message is the API's) and the trial is not kept.
 * - `pending` / `waitingIds`: trials waiting to be sent; `failed`: queued trials the API later refused.
 * - `dismiss` forgets a failed trial.
 * On success the version's trial list (trialKeys.list) is refreshed.
 */
export function usePendingTrials(): {
  pending: number;
  /** localTrialId of each trial still waiting to be sent. */
  waitingIds: string[];
  failed: { localTrialId: string; message: string }[];
  submit: (versionId: string, input: CreateTrialInput) => Promise<SubmitOutcome>;
  dismiss: (localTrialId: string) => void;
} {
  const queryClient = useQueryClient();
  const items = useSyncExternalStore(subscribe, queue, queue);

  const onSent = useCallback(
    (versionId: string) => {
      void queryClient.invalidateQueries({ queryKey: trialKeys.list(versionId) });
    },
    [queryClient],
  );

  const waiting = items.filter((p) => p.failed === null).length;
  useEffect(() => {
    const retry = () => void flushPendingTrials(onSent);
    window.addEventListener('online', retry);
    // A trial left over from an earlier visit goes as soon as the page opens.
    if (waiting > 0) retry();
    const timer = waiting > 0 ? setInterval(retry, PENDING_RETRY_MS) : null;
    return () => {
      window.removeEventListener('online', retry);
      if (timer !== null) clearInterval(timer);
    };
  }, [onSent, waiting]);

  const submit = useCallback(
    async (versionId: string, input: CreateTrialInput): Promise<SubmitOutcome> => {
      const id = input.localTrialId;
      writeQueue([...withoutTrial(id), { versionId, input, failed: null }]);
      inFlight.add(id);
      try {
        const trial = await postTrial(versionId, input);
        writeQueue(withoutTrial(id));
        onSent(versionId);
        return { outcome: 'sent', trial };
      } catch (error) {
        if (isTransient(error)) return { outcome: 'queued' };
        writeQueue(withoutTrial(id));
        throw error;
      } finally {
        inFlight.delete(id);
      }
    },
    [onSent],
  );

  const dismiss = useCallback((localTrialId: string) => writeQueue(withoutTrial(localTrialId)), []);

  const failed = items
    .filter((p): p is PendingTrial & { failed: string } => p.failed !== null)
    .map((p) => ({ localTrialId: p.input.localTrialId, message: p.failed }));

  const waitingIds = items.filter((p) => p.failed === null).map((p) => p.input.localTrialId);

  return { pending: waiting, waitingIds, failed, submit, dismiss };
}
