import type { Contact as ContactDto } from '@keyloom/shared';
import type { FamilyContact } from '../family-contact.entity';

export type { ContactDto };

/** Entity → the shared contactSchema shape. */
export function toContactDto(contact: FamilyContact): ContactDto {
  return {
    id: contact.id,
    clientId: contact.clientId,
    name: contact.name,
    relationship: contact.relationship,
    email: contact.email,
    consentToSummaries: contact.consentToSummaries,
    unsubscribedAt: contact.unsubscribedAt ? contact.unsubscribedAt.toISOString() : null,
    summariesConsentGivenOn: contact.summariesConsentGivenOn,
    summariesConsentGivenBy: contact.summariesConsentGivenBy,
    createdAt: contact.createdAt.toISOString(),
  };
}
