// Progress and cancellation for the profile pipeline. The pipeline plans its
// steps first, each with a cost estimate (roughly µs of work on this kind of
// machine), so the fraction reported moves in proportion to time, not to
// the number of steps.
import { CancelledError } from './profile-errors';

/** The steps of a run (the list is the report schema's). */
export type ProfileStage = TrainingStage;
import type { TrainingStage } from '../../schemas/profile-report.schema';

/** What onProgress receives; `fraction` is the overall share done, 0..1, never decreasing. */
export type ProfileProgress = { stage: ProfileStage; fraction: number };

/** Smallest rise of the fraction worth a call from inside a step (0.5%). */
const MIN_STEP = 0.005;

type SetTimeoutLike = (callback: () => void, ms: number) => unknown;

/**
 * Lets pending events run (a cancel request, a progress write) between steps.
 * Plain TypeScript has no timer type here, so the global is looked up.
 */
function yieldToEventLoop(): Promise<void> {
  const timer = (globalThis as { setTimeout?: SetTimeoutLike }).setTimeout;
  return new Promise((resolve) => {
    if (timer) timer(resolve, 0);
    else resolve();
  });
}

export class ProgressTracker {
  private done = 0;
  private lastSent = -1;
  private stage: ProfileStage = 'preparing';
  private stageStart = Date.now();
  /** ms spent per stage. */
  readonly timings: Record<ProfileStage, number> = {
    preparing: 0,
    training: 0,
    'cross-validating': 0,
    simulating: 0,
    saving: 0,
  };

  /**
   * @param total sum of the cost estimates of all planned steps (> 0)
   */
  constructor(
    private readonly total: number,
    private readonly onProgress?: (p: ProfileProgress) => void,
    private readonly shouldCancel?: () => boolean,
  ) {}

  /** Throws CancelledError when the caller asked to stop. */
  checkCancel(): void {
    if (this.shouldCancel?.()) throw new CancelledError();
  }

  private enter(stage: ProfileStage): void {
    if (stage === this.stage) return;
    const now = Date.now();
    this.timings[this.stage] += now - this.stageStart;
    this.stage = stage;
    this.stageStart = now;
  }

  private send(fraction: number, force: boolean): void {
    const f = Math.min(1, Math.max(this.lastSent, fraction));
    if (!force && f - this.lastSent < MIN_STEP) return;
    this.lastSent = f;
    this.onProgress?.({ stage: this.stage, fraction: f });
  }

  /**
   * Runs one planned step: yields to the event loop, checks for cancellation,
   * reports, runs `work`, and counts its cost as done. `work` may call the
   * `inside(share)` callback it is given (share 0..1 of this step) to move
   * the bar during a long step; that also checks for cancellation.
   */
  async step<T>(stage: ProfileStage, cost: number, work: (inside: (share: number) => void) => T): Promise<T> {
    await yieldToEventLoop();
    this.checkCancel();
    this.enter(stage);
    const start = this.done;
    this.send(start / this.total, true);
    const result = work((share) => {
      const f = (start + cost * Math.min(1, Math.max(0, share))) / this.total;
      if (f - this.lastSent >= MIN_STEP) {
        this.checkCancel();
        this.send(f, false);
      }
    });
    this.done = start + cost;
    this.send(this.done / this.total, false);
    return result;
  }

  /** Reports 1 and closes the timings. */
  finish(): void {
    this.enter('saving');
    this.timings.saving += Date.now() - this.stageStart;
    this.stageStart = Date.now();
    this.send(1, true);
  }
}
