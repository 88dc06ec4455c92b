import {
  BadRequestException,
  ConflictException,
  Injectable,
  Logger,
  NotFoundException,
  type OnModuleInit,
} from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import {
  type CreateSummaryInput,
  type Summary as SummaryDto,
  type SummaryPreview,
  type SummaryPreviewRequest,
  summaryStatusOf,
} from '@keyloom/shared';
import { randomBytes, randomUUID } from 'node:crypto';
import { DataSource, type EntityManager, In } from 'typeorm';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../auth/session-user';
import { ClientAccessService } from '../clients/client-access.service';
import { coversScope, todayIso } from '../consents/consent-status';
import { Consent } from '../consents/consent.entity';
import { WithdrawalHooks } from '../consents/withdrawal-hooks';
import { FamilyContact } from '../contacts/family-contact.entity';
import { stopAddress } from '../contacts/summary-stop';
import { isUniqueViolation } from '../database/database-errors';
import { type FinishIdempotent, IdempotencyService } from '../idempotency/idempotency.service';
import { JobQueueService } from '../jobs/job-queue.service';
import { ProfileVersion } from '../profile-versions/profile-version.entity';
import { SUMMARY_MAIL_QUEUE } from './summary-delivery';
import { summaryCharts } from './summary-message';
import { summaryEmailsWithdrawalHook } from './summary-withdrawal';
import { SummaryRecipient } from './summary-recipient.entity';
import {
  figuresFromMetrics,
  summarySubject,
  summaryText,
  type TrialFigures,
  type VersionFigures,
} from './summary-text';
import { Summary } from './summary.entity';

export const SUMMARY_NOT_FOUND_MESSAGE = 'There is no summary with that id in your caseload.';
export const NO_SUMMARY_CONSENT_MESSAGE =
  'The client has no consent in force that covers progress summaries. Record one before sending.';
export const NO_RECIPIENTS_LEFT_MESSAGE =
  'None of the recipients may receive summaries any more (consent changed or they stopped them).';
export const ROUND_PENDING_MESSAGE =
  'The last sending of this summary is still going out. Wait until every e-mail is sent or failed, then send again.';
export const CLINIC_NAME = 'Willowmere Community Communication Clinic';

// Versions a summary may report: trained at least (draft, training and failed versions have no metrics).
const REPORTABLE = ['trained', 'signed_off', 'active', 'retired', 'sent_back'] as const;

const iso = (date: Date | null): string | null => (date ? date.toISOString() : null);

@Injectable()
export class SummariesService implements OnModuleInit {
  private readonly logger = new Logger('Summaries');

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly access: ClientAccessService,
    private readonly audit: AuditService,
    private readonly jobs: JobQueueService,
    private readonly withdrawalHooks: WithdrawalHooks,
    private readonly idempotency: IdempotencyService,
  ) {}

  onModuleInit(): void {
    this.withdrawalHooks.register('summaryEmails', summaryEmailsWithdrawalHook(this.audit));
  }

  /** The client's summaries, newest first (owning clinician, supervisor). */
  async list(actor: Actor, clientId: string): Promise<SummaryDto[]> {
    await this.access.requireReadable(actor, clientId, 'contacts');
    const rows = await this.dataSource
      .getRepository(Summary)
      .find({ where: { clientId }, order: { createdAt: 'DESC' } });
    return Promise.all(rows.map((row) => this.toDto(row)));
  }

  /** One summary with the state of every e-mail (owning clinician, supervisor). */
  async get(actor: Actor, id: string): Promise<SummaryDto> {
    const summary = await this.dataSource.getRepository(Summary).findOneBy({ id });
    if (!summary) throw new NotFoundException(SUMMARY_NOT_FOUND_MESSAGE);
    try {
      await this.access.requireReadable(actor, summary.clientId, 'contacts');
    } catch (error) {
      if (error instanceof NotFoundException) throw new NotFoundException(SUMMARY_NOT_FOUND_MESSAGE);
      throw error;
    }
    return this.toDto(summary);
  }

  /**
   * Composes, stores and queues a summary (owning clinician). Refuses contacts who did not consent or
   * stopped summaries (400), and sending without a summaries consent of the client (409).
   */
  async create(
    actor: Actor,
    clientId: string,
    input: CreateSummaryInput,
    idempotencyKey?: string,
  ): Promise<SummaryDto> {
    return this.idempotency.once(
      actor.id,
      idempotencyKey,
      { route: `POST /clients/${clientId}/summaries`, body: input },
      (finish) => this.createOnce(actor, clientId, input, finish),
      (summaryId) => this.get(actor, summaryId),
    );
  }

  private async createOnce(
    actor: Actor,
    clientId: string,
    input: CreateSummaryInput,
    finish: FinishIdempotent,
  ): Promise<SummaryDto> {
    const { summary, recipients } = await this.dataSource.transaction(async (manager) => {
      const client = await this.access.requireOwned(actor, clientId, manager);
      await this.requireSummaryConsent(manager, clientId);
      const contacts = await this.allowedContacts(manager, clientId, input.contactIds);
      const content = await this.compose(manager, client.pseudonym, clientId, input);
      const saved = await manager.getRepository(Summary).save(
        manager.getRepository(Summary).create({
          clientId,
          periodFrom: input.from,
          periodTo: input.to,
          versionIds: content.versionIds,
          note: input.note,
          subject: content.subject,
          text: content.text,
          figures: content.figures,
          createdById: actor.id,
        }),
      );
      const rows = await this.queueRecipients(manager, saved.id, contacts, 1);
      await this.audit.record(
        actor,
        'summary.create',
        { type: 'summary', id: saved.id, clientId },
        { versions: content.versionIds.length, recipients: rows.length },
        manager,
      );
      await finish(manager, saved.id);
      return { summary: saved, recipients: rows };
    });
    await this.sendJobs(recipients);
    return this.toDto(summary);
  }

  /** What the e-mail would say and show, without storing or sending anything (owning clinician). */
  async preview(actor: Actor, clientId: string, input: SummaryPreviewRequest): Promise<SummaryPreview> {
    return this.dataSource.transaction(async (manager) => {
      const client = await this.access.requireOwned(actor, clientId, manager);
      const content = await this.compose(manager, client.pseudonym, clientId, input);
      return {
        subject: content.subject,
        text: content.text,
        versionIds: content.versionIds,
        charts: summaryCharts(content.figures).map((c) => ({
          name: c.name,
          alt: c.alt,
          pngBase64: c.png.toString('base64'),
          width: c.width,
          height: c.height,
        })),
      };
    });
  }

  /** Subject, text and figures from the versions' stored metrics (the same for preview and send). */
  private async compose(
    manager: EntityManager,
    clientName: string,
    clientId: string,
    input: SummaryPreviewRequest,
  ): Promise<{ subject: string; text: string; figures: VersionFigures[]; versionIds: string[] }> {
    const versions = await this.versionsFor(manager, clientId, input);
    const trials = await this.trialFigures(
      manager,
      versions.map((v) => v.id),
      input,
    );
    const figures = versions.map((v) => ({
      ...figuresFromMetrics(
        {
          number: v.number,
          status: v.status,
          date: (v.approvedAt ?? v.trainedAt)?.toISOString().slice(0, 10) ?? null,
          slots: v.settings.slots,
        },
        v.metrics,
      ),
      trials: trials.get(v.id) ?? null,
      carerComment:
        v.signOffComment && v.signedOffBy ? { by: v.signedOffBy.name, text: v.signOffComment } : null,
    }));
    const period = { clientName, from: input.from, to: input.to };
    return {
      subject: summarySubject(period),
      text: summaryText({ ...period, clinicName: CLINIC_NAME, versions: figures, note: input.note }),
      figures,
      versionIds: versions.map((v) => v.id),
    };
  }

  /**
   * Per version, the trials finished in the period: their number and the means of the measured
   * keystroke savings and words a minute (`trials.measures`, jsonb; a null measure is left out of
   * its mean). Read with SQL: the trials table belongs to the test keyboard's module.
   */
  private async trialFigures(
    manager: EntityManager,
    versionIds: string[],
    period: { from: string; to: string },
  ): Promise<Map<string, TrialFigures>> {
    const figures = new Map<string, TrialFigures>();
    if (versionIds.length === 0) return figures;
    const rows = await manager.query<
      { version_id: string; count: number; keystroke_savings: number | null; wpm: number | null }[]
    >(
      `SELECT profile_version_id AS version_id, count(*)::int AS count,
              avg((measures->>'keystrokeSavings')::float8) AS keystroke_savings,
              avg((measures->>'wpm')::float8) AS wpm
         FROM trials
        WHERE profile_version_id = ANY($1::uuid[]) AND finished_at::date BETWEEN $2::date AND $3::date
        GROUP BY profile_version_id`,
      [versionIds, period.from, period.to],
    );
    for (const row of rows) {
      figures.set(row.version_id, {
        count: row.count,
        keystrokeSavings: row.keystroke_savings,
        wpm: row.wpm,
      });
    }
    return figures;
  }

  /**
   * Sends the same content again, as a new round, to the original contacts who may still receive it.
   * One round at a time: the summary row is locked, and while an e-mail of an earlier round is still
   * queued the answer is 409 (so a double click, or twenty, adds one round).
   */
  async resend(actor: Actor, id: string, idempotencyKey?: string): Promise<SummaryDto> {
    return this.idempotency.once(
      actor.id,
      idempotencyKey,
      { route: `POST /summaries/${id}/resend`, body: null },
      (finish) => this.resendOnce(actor, id, finish),
      (summaryId) => this.get(actor, summaryId),
    );
  }

  private async resendOnce(actor: Actor, id: string, finish: FinishIdempotent): Promise<SummaryDto> {
    let queued: { summary: Summary; recipients: SummaryRecipient[] };
    try {
      queued = await this.dataSource.transaction(async (manager) => {
        // SELECT … FOR UPDATE on the summary: concurrent resends of it run one after the other, and
        // each reads the rounds the one before committed.
        const summary = await manager
          .getRepository(Summary)
          .findOne({ where: { id }, lock: { mode: 'pessimistic_write' } });
        if (!summary) throw new NotFoundException(SUMMARY_NOT_FOUND_MESSAGE);
        try {
          await this.access.requireOwned(actor, summary.clientId, manager);
        } catch (error) {
          if (error instanceof NotFoundException) throw new NotFoundException(SUMMARY_NOT_FOUND_MESSAGE);
          throw error;
        }
        await this.requireSummaryConsent(manager, summary.clientId);
        const previous = await manager.getRepository(SummaryRecipient).find({ where: { summaryId: id } });
        if (previous.some((r) => r.status === 'queued')) throw new ConflictException(ROUND_PENDING_MESSAGE);
        const round = Math.max(0, ...previous.map((r) => r.round)) + 1;
        const contactIds = [...new Set(previous.flatMap((r) => (r.contactId ? [r.contactId] : [])))];
        const contacts = (
          await manager
            .getRepository(FamilyContact)
            .findBy({ id: In(contactIds), clientId: summary.clientId })
        ).filter((c) => c.consentToSummaries && c.unsubscribedAt === null);
        if (contacts.length === 0) throw new ConflictException(NO_RECIPIENTS_LEFT_MESSAGE);
        const rows = await this.queueRecipients(manager, id, contacts, round);
        await this.audit.record(
          actor,
          'summary.resend',
          { type: 'summary', id, clientId: summary.clientId },
          { round, recipients: rows.length },
          manager,
        );
        await finish(manager, id);
        return { summary, recipients: rows };
      });
    } catch (error) {
      // The same round written twice (a path the lock should never leave open): still a conflict.
      if (isUniqueViolation(error)) throw new ConflictException(ROUND_PENDING_MESSAGE);
      throw error;
    }
    await this.sendJobs(queued.recipients);
    return this.toDto(queued.summary);
  }

  /**
   * What the stop link's page should offer, without changing anything (a GET may be opened by a
   * mail scanner): 'unknown' token, 'active' (summaries still go out), or 'stopped' already.
   */
  async stopState(token: string): Promise<'unknown' | 'active' | 'stopped'> {
    const recipient = await this.dataSource
      .getRepository(SummaryRecipient)
      .findOne({ where: { stopToken: token }, relations: { contact: true } });
    if (!recipient) return 'unknown';
    return recipient.contact && recipient.contact.unsubscribedAt === null ? 'active' : 'stopped';
  }

  /**
   * The stop link: the contact gets no more summaries. Idempotent; false for an unknown token.
   * Public (no account): the token is the only key, 256 random bits.
   */
  async stop(token: string): Promise<boolean> {
    return this.dataSource.transaction(async (manager) => {
      const recipient = await manager.getRepository(SummaryRecipient).findOne({
        where: { stopToken: token },
        relations: { summary: true },
      });
      if (!recipient) return false;
      if (!recipient.contactId) return true; // contact deleted since: nothing left to send to
      const result = await manager
        .createQueryBuilder()
        .update(FamilyContact)
        .set({ unsubscribedAt: () => 'now()' })
        .where('id = :id AND unsubscribed_at IS NULL', { id: recipient.contactId })
        .returning(['clientId', 'email'])
        .execute();
      // The stop belongs to the address for this client, whatever contact carries it later.
      for (const row of result.raw as Array<{ client_id: string; email: string }>) {
        await stopAddress(manager, row.client_id, row.email);
      }
      if ((result.affected ?? 0) > 0) {
        await this.audit.record(
          null,
          'summary.stop',
          { type: 'family_contact', id: recipient.contactId, clientId: recipient.summary?.clientId ?? null },
          { summaryId: recipient.summaryId },
          manager,
        );
      }
      return true;
    });
  }

  private async requireSummaryConsent(manager: EntityManager, clientId: string): Promise<void> {
    const records = await manager.getRepository(Consent).findBy({ clientId });
    if (!coversScope(records, 'summaries', todayIso()))
      throw new ConflictException(NO_SUMMARY_CONSENT_MESSAGE);
  }

  /** The chosen contacts, all of this client, all consenting and not stopped; 400 naming the others. */
  private async allowedContacts(
    manager: EntityManager,
    clientId: string,
    ids: string[],
  ): Promise<FamilyContact[]> {
    const unique = [...new Set(ids)];
    const contacts = await manager.getRepository(FamilyContact).findBy({ id: In(unique), clientId });
    const unknown = unique.filter((id) => !contacts.some((c) => c.id === id));
    if (unknown.length > 0)
      throw new BadRequestException('Some chosen contacts are not contacts of this client.');
    const refused = contacts.filter((c) => !c.consentToSummaries || c.unsubscribedAt !== null);
    if (refused.length > 0) {
      throw new BadRequestException(
        `${refused.map((c) => c.name).join(', ')} cannot receive summaries (no consent, or they stopped them).`,
      );
    }
    return contacts;
  }

  /** The chosen versions, or (none chosen) every version trained or approved in the period, oldest first. */
  private async versionsFor(
    manager: EntityManager,
    clientId: string,
    input: SummaryPreviewRequest,
  ): Promise<ProfileVersion[]> {
    const repo = manager.getRepository(ProfileVersion);
    if (input.versionIds.length > 0) {
      const chosen = await repo.find({
        where: { id: In(input.versionIds), clientId, status: In([...REPORTABLE]) },
        relations: { signedOffBy: true },
        order: { number: 'ASC' },
      });
      if (chosen.length !== new Set(input.versionIds).size) {
        throw new BadRequestException('Choose trained versions of this client only.');
      }
      return chosen;
    }
    return repo
      .createQueryBuilder('v')
      .leftJoinAndSelect('v.signedOffBy', 'signer')
      .where('v.clientId = :clientId', { clientId })
      .andWhere('v.status IN (:...statuses)', { statuses: [...REPORTABLE] })
      .andWhere(
        `((v.trained_at::date BETWEEN :from AND :to) OR (v.approved_at::date BETWEEN :from AND :to))`,
        { from: input.from, to: input.to },
      )
      .orderBy('v.number', 'ASC')
      .getMany();
  }

  private async queueRecipients(
    manager: EntityManager,
    summaryId: string,
    contacts: FamilyContact[],
    round: number,
  ): Promise<SummaryRecipient[]> {
    const repo = manager.getRepository(SummaryRecipient);
    return repo.save(
      contacts.map((c) =>
        repo.create({
          summaryId,
          contactId: c.id,
          name: c.name,
          email: c.email,
          round,
          idempotencyKey: randomUUID(),
          stopToken: randomBytes(32).toString('base64url'),
          status: 'queued',
          jobId: randomUUID(),
        }),
      ),
    );
  }

  /**
   * Queues one job per recipient after the commit. A job that cannot be queued leaves its row
   * 'queued' with the reason; it is not lost (TODO next session: a sweep in the worker re-queues
   * queued rows whose job is unknown).
   */
  private async sendJobs(recipients: SummaryRecipient[]): Promise<void> {
    for (const r of recipients) {
      try {
        await this.jobs.send(SUMMARY_MAIL_QUEUE, { recipientId: r.id }, r.jobId ?? randomUUID());
      } catch (error) {
        const why = error instanceof Error ? error.message : String(error);
        this.logger.error(`Could not queue the summary e-mail ${r.id}: ${why}`);
        await this.dataSource
          .getRepository(SummaryRecipient)
          .update({ id: r.id, status: 'queued' }, { lastError: `Not queued yet: ${why}` });
      }
    }
  }

  private async toDto(summary: Summary): Promise<SummaryDto> {
    const recipients = await this.dataSource.getRepository(SummaryRecipient).find({
      where: { summaryId: summary.id },
      relations: { contact: true },
      order: { round: 'ASC', name: 'ASC' },
    });
    return {
      id: summary.id,
      clientId: summary.clientId,
      from: summary.periodFrom,
      to: summary.periodTo,
      versionIds: summary.versionIds,
      note: summary.note,
      subject: summary.subject,
      text: summary.text,
      status: summaryStatusOf(recipients.map((r) => r.status)),
      createdBy: summary.createdById,
      createdAt: summary.createdAt.toISOString(),
      recipients: recipients.map((r) => ({
        id: r.id,
        contactId: r.contactId,
        name: r.name,
        email: r.email,
        round: r.round,
        status: r.status,
        attempts: r.attempts,
        lastError: r.lastError,
        sentAt: iso(r.sentAt),
        stopped: r.contact?.unsubscribedAt != null,
      })),
    };
  }
}
