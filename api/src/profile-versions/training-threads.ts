import { CancelledError, type ProfileProgress, ProfileInputError, type ProfileResult } from '@keyloom/shared';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { Worker } from 'node:worker_threads';
import type { Trainer, TrainerInput } from './profile-training';

// Training off the worker's event loop: each run goes to a node:worker_threads thread, so the
// worker keeps writing heartbeats, answering PostgreSQL and sending e-mails while a large version
// trains. Threads are kept between jobs (each holds the deserialized base model and base
// vocabulary); the two base files are read once and shared with every thread as SharedArrayBuffers
// (no copy per thread).

/** What a training thread starts with. */
export type TrainingThreadData = { baseModel: SharedArrayBuffer | null; baseWords: SharedArrayBuffer | null };
export type ToTrainingThread = { type: 'train'; input: TrainerInput };
export type FromTrainingThread =
  | { type: 'progress'; progress: ProfileProgress }
  | { type: 'done'; result: ProfileResult }
  | { type: 'error'; kind: 'input' | 'fault'; message: string };

/** The compiled thread body beside this file (api/dist/profile-versions/training-thread.js). */
export const TRAINING_THREAD_FILE = join(__dirname, 'training-thread.js');

/** How often a running thread's job is checked for cancellation (ms). */
const CANCEL_POLL_MS = 200;

/** Copies file bytes into memory every thread can read. */
export function sharedBytes(bytes: Uint8Array): SharedArrayBuffer {
  const shared = new SharedArrayBuffer(bytes.byteLength);
  new Uint8Array(shared).set(bytes);
  return shared;
}

export class TrainingThreads {
  private readonly idle: Worker[] = [];
  private readonly busy = new Set<Worker>();

  constructor(
    private readonly baseModel: SharedArrayBuffer | null,
    private readonly baseWords: SharedArrayBuffer | null = null,
    private readonly file = TRAINING_THREAD_FILE,
  ) {
    if (!existsSync(file)) throw new Error(`The training thread ${file} is missing. Run \`npm run build\`.`);
  }

  /** The Trainer to put in TrainingRuntime.trainer. */
  readonly trainer: Trainer = (input, onProgress, isCancelled) => this.run(input, onProgress, isCancelled);

  /** Threads alive now (idle or training). */
  get size(): number {
    return this.idle.length + this.busy.size;
  }

  /** Stops every thread (a running training is abandoned; its job is retried elsewhere). */
  async close(): Promise<void> {
    const all = [...this.idle, ...this.busy];
    this.idle.length = 0;
    this.busy.clear();
    await Promise.all(all.map((thread) => thread.terminate()));
  }

  private take(): Worker {
    const thread =
      this.idle.pop() ??
      new Worker(this.file, {
        workerData: { baseModel: this.baseModel, baseWords: this.baseWords } satisfies TrainingThreadData,
      });
    this.busy.add(thread);
    return thread;
  }

  private run(
    input: TrainerInput,
    onProgress: (progress: ProfileProgress) => void,
    isCancelled: () => boolean,
  ): Promise<ProfileResult> {
    const thread = this.take();
    return new Promise<ProfileResult>((resolve, reject) => {
      let ended = false;
      const end = (keep: boolean) => {
        ended = true;
        clearInterval(poll);
        thread.off('message', onMessage);
        thread.off('error', onError);
        thread.off('exit', onExit);
        this.busy.delete(thread);
        if (keep) this.idle.push(thread);
        else void thread.terminate();
      };
      const onMessage = (message: FromTrainingThread) => {
        if (ended) return;
        if (message.type === 'progress') {
          onProgress(message.progress);
        } else if (message.type === 'done') {
          end(true);
          resolve(message.result);
        } else {
          end(true);
          reject(
            message.kind === 'input' ? new ProfileInputError(message.message) : new Error(message.message),
          );
        }
      };
      const onError = (error: Error) => {
        if (ended) return;
        end(false);
        reject(new Error(`the training thread failed: ${error.message}`));
      };
      const onExit = (code: number) => {
        if (ended) return;
        end(false);
        reject(new Error(`the training thread stopped (exit code ${code})`));
      };
      const poll = setInterval(() => {
        if (ended || !isCancelled()) return;
        // The engine cannot be interrupted from outside: the thread is stopped and not reused.
        end(false);
        reject(new CancelledError());
      }, CANCEL_POLL_MS);
      thread.on('message', onMessage);
      thread.on('error', onError);
      thread.on('exit', onExit);
      thread.postMessage({ type: 'train', input } satisfies ToTrainingThread);
    });
  }
}
