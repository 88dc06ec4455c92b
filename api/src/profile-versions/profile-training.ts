import {
  type BaseWords,
  buildBaseOnlyProfile,
  CancelledError,
  deserializeBaseWords,
  deserializeModel,
  type PpmModel,
  type ProfileInput,
  type ProfileProgress,
  ProfileInputError,
  type ProfileResult,
  type ProfileSettings,
  type ProfileSettingsInput,
  profileSettingsSchema,
  trainAndEvaluateProfile,
} from '@keyloom/shared';
import { createHash } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import type { DataSource, EntityManager } from 'typeorm';
import type { AuditService } from '../audit/audit.service';
import { corporaCacheFile } from '../config/data-paths';
import type { FrozenSample, StoredVersionEvent } from './profile-version.entity';

// corpora/.cache/base-model.bin (built by `npm run corpora`), three levels above both
// api/src/profile-versions and api/dist/profile-versions — found the way LexiconService finds the lexicon.
export const BASE_MODEL_FILE = corporaCacheFile('base-model.bin');
/** The base vocabulary (corpora/.cache/base-words.bin), beside the base model. */
export const BASE_WORDS_FILE = corporaCacheFile('base-words.bin');

/** What one training run gets: the frozen samples and settings (the trainer adds its base model and vocabulary). */
export type TrainerInput = Omit<ProfileInput, 'base' | 'baseWords'>;

/** The engine's input for one run: the base vocabulary goes only with the base model. */
export function engineInput(
  input: TrainerInput,
  base: PpmModel | null,
  baseWords: BaseWords | null,
): ProfileInput {
  return { ...input, base, baseWords: base ? baseWords : null };
}

/**
 * Runs the engine for one version. `isCancelled` turns true when the version stops waiting for the
 * job (cancel, delete, re-queue); the trainer then rejects with CancelledError.
 */
export type Trainer = (
  input: TrainerInput,
  onProgress: (progress: ProfileProgress) => void,
  isCancelled: () => boolean,
) => Promise<ProfileResult>;

/** The engine on the calling thread (the HTTP tests and the seed). */
export function inProcessTrainer(base: PpmModel | null, baseWords: BaseWords | null = null): Trainer {
  return (input, onProgress, isCancelled) =>
    trainAndEvaluateProfile(engineInput(input, base, baseWords), onProgress, isCancelled);
}

/** What the worker holds between jobs: the frozen base model and vocabulary, and how to evaluate. */
export type TrainingRuntime = {
  /** The base model for the in-process trainer (unused when `trainer` is given). */
  base: PpmModel | null;
  /** SHA-256 (hex) of the base model file, stored with each version. */
  baseModelSha256: string | null;
  /** The base vocabulary for the in-process trainer (unused when `trainer` is given). */
  baseWords?: BaseWords | null;
  /** SHA-256 (hex) of the base vocabulary file, stored with each version trained with words. */
  baseWordsSha256?: string | null;
  /** Cross-validation folds, 2..10 (PROFILE_FOLDS; tests use 2–3). */
  folds: number;
  /** Keystroke-simulation cap per fold (engine default when undefined). */
  ksSampleChars?: number | null;
  /** ms between progress writes (default 500). */
  progressIntervalMs?: number;
  /**
   * Where the engine runs; default: in-process with `base`. The worker passes the trainer of
   * training-threads.ts, whose threads hold the base model whose hash is `baseModelSha256`.
   */
  trainer?: Trainer;
};

/** A base file's bytes and SHA-256 (hex); throws a clear message when it is missing. */
function readBaseFile(file: string, what: string): { bytes: Uint8Array; sha256: string } {
  if (!existsSync(file)) {
    throw new Error(`The ${what} ${file} is missing. Run \`npm run corpora\` to build it.`);
  }
  const bytes = readFileSync(file);
  return { bytes: new Uint8Array(bytes), sha256: createHash('sha256').update(bytes).digest('hex') };
}

/** The base model file's bytes and SHA-256 (hex); throws a clear message when it is missing. */
export function readBaseModelFile(file = BASE_MODEL_FILE): { bytes: Uint8Array; sha256: string } {
  return readBaseFile(file, 'base model');
}

/** The base vocabulary file's bytes and SHA-256 (hex); throws a clear message when it is missing. */
export function readBaseWordsFile(file = BASE_WORDS_FILE): { bytes: Uint8Array; sha256: string } {
  return readBaseFile(file, 'base vocabulary');
}

/**
 * Loads the Brown base model and the base vocabulary from the corpus cache (about 1 s) for the
 * in-process trainer.
 */
export function loadTrainingRuntime(
  folds: number,
  file = BASE_MODEL_FILE,
  wordsFile = BASE_WORDS_FILE,
): TrainingRuntime {
  const { bytes, sha256 } = readBaseModelFile(file);
  const words = readBaseWordsFile(wordsFile);
  return {
    base: deserializeModel(bytes).freeze(),
    baseModelSha256: sha256,
    baseWords: deserializeBaseWords(words.bytes),
    baseWordsSha256: words.sha256,
    folds,
  };
}

/** What a training run saves: a trained profile, or a base-only one (no report: nothing held out). */
type TrainedModels = Omit<ProfileResult, 'report'> & { report: ProfileResult['report'] | null };

export const BASE_ONLY_NEEDS_BASE_MESSAGE =
  'A base-only version needs the general English model, and this server has none. Run `npm run corpora` to build it, then train again.';

/** The models of a base-only version (no report); ProfileInputError without a base model. */
function baseOnlyModels(settings: ProfileSettings, haveBase: boolean): TrainedModels {
  if (!haveBase) throw new ProfileInputError(BASE_ONLY_NEEDS_BASE_MESSAGE);
  return { ...buildBaseOnlyProfile(settings), report: null };
}

/** How a training job ended. 'stale': the version no longer waits for this job (cancelled, deleted, re-queued). */
export type TrainingOutcome = 'trained' | 'failed' | 'cancelled' | 'stale';

/**
 * The engine's input settings from the stored settings, through the one settings schema: fields
 * added since a version was made take their defaults (e.g. no added or blocked words).
 */
export function engineSettings(settings: ProfileSettingsInput): ProfileSettings {
  return profileSettingsSchema.parse(settings);
}

/** Documents in the order they were frozen (the order decides the folds). */
export function frozenDocuments(samples: FrozenSample[]): { id: string; text: string }[] {
  return samples.map((s) => ({ id: s.id, text: s.text }));
}

// UPDATE … through TypeORM's raw query answers [rows, rowCount].
export async function updateCount(manager: EntityManager, sql: string, params: unknown[]): Promise<number> {
  const raw: unknown = await manager.query(sql, params);
  if (Array.isArray(raw) && raw.length === 2 && typeof raw[1] === 'number') return raw[1];
  return Array.isArray(raw) ? raw.length : 0;
}

const STILL_MINE = `id = $1 AND job_id = $2 AND status = 'training'`;

/** One history entry written by the worker (no person), as the jsonb array to append. */
export function event(status: StoredVersionEvent['status'], comment: string | null): string {
  const e: StoredVersionEvent = { status, at: new Date().toISOString(), by: null, comment };
  return JSON.stringify([e]);
}

/**
 * The job handler (the worker calls it for each pg-boss job; the HTTP tests call it in-process).
 * Claims the version only while it is `training` under this `jobId`, trains and evaluates the
 * frozen samples, writes progress about every 500 ms, and saves report + model + `trained` in one
 * transaction guarded by the same condition, so a cancelled or re-queued version is never
 * overwritten and nothing is half-saved. Bad input (too little text, settings out of range) → `failed`
 * with the engine's message. Any other fault → `failed` too; when even that cannot be written
 * (database down) the error is rethrown so pg-boss retries the job.
 */
export async function runProfileTraining(
  dataSource: DataSource,
  audit: AuditService,
  versionId: string,
  jobId: string,
  runtime: TrainingRuntime,
): Promise<TrainingOutcome> {
  const manager = dataSource.manager;
  const claimed = await updateCount(
    manager,
    `UPDATE profile_versions SET stage = 'preparing', heartbeat_at = now(), updated_at = now() WHERE ${STILL_MINE}`,
    [versionId, jobId],
  );
  if (claimed === 0) return 'stale';
  const rows: {
    client_id: string;
    settings: ProfileSettings;
    samples: FrozenSample[];
    base_only: boolean;
  }[] = await manager.query(
    'SELECT client_id, settings, samples, base_only FROM profile_versions WHERE id = $1',
    [versionId],
  );
  const row = rows[0];
  if (!row) return 'stale';
  const subject = { type: 'profile-version', id: versionId, clientId: row.client_id };

  let latest: ProfileProgress = { stage: 'preparing', fraction: 0 };
  let lost = false; // the row stopped waiting for this job (cancel, delete, re-queue)
  let writing: Promise<void> | null = null;
  const writeProgress = (): Promise<void> => {
    if (writing) return writing;
    const { stage, fraction } = latest;
    writing = updateCount(
      manager,
      `UPDATE profile_versions SET progress = $3, stage = $4, heartbeat_at = now(), updated_at = now() WHERE ${STILL_MINE}`,
      [versionId, jobId, Math.min(1, Math.max(0, fraction)), stage],
    )
      .then((count) => {
        if (count === 0) lost = true;
      })
      // A failed progress write (e.g. a database restart) is not fatal; the final save decides.
      .catch(() => undefined)
      .finally(() => {
        writing = null;
      });
    return writing;
  };
  const settled = (): Promise<void> => writing ?? Promise.resolve();
  const timer = setInterval(() => {
    // Every tick, changed or not: the write is also the heartbeat and the cancel check.
    if (!lost) void writeProgress();
  }, runtime.progressIntervalMs ?? 500);
  timer.unref();

  const settings = engineSettings(row.settings);
  const train = runtime.trainer ?? inProcessTrainer(runtime.base, runtime.baseWords ?? null);
  const withBase = runtime.base !== null || runtime.trainer !== undefined;
  try {
    const result: TrainedModels = row.base_only
      ? baseOnlyModels(settings, withBase && runtime.baseModelSha256 !== null)
      : await train(
          {
            documents: frozenDocuments(row.samples),
            settings,
            // The client's additions and blocks as frozen with the version (empty for older versions).
            vocabulary: settings.vocabulary,
            folds: runtime.folds,
            ...(runtime.ksSampleChars === undefined ? {} : { ksSampleChars: runtime.ksSampleChars }),
          },
          (p) => {
            latest = p;
          },
          () => lost,
        );
    clearInterval(timer);
    await settled();
    const wordModel = result.wordModelBytes;
    const saved = await dataSource.transaction(async (tx) => {
      const count = await updateCount(
        tx,
        `UPDATE profile_versions SET status = 'trained', progress = 1, stage = NULL, error = NULL,
           metrics = $3::jsonb, model = $4, model_size = $5, base_weight = $6, base_model_sha256 = $7,
           word_model = $9, word_weights = $10::jsonb, base_words_sha256 = $11,
           trained_at = now(), heartbeat_at = now(), updated_at = now(), history = history || $8::jsonb
         WHERE ${STILL_MINE}`,
        [
          versionId,
          jobId,
          result.report ? JSON.stringify(result.report) : null,
          Buffer.from(result.modelBytes),
          result.modelBytes.length,
          result.baseWeight,
          withBase ? runtime.baseModelSha256 : null,
          event('trained', null),
          wordModel ? Buffer.from(wordModel) : null,
          wordModel && result.wordWeights ? JSON.stringify(result.wordWeights) : null,
          wordModel && withBase ? (runtime.baseWordsSha256 ?? null) : null,
        ],
      );
      if (count === 0) return false;
      await audit.record(
        null,
        'profile.trained',
        subject,
        {
          jobId,
          ...(result.report
            ? {
                chars: result.report.chars,
                bpcIdeal: result.report.bpcIdeal,
                ms: result.report.timings.total,
              }
            : { baseOnly: true }),
          modelBytes: result.modelBytes.length,
          wordModelBytes: wordModel?.length ?? 0,
        },
        tx,
      );
      return true;
    });
    return saved ? 'trained' : 'stale';
  } catch (error) {
    clearInterval(timer);
    await settled();
    if (error instanceof CancelledError) return 'cancelled';
    const message =
      error instanceof ProfileInputError
        ? error.message
        : `Training stopped by a fault: ${error instanceof Error ? error.message : String(error)}. Train again to retry.`;
    try {
      await dataSource.transaction(async (tx) => {
        const count = await updateCount(
          tx,
          `UPDATE profile_versions SET status = 'failed', stage = NULL, error = $3, updated_at = now(),
             history = history || $4::jsonb WHERE ${STILL_MINE}`,
          [versionId, jobId, message, event('failed', message)],
        );
        if (count > 0) await audit.record(null, 'profile.failed', subject, { jobId, error: message }, tx);
      });
    } catch {
      // The failure could not be recorded (database unreachable): let pg-boss retry the whole job.
      throw error;
    }
    return 'failed';
  }
}
