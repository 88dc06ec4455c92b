import type { Consent as ConsentDto } from '@keyloom/shared';
import { consentRecordStatus } from '../consent-status';
import type { Consent } from '../consent.entity';

export type { ConsentDto };

/** Entity (with recordedBy/withdrawnBy/voidedBy joined) → the shared consentSchema shape. */
export function toConsentDto(consent: Consent, today: string): ConsentDto {
  return {
    id: consent.id,
    clientId: consent.clientId,
    givenBy: consent.givenBy,
    representativeName: consent.representativeName,
    representativeRelationship: consent.representativeRelationship,
    scopes: consent.scopes,
    givenOn: consent.givenOn,
    expiresOn: consent.expiresOn,
    notes: consent.notes,
    status: consentRecordStatus(consent, today),
    recordedBy: consent.recordedBy?.name ?? '',
    createdAt: consent.createdAt.toISOString(),
    withdrawnAt: consent.withdrawnAt ? consent.withdrawnAt.toISOString() : null,
    withdrawnBy: consent.withdrawnBy ? consent.withdrawnBy.name : null,
    withdrawalReason: consent.withdrawalReason,
    withdrawal: consent.withdrawal,
    voidedAt: consent.voidedAt ? consent.voidedAt.toISOString() : null,
    voidedBy: consent.voidedBy ? consent.voidedBy.name : null,
    voidReason: consent.voidReason,
    voidReport: consent.voidReport,
    document:
      consent.documentName && consent.documentMime && consent.documentSize !== null
        ? { fileName: consent.documentName, mimeType: consent.documentMime, byteSize: consent.documentSize }
        : null,
  };
}
