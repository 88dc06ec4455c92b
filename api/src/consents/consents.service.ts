import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import {
  type ConsentScope,
  type CreateConsentInput,
  FUTURE_CONSENT_MESSAGE,
  type VoidConsentInput,
  type WithdrawConsentInput,
  type WithdrawalPreview,
  type WithdrawalReport,
} from '@keyloom/shared';
import { createHash } from 'node:crypto';
import { DataSource, type EntityManager } from 'typeorm';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../auth/session-user';
import { ClientAccessService } from '../clients/client-access.service';
import { isInForce, releasedScopes, todayIso } from './consent-status';
import { Consent } from './consent.entity';
import { cleanFileName, detectConsentDocumentType } from './document-type';
import { type ConsentDto, toConsentDto } from './dto/consent.dto';
import { type WithdrawalCounts, WithdrawalHooks } from './withdrawal-hooks';

export const CONSENT_NOT_FOUND_MESSAGE = 'There is no consent record with that id for this client.';
export const ALREADY_WITHDRAWN_MESSAGE = 'This consent was already withdrawn.';
export const WITHDRAWN_IS_FINAL_MESSAGE = 'This consent was withdrawn; its record can no longer be changed.';
export const ALREADY_VOIDED_MESSAGE = 'This consent record was already voided.';
export const VOIDED_IS_FINAL_MESSAGE = 'This consent record was voided; it can no longer be changed.';
export const WITHDRAWN_CANNOT_BE_VOIDED_MESSAGE =
  'This consent was withdrawn; a withdrawn record stays as it is and cannot be voided.';
export { FUTURE_CONSENT_MESSAGE };
export const NOT_A_DOCUMENT_MESSAGE =
  'The consent form must be a PDF, PNG or JPEG file. Scan or save it in one of these formats and try again.';
export const NO_DOCUMENT_MESSAGE = 'No consent form was uploaded for this consent.';

/** The uploaded file as multer hands it over (memory storage). */
export type UploadedDocument = { originalname?: string; buffer: Buffer; size: number };
/** A stored consent form for download. */
export type StoredDocument = { fileName: string; mimeType: string; bytes: Buffer };

@Injectable()
export class ConsentsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly access: ClientAccessService,
    private readonly hooks: WithdrawalHooks,
    private readonly audit: AuditService,
  ) {}

  /** The client's consent records, newest first (owning clinician, supervisor). */
  async findAll(actor: Actor, clientId: string): Promise<ConsentDto[]> {
    await this.access.requireReadable(actor, clientId, 'consents');
    const rows = await this.query(this.dataSource.manager)
      .where('consent.clientId = :clientId', { clientId })
      .orderBy('consent.createdAt', 'DESC')
      .addOrderBy('consent.id', 'ASC')
      .getMany();
    const today = todayIso();
    return rows.map((row) => toConsentDto(row, today));
  }

  /** Records a consent (owning clinician). givenOn may not lie after today (400). */
  async create(actor: Actor, clientId: string, input: CreateConsentInput): Promise<ConsentDto> {
    if (input.givenOn > todayIso()) {
      throw new BadRequestException({
        message: FUTURE_CONSENT_MESSAGE,
        issues: [{ path: 'givenOn', message: FUTURE_CONSENT_MESSAGE }],
      });
    }
    return this.dataSource.transaction(async (manager) => {
      await this.access.requireOwned(actor, clientId, manager);
      const representative = input.givenBy === 'representative';
      const inserted = await manager.getRepository(Consent).insert({
        clientId,
        givenBy: input.givenBy,
        representativeName: representative ? (input.representativeName ?? null) : null,
        representativeRelationship: representative ? (input.representativeRelationship ?? null) : null,
        scopes: input.scopes,
        givenOn: input.givenOn,
        expiresOn: input.expiresOn ?? null,
        notes: input.notes ?? null,
        recordedById: actor.id,
      });
      const id = String(inserted.identifiers[0]?.id);
      await this.audit.record(
        actor,
        'consent.create',
        { type: 'consent', id, clientId },
        {
          givenBy: input.givenBy,
          scopes: input.scopes,
          givenOn: input.givenOn,
          expiresOn: input.expiresOn ?? null,
        },
        manager,
      );
      return this.findDto(manager, clientId, id);
    });
  }

  /**
   * Withdraws a consent (owning clinician), in ONE transaction with every consent record of the
   * client locked: the scopes that no other consent in force still covers are released, the hooks of
   * those scopes delete (or cancel) what they keep, the record gets withdrawn_* and the report of
   * what went, and the audit event is written. Cannot be undone; a second withdrawal is 409.
   */
  async withdraw(
    actor: Actor,
    clientId: string,
    consentId: string,
    input: WithdrawConsentInput,
  ): Promise<ConsentDto> {
    return this.dataSource.transaction(async (manager) => {
      await this.access.requireOwned(actor, clientId, manager);
      const { consent, others } = await this.lockClientConsents(manager, clientId, consentId);
      if (consent.voidedAt !== null) throw new ConflictException(VOIDED_IS_FINAL_MESSAGE);
      if (consent.withdrawnAt !== null) throw new ConflictException(ALREADY_WITHDRAWN_MESSAGE);
      const report = await this.release(manager, clientId, consent, others);
      await manager.getRepository(Consent).update(
        { id: consentId },
        {
          withdrawnAt: new Date(),
          withdrawnById: actor.id,
          withdrawalReason: input.reason,
          withdrawal: report,
        },
      );
      // The reason stays on the consent record (readable by clinician and supervisor), not in the log.
      await this.audit.record(
        actor,
        'consent.withdraw',
        { type: 'consent', id: consentId, clientId },
        { ...report },
        manager,
      );
      return this.findDto(manager, clientId, consentId);
    });
  }

  /**
   * Voids a record made in error (owning clinician), in the same locked transaction as a withdrawal:
   * the record stays (with when, who, why) but no longer counts as consent, so what only it allowed
   * is deleted exactly as a withdrawal would (nothing while another consent in force covers it).
   * Once only: a voided record 409; a withdrawn record 409 (its withdrawal already stands).
   */
  async voidConsent(
    actor: Actor,
    clientId: string,
    consentId: string,
    input: VoidConsentInput,
  ): Promise<ConsentDto> {
    return this.dataSource.transaction(async (manager) => {
      await this.access.requireOwned(actor, clientId, manager);
      const { consent, others } = await this.lockClientConsents(manager, clientId, consentId);
      if (consent.voidedAt !== null) throw new ConflictException(ALREADY_VOIDED_MESSAGE);
      if (consent.withdrawnAt !== null) throw new ConflictException(WITHDRAWN_CANNOT_BE_VOIDED_MESSAGE);
      const report = await this.release(manager, clientId, consent, others);
      await manager
        .getRepository(Consent)
        .update(
          { id: consentId },
          { voidedAt: new Date(), voidedById: actor.id, voidReason: input.reason, voidReport: report },
        );
      // The reason is free text staff wrote about the client: like every such text it stays on the
      // record (shown in the list), and the log keeps its SHA-256, which ties the event to that text
      // (see CLIENT_TEXT_KEYS in audit-details.ts for why the log holds no client text).
      await this.audit.record(
        actor,
        'consent.void',
        { type: 'consent', id: consentId, clientId },
        { reasonSha256: createHash('sha256').update(input.reason).digest('hex'), ...report },
        manager,
      );
      return this.findDto(manager, clientId, consentId);
    });
  }

  /** Runs the hooks of the scopes only `consent` covers; the report of what went. */
  private async release(
    manager: EntityManager,
    clientId: string,
    consent: Consent,
    others: readonly Consent[],
  ): Promise<WithdrawalReport> {
    const released = releasedScopes(consent, others, todayIso());
    const counts = await this.hooks.runAll(clientId, released, manager);
    return toWithdrawalReport(counts, consent.scopes, released);
  }

  /**
   * What withdrawing (or voiding) the consent would do now (owning clinician), counted by the same hooks as the
   * withdrawal, without changing anything; with the other consents that keep each scope covered.
   */
  async withdrawalPreview(actor: Actor, clientId: string, consentId: string): Promise<WithdrawalPreview> {
    return this.dataSource.transaction('REPEATABLE READ', async (manager) => {
      await this.access.requireOwned(actor, clientId, manager);
      const all = await manager.getRepository(Consent).find({ where: { clientId } });
      const consent = all.find((row) => row.id === consentId);
      if (!consent) throw new NotFoundException(CONSENT_NOT_FOUND_MESSAGE);
      if (consent.voidedAt !== null) throw new ConflictException(VOIDED_IS_FINAL_MESSAGE);
      if (consent.withdrawnAt !== null) throw new ConflictException(ALREADY_WITHDRAWN_MESSAGE);
      const others = all.filter((row) => row.id !== consentId);
      const today = todayIso();
      const released = releasedScopes(consent, others, today);
      const counts = await this.hooks.countAll(clientId, released, manager);
      return {
        consentId,
        report: toWithdrawalReport(counts, consent.scopes, released),
        scopes: consent.scopes.map((scope) => ({
          scope,
          coveredBy: others
            .filter((row) => isInForce(row, today) && row.scopes.includes(scope))
            .sort((a, b) => a.givenOn.localeCompare(b.givenOn) || a.id.localeCompare(b.id))
            .map(({ id, givenOn, expiresOn }) => ({ id, givenOn, expiresOn })),
        })),
      };
    });
  }

  /** Attaches (or replaces) the scanned form of a standing consent (owning clinician). */
  async attachDocument(
    actor: Actor,
    clientId: string,
    consentId: string,
    file: UploadedDocument,
  ): Promise<ConsentDto> {
    const type = detectConsentDocumentType(file.buffer);
    return this.dataSource.transaction(async (manager) => {
      await this.access.requireOwned(actor, clientId, manager);
      const consent = await this.lockConsent(manager, clientId, consentId);
      if (consent.withdrawnAt !== null) throw new ConflictException(WITHDRAWN_IS_FINAL_MESSAGE);
      if (consent.voidedAt !== null) throw new ConflictException(VOIDED_IS_FINAL_MESSAGE);
      if (!type) throw new BadRequestException(NOT_A_DOCUMENT_MESSAGE);
      const fileName = cleanFileName(file.originalname, `consent-form.${type.extension}`);
      await manager.getRepository(Consent).update(
        { id: consentId },
        {
          documentName: fileName,
          documentMime: type.mimeType,
          documentSize: file.buffer.length,
          documentBytes: file.buffer,
          documentUploadedAt: new Date(),
        },
      );
      await this.audit.record(
        actor,
        'consent.document-upload',
        { type: 'consent', id: consentId, clientId },
        {
          mimeType: type.mimeType,
          byteSize: file.buffer.length,
          sha256: createHash('sha256').update(file.buffer).digest('hex'),
          replaced: consent.documentName !== null,
        },
        manager,
      );
      return this.findDto(manager, clientId, consentId);
    });
  }

  /** The stored form for download (owning clinician, supervisor; carers 403). */
  async document(actor: Actor, clientId: string, consentId: string): Promise<StoredDocument> {
    await this.access.requireReadable(actor, clientId, 'consents');
    const row = await this.dataSource
      .getRepository(Consent)
      .createQueryBuilder('consent')
      .addSelect('consent.documentBytes')
      .where('consent.id = :consentId AND consent.clientId = :clientId', { consentId, clientId })
      .getOne();
    if (!row) throw new NotFoundException(CONSENT_NOT_FOUND_MESSAGE);
    if (!row.documentBytes || !row.documentName || !row.documentMime) {
      throw new NotFoundException(NO_DOCUMENT_MESSAGE);
    }
    return { fileName: row.documentName, mimeType: row.documentMime, bytes: row.documentBytes };
  }

  private query(manager: EntityManager) {
    return manager
      .getRepository(Consent)
      .createQueryBuilder('consent')
      .leftJoinAndSelect('consent.recordedBy', 'recordedBy')
      .leftJoinAndSelect('consent.withdrawnBy', 'withdrawnBy')
      .leftJoinAndSelect('consent.voidedBy', 'voidedBy');
  }

  private async findDto(manager: EntityManager, clientId: string, id: string): Promise<ConsentDto> {
    const row = await this.query(manager)
      .where('consent.id = :id AND consent.clientId = :clientId', { id, clientId })
      .getOne();
    if (!row) throw new NotFoundException(CONSENT_NOT_FOUND_MESSAGE);
    return toConsentDto(row, todayIso());
  }

  // Row lock: two withdrawals at once cannot both pass the "not yet withdrawn" check.
  private async lockConsent(manager: EntityManager, clientId: string, consentId: string): Promise<Consent> {
    const consent = await manager
      .getRepository(Consent)
      .findOne({ where: { id: consentId, clientId }, lock: { mode: 'pessimistic_write' } });
    if (!consent) throw new NotFoundException(CONSENT_NOT_FOUND_MESSAGE);
    return consent;
  }

  // Every consent of the client locked, always in id order (no deadlock between two withdrawals):
  // withdrawing X and Y at once, the second waits for the first and then sees X withdrawn, so the
  // pair can neither both keep the data nor both count it.
  private async lockClientConsents(
    manager: EntityManager,
    clientId: string,
    consentId: string,
  ): Promise<{ consent: Consent; others: Consent[] }> {
    const all = await manager.getRepository(Consent).find({
      where: { clientId },
      order: { id: 'ASC' },
      lock: { mode: 'pessimistic_write' },
    });
    const consent = all.find((row) => row.id === consentId);
    if (!consent) throw new NotFoundException(CONSENT_NOT_FOUND_MESSAGE);
    return { consent, others: all.filter((row) => row.id !== consentId) };
  }
}

/** The stored report: samples apart, every other deleted kind under its hook's name, zeros included. */
export function toWithdrawalReport(
  counts: WithdrawalCounts,
  scopes: readonly ConsentScope[],
  released: readonly ConsentScope[],
): WithdrawalReport {
  const { samples = 0, ...derived } = counts.deleted;
  return {
    samplesDeleted: samples,
    derived,
    cancelled: counts.cancelled,
    keptScopes: scopes.filter((scope) => !released.includes(scope)),
  };
}
