// Starts the engine: a Web Worker in the browser; where there is no Worker (jsdom tests), the
// same protocol handler on this thread behind the same interface.
import {
  createEngineState,
  type EngineReply,
  type EngineRequest,
  handleEngineMessage,
} from './engine-protocol';

/** The part of a Worker the keyboard uses. */
export type EngineWorker = {
  postMessage: (message: EngineRequest, transfer: Transferable[]) => void;
  onmessage: ((event: MessageEvent<EngineReply>) => void) | null;
  onerror: ((event: ErrorEvent) => void) | null;
  terminate: () => void;
};

/** The protocol handler on this thread (no Worker available); answers arrive asynchronously as from a worker. */
export function createInlineEngineWorker(): EngineWorker {
  const state = createEngineState();
  let stopped = false;
  const worker: EngineWorker = {
    onmessage: null,
    onerror: null,
    postMessage: (message) => {
      setTimeout(() => {
        if (stopped) return;
        handleEngineMessage(state, message, (reply) => {
          if (!stopped) worker.onmessage?.(new MessageEvent('message', { data: reply }));
        });
      }, 0);
    },
    terminate: () => {
      stopped = true;
    },
  };
  return worker;
}

/** A new engine worker (module worker built by Vite from engine.worker.ts). */
export function createEngineWorker(): EngineWorker {
  if (typeof Worker === 'undefined') return createInlineEngineWorker();
  return new Worker(new URL('./engine.worker.ts', import.meta.url), {
    type: 'module',
    name: 'keyloom-engine',
  });
}
