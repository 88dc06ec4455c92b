// The keyboard's engine as a React hook: downloads the version's model (+ its base model and the
// base vocabulary, once per browser session), gunzips it and loads it in a Web Worker, then answers suggestion requests.
// Once loaded, everything runs in memory: the keyboard keeps working if the network drops.
import { useCallback, useEffect, useRef, useState } from 'react';
import type { EngineReply, EngineRequest } from './engine-protocol';
import { createEngineWorker, type EngineWorker } from './engine-worker-factory';
import { downloadVersionModels } from './model-download';

export type EngineStatus = 'idle' | 'downloading' | 'loading' | 'ready' | 'error';

/** Sizes (bytes) of what was downloaded and how the model loaded. */
export type ModelDownloadInfo = {
  versionBytes: number;
  versionCompressedBytes: number;
  baseBytes: number;
  baseCompressedBytes: number;
  /** The base vocabulary's sizes (0 when none was loaded). */
  baseWordsBytes: number;
  baseWordsCompressedBytes: number;
  /** Time the worker took to read and load the models, ms. */
  loadMs: number;
  order: number;
  contexts: number;
};

/** One answer of the engine. `seq` is the request's; `engineMs` the worker's time for it. */
export type SuggestionResult = {
  seq: number;
  text: string;
  words: string[];
  letters: { char: string; p: number }[];
  engineMs: number;
};

export type KeyboardEngine = {
  status: EngineStatus;
  error: string | null;
  info: ModelDownloadInfo | null;
  /** From the file header's settings (5 until loaded). */
  slots: number;
  caseFold: boolean;
  /** The newest answer (an answer older than the one shown is dropped). */
  suggestions: SuggestionResult | null;
  /**
   * Asks for suggestions at the end of `text`. `seq` must grow with each request; while one is
   * being worked out, only the newest later request is sent. Requests before the model is
   * ready wait, and the newest is answered once it is.
   * @param slots list length 1..10 (default: the version's)
   */
  request: (text: string, seq: number, slots?: number) => void;
  /**
   * Starts again from the version as trained. The personal model learns each word finished on the
   * keyboard (as on the client's device and in the version's simulation); a new trial calls this
   * so every trial starts from the same model.
   */
  resetLearning: () => void;
};

type Download = Omit<ModelDownloadInfo, 'loadMs' | 'order' | 'contexts'>;
type SuggestRequest = Extract<EngineRequest, { type: 'suggest' }>;

const messageOf = (error: unknown): string => (error instanceof Error ? error.message : String(error));

// A copy that owns its buffer (the downloaded bytes stay cached for the next load).
const ownBuffer = (bytes: Uint8Array): ArrayBuffer => bytes.slice().buffer;

type EngineView = Omit<KeyboardEngine, 'request' | 'resetLearning'> & { versionId: string | null };

const initialView = (versionId: string | null): EngineView => ({
  versionId,
  status: versionId === null ? 'idle' : 'downloading',
  error: null,
  info: null,
  slots: 5,
  caseFold: false,
  suggestions: null,
});

/**
 * Runs a profile version's model in a Web Worker.
 * @param versionId the profile version to load, or null for none (status 'idle')
 */
export function useKeyboardEngine(versionId: string | null): KeyboardEngine {
  const [stored, setStored] = useState<EngineView>(() => initialView(versionId));
  // A new version starts from a fresh view (derived here, so no effect has to reset state).
  const view = stored.versionId === versionId ? stored : initialView(versionId);

  const workerRef = useRef<EngineWorker | null>(null);
  const readyRef = useRef(false);
  const slotsRef = useRef(5);
  const inFlightRef = useRef(false);
  const queuedRef = useRef<SuggestRequest | null>(null);
  const shownSeqRef = useRef(-Infinity);

  const sendQueued = useCallback(() => {
    const worker = workerRef.current;
    const next = queuedRef.current;
    if (!worker || !readyRef.current || inFlightRef.current || !next) return;
    queuedRef.current = null;
    inFlightRef.current = true;
    worker.postMessage(next, []);
  }, []);

  useEffect(() => {
    readyRef.current = false;
    inFlightRef.current = false;
    shownSeqRef.current = -Infinity;
    if (versionId === null) return;
    let live = true;
    let download: Download | null = null;
    const worker = createEngineWorker();
    workerRef.current = worker;
    // Every update names the version it belongs to; one for another version starts afresh.
    const patch = (change: Partial<EngineView>) =>
      setStored((prev) => ({ ...(prev.versionId === versionId ? prev : initialView(versionId)), ...change }));

    const fail = (message: string) => {
      if (!live) return;
      readyRef.current = false;
      patch({ error: message, status: 'error' });
    };

    worker.onerror = () => fail('The keyboard engine could not start in this browser.');
    worker.onmessage = (event: MessageEvent<EngineReply>) => {
      if (!live) return;
      const reply = event.data;
      if (reply.type === 'loaded') {
        readyRef.current = true;
        slotsRef.current = reply.slots;
        patch({
          status: 'ready',
          slots: reply.slots,
          caseFold: reply.caseFold,
          info: {
            ...(download ?? {
              versionBytes: 0,
              versionCompressedBytes: 0,
              baseBytes: 0,
              baseCompressedBytes: 0,
              baseWordsBytes: 0,
              baseWordsCompressedBytes: 0,
            }),
            loadMs: reply.loadMs,
            order: reply.order,
            contexts: reply.contexts,
          },
        });
        sendQueued();
      } else if (reply.type === 'suggestions') {
        inFlightRef.current = false;
        if (reply.seq > shownSeqRef.current) {
          shownSeqRef.current = reply.seq;
          patch({
            suggestions: {
              seq: reply.seq,
              text: reply.text,
              words: reply.words,
              letters: reply.letters,
              engineMs: reply.engineMs,
            },
          });
        }
        sendQueued();
      } else {
        inFlightRef.current = false;
        fail(reply.message);
      }
    };

    downloadVersionModels(versionId)
      .then(({ version, base, baseWords }) => {
        if (!live) return;
        download = {
          versionBytes: version.bytes.length,
          versionCompressedBytes: version.compressedBytes,
          baseBytes: base?.bytes.length ?? 0,
          baseCompressedBytes: base?.compressedBytes ?? 0,
          baseWordsBytes: baseWords?.bytes.length ?? 0,
          baseWordsCompressedBytes: baseWords?.compressedBytes ?? 0,
        };
        patch({ status: 'loading' });
        const profile = ownBuffer(version.bytes);
        const baseBuffer = base ? ownBuffer(base.bytes) : null;
        const wordsBuffer = baseWords ? ownBuffer(baseWords.bytes) : null;
        const transfer = [profile, baseBuffer, wordsBuffer].filter((b): b is ArrayBuffer => b !== null);
        worker.postMessage(
          { type: 'load', profile, base: baseBuffer, baseWords: wordsBuffer, adaptive: true },
          transfer,
        );
      })
      .catch((reason: unknown) => fail(messageOf(reason)));

    return () => {
      live = false;
      worker.terminate();
      if (workerRef.current === worker) workerRef.current = null;
      readyRef.current = false;
    };
  }, [versionId, sendQueued]);

  const request = useCallback(
    (text: string, seq: number, slotCount?: number) => {
      const pending = queuedRef.current;
      if (pending && pending.seq > seq) return;
      queuedRef.current = { type: 'suggest', seq, text, slots: slotCount ?? slotsRef.current };
      sendQueued();
    },
    [sendQueued],
  );

  const resetLearning = useCallback(() => {
    // Messages reach the worker in order: requests sent after this are answered by the fresh model.
    workerRef.current?.postMessage({ type: 'reset' } satisfies EngineRequest, []);
  }, []);

  const { status, error, info, slots, caseFold, suggestions } = view;
  return { status, error, info, slots, caseFold, suggestions, request, resetLearning };
}
