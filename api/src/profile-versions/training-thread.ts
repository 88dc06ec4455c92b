import {
  type BaseWords,
  deserializeBaseWords,
  deserializeModel,
  type PpmModel,
  ProfileInputError,
  trainAndEvaluateProfile,
} from '@keyloom/shared';
import { parentPort, workerData } from 'node:worker_threads';
import { engineInput } from './profile-training';
import type { FromTrainingThread, ToTrainingThread, TrainingThreadData } from './training-threads';

// The body of one training thread (started by training-threads.ts from api/dist). It turns the
// shared base-model and base-vocabulary bytes into models once, then trains one version per 'train'
// message, posting progress and the result back. The worker's own event loop never runs the engine.

const port = parentPort;
if (!port) throw new Error('training-thread runs only as a worker thread');
const { baseModel, baseWords: baseWordsBytes } = workerData as TrainingThreadData;
const base: PpmModel | null = baseModel ? deserializeModel(new Uint8Array(baseModel)).freeze() : null;
const baseWords: BaseWords | null = baseWordsBytes
  ? deserializeBaseWords(new Uint8Array(baseWordsBytes))
  : null;
const post = (message: FromTrainingThread, transfer: ArrayBuffer[] = []) =>
  port.postMessage(message, transfer);

/** Bytes that own their whole buffer, so it can move to the main thread without a copy. */
function owned(bytes: Uint8Array): Uint8Array {
  return bytes.byteOffset === 0 && bytes.byteLength === bytes.buffer.byteLength ? bytes : bytes.slice();
}

port.on('message', (message: ToTrainingThread) => {
  trainAndEvaluateProfile(engineInput(message.input, base, baseWords), (progress) =>
    post({ type: 'progress', progress }),
  )
    .then((result) => {
      const modelBytes = owned(result.modelBytes);
      const wordModelBytes = result.wordModelBytes ? owned(result.wordModelBytes) : null;
      const transfer = [modelBytes.buffer as ArrayBuffer];
      if (wordModelBytes && wordModelBytes.buffer !== modelBytes.buffer)
        transfer.push(wordModelBytes.buffer as ArrayBuffer);
      post({ type: 'done', result: { ...result, modelBytes, wordModelBytes } }, transfer);
    })
    .catch((error: unknown) => {
      post({
        type: 'error',
        kind: error instanceof ProfileInputError ? 'input' : 'fault',
        message: error instanceof Error ? error.message : String(error),
      });
    });
});
