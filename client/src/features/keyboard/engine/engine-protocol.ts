// The messages between the page and the engine worker, and the worker's whole behaviour as a
// pure function of (state, message) → posted answers, so it is tested without a worker.
import {
  type EngineAnswer,
  engineLearn,
  engineSuggest,
  type LoadedEngine,
  loadEngine,
  resetEngineLearning,
  warmUpEngine,
} from './engine-core';

/**
 * Page → worker. `load.baseWords` is the base vocabulary (serializeBaseWords bytes) or null.
 * `suggest.seq` grows with every request; only the newest queued one is answered.
 * With `load.adaptive`, the personal models learn each finished word of the texts they are asked
 * about (engineLearn) before answering; `reset` forgets what they learned (a new trial).
 */
export type EngineRequest =
  | {
      type: 'load';
      profile: ArrayBuffer;
      base: ArrayBuffer | null;
      baseWords?: ArrayBuffer | null;
      adaptive?: boolean;
    }
  | { type: 'suggest'; seq: number; text: string; slots: number }
  | { type: 'reset' };

/** Worker → page. */
export type EngineReply =
  | { type: 'loaded'; slots: number; caseFold: boolean; order: number; contexts: number; loadMs: number }
  | { type: 'error'; message: string }
  | ({ type: 'suggestions'; seq: number; text: string; engineMs: number } & EngineAnswer);

/** What the worker keeps between messages. */
export type EngineState = {
  engine: LoadedEngine | null;
  /** Whether the loaded engine learns what is typed (load.adaptive). */
  adaptive: boolean;
  /** The newest suggest request not answered yet (older queued ones are dropped). */
  pending: Extract<EngineRequest, { type: 'suggest' }> | null;
  scheduled: boolean;
  /** Runs a callback after the messages already queued (setTimeout 0 in the worker). */
  schedule: (run: () => void) => void;
  /** A clock in ms (performance.now in the worker). */
  now: () => number;
};

/**
 * A fresh worker state.
 * @param schedule defers answering so that requests queued meanwhile can replace each other
 * @param now a millisecond clock for the timings reported
 */
export function createEngineState(
  schedule: (run: () => void) => void = (run) => setTimeout(run, 0),
  now: () => number = () => performance.now(),
): EngineState {
  return { engine: null, adaptive: false, pending: null, scheduled: false, schedule, now };
}

const messageOf = (error: unknown): string => (error instanceof Error ? error.message : String(error));

function answer(
  state: EngineState,
  request: Extract<EngineRequest, { type: 'suggest' }>,
  post: (reply: EngineReply) => void,
) {
  const { engine } = state;
  if (!engine) {
    // Nothing loaded (or the load failed): an empty row keeps the page's sequence moving.
    post({ type: 'suggestions', seq: request.seq, text: request.text, words: [], letters: [], engineMs: 0 });
    return;
  }
  const started = state.now();
  try {
    const slots = Math.min(10, Math.max(1, Math.round(request.slots)));
    if (state.adaptive) engineLearn(engine, request.text);
    const { words, letters } = engineSuggest(engine, request.text, slots);
    post({
      type: 'suggestions',
      seq: request.seq,
      text: request.text,
      words,
      letters,
      engineMs: state.now() - started,
    });
  } catch (error) {
    post({ type: 'error', message: `The suggestions could not be worked out: ${messageOf(error)}` });
  }
}

/**
 * Handles one message. `load` is answered at once (`loaded` or `error`; the engine is warmed up
 * first, within `loadMs`); a `suggest` is kept and
 * answered after the messages already queued, so when several arrive together only the newest
 * is answered (the older ones are superseded: the page shows only the newest row anyway).
 * @param post sends a reply to the page
 */
export function handleEngineMessage(
  state: EngineState,
  message: EngineRequest,
  post: (reply: EngineReply) => void,
): void {
  if (message.type === 'load') {
    state.engine = null;
    state.pending = null;
    const started = state.now();
    try {
      const engine = loadEngine(
        new Uint8Array(message.profile),
        message.base ? new Uint8Array(message.base) : null,
        message.baseWords ? new Uint8Array(message.baseWords) : null,
      );
      warmUpEngine(engine);
      state.engine = engine;
      state.adaptive = message.adaptive === true;
      post({
        type: 'loaded',
        slots: engine.slots,
        caseFold: engine.caseFold,
        order: engine.order,
        contexts: engine.contexts,
        loadMs: state.now() - started,
      });
    } catch (error) {
      post({ type: 'error', message: messageOf(error) });
    }
    return;
  }
  if (message.type === 'reset') {
    if (state.engine) resetEngineLearning(state.engine);
    return;
  }
  if (message.type === 'suggest') {
    if (state.pending === null || message.seq >= state.pending.seq) state.pending = message;
    if (state.scheduled) return;
    state.scheduled = true;
    state.schedule(() => {
      state.scheduled = false;
      const request = state.pending;
      state.pending = null;
      if (request) answer(state, request, post);
    });
  }
}
