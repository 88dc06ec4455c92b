import {
  BadRequestException,
  ConflictException,
  ForbiddenException,
  Injectable,
  Logger,
  NotFoundException,
  type OnModuleInit,
  ServiceUnavailableException,
} from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import {
  type ApproveInput,
  BASE_ONLY_WEIGHT,
  type ClientVocabulary,
  checkProfileSettings,
  headlineReportKeys,
  type CreateProfileVersionInput,
  MIN_PROFILE_CHARS,
  prepareText,
  PROFILE_FILE_EXTENSION,
  type ProfileFileCheck,
  ProfileFileError,
  type ProfileFileHeader,
  ProfileInputError,
  type ProfileSettings,
  type ProfileVersionStatus,
  profileSettingsSchema,
  type ReportProblemInput,
  type RetireInput,
  profileVersionStatusLabels,
  type SendBackInput,
  type SignOffInput,
  type UpdateProfileVersionInput,
  verifyProfileFile,
  writeProfileFile,
} from '@keyloom/shared';
import { createHash, randomUUID } from 'node:crypto';
import { DataSource, type EntityManager, In } from 'typeorm';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../auth/session-user';
import { WRONG_ROLE_MESSAGE } from '../auth/session-user';
import { ClientAccessService } from '../clients/client-access.service';
import type { Client } from '../clients/client.entity';
import { AppConfig } from '../config/app-config';
import { clientRowsHook, WithdrawalHooks } from '../consents/withdrawal-hooks';
import { LIVE_JOB_STATES, PROFILE_TRAINING_QUEUE } from '../jobs/job-queue';
import { JobQueueService } from '../jobs/job-queue.service';
import { Sample } from '../samples/sample.entity';
import { ClientVocabularyRow } from '../vocabulary/client-vocabulary.entity';
import { ExportSigningService } from './export-signing.service';
import { engineSettings } from './profile-training';
import { type FrozenSample, ProfileVersion, type StoredVersionEvent } from './profile-version.entity';
import { type ProfileVersionDto, toProfileVersionDto } from './profile-version.mapper';

export const VERSION_NOT_FOUND_MESSAGE = 'There is no profile version with that id.';
export const NO_READY_SAMPLES_MESSAGE =
  'This client has no samples ready for training. Upload samples and review their personal-data flags first.';
export const ALREADY_TRAINING_MESSAGE = 'This version is already training.';
export const ALREADY_TRAINED_MESSAGE =
  'This version is already trained, and a trained version never changes. Create a new version to train with other settings.';
export const NOT_TRAINING_MESSAGE = 'This version is not training; there is nothing to cancel.';
export const ALREADY_SIGNED_OFF_MESSAGE = 'This version is already signed off.';
export const ALREADY_ACTIVE_MESSAGE = 'This version is already approved and active.';
export const ALREADY_SENT_BACK_MESSAGE = 'This version was already sent back.';
export const OWN_WORK_MESSAGE = 'Nobody approves their own work: you created or signed off this version.';
export const ONLY_CARER_SIGNS_OFF_MESSAGE = 'Only a carer assigned to this client signs off a version.';
export const ONLY_SUPERVISOR_MESSAGE = 'Only a supervisor approves or sends back a version.';
export const NO_MODEL_MESSAGE = 'This version has no trained model yet; train it first.';
export const CARER_EXPORT_MESSAGE = 'Carers cannot export profiles. Ask the client’s clinician.';
export const TRIAL_FIRST_MESSAGE =
  'Try this version on the test keyboard at least once before signing it off.';
export const ONLY_DRAFT_MESSAGE = (status: string) =>
  `Only a draft can be edited or deleted; this version is ${status}. Create a new version instead.`;
export const NOT_ACTIVE_MESSAGE = (status: string) =>
  `Only the active version can be retired; this one is ${status}.`;
export const ONLY_SUPERVISOR_RETIRES_MESSAGE = 'Only a supervisor retires the active version.';
export const BASE_ONLY_SAMPLES_MESSAGE =
  'A base-only version uses general English alone: choose no samples, or make a version from the client’s writing.';
export const ONLY_CARER_REPORTS_MESSAGE =
  'Only a carer assigned to this client reports a problem with a version.';

/** Statuses whose version holds a trained model (it can be exported). */
export const WITH_MODEL: readonly ProfileVersionStatus[] = [
  'trained',
  'signed_off',
  'active',
  'retired',
  'sent_back',
];

/** The file a version exports to. */
export type ExportedProfile = { fileName: string; bytes: Buffer };

/** What POST /api/profile-exports/verify answers for a readable file (damaged ones: 400). */
export type ProfileFileReport = ProfileFileCheck & { header: ProfileFileHeader };

/**
 * The .klprofile header of a version loaded with `client` and `approvedBy`. With `'as-trained'` it holds
 * only what was fixed when the version was trained (status "trained", no approval, exported at the
 * training time by "Keyloom"), so the file's bytes stay the same whatever happens to the version later
 * (the test keyboard's download and its ETag); otherwise it is stamped with who exports it now.
 */
export function profileFileHeader(
  version: ProfileVersion,
  stamp: 'as-trained' | { exportedAt: string; exportedBy: string },
): ProfileFileHeader {
  const metrics = version.metrics ?? {};
  const headline = Object.fromEntries(
    headlineReportKeys.filter((k) => k in metrics).map((k) => [k, metrics[k]]),
  );
  const trainedAt = version.trainedAt?.toISOString() ?? null;
  const asTrained = stamp === 'as-trained';
  const vocabulary = engineSettings(version.settings).vocabulary;
  return {
    format: 'keyloom-profile',
    client: { pseudonym: version.client?.pseudonym ?? 'client' },
    version: {
      id: version.id,
      number: version.number,
      status: asTrained ? 'trained' : version.status,
      note: version.note,
    },
    settings: version.settings,
    // The client's additions and blocks, so the test keyboard and a device apply the blocks.
    ...(vocabulary.additions.length + vocabulary.blocks.length > 0 ? { vocabulary } : {}),
    baseWeight: version.baseWeight ?? 0,
    // Only with the word model it was tuned for (a file without words has no word list to weigh).
    ...(version.wordWeights && version.wordModel ? { wordWeights: version.wordWeights } : {}),
    baseModelSha256: version.baseModelSha256,
    // The base vocabulary the words were trained beside (the file is self-describing without the database).
    ...(version.baseWordsSha256 && version.wordModel ? { baseWordsSha256: version.baseWordsSha256 } : {}),
    engineVersion: typeof metrics.engineVersion === 'string' ? metrics.engineVersion : 'unknown',
    metrics: headline,
    samples: version.samples.map(({ title, sha256, characters }) => ({ title, sha256, characters })),
    createdAt: version.createdAt.toISOString(),
    trainedAt,
    approvedBy: asTrained || !version.approvedById ? null : (version.approvedBy?.name ?? '(removed account)'),
    approvedAt: asTrained ? null : (version.approvedAt?.toISOString() ?? null),
    exportedAt: asTrained ? (trainedAt ?? version.createdAt.toISOString()) : stamp.exportedAt,
    exportedBy: asTrained ? 'Keyloom' : stamp.exportedBy,
  };
}

/**
 * The ready samples (or the chosen ones, which must be ready), oldest first, with their text now:
 * what a new version freezes (the demo seed's version too). 400 for a chosen sample not ready or not the client's.
 */
export async function frozenSamples(
  manager: EntityManager,
  clientId: string,
  sampleIds: string[] | undefined,
): Promise<FrozenSample[]> {
  const repo = manager.getRepository(Sample);
  const order = { createdAt: 'ASC', title: 'ASC', id: 'ASC' } as const;
  let rows: Sample[];
  if (sampleIds) {
    const unique = [...new Set(sampleIds)];
    rows = await repo.find({ where: { clientId, id: In(unique) }, order });
    const missing = unique.filter((id) => !rows.some((r) => r.id === id));
    if (missing.length > 0) {
      throw new BadRequestException({
        message: `${missing.length === 1 ? 'One chosen sample is' : `${missing.length} chosen samples are`} not this client's.`,
        issues: [{ path: 'sampleIds', message: `Unknown sample: ${missing.join(', ')}` }],
      });
    }
    const notReady = rows.filter((r) => r.status !== 'ready');
    if (notReady.length > 0) {
      const why = (r: Sample) =>
        r.status === 'excluded'
          ? `“${r.title}” is excluded`
          : `“${r.title}” still has personal-data flags to review`;
      const message = `${notReady.map(why).join('; ')}. Only ready samples can be used.`;
      throw new BadRequestException({ message, issues: [{ path: 'sampleIds', message }] });
    }
  } else {
    rows = await repo.find({ where: { clientId, status: 'ready' }, order });
    if (rows.length === 0) throw new BadRequestException(NO_READY_SAMPLES_MESSAGE);
  }
  return rows.map((r) => ({
    id: r.id,
    title: r.title,
    sha256: r.sha256,
    characters: r.characters,
    text: r.text,
  }));
}

/**
 * Characters of writing the training will see in `samples` (the engine's prepared text, so the
 * figure is the one training checks against MIN_PROFILE_CHARS).
 */
export function preparedCharacters(samples: readonly FrozenSample[], caseFold: boolean): number {
  return samples.reduce((n, s) => n + prepareText(s.text, { caseFold }).length, 0);
}

/** The refusal for too little writing, with both figures (at creation, on edit and before training). */
export function tooLittleTextMessage(chars: number): string {
  return (
    `A profile needs at least ${MIN_PROFILE_CHARS} characters of writing; ` +
    `the chosen samples have ${chars}. Add more samples.`
  );
}

// 400 when the samples hold less writing than a profile needs (MIN_PROFILE_CHARS, the engine's floor;
// the figure itself is the engine's own choice: common practice, no source).
function requireEnoughText(samples: readonly FrozenSample[], settings: ProfileSettings): void {
  const chars = preparedCharacters(samples, engineSettings(settings).caseFold);
  if (chars < MIN_PROFILE_CHARS) {
    const message = tooLittleTextMessage(chars);
    throw new BadRequestException({ message, issues: [{ path: 'sampleIds', message }] });
  }
}

/** Additions and blocks as counts (what the audit log keeps of a vocabulary). */
export function vocabularyCounts(vocabulary: ClientVocabulary): { additions: number; blocks: number } {
  return { additions: vocabulary.additions.length, blocks: vocabulary.blocks.length };
}

function label(status: ProfileVersionStatus): string {
  return profileVersionStatusLabels[status].toLowerCase();
}

function historyEvent(status: ProfileVersionStatus, actor: Actor | null, comment: string | null): string {
  const e: StoredVersionEvent = { status, at: new Date().toISOString(), by: actor?.name ?? null, comment };
  return JSON.stringify([e]);
}

// UPDATE … through TypeORM's raw query answers [rows, rowCount].
async function updateCount(manager: EntityManager, sql: string, params: unknown[]): Promise<number> {
  const raw: unknown = await manager.query(sql, params);
  if (Array.isArray(raw) && raw.length === 2 && typeof raw[1] === 'number') return raw[1];
  return Array.isArray(raw) ? raw.length : 0;
}

/**
 * The settings a draft freezes: `access` defaults to the client record's timings and, without
 * `vocabulary` in the body, the client's current vocabulary list is frozen.
 */
async function resolvedSettings(
  manager: EntityManager,
  client: Client,
  input: CreateProfileVersionInput['settings'],
  baseOnly = false,
): Promise<ProfileSettings> {
  const vocabulary =
    input.vocabulary ??
    (await manager.getRepository(ClientVocabularyRow).findOneBy({ clientId: client.id }))?.vocabulary;
  return profileSettingsSchema.parse({
    ...input,
    // A base-only version is general English alone, whatever weight was sent.
    ...(baseOnly ? { baseWeight: BASE_ONLY_WEIGHT } : {}),
    access: input.access ?? accessFromClient(client),
    vocabulary,
  });
}

/** 400 for samples chosen for a base-only version. */
function baseOnlySamplesRefusal(): BadRequestException {
  return new BadRequestException({
    message: BASE_ONLY_SAMPLES_MESSAGE,
    issues: [{ path: 'sampleIds', message: BASE_ONLY_SAMPLES_MESSAGE }],
  });
}

/** The access timings of the client record, as the settings' `access` (also the demo seed's). */
export function accessFromClient(client: Client): ProfileSettings['access'] {
  return {
    method: client.accessMethod,
    ...(client.scanIntervalMs === null ? {} : { scanIntervalMs: client.scanIntervalMs }),
    ...(client.dwellMs === null ? {} : { dwellMs: client.dwellMs }),
    ...(client.keyTimeMs === null ? {} : { keyTimeMs: client.keyTimeMs }),
  };
}

/** A pseudonym as part of a download's file name: ASCII letters, digits and hyphens ("R. Ashby" → "r-ashby"). */
export function slug(text: string): string {
  return (
    text
      .normalize('NFKD')
      .replace(/[^\w\s-]/g, '')
      .trim()
      .replace(/[\s_]+/g, '-')
      .toLowerCase() || 'client'
  );
}

@Injectable()
export class ProfileVersionsService implements OnModuleInit {
  private readonly logger = new Logger('ProfileVersions');

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly access: ClientAccessService,
    private readonly audit: AuditService,
    private readonly jobs: JobQueueService,
    private readonly withdrawalHooks: WithdrawalHooks,
    private readonly signing: ExportSigningService,
    private readonly config: AppConfig,
  ) {}

  onModuleInit(): void {
    // Versions are models of the samples: they go with the training consent. A running job finds its
    // row gone.
    this.withdrawalHooks.register(
      'profileVersions',
      clientRowsHook({
        entity: ProfileVersion,
        scope: 'training',
        audit: this.audit,
        action: 'profile.delete',
        idsKey: 'versionIds',
      }),
    );
  }

  /** The client's versions, newest first (owning clinician, supervisor, assigned carer). */
  async list(actor: Actor, clientId: string): Promise<ProfileVersionDto[]> {
    await this.access.requireReadable(actor, clientId, 'clinical');
    const rows = await this.dataSource.getRepository(ProfileVersion).find({
      where: { clientId },
      relations: { createdBy: true, signedOffBy: true, approvedBy: true, retiredBy: true },
      order: { number: 'DESC' },
    });
    return rows.map((row) => toProfileVersionDto(row, this.config.trainingStaleMs));
  }

  /** One version. */
  async findOne(actor: Actor, id: string): Promise<ProfileVersionDto> {
    await this.readable(actor, id);
    return this.dto(this.dataSource.manager, id);
  }

  /** Freezes settings and samples into a new draft (owning clinician, active training consent). */
  async create(actor: Actor, clientId: string, input: CreateProfileVersionInput): Promise<ProfileVersionDto> {
    return this.dataSource.transaction(async (manager) => {
      const client = await this.access.requireOwned(actor, clientId, manager);
      await this.access.requireTrainingConsent(clientId, manager);
      const baseOnly = input.baseOnly === true;
      const settings = await resolvedSettings(manager, client, input.settings, baseOnly);
      if (baseOnly && input.sampleIds?.length) throw baseOnlySamplesRefusal();
      const samples = baseOnly ? [] : await frozenSamples(manager, clientId, input.sampleIds);
      if (!baseOnly) requireEnoughText(samples, settings);
      // Numbers per client: one creation at a time per client.
      await manager.query('SELECT 1 FROM clients WHERE id = $1 FOR UPDATE', [clientId]);
      const rows: { next: number }[] = await manager.query(
        'SELECT COALESCE(MAX(number), 0) + 1 AS next FROM profile_versions WHERE client_id = $1',
        [clientId],
      );
      const repo = manager.getRepository(ProfileVersion);
      const version = await repo.save(
        repo.create({
          clientId,
          number: Number(rows[0]?.next ?? 1),
          note: input.note ?? null,
          status: 'draft',
          settings,
          samples,
          baseOnly,
          progress: 0,
          stage: null,
          history: [
            { status: 'draft', at: new Date().toISOString(), by: actor.name, comment: input.note ?? null },
          ],
          createdById: actor.id,
        }),
      );
      await this.audit.record(
        actor,
        'profile.create',
        { type: 'profile-version', id: version.id, clientId },
        {
          number: version.number,
          ...(baseOnly ? { baseOnly: true } : {}),
          // The words stay with the version; the log holds their counts.
          settings: { ...settings, vocabulary: vocabularyCounts(settings.vocabulary) },
          samples: samples.map(({ id, sha256 }) => ({ id, sha256 })),
        },
        manager,
      );
      return this.dto(manager, version.id);
    });
  }

  /**
   * Changes a draft (owning clinician, active training consent): each field sent replaces the draft's,
   * settings and samples frozen again as at creation. Anything past draft: 409.
   */
  async update(actor: Actor, id: string, input: UpdateProfileVersionInput): Promise<ProfileVersionDto> {
    const { clientId } = await this.owned(actor, id);
    return this.dataSource.transaction(async (manager) => {
      const client = await this.access.requireOwned(actor, clientId, manager);
      await this.access.requireTrainingConsent(clientId, manager);
      const version = await this.locked(manager, id);
      if (version.status !== 'draft') throw new ConflictException(ONLY_DRAFT_MESSAGE(label(version.status)));
      const changed: string[] = [];
      if (input.settings) {
        version.settings = await resolvedSettings(manager, client, input.settings, version.baseOnly);
        changed.push('settings');
      }
      if (version.baseOnly && input.sampleIds?.length) throw baseOnlySamplesRefusal();
      if (input.sampleIds && !version.baseOnly) {
        version.samples = await frozenSamples(manager, clientId, input.sampleIds);
        changed.push('samples');
      }
      if (input.note !== undefined) {
        version.note = input.note || null;
        changed.push('note');
      }
      if (!version.baseOnly) requireEnoughText(version.samples, version.settings);
      version.history = [
        ...version.history,
        { status: 'draft', at: new Date().toISOString(), by: actor.name, comment: 'Draft edited.' },
      ];
      await manager.getRepository(ProfileVersion).save(version);
      await this.audit.record(
        actor,
        'profile.update',
        { type: 'profile-version', id, clientId },
        {
          number: version.number,
          changed,
          settings: { ...version.settings, vocabulary: vocabularyCounts(version.settings.vocabulary) },
          samples: version.samples.map(({ id: sampleId, sha256 }) => ({ id: sampleId, sha256 })),
        },
        manager,
      );
      return this.dto(manager, id);
    });
  }

  /** Deletes a draft (owning clinician); anything past draft: 409 (trained versions are kept). */
  async remove(actor: Actor, id: string): Promise<void> {
    const { clientId } = await this.owned(actor, id);
    await this.dataSource.transaction(async (manager) => {
      const version = await this.locked(manager, id);
      if (version.status !== 'draft') throw new ConflictException(ONLY_DRAFT_MESSAGE(label(version.status)));
      await manager.getRepository(ProfileVersion).delete({ id });
      await this.audit.record(
        actor,
        'profile.delete-draft',
        { type: 'profile-version', id, clientId },
        { number: version.number, samples: version.samples.length },
        manager,
      );
    });
  }

  /**
   * The active version → retired, by hand (a supervisor: approving makes a version active, so only
   * the role that approves decides which version is in use). The most recent version approved before
   * it that was not itself retired by hand becomes active again, or none does. The reason stays on
   * the version; the log keeps its SHA-256 and length.
   */
  async retire(actor: Actor, id: string, input: RetireInput): Promise<ProfileVersionDto> {
    const { clientId } = await this.readable(actor, id);
    if (actor.role !== 'supervisor') throw new ForbiddenException(ONLY_SUPERVISOR_RETIRES_MESSAGE);
    return this.dataSource.transaction(async (manager) => {
      await manager.query('SELECT 1 FROM clients WHERE id = $1 FOR UPDATE', [clientId]);
      const version = await this.locked(manager, id);
      if (version.status !== 'active') throw new ConflictException(NOT_ACTIVE_MESSAGE(label(version.status)));
      const previous = await previousApproved(manager, version);
      await updateCount(
        manager,
        `UPDATE profile_versions SET status = 'retired', retired_at = now(), retired_by_id = $2,
           retire_reason = $3, updated_at = now(), history = history || $4::jsonb WHERE id = $1`,
        [id, actor.id, input.reason, historyEvent('retired', actor, input.reason)],
      );
      if (previous) {
        await updateCount(
          manager,
          `UPDATE profile_versions SET status = 'active', updated_at = now(), history = history || $2::jsonb WHERE id = $1`,
          [
            previous.id,
            historyEvent('active', actor, `Active again: version ${version.number} was retired.`),
          ],
        );
        await this.audit.record(
          actor,
          'profile.reactivate',
          { type: 'profile-version', id: previous.id, clientId },
          { number: previous.number, replacing: id },
          manager,
        );
      }
      await this.audit.record(
        actor,
        'profile.retire',
        { type: 'profile-version', id, clientId },
        {
          number: version.number,
          reactivated: previous?.id ?? null,
          // Free text about the client stays on the version (OWASP Logging Cheat Sheet, "Data to
          // exclude", as in audit-details.ts); the hash lets the log show it was not changed since.
          reasonSha256: createHash('sha256').update(input.reason).digest('hex'),
          reasonLength: input.reason.length,
        },
        manager,
      );
      return this.dto(manager, id);
    });
  }

  /**
   * Queues the training job (owning clinician). Allowed from draft and failed, and from training
   * when its job is no longer alive (finished, cancelled, unknown, or running with no heartbeat for
   * TRAINING_STALE_SECONDS, 30 s: the worker was killed), so every stuck version can be retried.
   */
  async train(actor: Actor, id: string): Promise<ProfileVersionDto> {
    const { clientId } = await this.owned(actor, id);
    await this.access.requireTrainingConsent(clientId);
    const jobId = randomUUID();
    let staleJob: string | null = null;
    await this.dataSource.transaction(async (manager) => {
      const version = await this.locked(manager, id);
      if (version.status === 'training') {
        if (await this.jobIsAlive(version)) throw new ConflictException(ALREADY_TRAINING_MESSAGE);
        staleJob = version.jobId;
      } else if (version.status !== 'draft' && version.status !== 'failed') {
        throw new ConflictException(ALREADY_TRAINED_MESSAGE);
      }
      this.checkTrainable(version);
      await updateCount(
        manager,
        `UPDATE profile_versions SET status = 'training', progress = 0, stage = 'queued', error = NULL,
           job_id = $2, heartbeat_at = now(), updated_at = now(), history = history || $3::jsonb WHERE id = $1`,
        [id, jobId, historyEvent('training', actor, null)],
      );
      await this.audit.record(
        actor,
        'profile.train',
        { type: 'profile-version', id, clientId },
        { jobId, retry: version.status !== 'draft', replacedJobId: staleJob },
        manager,
      );
    });
    if (staleJob) await this.jobs.cancel(PROFILE_TRAINING_QUEUE, staleJob).catch(() => undefined);
    try {
      await this.jobs.send(PROFILE_TRAINING_QUEUE, { versionId: id }, jobId);
    } catch (error) {
      const why = error instanceof Error ? error.message : String(error);
      this.logger.error(`Could not queue the training job of ${id}: ${why}`);
      const message = `The training job could not be queued (${why}). Train again to retry.`;
      await this.dataSource.transaction(async (manager) => {
        const count = await updateCount(
          manager,
          `UPDATE profile_versions SET status = 'failed', stage = NULL, error = $3, updated_at = now(),
             history = history || $4::jsonb WHERE id = $1 AND job_id = $2 AND status = 'training'`,
          [id, jobId, message, historyEvent('failed', null, message)],
        );
        if (count > 0) {
          await this.audit.record(
            null,
            'profile.failed',
            { type: 'profile-version', id, clientId },
            { jobId, error: message },
            manager,
          );
        }
      });
      throw new ServiceUnavailableException(message);
    }
    return this.dto(this.dataSource.manager, id);
  }

  // Too little text or bad settings: 400 with the engine's message, before anything is queued.
  private checkTrainable(version: ProfileVersion): void {
    const settings = engineSettings(version.settings);
    try {
      checkProfileSettings(settings);
    } catch (error) {
      if (error instanceof ProfileInputError) throw new BadRequestException(error.message);
      throw error;
    }
    // Drafts made before creation checked the text, so training checks it too.
    if (!version.baseOnly) requireEnoughText(version.samples, version.settings);
  }

  private async jobIsAlive(version: ProfileVersion): Promise<boolean> {
    if (!version.jobId) return false;
    const state = await this.jobs.state(PROFILE_TRAINING_QUEUE, version.jobId);
    if (state === null || !LIVE_JOB_STATES.includes(state)) return false;
    // Queued jobs wait their turn; a running one must keep its heartbeat.
    if (state !== 'active') return true;
    const beat = version.heartbeatAt?.getTime() ?? 0;
    return Date.now() - beat < this.config.trainingStaleMs;
  }

  /** Stops training (owning clinician): the version goes back to draft; the worker drops its work. */
  async cancel(actor: Actor, id: string): Promise<ProfileVersionDto> {
    const { clientId } = await this.owned(actor, id);
    let jobId: string | null = null;
    await this.dataSource.transaction(async (manager) => {
      const version = await this.locked(manager, id);
      if (version.status !== 'training') throw new ConflictException(NOT_TRAINING_MESSAGE);
      jobId = version.jobId;
      const message = `Cancelled by ${actor.name}.`;
      await updateCount(
        manager,
        `UPDATE profile_versions SET status = 'draft', progress = 0, stage = NULL, error = $2, job_id = NULL,
           updated_at = now(), history = history || $3::jsonb WHERE id = $1`,
        [id, message, historyEvent('draft', actor, 'Training cancelled.')],
      );
      await this.audit.record(
        actor,
        'profile.cancel',
        { type: 'profile-version', id, clientId },
        { jobId },
        manager,
      );
    });
    if (jobId) await this.jobs.cancel(PROFILE_TRAINING_QUEUE, jobId).catch(() => undefined);
    return this.dto(this.dataSource.manager, id);
  }

  /** trained → signed_off (an assigned carer, with a comment). */
  async signOff(actor: Actor, id: string, input: SignOffInput): Promise<ProfileVersionDto> {
    const { clientId } = await this.readable(actor, id);
    if (actor.role !== 'carer') throw new ForbiddenException(ONLY_CARER_SIGNS_OFF_MESSAGE);
    return this.dataSource.transaction(async (manager) => {
      const version = await this.locked(manager, id);
      if (version.status === 'signed_off') throw new ConflictException(ALREADY_SIGNED_OFF_MESSAGE);
      if (version.status !== 'trained') {
        throw new ConflictException(
          `Only a version that is ready for trial can be signed off; this one is ${label(version.status)}.`,
        );
      }
      if (!(await hasTrial(manager, id))) throw new ConflictException(TRIAL_FIRST_MESSAGE);
      await updateCount(
        manager,
        `UPDATE profile_versions SET status = 'signed_off', signed_off_by_id = $2, signed_off_at = now(),
           sign_off_comment = $3, updated_at = now(), history = history || $4::jsonb WHERE id = $1`,
        [id, actor.id, input.comment, historyEvent('signed_off', actor, input.comment)],
      );
      await this.audit.record(
        actor,
        'profile.sign-off',
        { type: 'profile-version', id, clientId },
        // The comment stays with the version (its history), not in the log.
        { status: 'signed_off', number: version.number },
        manager,
      );
      return this.dto(manager, id);
    });
  }

  /**
   * trained → sent_back (an assigned carer, after at least one trial), instead of signing off: the
   * reason is stored as the send-back reason and the history says it came from a trial.
   */
  async reportProblem(actor: Actor, id: string, input: ReportProblemInput): Promise<ProfileVersionDto> {
    const { clientId } = await this.readable(actor, id);
    if (actor.role !== 'carer') throw new ForbiddenException(ONLY_CARER_REPORTS_MESSAGE);
    return this.dataSource.transaction(async (manager) => {
      const version = await this.locked(manager, id);
      if (version.status === 'sent_back') throw new ConflictException(ALREADY_SENT_BACK_MESSAGE);
      if (version.status !== 'trained') {
        throw new ConflictException(
          `Only a version that is ready for trial can have a problem reported; this one is ${label(version.status)}.`,
        );
      }
      if (!(await hasTrial(manager, id))) throw new ConflictException(TRIAL_FIRST_MESSAGE);
      const comment = `Problem reported after a trial: ${input.reason}`;
      await this.markSentBack(
        manager,
        actor,
        { id, clientId, number: version.number },
        input.reason,
        comment,
        'profile.report-problem',
      );
      return this.dto(manager, id);
    });
  }

  // → sent_back with the reason; the history event carries `comment`; audited as `action`.
  private async markSentBack(
    manager: EntityManager,
    actor: Actor,
    version: { id: string; clientId: string; number: number },
    reason: string,
    comment: string,
    action: 'profile.send-back' | 'profile.report-problem',
  ): Promise<void> {
    await updateCount(
      manager,
      `UPDATE profile_versions SET status = 'sent_back', sent_back_reason = $2, updated_at = now(),
         history = history || $3::jsonb WHERE id = $1`,
      [version.id, reason, historyEvent('sent_back', actor, comment)],
    );
    await this.audit.record(
      actor,
      action,
      { type: 'profile-version', id: version.id, clientId: version.clientId },
      // The reason and comment stay with the version (its history), not in the log.
      { status: 'sent_back', number: version.number },
      manager,
    );
  }

  /**
   * signed_off → active (a supervisor who neither created nor signed it off); the client's
   * previous active version → retired. The client row is locked, so of two approvals at once
   * exactly one wins and the other gets 409.
   */
  async approve(actor: Actor, id: string, input: ApproveInput): Promise<ProfileVersionDto> {
    const { clientId } = await this.readable(actor, id);
    if (actor.role !== 'supervisor') throw new ForbiddenException(ONLY_SUPERVISOR_MESSAGE);
    return this.dataSource.transaction(async (manager) => {
      await manager.query('SELECT 1 FROM clients WHERE id = $1 FOR UPDATE', [clientId]);
      const version = await this.locked(manager, id);
      if (version.status === 'active') throw new ConflictException(ALREADY_ACTIVE_MESSAGE);
      if (version.status !== 'signed_off') {
        throw new ConflictException(
          `Only a version signed off by a carer can be approved; this one is ${label(version.status)}.`,
        );
      }
      if (version.createdById === actor.id || version.signedOffById === actor.id) {
        throw new ForbiddenException(OWN_WORK_MESSAGE);
      }
      const previous = await manager
        .getRepository(ProfileVersion)
        .findOne({ where: { clientId, status: 'active' }, select: ['id', 'number'] });
      if (previous) {
        await updateCount(
          manager,
          `UPDATE profile_versions SET status = 'retired', updated_at = now(), history = history || $2::jsonb WHERE id = $1`,
          [previous.id, historyEvent('retired', actor, `Replaced by version ${version.number}.`)],
        );
        await this.audit.record(
          actor,
          'profile.retire',
          { type: 'profile-version', id: previous.id, clientId },
          { number: previous.number, replacedBy: id },
          manager,
        );
      }
      await updateCount(
        manager,
        `UPDATE profile_versions SET status = 'active', approved_by_id = $2, approved_at = now(),
           approval_comment = $3, updated_at = now(), history = history || $4::jsonb WHERE id = $1`,
        [id, actor.id, input.comment, historyEvent('active', actor, input.comment)],
      );
      await this.audit.record(
        actor,
        'profile.approve',
        { type: 'profile-version', id, clientId },
        {
          status: 'active',
          number: version.number,
          retired: previous?.id ?? null,
          retiredNumber: previous?.number ?? null,
        },
        manager,
      );
      return this.dto(manager, id);
    });
  }

  /** signed_off → sent_back (a supervisor, with a reason). */
  async sendBack(actor: Actor, id: string, input: SendBackInput): Promise<ProfileVersionDto> {
    const { clientId } = await this.readable(actor, id);
    if (actor.role !== 'supervisor') throw new ForbiddenException(ONLY_SUPERVISOR_MESSAGE);
    return this.dataSource.transaction(async (manager) => {
      const version = await this.locked(manager, id);
      if (version.status === 'sent_back') throw new ConflictException(ALREADY_SENT_BACK_MESSAGE);
      if (version.status !== 'signed_off') {
        throw new ConflictException(
          `Only a version signed off by a carer can be sent back; this one is ${label(version.status)}.`,
        );
      }
      await this.markSentBack(
        manager,
        actor,
        { id, clientId, number: version.number },
        input.reason,
        input.reason,
        'profile.send-back',
      );
      return this.dto(manager, id);
    });
  }

  /** The .klprofile file of a trained version (owning clinician or supervisor; carers 403). */
  async export(actor: Actor, id: string): Promise<ExportedProfile> {
    const { clientId } = await this.readable(actor, id);
    if (actor.role === 'carer') throw new ForbiddenException(CARER_EXPORT_MESSAGE);
    if (actor.role !== 'clinician' && actor.role !== 'supervisor')
      throw new ForbiddenException(WRONG_ROLE_MESSAGE);
    const version = await this.dataSource
      .getRepository(ProfileVersion)
      .createQueryBuilder('v')
      .addSelect('v.model')
      .addSelect('v.wordModel')
      .leftJoinAndSelect('v.client', 'client')
      .leftJoinAndSelect('v.approvedBy', 'approver')
      .where('v.id = :id', { id })
      .getOneOrFail();
    if (!WITH_MODEL.includes(version.status) || !version.model) throw new ConflictException(NO_MODEL_MESSAGE);
    const pseudonym = version.client?.pseudonym ?? 'client';
    const header = profileFileHeader(version, {
      exportedAt: new Date().toISOString(),
      exportedBy: actor.name,
    });
    const bytes = Buffer.from(
      writeProfileFile(
        header,
        new Uint8Array(version.model),
        await this.signing.signer(),
        version.wordModel ? new Uint8Array(version.wordModel) : null,
      ),
    );
    await this.audit.record(
      actor,
      'profile.export',
      { type: 'profile-version', id, clientId },
      { number: version.number, status: version.status, bytes: bytes.length },
    );
    return { fileName: `keyloom-${slug(pseudonym)}-v${version.number}${PROFILE_FILE_EXTENSION}`, bytes };
  }

  /**
   * Checks an uploaded .klprofile file: damage (layout, CRC, the model loads; 400 with what is wrong)
   * and, apart from it, whether this clinic's key signed it (`authenticity`); `valid` is both.
   */
  async verify(fileName: string | null, bytes: Buffer): Promise<ProfileFileReport> {
    let contents;
    try {
      contents = verifyProfileFile(new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength));
    } catch (error) {
      if (error instanceof ProfileFileError) throw new BadRequestException(error.message);
      throw error;
    }
    const authenticity = await this.signing.authenticity(contents.signature, contents.signedBytes);
    return {
      valid: authenticity === 'this-clinic',
      intact: true,
      authenticity,
      fileName,
      bytes: bytes.length,
      checksum: contents.checksum,
      modelBytes: contents.modelBytes,
      modelOrder: contents.modelOrder,
      modelContexts: contents.modelContexts,
      vocabularyWords: contents.vocabularyWords,
      header: contents.header,
    };
  }

  /** The version's client when the actor may read it; out of sight → 404 as for a made-up id. */
  async readable(actor: Actor, id: string): Promise<{ clientId: string }> {
    const clientId = await this.clientOf(id);
    try {
      await this.access.requireReadable(actor, clientId, 'clinical');
    } catch (error) {
      if (error instanceof NotFoundException) throw new NotFoundException(VERSION_NOT_FOUND_MESSAGE);
      throw error;
    }
    return { clientId };
  }

  // The version's client when the actor is its owning clinician.
  private async owned(actor: Actor, id: string): Promise<{ clientId: string }> {
    const clientId = await this.clientOf(id);
    try {
      await this.access.requireOwned(actor, clientId);
    } catch (error) {
      if (error instanceof NotFoundException) throw new NotFoundException(VERSION_NOT_FOUND_MESSAGE);
      throw error;
    }
    return { clientId };
  }

  private async clientOf(id: string): Promise<string> {
    const row = await this.dataSource
      .getRepository(ProfileVersion)
      .findOne({ where: { id }, select: ['id', 'clientId'] });
    if (!row) throw new NotFoundException(VERSION_NOT_FOUND_MESSAGE);
    return row.clientId;
  }

  private async locked(manager: EntityManager, id: string): Promise<ProfileVersion> {
    const version = await manager
      .getRepository(ProfileVersion)
      .findOne({ where: { id }, lock: { mode: 'pessimistic_write' } });
    if (!version) throw new NotFoundException(VERSION_NOT_FOUND_MESSAGE);
    return version;
  }

  private async dto(manager: EntityManager, id: string): Promise<ProfileVersionDto> {
    const version = await manager.getRepository(ProfileVersion).findOne({
      where: { id },
      relations: { createdBy: true, signedOffBy: true, approvedBy: true, retiredBy: true },
    });
    if (!version) throw new NotFoundException(VERSION_NOT_FOUND_MESSAGE);
    return toProfileVersionDto(version, this.config.trainingStaleMs);
  }
}

/**
 * The version that becomes active when `version` is retired: the client's most recently approved
 * version before it that was retired by an approval (never one retired by hand), or null.
 */
async function previousApproved(
  manager: EntityManager,
  version: ProfileVersion,
): Promise<{ id: string; number: number } | null> {
  const rows: { id: string; number: number }[] = await manager.query(
    `SELECT id, number FROM profile_versions
      WHERE client_id = $1 AND id <> $2 AND status = 'retired' AND retired_at IS NULL
        AND approved_at IS NOT NULL AND approved_at <= $3
      ORDER BY approved_at DESC, number DESC LIMIT 1`,
    [version.clientId, version.id, version.approvedAt ?? new Date()],
  );
  return rows[0] ?? null;
}

// Whether the version was tried at least once on the test keyboard (the trials table is the test keyboard's).
async function hasTrial(manager: EntityManager, versionId: string): Promise<boolean> {
  const rows: unknown[] = await manager.query('SELECT 1 FROM trials WHERE profile_version_id = $1 LIMIT 1', [
    versionId,
  ]);
  return rows.length > 0;
}
