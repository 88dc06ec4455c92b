import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { CreateContactInput, RenewSummariesConsentInput, UpdateContactInput } from '@keyloom/shared';
import { DataSource, type EntityManager, Not } from 'typeorm';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../auth/session-user';
import { ClientAccessService } from '../clients/client-access.service';
import type { Client } from '../clients/client.entity';
import { SummaryRecipient } from '../summaries/summary-recipient.entity';
import { type ContactDto, toContactDto } from './dto/contact.dto';
import { FamilyContact } from './family-contact.entity';
import { SummaryStop } from './summary-stop.entity';

export const CONTACT_NOT_FOUND_MESSAGE = 'There is no family contact with that id for this client.';
export const STOPPED_ADDRESS_MESSAGE =
  'This address used the stop link of a summary e-mail, so it cannot be ticked as agreeing. Record the ' +
  'family’s new consent to summaries (with its date and who gave it) to send summaries again.';
export const NOT_STOPPED_MESSAGE = 'Summaries to this address were never stopped: there is nothing to renew.';
export const duplicateAddressMessage = (pseudonym: string, email: string) =>
  `${pseudonym} already has a contact with this address: ${email}. Change that contact instead.`;

const EDITABLE_FIELDS = ['name', 'relationship', 'email', 'consentToSummaries'] as const;

/**
 * Addresses are compared without regard to case. RFC 5321 §2.4 (docs/references.md §6) lets a
 * receiving host treat the local part as case-sensitive, but mailboxes that differ only by case are
 * not seen in practice, and the shared schema already lower-cases what is typed: common practice.
 */
export const emailKey = (email: string) => email.toLowerCase();

@Injectable()
export class ContactsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly access: ClientAccessService,
    private readonly audit: AuditService,
  ) {}

  /** The client's family contacts by name (owning clinician, supervisor). */
  async findAll(actor: Actor, clientId: string): Promise<ContactDto[]> {
    await this.access.requireReadable(actor, clientId, 'contacts');
    const rows = await this.dataSource
      .getRepository(FamilyContact)
      .find({ where: { clientId }, order: { name: 'ASC', createdAt: 'ASC' } });
    return rows.map(toContactDto);
  }

  /**
   * Adds a contact (owning clinician). One contact per address per client (409); a stopped address
   * comes in stopped and cannot be ticked as agreeing (409). The log keeps the relationship and
   * consent, not name or address.
   */
  async create(actor: Actor, clientId: string, input: CreateContactInput): Promise<ContactDto> {
    return this.dataSource.transaction(async (manager) => {
      const client = await this.access.requireOwned(actor, clientId, manager);
      await this.lockAddresses(manager, clientId);
      await this.refuseDuplicate(manager, client, input.email, null);
      const stop = await this.stopOf(manager, clientId, input.email);
      if (stop && input.consentToSummaries) throw new ConflictException(STOPPED_ADDRESS_MESSAGE);
      const repo = manager.getRepository(FamilyContact);
      const inserted = await repo.insert({ ...input, clientId, unsubscribedAt: stop?.stoppedAt ?? null });
      const id = String(inserted.identifiers[0]?.id);
      await this.audit.record(
        actor,
        'contact.create',
        { type: 'family_contact', id, clientId },
        stop
          ? { consentToSummaries: input.consentToSummaries, stopped: true }
          : { consentToSummaries: input.consentToSummaries },
        manager,
      );
      return toContactDto(await repo.findOneByOrFail({ id }));
    });
  }

  /**
   * Changes a contact (owning clinician); audits which fields changed and any change of consent. A
   * new address must not be another contact's (409); the stop of the address the contact ends up
   * with applies, and a stopped contact cannot be ticked as agreeing (409).
   */
  async update(
    actor: Actor,
    clientId: string,
    contactId: string,
    input: UpdateContactInput,
  ): Promise<ContactDto> {
    return this.dataSource.transaction(async (manager) => {
      const client = await this.access.requireOwned(actor, clientId, manager);
      await this.lockAddresses(manager, clientId);
      const repo = manager.getRepository(FamilyContact);
      const contact = await this.findContact(manager, clientId, contactId);
      const patch: Partial<Pick<FamilyContact, (typeof EDITABLE_FIELDS)[number]>> = {};
      for (const key of EDITABLE_FIELDS) {
        const next = input[key];
        if (next !== undefined && next !== contact[key]) Object.assign(patch, { [key]: next });
      }
      const email = patch.email ?? contact.email;
      if (patch.email !== undefined) await this.refuseDuplicate(manager, client, email, contactId);
      const stop = await this.stopOf(manager, clientId, email);
      // Ticking a stopped contact as agreeing is refused; an unchanged tick is ignored like any unchanged field.
      if (stop && patch.consentToSummaries === true) throw new ConflictException(STOPPED_ADDRESS_MESSAGE);
      const fields = Object.keys(patch);
      if (fields.length === 0) return toContactDto(contact);
      await repo.update({ id: contactId }, { ...patch, unsubscribedAt: stop?.stoppedAt ?? null });
      await this.audit.record(
        actor,
        'contact.update',
        { type: 'family_contact', id: contactId, clientId },
        patch.consentToSummaries === undefined
          ? { fields }
          : { fields, consentToSummaries: patch.consentToSummaries },
        manager,
      );
      return toContactDto(await repo.findOneByOrFail({ id: contactId }));
    });
  }

  /**
   * Deletes a contact (owning clinician). Summaries already sent keep their record (name and address
   * as sent; the link to the contact is cleared); a stop of the address stays with the client.
   */
  async remove(actor: Actor, clientId: string, contactId: string): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      await this.access.requireOwned(actor, clientId, manager);
      await this.lockAddresses(manager, clientId);
      const contact = await this.findContact(manager, clientId, contactId);
      const summariesKept = await manager.getRepository(SummaryRecipient).countBy({ contactId });
      await manager.getRepository(FamilyContact).delete({ id: contactId });
      await this.audit.record(
        actor,
        'contact.delete',
        { type: 'family_contact', id: contactId, clientId },
        {
          summariesKept,
          consentToSummaries: contact.consentToSummaries,
          stopped: contact.unsubscribedAt !== null,
        },
        manager,
      );
    });
  }

  /**
   * The family's new consent to summaries after a stop (owning clinician): the address's stop is
   * lifted for every contact of the client carrying it, and this contact agrees again, with the date
   * and who gave it kept on the contact. 409 when the address was never stopped.
   */
  async renewSummariesConsent(
    actor: Actor,
    clientId: string,
    contactId: string,
    input: RenewSummariesConsentInput,
  ): Promise<ContactDto> {
    return this.dataSource.transaction(async (manager) => {
      await this.access.requireOwned(actor, clientId, manager);
      await this.lockAddresses(manager, clientId);
      const contact = await this.findContact(manager, clientId, contactId);
      const stop = await this.stopOf(manager, clientId, contact.email);
      if (!stop && contact.unsubscribedAt === null) throw new ConflictException(NOT_STOPPED_MESSAGE);
      const key = emailKey(contact.email);
      await manager.getRepository(SummaryStop).delete({ clientId, emailKey: key });
      await manager
        .createQueryBuilder()
        .update(FamilyContact)
        .set({ unsubscribedAt: null })
        .where('client_id = :clientId AND lower(email) = :key', { clientId, key })
        .execute();
      await manager.getRepository(FamilyContact).update(
        { id: contactId },
        {
          consentToSummaries: true,
          summariesConsentGivenOn: input.givenOn,
          summariesConsentGivenBy: input.givenBy,
        },
      );
      await this.audit.record(
        actor,
        'contact.summaries-consent',
        { type: 'family_contact', id: contactId, clientId },
        { givenOn: input.givenOn, stoppedAt: stop ? stop.stoppedAt.toISOString() : null },
        manager,
      );
      return toContactDto(await manager.getRepository(FamilyContact).findOneByOrFail({ id: contactId }));
    });
  }

  private async findContact(manager: EntityManager, clientId: string, contactId: string) {
    const contact = await manager
      .getRepository(FamilyContact)
      .findOne({ where: { id: contactId, clientId }, lock: { mode: 'pessimistic_write' } });
    if (!contact) throw new NotFoundException(CONTACT_NOT_FOUND_MESSAGE);
    return contact;
  }

  // One writer of a client's contact addresses at a time: two requests adding the same address at
  // once cannot both pass the duplicate check (the unique index would catch it, as a 500).
  private async lockAddresses(manager: EntityManager, clientId: string): Promise<void> {
    await manager.query('SELECT pg_advisory_xact_lock(hashtext($1))', [`family_contacts:${clientId}`]);
  }

  private async refuseDuplicate(
    manager: EntityManager,
    client: Client,
    email: string,
    exceptId: string | null,
  ): Promise<void> {
    const query = manager
      .getRepository(FamilyContact)
      .createQueryBuilder('contact')
      .where('contact.clientId = :clientId', { clientId: client.id })
      .andWhere('lower(contact.email) = :key', { key: emailKey(email) });
    if (exceptId) query.andWhere({ id: Not(exceptId) });
    const other = await query.getOne();
    if (other) throw new ConflictException(duplicateAddressMessage(client.pseudonym, other.email));
  }

  private stopOf(manager: EntityManager, clientId: string, email: string): Promise<SummaryStop | null> {
    return manager.getRepository(SummaryStop).findOneBy({ clientId, emailKey: emailKey(email) });
  }
}
