import { deserializeModel, type PpmModel, ProfileInputError, trainAndEvaluateProfile } from '@keyloom/shared';
import { parentPort, workerData } from 'node:worker_threads';
import type { FromTrainingThread, ToTrainingThread, TrainingThreadData } from './training-threads';

// The body of one training thread (started by training-threads.ts from api/dist). It turns the
// shared base-model bytes into a model once, then trains one version per 'train' message, posting
// progress and the result back. The worker's own event loop never runs the engine.

const port = parentPort;
if (!port) throw new Error('training-thread runs only as a worker thread');
const { baseModel } = workerData as TrainingThreadData;
const base: PpmModel | null = baseModel ? deserializeModel(new Uint8Array(baseModel)).freeze() : null;
const post = (message: FromTrainingThread, transfer: ArrayBuffer[] = []) =>
  port.postMessage(message, transfer);

port.on('message', (message: ToTrainingThread) => {
  trainAndEvaluateProfile({ ...message.input, base }, (progress) => post({ type: 'progress', progress }))
    .then((result) => {
      // The model bytes move to the main thread without a copy.
      const bytes = result.modelBytes;
      const owned = bytes.byteOffset === 0 && bytes.byteLength === bytes.buffer.byteLength;
      const modelBytes = owned ? bytes : bytes.slice();
      post({ type: 'done', result: { ...result, modelBytes } }, [modelBytes.buffer as ArrayBuffer]);
    })
    .catch((error: unknown) => {
      post({
        type: 'error',
        kind: error instanceof ProfileInputError ? 'input' : 'fault',
        message: error instanceof Error ? error.message : String(error),
      });
    });
});
