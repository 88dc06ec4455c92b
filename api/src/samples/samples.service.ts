import {
  BadRequestException,
  ConflictException,
  Injectable,
  NotFoundException,
  type OnModuleInit,
  PayloadTooLargeException,
} from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import {
  applyRedaction,
  type DeleteSampleInput,
  type ExcludeSampleInput,
  type FlagDecisionInput,
  type PasteSampleInput,
  type SampleDetail,
  type SampleSummary,
  type UploadResult,
  type UploadSamplesFields,
  undoRedaction,
  trainedOnMessage,
} from '@keyloom/shared';
import { createHash } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../auth/session-user';
import { ClientAccessService } from '../clients/client-access.service';
import { AppConfig } from '../config/app-config';
import { clientRowsHook, type WithdrawalHook, WithdrawalHooks } from '../consents/withdrawal-hooks';
import { LexiconService } from './lexicon.service';
import { SampleFlag } from './sample-flag.entity';
import {
  countKinds,
  type IncomingFile,
  insertSample,
  type PreparedSample,
  prepareFile,
  preparePaste,
  SampleInputError,
  type SampleMeta,
  sampleStatistics,
  sizeLabel,
} from './sample-ingest';
import { Sample } from './sample.entity';
import { toSampleDetail, toSampleSummary } from './sample.mapper';

export const SAMPLE_NOT_FOUND_MESSAGE = 'There is no sample with that id.';
export const FLAG_NOT_FOUND_MESSAGE = 'There is no flag with that id on this sample.';
export const FLAG_ALREADY_DECIDED_MESSAGE = 'This flag was already decided.';
export const NO_FILES_MESSAGE = 'Choose at least one .txt, .md or .csv file.';
export const NOT_EXCLUDED_MESSAGE = 'This sample is not left out; there is nothing to include again.';
export const NOT_REDACTED_MESSAGE = 'This flag is not redacted; there is nothing to undo.';
export const ORIGINAL_GONE_MESSAGE =
  'A version was trained on this sample after the redaction, so the original text is gone; the redaction stays.';
export const EXCLUDED_FLAGS_MESSAGE = 'This sample is left out; include it again before changing its flags.';


// Versions that froze the sample, by number: `trained` = every one except drafts that never started training.
const VERSIONS_WITH_SAMPLE = `
  SELECT id, number, (status <> 'draft' OR history @> '[{"status": "training"}]'::jsonb) AS trained
    FROM profile_versions
   WHERE samples @> jsonb_build_array(jsonb_build_object('id', $1::text))
   ORDER BY number
     FOR UPDATE`;

@Injectable()
export class SamplesService implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly access: ClientAccessService,
    private readonly audit: AuditService,
    private readonly lexicon: LexiconService,
    private readonly config: AppConfig,
    private readonly withdrawalHooks: WithdrawalHooks,
  ) {}

  onModuleInit(): void {
    // Samples and their flags exist only under a training consent.
    this.withdrawalHooks.register(
      'samples',
      clientRowsHook({
        entity: Sample,
        scope: 'training',
        audit: this.audit,
        action: 'sample.delete',
        idsKey: 'sampleIds',
      }),
    );
    this.withdrawalHooks.register('sampleFlags', sampleFlagsWithdrawalHook);
  }

  private readonly isKnownWord = (word: string) => this.lexicon.has(word);

  /** Multipart upload: every file checked first, then all stored in one transaction (or none). */
  async upload(
    actor: Actor,
    clientId: string,
    files: IncomingFile[],
    fields: UploadSamplesFields,
  ): Promise<UploadResult> {
    await this.access.requireOwned(actor, clientId);
    await this.access.requireTrainingConsent(clientId);
    if (files.length === 0) throw new BadRequestException(NO_FILES_MESSAGE);
    const prepared: PreparedSample[] = [];
    const issues: { path: string; message: string }[] = [];
    files.forEach((file, index) => {
      try {
        prepared.push(prepareFile(file, fields.csvColumn, this.isKnownWord));
      } catch (error) {
        if (!(error instanceof SampleInputError)) throw error;
        issues.push({ path: `files.${index}`, message: `${file.originalname}: ${error.message}` });
      }
    });
    if (issues.length > 0) {
      const message =
        issues.length === 1
          ? `${issues[0].message} Nothing was stored.`
          : `${issues.length} files could not be taken; nothing was stored. ${issues[0].message}`;
      throw new BadRequestException({ message, issues });
    }
    return this.store(actor, clientId, fields, prepared, 'sample.upload');
  }

  /** Pasted text: one sample. */
  async paste(actor: Actor, clientId: string, input: PasteSampleInput): Promise<UploadResult> {
    await this.access.requireOwned(actor, clientId);
    await this.access.requireTrainingConsent(clientId);
    const prepared = preparePaste(input.title, input.text, this.isKnownWord);
    return this.store(actor, clientId, input, [prepared], 'sample.paste');
  }

  private async store(
    actor: Actor,
    clientId: string,
    meta: SampleMeta,
    prepared: PreparedSample[],
    action: 'sample.upload' | 'sample.paste',
  ): Promise<UploadResult> {
    return this.dataSource.transaction(async (manager) => {
      // Consent re-checked inside the transaction, so a withdrawal cannot slip in between.
      await this.access.requireTrainingConsent(clientId, manager);
      const { maxClientBytes } = this.config.sampleLimits;
      // One upload per client at a time: the size check and the duplicate check see every stored byte.
      await manager.query('SELECT 1 FROM clients WHERE id = $1 FOR UPDATE', [clientId]);
      const storedBytes = await this.storedBytes(manager, clientId);
      const result: UploadResult = { samples: [], duplicates: [] };
      const seen = new Map<string, string>();
      const existing = await manager
        .getRepository(Sample)
        .find({ where: prepared.map((p) => ({ clientId, sha256: p.sha256 })), select: ['id', 'sha256'] });
      for (const row of existing) seen.set(row.sha256, row.id);
      const fresh = prepared.filter(
        (p, i) => !seen.has(p.sha256) && prepared.findIndex((q) => q.sha256 === p.sha256) === i,
      );
      const newBytes = fresh.reduce((sum, p) => sum + p.byteSize, 0);
      if (storedBytes + newBytes > maxClientBytes) {
        throw new PayloadTooLargeException(
          `This upload would take the client's samples over the ${sizeLabel(maxClientBytes)} limit ` +
            `(${sizeLabel(storedBytes)} stored, ${sizeLabel(newBytes)} new). Nothing was stored; ` +
            'upload fewer or smaller files.',
        );
      }
      for (const p of prepared) {
        const name = p.fileName ?? p.title;
        const existingId = seen.get(p.sha256);
        if (existingId) {
          result.duplicates.push({
            fileName: name,
            existingSampleId: existingId,
            message: `"${name}" was uploaded before (same bytes); it was not stored again.`,
          });
          await this.audit.record(
            actor,
            'sample.duplicate-refused',
            { type: 'sample', id: existingId, clientId },
            { sha256: p.sha256, byteSize: p.byteSize },
            manager,
          );
          continue;
        }
        const sample = await insertSample(manager, clientId, actor.id, meta, p);
        seen.set(p.sha256, sample.id);
        await this.audit.record(
          actor,
          action,
          { type: 'sample', id: sample.id, clientId },
          {
            // The file name or title may name people: the log keeps the hash and sizes only.
            sha256: p.sha256,
            byteSize: p.byteSize,
            encoding: p.encoding,
            words: p.statistics.words,
            flags: countKinds(p.matches),
          },
          manager,
        );
        result.samples.push(toSampleSummary(sample, p.matches.length, actor.name));
      }
      return result;
    });
  }

  private async storedBytes(manager: EntityManager, clientId: string): Promise<number> {
    const row = await manager
      .getRepository(Sample)
      .createQueryBuilder('s')
      .select('COALESCE(SUM(s.byteSize), 0)', 'total')
      .where('s.clientId = :clientId', { clientId })
      .getRawOne<{ total: string }>();
    return Number(row?.total ?? 0);
  }

  /** The client's samples, newest first. */
  async list(actor: Actor, clientId: string): Promise<SampleSummary[]> {
    await this.access.requireReadable(actor, clientId, 'samples');
    const rows = await this.dataSource
      .getRepository(Sample)
      .createQueryBuilder('s')
      .leftJoinAndSelect('s.uploadedBy', 'u')
      .loadRelationCountAndMap('s.openFlagCount', 's.flags', 'f', (qb) => qb.where(`f.status = 'open'`))
      .where('s.clientId = :clientId', { clientId })
      .orderBy('s.createdAt', 'DESC')
      .addOrderBy('s.title', 'ASC')
      .getMany();
    return rows.map((s) =>
      toSampleSummary(s, (s as Sample & { openFlagCount?: number }).openFlagCount ?? 0, s.uploadedBy?.name),
    );
  }

  /** One sample with text, statistics and flags. */
  async findOne(actor: Actor, sampleId: string): Promise<SampleDetail> {
    const sample = await this.readable(actor, sampleId, 'read');
    return this.detail(this.dataSource.manager, sample.id);
  }

  /** Redact or keep one open flag. */
  async decideFlag(
    actor: Actor,
    sampleId: string,
    flagId: string,
    input: FlagDecisionInput,
  ): Promise<SampleDetail> {
    await this.readable(actor, sampleId, 'write');
    return this.dataSource.transaction(async (manager) => {
      const { sample, flag, stillOpen } = await decideSampleFlag(
        manager,
        sampleId,
        flagId,
        input,
        actor.id,
        this.isKnownWord,
      );
      await this.audit.record(
        actor,
        input.action === 'redact' ? 'sample.flag-redact' : 'sample.flag-keep',
        { type: 'sample', id: sample.id, clientId: sample.clientId },
        { flagId, kind: flag.kind, openFlags: stillOpen },
        manager,
      );
      return this.detail(manager, sample.id);
    });
  }

  /** Leaves a sample out for good (kept for the record, never used for training). */
  async exclude(actor: Actor, sampleId: string, input: ExcludeSampleInput): Promise<SampleSummary> {
    await this.readable(actor, sampleId, 'write');
    return this.dataSource.transaction(async (manager) => {
      const repo = manager.getRepository(Sample);
      const sample = await repo.findOne({ where: { id: sampleId }, lock: { mode: 'pessimistic_write' } });
      if (!sample) throw new NotFoundException(SAMPLE_NOT_FOUND_MESSAGE);
      if (sample.status === 'excluded') throw new ConflictException('This sample is already excluded.');
      sample.status = 'excluded';
      sample.excludedReason = input.reason;
      await repo.save(sample);
      await this.audit.record(
        actor,
        'sample.exclude',
        { type: 'sample', id: sample.id, clientId: sample.clientId },
        {},
        manager,
      );
      const detail = await this.detail(manager, sample.id);
      return toSampleSummary(sample, detail.openFlags, detail.uploadedBy);
    });
  }

  /** Takes a sample left out back in: ready, or needs review while flags are open. */
  async include(actor: Actor, sampleId: string): Promise<SampleSummary> {
    await this.readable(actor, sampleId, 'write');
    return this.dataSource.transaction(async (manager) => {
      const repo = manager.getRepository(Sample);
      const sample = await repo.findOne({ where: { id: sampleId }, lock: { mode: 'pessimistic_write' } });
      if (!sample) throw new NotFoundException(SAMPLE_NOT_FOUND_MESSAGE);
      if (sample.status !== 'excluded') throw new ConflictException(NOT_EXCLUDED_MESSAGE);
      const openFlags = await manager.getRepository(SampleFlag).countBy({ sampleId, status: 'open' });
      sample.status = openFlags > 0 ? 'needs_review' : 'ready';
      sample.excludedReason = null;
      await repo.save(sample);
      await this.audit.record(
        actor,
        'sample.include',
        { type: 'sample', id: sample.id, clientId: sample.clientId },
        { openFlags },
        manager,
      );
      const detail = await this.detail(manager, sample.id);
      return toSampleSummary(sample, detail.openFlags, detail.uploadedBy);
    });
  }

  /**
   * Deletes a sample (its text and flags) while no version has trained on it: 409 naming the versions
   * once one has. Drafts that never trained lose their frozen copy of it. The audit keeps ids, sizes
   * and a hash of the reason only (the audit rule strips free text).
   */
  async remove(actor: Actor, sampleId: string, input: DeleteSampleInput): Promise<void> {
    await this.readable(actor, sampleId, 'write');
    await this.dataSource.transaction(async (manager) => {
      const repo = manager.getRepository(Sample);
      const sample = await repo.findOne({ where: { id: sampleId }, lock: { mode: 'pessimistic_write' } });
      if (!sample) throw new NotFoundException(SAMPLE_NOT_FOUND_MESSAGE);
      const versions = await manager.query<{ id: string; number: number; trained: boolean }[]>(
        VERSIONS_WITH_SAMPLE,
        [sampleId],
      );
      const trained = versions.filter((v) => v.trained).map((v) => v.number);
      if (trained.length > 0) throw new ConflictException(trainedOnMessage(trained));
      const drafts = versions.map((v) => v.id);
      if (drafts.length > 0) {
        await manager.query(
          `UPDATE profile_versions
              SET samples = (SELECT COALESCE(jsonb_agg(s), '[]'::jsonb) FROM jsonb_array_elements(samples) AS s
                              WHERE s->>'id' <> $2),
                  updated_at = now()
            WHERE id = ANY($1::uuid[])`,
          [drafts, sampleId],
        );
      }
      const flags = await manager.getRepository(SampleFlag).countBy({ sampleId });
      await repo.delete({ id: sampleId });
      await this.audit.record(
        actor,
        'sample.remove',
        { type: 'sample', id: sampleId, clientId: sample.clientId },
        {
          reasonSha256: createHash('sha256').update(input.reason).digest('hex'),
          sha256: sample.sha256,
          byteSize: sample.byteSize,
          flags,
          draftIds: drafts,
        },
        manager,
      );
    });
  }

  /** Undoes a redaction while its original text is kept (until a version trains on the sample). */
  async undoFlagRedaction(actor: Actor, sampleId: string, flagId: string): Promise<SampleDetail> {
    await this.readable(actor, sampleId, 'write');
    return this.dataSource.transaction(async (manager) => {
      const samples = manager.getRepository(Sample);
      const sample = await samples.findOne({ where: { id: sampleId }, lock: { mode: 'pessimistic_write' } });
      if (!sample) throw new NotFoundException(SAMPLE_NOT_FOUND_MESSAGE);
      const flagsRepo = manager.getRepository(SampleFlag);
      const flags = await flagsRepo.find({ where: { sampleId }, order: { start: 'ASC' } });
      const flag = flags.find((f) => f.id === flagId);
      if (!flag) throw new NotFoundException(FLAG_NOT_FOUND_MESSAGE);
      if (sample.status === 'excluded') throw new ConflictException(EXCLUDED_FLAGS_MESSAGE);
      if (flag.status !== 'redacted') throw new ConflictException(NOT_REDACTED_MESSAGE);
      const kept = await flagsRepo.findOne({ where: { id: flagId }, select: ['id', 'originalText'] });
      const original = kept?.originalText ?? null;
      if (original === null) throw new ConflictException(ORIGINAL_GONE_MESSAGE);
      const { text, redacted: restored } = undoRedaction(sample.text, flags, flagId, original);
      await flagsRepo.update(
        { id: flagId },
        {
          end: restored.end,
          status: 'open',
          text: original,
          originalText: null,
          reason: null,
          decidedById: null,
          decidedAt: null,
        },
      );
      await shiftLaterFlags(manager, sampleId, flagId, flag.end, restored.end - flag.end);
      Object.assign(sample, statisticsColumns(text, this.isKnownWord), { text, status: 'needs_review' });
      await samples.save(sample);
      await this.audit.record(
        actor,
        'sample.flag-undo-redact',
        { type: 'sample', id: sample.id, clientId: sample.clientId },
        { flagId, kind: flag.kind },
        manager,
      );
      return this.detail(manager, sample.id);
    });
  }

  // The sample when the actor may read it (or, for 'write', change it); out of sight → 404 as for a made-up id.
  private async readable(actor: Actor, sampleId: string, mode: 'read' | 'write'): Promise<Sample> {
    const sample = await this.dataSource
      .getRepository(Sample)
      .findOne({ where: { id: sampleId }, select: ['id', 'clientId'] });
    if (!sample) throw new NotFoundException(SAMPLE_NOT_FOUND_MESSAGE);
    try {
      if (mode === 'read') await this.access.requireReadable(actor, sample.clientId, 'samples');
      else await this.access.requireOwned(actor, sample.clientId);
    } catch (error) {
      if (error instanceof NotFoundException) throw new NotFoundException(SAMPLE_NOT_FOUND_MESSAGE);
      throw error;
    }
    return sample;
  }

  private async detail(manager: EntityManager, sampleId: string): Promise<SampleDetail> {
    const sample = await manager
      .getRepository(Sample)
      .findOneOrFail({ where: { id: sampleId }, relations: { uploadedBy: true } });
    const flags = await manager
      .getRepository(SampleFlag)
      .find({ where: { sampleId }, relations: { decidedBy: true }, order: { start: 'ASC' } });
    return toSampleDetail(sample, flags);
  }
}

/** The 'samples' withdrawal hook: deletes the client's samples (their flags go by cascade); returns the count. */
const CLIENT_FLAGS = `FROM sample_flags WHERE sample_id IN (SELECT id FROM language_samples WHERE client_id = $1)`;

/** The 'sampleFlags' withdrawal hook: the flags of the client's samples (they hold found text). */
export const sampleFlagsWithdrawalHook: WithdrawalHook = {
  scope: 'training',
  count: async (clientId, manager) => {
    const rows = await manager.query<{ n: number }[]>(`SELECT count(*)::int AS n ${CLIENT_FLAGS}`, [
      clientId,
    ]);
    return rows[0]?.n ?? 0;
  },
  remove: async (clientId, manager) => {
    await manager.query(`DELETE ${CLIENT_FLAGS}`, [clientId]);
  },
};

/**
 * Redacts or keeps one open flag (inside the caller's transaction; the sample row is locked).
 * Redaction replaces the span with the placeholder token, moves later flags, clears the flag's text
 * and recounts the statistics. 404 for an unknown sample or flag, 409 when already decided or excluded.
 */
export async function decideSampleFlag(
  manager: EntityManager,
  sampleId: string,
  flagId: string,
  input: FlagDecisionInput,
  actorId: string | null,
  isKnownWord: (word: string) => boolean,
): Promise<{ sample: Sample; flag: SampleFlag; stillOpen: number }> {
  const samples = manager.getRepository(Sample);
  const sample = await samples.findOne({ where: { id: sampleId }, lock: { mode: 'pessimistic_write' } });
  if (!sample) throw new NotFoundException(SAMPLE_NOT_FOUND_MESSAGE);
  if (sample.status === 'excluded') {
    throw new ConflictException('This sample was excluded; its flags can no longer be decided.');
  }
  const flagsRepo = manager.getRepository(SampleFlag);
  const flags = await flagsRepo.find({ where: { sampleId }, order: { start: 'ASC' } });
  const flag = flags.find((f) => f.id === flagId);
  if (!flag) throw new NotFoundException(FLAG_NOT_FOUND_MESSAGE);
  if (flag.status !== 'open') throw new ConflictException(FLAG_ALREADY_DECIDED_MESSAGE);
  const decided = { reason: input.reason ?? null, decidedById: actorId, decidedAt: new Date() };
  if (input.action === 'redact') {
    const { text, redacted } = applyRedaction(sample.text, flags, flagId);
    await flagsRepo.update(
      { id: flagId },
      {
        start: redacted.start,
        end: redacted.end,
        status: 'redacted',
        text: null,
        // Kept for an undo until a version trains on the sample (see the sample-corrections migration).
        originalText: sample.text.slice(flag.start, flag.end),
        ...decided,
      },
    );
    await shiftLaterFlags(manager, sampleId, flagId, flag.end, redacted.end - flag.end);
    Object.assign(sample, statisticsColumns(text, isKnownWord), { text });
  } else {
    await flagsRepo.update({ id: flagId }, { status: 'kept', ...decided });
  }
  const stillOpen = flags.filter((f) => f.status === 'open' && f.id !== flagId).length;
  sample.status = stillOpen > 0 ? 'needs_review' : 'ready';
  await samples.save(sample);
  return { sample, flag, stillOpen };
}

/**
 * Later flags move by the change in length: one statement, however many flags the sample has (the
 * same shift applyRedaction and undoRedaction apply to their copy).
 */
async function shiftLaterFlags(
  manager: EntityManager,
  sampleId: string,
  flagId: string,
  after: number,
  shift: number,
): Promise<void> {
  if (shift === 0) return;
  await manager
    .getRepository(SampleFlag)
    .createQueryBuilder()
    .update()
    .set({ start: () => `start_offset + ${shift}`, end: () => `end_offset + ${shift}` })
    .where('sample_id = :sampleId AND start_offset >= :after AND id <> :flagId', { sampleId, after, flagId })
    .execute();
}

/** The statistics columns of a sample for `text`. */
function statisticsColumns(text: string, isKnownWord: (word: string) => boolean) {
  const stats = sampleStatistics(text, isKnownWord);
  return {
    characters: stats.characters,
    words: stats.words,
    distinctWords: stats.distinctWords,
    topWords: stats.topWords,
    unknownWords: stats.unknownWords,
  };
}
