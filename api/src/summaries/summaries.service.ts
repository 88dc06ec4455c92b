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
  type SummaryCommentRef,
  type SummaryMessagePreview,
  type SummaryPreview,
  type SummaryPreviewRequest,
  roleLabels,
  summaryStatusOf,
  type UpdateSummaryInput,
} from '@keyloom/shared';
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { DataSource, type EntityManager, In } from 'typeorm';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../auth/session-user';
import { ClientAccessService } from '../clients/client-access.service';
import type { Client } from '../clients/client.entity';
import { loadClinicSettings } from '../clinic/clinic-settings.service';
import { coversScope, todayIso } from '../consents/consent-status';
import { Consent } from '../consents/consent.entity';
import { WithdrawalHooks } from '../consents/withdrawal-hooks';
import { FamilyContact } from '../contacts/family-contact.entity';
import { stopAddress } from '../contacts/summary-stop';
import { isUniqueViolation } from '../database/database-errors';
import { type FinishIdempotent, IdempotencyService } from '../idempotency/idempotency.service';
import { JobQueueService } from '../jobs/job-queue.service';
import { ProfileVersion } from '../profile-versions/profile-version.entity';
import { User } from '../users/user.entity';
import { AppConfig } from '../config/app-config';
import { SUMMARY_MAIL_QUEUE, stopUrl } from './summary-delivery';
import { countTrials, plausibleTrials } from './trial-figures';
import { buildSummaryMessage, type SummaryChart, summaryCharts } from './summary-message';
import { summaryEmailsWithdrawalHook } from './summary-withdrawal';
import { SummaryRecipient } from './summary-recipient.entity';
import {
  figuresFromMetrics,
  summarySubject,
  summaryText,
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
export const DRAFT_NOT_SENT_MESSAGE = 'This summary is a draft and was never sent: send it first.';
export const ONLY_DRAFT_SUMMARY_MESSAGE =
  'This summary was already sent, and what was sent never changes. Compose a new summary instead.';

// Versions a summary may report when chosen: trained at least (draft, training and failed versions
// have no model). Without a choice, only versions approved in the period (active, or retired since).
const REPORTABLE = ['trained', 'signed_off', 'active', 'retired', 'sent_back'] as const;
const APPROVED = ['active', 'retired'] as const;

const iso = (date: Date | null): string | null => (date ? date.toISOString() : null);

/** A chart as the previews carry it: PNG in base64, its CSS size and alt text. */
const previewChart = (c: SummaryChart): SummaryPreview['charts'][number] => ({
  name: c.name,
  alt: c.alt,
  pngBase64: c.png.toString('base64'),
  width: c.width,
  height: c.height,
});

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
    private readonly config: AppConfig,
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
    return this.toDto(await this.readableSummary(actor, id));
  }

  /**
   * Composes and stores a draft (owning clinician): the generated text, the chosen recipients and
   * versions, no e-mail yet. Refuses contacts who did not consent or stopped summaries (400), and a
   * client without a summaries consent (409). With an Idempotency-Key a repeat answers the same draft.
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
    const summary = await this.dataSource.transaction(async (manager) => {
      const client = await this.access.requireOwned(actor, clientId, manager);
      await this.requireSummaryConsent(manager, clientId);
      const contacts = await this.allowedContacts(manager, clientId, input.contactIds);
      const content = await this.compose(manager, actor, client, clientId, input);
      const saved = await manager.getRepository(Summary).save(
        manager.getRepository(Summary).create({
          clientId,
          periodFrom: input.from,
          periodTo: input.to,
          versionIds: content.versionIds,
          note: input.note,
          subject: content.subject,
          text: content.text,
          generatedText: content.text,
          figures: content.figures,
          notes: content.notes,
          state: 'draft',
          contactIds: contacts.map((c) => c.id),
          includeComments: input.includeComments,
          createdById: actor.id,
        }),
      );
      await this.audit.record(
        actor,
        'summary.create',
        { type: 'summary', id: saved.id, clientId },
        { draft: true, versions: content.versionIds.length, recipients: contacts.length },
        manager,
      );
      await finish(manager, saved.id);
      return saved;
    });
    return this.toDto(summary);
  }

  /**
   * Changes a draft (owning clinician): each field sent replaces the draft's. New versions, ticked
   * comments or note write the generated text again; it replaces the draft's text only while the
   * clinician has not edited it (or with `regenerate`). A sent summary: 409.
   */
  async update(actor: Actor, id: string, input: UpdateSummaryInput): Promise<SummaryDto> {
    const summary = await this.dataSource.transaction(async (manager) => {
      const row = await this.lockedOwned(manager, actor, id);
      if (row.state !== 'draft') throw new ConflictException(ONLY_DRAFT_SUMMARY_MESSAGE);
      const changed: string[] = [];
      if (input.contactIds) {
        row.contactIds = (await this.allowedContacts(manager, row.clientId, input.contactIds)).map(
          (c) => c.id,
        );
        changed.push('recipients');
      }
      const recompose =
        input.versionIds !== undefined ||
        input.includeComments !== undefined ||
        input.note !== undefined ||
        input.regenerate === true;
      if (recompose) {
        const edited = row.generatedText !== null && row.text !== row.generatedText;
        if (input.note !== undefined) row.note = input.note;
        if (input.includeComments) row.includeComments = input.includeComments;
        const client = await this.access.requireOwned(actor, row.clientId, manager);
        const content = await this.compose(manager, actor, client, row.clientId, {
          from: row.periodFrom,
          to: row.periodTo,
          versionIds: input.versionIds ?? row.versionIds,
          note: row.note,
          includeComments: row.includeComments,
        });
        row.versionIds = content.versionIds;
        row.figures = content.figures;
        row.notes = content.notes;
        row.generatedText = content.text;
        if (!edited || input.regenerate) row.text = content.text;
        for (const key of ['versionIds', 'includeComments', 'note', 'regenerate'] as const)
          if (input[key] !== undefined) changed.push(key);
      }
      if (input.text !== undefined) {
        row.text = input.text;
        changed.push('text');
      }
      if (input.subject !== undefined) {
        row.subject = input.subject;
        changed.push('subject');
      }
      const saved = await manager.getRepository(Summary).save(row);
      // What changed, not the words (free text about the client stays on the summary).
      await this.audit.record(
        actor,
        'summary.update',
        { type: 'summary', id, clientId: row.clientId },
        { changed, textEdited: saved.generatedText !== null && saved.text !== saved.generatedText },
        manager,
      );
      return saved;
    });
    return this.toDto(summary);
  }

  /** Deletes a draft (owning clinician); nothing was sent. A sent summary: 409. */
  async remove(actor: Actor, id: string): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const row = await this.lockedOwned(manager, actor, id);
      if (row.state !== 'draft') throw new ConflictException(ONLY_DRAFT_SUMMARY_MESSAGE);
      await manager.getRepository(Summary).delete({ id });
      await this.audit.record(
        actor,
        'summary.delete-draft',
        { type: 'summary', id, clientId: row.clientId },
        { versions: row.versionIds.length },
        manager,
      );
    });
  }

  /**
   * Sends a draft (owning clinician): its subject and text exactly as they stand, to its recipients
   * (each checked again: consent, stop). 409 unless a draft; with an Idempotency-Key a repeat answers
   * the first result and sends nothing twice.
   */
  async send(actor: Actor, id: string, idempotencyKey?: string): Promise<SummaryDto> {
    return this.idempotency.once(
      actor.id,
      idempotencyKey,
      { route: `POST /summaries/${id}/send`, body: null },
      (finish) => this.sendOnce(actor, id, finish),
      (summaryId) => this.get(actor, summaryId),
    );
  }

  private async sendOnce(actor: Actor, id: string, finish: FinishIdempotent): Promise<SummaryDto> {
    const { summary, recipients } = await this.dataSource.transaction(async (manager) => {
      const row = await this.lockedOwned(manager, actor, id);
      if (row.state !== 'draft') throw new ConflictException(ONLY_DRAFT_SUMMARY_MESSAGE);
      await this.requireSummaryConsent(manager, row.clientId);
      const contacts = await this.allowedContacts(manager, row.clientId, row.contactIds);
      row.state = 'sent';
      row.sentAt = new Date();
      row.sentById = actor.id;
      const saved = await manager.getRepository(Summary).save(row);
      const rows = await this.queueRecipients(manager, id, contacts, 1);
      await this.audit.record(
        actor,
        'summary.send',
        { type: 'summary', id, clientId: row.clientId },
        {
          versions: row.versionIds.length,
          recipients: rows.length,
          textEdited: row.generatedText !== null && row.text !== row.generatedText,
          // The text as sent, by its hash (the words stay on the summary).
          textSha256: createHash('sha256').update(row.text).digest('hex'),
        },
        manager,
      );
      await finish(manager, id);
      return { summary: saved, recipients: rows };
    });
    await this.sendJobs(recipients);
    return this.toDto(summary);
  }

  /**
   * The e-mail exactly as a family member receives it (owning clinician, supervisor): the message the
   * worker would build for the draft's first recipient (or the first one it was sent to), with an
   * example stop link.
   */
  async message(actor: Actor, id: string): Promise<SummaryMessagePreview> {
    const row = await this.readableSummary(actor, id);
    const contact = row.contactIds[0]
      ? await this.dataSource.getRepository(FamilyContact).findOneBy({ id: row.contactIds[0] })
      : null;
    const to = contact
      ? { name: contact.name, email: contact.email }
      : { name: 'Family member', email: 'family@example.org' };
    const built = buildSummaryMessage({
      from: this.config.mailFrom,
      to,
      subject: row.subject,
      text: row.text,
      figures: row.figures,
      idempotencyKey: row.id,
      stopUrl: stopUrl(this.config.appUrl, 'example-stop-link'),
    });
    const charts = summaryCharts(row.figures);
    return {
      subject: row.subject,
      to: `${to.name} <${to.email}>`,
      from: this.config.mailFrom,
      text: typeof built.text === 'string' ? built.text : '',
      html: typeof built.html === 'string' ? built.html : '',
      headers: {
        ...(built.headers as Record<string, string>),
        'List-Unsubscribe': `<${stopUrl(this.config.appUrl, 'example-stop-link')}>`,
      },
      charts: charts.map(previewChart),
    };
  }

  /** What the e-mail would say and show, without storing or sending anything (owning clinician). */
  async preview(actor: Actor, clientId: string, input: SummaryPreviewRequest): Promise<SummaryPreview> {
    return this.dataSource.transaction(async (manager) => {
      const client = await this.access.requireOwned(actor, clientId, manager);
      const content = await this.compose(manager, actor, client, clientId, input);
      return {
        subject: content.subject,
        text: content.text,
        versionIds: content.versionIds,
        charts: summaryCharts(content.figures).map(previewChart),
      };
    });
  }

  /**
   * Subject, text and figures from the versions' stored metrics (the same for preview, draft and
   * send), and the notes for the clinician on what was left out. Staff comments go in only when
   * ticked; trial figures only when plausible.
   */
  private async compose(
    manager: EntityManager,
    actor: Actor,
    client: Client,
    clientId: string,
    input: SummaryPreviewRequest,
  ): Promise<{
    subject: string;
    text: string;
    figures: VersionFigures[];
    versionIds: string[];
    notes: string[];
  }> {
    const versions = await this.versionsFor(manager, clientId, input);
    const notes: string[] = [];
    const trials = await countTrials(
      manager,
      versions.map((v) => v.id),
      input,
    );
    const ticked = (v: ProfileVersion, kind: SummaryCommentRef['kind']) =>
      input.includeComments.some((c) => c.versionId === v.id && c.kind === kind);
    const figures = versions.map((v) => {
      const base = figuresFromMetrics(
        {
          number: v.number,
          status: v.status,
          date: (v.approvedAt ?? v.trainedAt)?.toISOString().slice(0, 10) ?? null,
          slots: v.settings.slots,
          baseOnly: v.baseOnly,
        },
        v.metrics,
      );
      const trial = plausibleTrials(base, trials.get(v.id) ?? null, notes);
      return {
        ...base,
        trials: trial,
        carerComment:
          ticked(v, 'sign-off') && v.signOffComment && v.signedOffBy
            ? { by: v.signedOffBy.name, text: v.signOffComment }
            : null,
        supervisorComment:
          ticked(v, 'approval') && v.approvalComment && v.approvedBy
            ? { by: v.approvedBy.name, text: v.approvalComment }
            : null,
      };
    });
    // The name the family uses (the client record's preferred name); the pseudonym only without one.
    const clientName = client.preferredName?.trim() || client.pseudonym;
    if (!client.preferredName?.trim()) {
      notes.push(
        `${client.pseudonym} has no preferred name on the client record, so the e-mail calls them ` +
          `“${client.pseudonym}”. Add the name the family uses on the client record and write the text again.`,
      );
    }
    const clinic = await loadClinicSettings(manager);
    if (!clinic.configured) {
      notes.push(
        'The clinic’s name, phone and address are not set, so the e-mail names no phone number. An administrator sets them under Clinic details.',
      );
    }
    const period = { clientName, from: input.from, to: input.to };
    return {
      subject: summarySubject(period),
      text: summaryText({
        ...period,
        clinicName: clinic.name,
        clinicPhone: clinic.phone,
        clinicAddress: clinic.address,
        clinician: { name: actor.name, role: roleLabels[actor.role].toLowerCase() },
        versions: figures,
        note: input.note,
      }),
      figures,
      versionIds: versions.map((v) => v.id),
      notes,
    };
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
        if (summary.state === 'draft') throw new ConflictException(DRAFT_NOT_SENT_MESSAGE);
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

  /** The summary locked for a change by the owning clinician; 404 for an unknown or other clinician's one. */
  private async lockedOwned(manager: EntityManager, actor: Actor, id: string): Promise<Summary> {
    const row = await manager
      .getRepository(Summary)
      .findOne({ where: { id }, lock: { mode: 'pessimistic_write' } });
    if (!row) throw new NotFoundException(SUMMARY_NOT_FOUND_MESSAGE);
    try {
      await this.access.requireOwned(actor, row.clientId, manager);
    } catch (error) {
      if (error instanceof NotFoundException) throw new NotFoundException(SUMMARY_NOT_FOUND_MESSAGE);
      throw error;
    }
    return row;
  }

  /** The summary for reading (owning clinician, supervisor); 404 otherwise. */
  private async readableSummary(actor: Actor, id: string): Promise<Summary> {
    const row = await this.dataSource.getRepository(Summary).findOneBy({ id });
    if (!row) throw new NotFoundException(SUMMARY_NOT_FOUND_MESSAGE);
    try {
      await this.access.requireReadable(actor, row.clientId, 'contacts');
    } catch (error) {
      if (error instanceof NotFoundException) throw new NotFoundException(SUMMARY_NOT_FOUND_MESSAGE);
      throw error;
    }
    return row;
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

  /** The chosen versions, or (none chosen) every version approved in the period, oldest first. */
  private async versionsFor(
    manager: EntityManager,
    clientId: string,
    input: SummaryPreviewRequest,
  ): Promise<ProfileVersion[]> {
    const repo = manager.getRepository(ProfileVersion);
    if (input.versionIds.length > 0) {
      const chosen = await repo.find({
        where: { id: In(input.versionIds), clientId, status: In([...REPORTABLE]) },
        relations: { signedOffBy: true, approvedBy: true },
        order: { number: 'ASC' },
      });
      if (chosen.length !== new Set(input.versionIds).size) {
        throw new BadRequestException('Choose trained versions of this client only.');
      }
      return chosen;
    }
    // Without a choice: only what a supervisor approved in the period (in use, or replaced since).
    return repo
      .createQueryBuilder('v')
      .leftJoinAndSelect('v.signedOffBy', 'signer')
      .leftJoinAndSelect('v.approvedBy', 'approver')
      .where('v.clientId = :clientId', { clientId })
      .andWhere('v.status IN (:...statuses)', { statuses: [...APPROVED] })
      .andWhere('v.approved_at::date BETWEEN :from AND :to', { from: input.from, to: input.to })
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
    const versions = summary.versionIds.length
      ? await this.dataSource.getRepository(ProfileVersion).find({
          where: { id: In(summary.versionIds) },
          relations: { signedOffBy: true, approvedBy: true },
          order: { number: 'ASC' },
        })
      : [];
    const sentBy = summary.sentById
      ? ((await this.dataSource.getRepository(User).findOneBy({ id: summary.sentById }))?.name ?? null)
      : null;
    const ticked = (versionId: string, kind: SummaryCommentRef['kind']) =>
      summary.includeComments.some((c) => c.versionId === versionId && c.kind === kind);
    return {
      id: summary.id,
      clientId: summary.clientId,
      from: summary.periodFrom,
      to: summary.periodTo,
      versionIds: summary.versionIds,
      note: summary.note,
      subject: summary.subject,
      text: summary.text,
      status: summary.state === 'draft' ? 'draft' : summaryStatusOf(recipients.map((r) => r.status)),
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
      contactIds: summary.contactIds,
      includeComments: summary.includeComments.filter((c) => ticked(c.versionId, c.kind)),
      textEdited: summary.generatedText !== null && summary.text !== summary.generatedText,
      availableComments: versions.flatMap((v) => [
        ...(v.signOffComment && v.signedOffBy
          ? [
              {
                versionId: v.id,
                kind: 'sign-off' as const,
                versionNumber: v.number,
                by: v.signedOffBy.name,
                text: v.signOffComment,
              },
            ]
          : []),
        ...(v.approvalComment && v.approvedBy
          ? [
              {
                versionId: v.id,
                kind: 'approval' as const,
                versionNumber: v.number,
                by: v.approvedBy.name,
                text: v.approvalComment,
              },
            ]
          : []),
      ]),
      notes: summary.notes,
      sentAt: iso(summary.sentAt),
      sentBy,
    };
  }
}
