import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { CreateContactInput, UpdateContactInput } from '@keyloom/shared';
import { DataSource } from 'typeorm';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../auth/session-user';
import { ClientAccessService } from '../clients/client-access.service';
import { type ContactDto, toContactDto } from './dto/contact.dto';
import { FamilyContact } from './family-contact.entity';

export const CONTACT_NOT_FOUND_MESSAGE = 'There is no family contact with that id for this client.';

const EDITABLE_FIELDS = ['name', 'relationship', 'email', 'consentToSummaries'] as const;

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

  /** Adds a contact (owning clinician). The log keeps the relationship and consent, not name or address. */
  async create(actor: Actor, clientId: string, input: CreateContactInput): Promise<ContactDto> {
    return this.dataSource.transaction(async (manager) => {
      await this.access.requireOwned(actor, clientId, manager);
      const repo = manager.getRepository(FamilyContact);
      const inserted = await repo.insert({ ...input, clientId });
      const id = String(inserted.identifiers[0]?.id);
      await this.audit.record(
        actor,
        'contact.create',
        { type: 'family_contact', id, clientId },
        { consentToSummaries: input.consentToSummaries },
        manager,
      );
      return toContactDto(await repo.findOneByOrFail({ id }));
    });
  }

  /** Changes a contact (owning clinician); audits which fields changed and any change of consent. */
  async update(
    actor: Actor,
    clientId: string,
    contactId: string,
    input: UpdateContactInput,
  ): Promise<ContactDto> {
    return this.dataSource.transaction(async (manager) => {
      await this.access.requireOwned(actor, clientId, manager);
      const repo = manager.getRepository(FamilyContact);
      const contact = await repo.findOne({
        where: { id: contactId, clientId },
        lock: { mode: 'pessimistic_write' },
      });
      if (!contact) throw new NotFoundException(CONTACT_NOT_FOUND_MESSAGE);
      const patch: Partial<Pick<FamilyContact, (typeof EDITABLE_FIELDS)[number]>> = {};
      for (const key of EDITABLE_FIELDS) {
        const next = input[key];
        if (next !== undefined && next !== contact[key]) Object.assign(patch, { [key]: next });
      }
      const fields = Object.keys(patch);
      if (fields.length === 0) return toContactDto(contact);
      await repo.update({ id: contactId }, patch);
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
}
