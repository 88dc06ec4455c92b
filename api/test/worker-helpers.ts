// Shared by the tests that run the job worker as a real process (`node api/dist/worker.js`, from the
// build that `npm test` makes before the api-http suite): starting one, reading its log, waiting,
// and invented sample text.
import { type ChildProcess, spawn } from 'node:child_process';
import { join } from 'node:path';

export const WORKER_JS = join(__dirname, '..', 'dist', 'worker.js');

/** What the worker logs once it takes training jobs. */
export const READY = 'Waiting for profile-training jobs';

// Invented words in the demo scenario's voice (sailing, jazz piano, a dog); sentences drawn with a
// fixed seed so every run trains on the same text.
const WORDS = (
  'the wind came round to the west and the water was flat for an hour Pepper sat in the bow and ' +
  'barked at every gull Hannah says the regatta starts at ten on Saturday we should be at the club ' +
  'by nine to rig the boat I want to sail the new course with the downwind leg close to the shore ' +
  'back home I practised the slow blues for Thursday the left hand still drags in the turnaround'
).split(' ');

export function inventedText(chars: number, seed: number): string {
  let state = seed;
  const next = () => (state = (state * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
  const sentences: string[] = [];
  let length = 0;
  while (length < chars) {
    const words = Array.from(
      { length: 5 + Math.floor(next() * 10) },
      () => WORDS[Math.floor(next() * WORDS.length)],
    );
    const sentence = `${words.join(' ')}.`;
    sentences.push(sentence);
    length += sentence.length + 1;
  }
  return sentences.join(' ');
}

export type Worker = { child: ChildProcess; output: () => string; exit: Promise<number | null> };

/** Starts a worker on the test database (2 folds, one training at a time); `env` adds or overrides settings. */
export function startWorker(env: Record<string, string> = {}): Worker {
  const child = spawn(process.execPath, [WORKER_JS], {
    env: {
      ...process.env,
      NODE_ENV: 'test',
      NO_COLOR: '1',
      PROFILE_FOLDS: '2',
      TRAINING_CONCURRENCY: '1',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout?.on('data', (chunk: Buffer) => (output += chunk.toString()));
  child.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString()));
  const exit = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  return { child, output: () => output, exit };
}

export const alive = (worker: Worker) => worker.child.exitCode === null && worker.child.signalCode === null;

export const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** Polls `check` every 100 ms until it answers a value (not undefined); fails after `ms`. */
export async function waitFor<T>(
  what: string,
  ms: number,
  check: () => Promise<T | undefined> | T | undefined,
): Promise<T> {
  const deadline = Date.now() + ms;
  for (;;) {
    const value = await check();
    if (value !== undefined) return value;
    if (Date.now() > deadline) throw new Error(`Timed out after ${ms} ms waiting for ${what}`);
    await sleep(100);
  }
}

export async function waitForLog(worker: Worker, text: string, ms: number): Promise<void> {
  await waitFor(`"${text}" in the worker's log`, ms, () => {
    if (!alive(worker)) throw new Error(`The worker exited (${worker.child.exitCode}):\n${worker.output()}`);
    return worker.output().includes(text) ? true : undefined;
  });
}
