// The engine's Web Worker: wires messages to the pure protocol handler (engine-protocol.ts).
import {
  createEngineState,
  type EngineReply,
  type EngineRequest,
  handleEngineMessage,
} from './engine-protocol';

// The client compiles with the DOM library only; this is the part of a worker's global scope used.
type WorkerScope = {
  postMessage: (message: EngineReply) => void;
  onmessage: ((event: MessageEvent<EngineRequest>) => void) | null;
};

const scope = self as unknown as WorkerScope;
const state = createEngineState();

scope.onmessage = (event) => handleEngineMessage(state, event.data, (reply) => scope.postMessage(reply));
