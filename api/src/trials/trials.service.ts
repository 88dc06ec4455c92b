import {
  BadRequestException,
  ConflictException,
  ForbiddenException,
  Injectable,
  NotFoundException,
  type OnModuleInit,
} from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import {
  type CreateTrialBody,
  type ProfileVersionStatus,
  profileVersionStatusLabels,
  type Trial as TrialShape,
} from '@keyloom/shared';
import type { DataSource } from 'typeorm';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../auth/session-user';
import { clientRowsHook, WithdrawalHooks } from '../consents/withdrawal-hooks';
import { isUniqueViolation } from '../database/database-errors';
import { ProfileVersion } from '../profile-versions/profile-version.entity';
import {
  ProfileVersionsService,
  VERSION_NOT_FOUND_MESSAGE,
} from '../profile-versions/profile-versions.service';
import { MODEL_NOT_READY_MESSAGE } from './model-download.service';
import { checkAndMeasureTrial, simulatedFigures, TrialCheckError } from './trial-check';
import { Trial } from './trial.entity';
import { toTrialDto } from './trial.mapper';

export const ONLY_TRIERS_MESSAGE = 'Only the client’s clinician or an assigned carer records trials.';
export const TRIAL_ID_OTHER_VERSION_MESSAGE =
  'This trial id was already used for another version. Start a new trial to try this one.';

/** Statuses in which a version can be tried on the test keyboard. */
const TRIABLE: readonly ProfileVersionStatus[] = ['trained', 'signed_off', 'active'];

/** What POST answers: the trial, and whether it was stored now (201) or already (200). */
export type TrialUpload = { created: boolean; trial: TrialShape };

@Injectable()
export class TrialsService implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly versions: ProfileVersionsService,
    private readonly audit: AuditService,
    private readonly withdrawalHooks: WithdrawalHooks,
  ) {}

  onModuleInit(): void {
    // Trials are runs of the client's profile versions (and may carry typed text): they go with the
    // training consent, counted under their own name even when their version's deletion takes them.
    this.withdrawalHooks.register(
      'trials',
      clientRowsHook({
        entity: Trial,
        scope: 'training',
        audit: this.audit,
        action: 'trial.delete',
        idsKey: 'trialIds',
      }),
    );
  }

  /** The version's trials, newest first (readers of the version). */
  async list(actor: Actor, versionId: string): Promise<TrialShape[]> {
    await this.versions.readable(actor, versionId);
    const version = await this.version(versionId);
    const rows = await this.dataSource.getRepository(Trial).find({
      where: { profileVersionId: versionId },
      order: { createdAt: 'DESC', startedAt: 'DESC', id: 'DESC' },
    });
    return rows.map((row) => toTrialDto(row, version.number));
  }

  /**
   * Stores a finished trial (owning clinician or assigned carer) after replaying its log; the measures
   * are computed here. The same localTrialId again → the stored trial (created false), also when two
   * uploads race; on another version → 409.
   */
  async create(actor: Actor, versionId: string, body: CreateTrialBody): Promise<TrialUpload> {
    const { clientId } = await this.versions.readable(actor, versionId);
    if (actor.role !== 'clinician' && actor.role !== 'carer')
      throw new ForbiddenException(ONLY_TRIERS_MESSAGE);
    const stored = await this.stored(body.localTrialId, versionId);
    if (stored) return { created: false, trial: stored };
    let measures;
    try {
      measures = checkAndMeasureTrial(body);
    } catch (error) {
      if (error instanceof TrialCheckError) throw new BadRequestException(error.message);
      throw error;
    }
    const version = await this.version(versionId);
    if (version.modelSize === null) throw new ConflictException(MODEL_NOT_READY_MESSAGE);
    if (!TRIABLE.includes(version.status)) {
      throw new ConflictException(
        `Only a version that is ready for trial, signed off or active can be tried; this one is ${profileVersionStatusLabels[version.status].toLowerCase()}.`,
      );
    }
    try {
      const trial = await this.dataSource.transaction(async (manager) => {
        const repo = manager.getRepository(Trial);
        const saved = await repo.save(
          repo.create({
            localTrialId: body.localTrialId,
            profileVersionId: versionId,
            clientId,
            userId: actor.id,
            userName: actor.name,
            userRole: actor.role,
            startedAt: new Date(body.startedAt),
            finishedAt: new Date(body.finishedAt),
            phraseId: body.phraseId,
            targetPhrase: body.targetPhrase,
            text: body.text,
            settings: body.settings,
            events: body.events,
            measures,
            simulated: simulatedFigures(version.metrics, body.settings.slots),
            note: body.note,
          }),
        );
        await this.audit.record(
          actor,
          'trial.create',
          { type: 'trial', id: saved.id, clientId },
          {
            versionId,
            localTrialId: body.localTrialId,
            characters: measures.characters,
            keystrokes: measures.keystrokes,
            keystrokeSavings: measures.keystrokeSavings,
            selectionMode: body.settings.selectionMode,
          },
          manager,
        );
        return repo.findOneByOrFail({ id: saved.id });
      });
      return { created: true, trial: toTrialDto(trial, version.number) };
    } catch (error) {
      // Two uploads of one trial at once: the other one stored it first.
      if (!isUniqueViolation(error)) throw error;
      const again = await this.stored(body.localTrialId, versionId);
      if (!again) throw error;
      return { created: false, trial: again };
    }
  }

  // The trial stored under this browser-made id, or null; 409 when it belongs to another version.
  private async stored(localTrialId: string, versionId: string): Promise<TrialShape | null> {
    const row = await this.dataSource.getRepository(Trial).findOneBy({ localTrialId });
    if (!row) return null;
    if (row.profileVersionId !== versionId) throw new ConflictException(TRIAL_ID_OTHER_VERSION_MESSAGE);
    return toTrialDto(row, (await this.version(versionId)).number);
  }

  private async version(id: string): Promise<ProfileVersion> {
    const version = await this.dataSource.getRepository(ProfileVersion).findOne({
      where: { id },
      select: ['id', 'number', 'status', 'modelSize', 'metrics'],
    });
    if (!version) throw new NotFoundException(VERSION_NOT_FOUND_MESSAGE);
    return version;
  }
}
