import type {
  Assignment,
  Client as ClientDto,
  ClientSummary,
  ConsentScope,
  PersonRef,
} from '@keyloom/shared';
import { clientConsentStatus, coversScope, type ConsentTerms } from '../../consents/consent-status';
import type { Client } from '../client.entity';

export type { Assignment, ClientDto, ClientSummary };

/** An active carer offered by the assignment picker. */
export type CarerOption = PersonRef & { email: string };

/** What the summary needs besides the client row, gathered in bulk by ClientsService. */
export type SummaryContext = {
  clinician: PersonRef;
  carers: PersonRef[];
  /** The client's consent records, newest first. */
  consents: ConsentTerms[];
  sampleCount: number;
  today: string;
};

const consentFlag = (consents: ConsentTerms[], scope: ConsentScope, today: string) =>
  coversScope(consents, scope, today);

/** Entity + context → a caseload row (clientSummarySchema). */
export function toClientSummary(client: Client, context: SummaryContext): ClientSummary {
  return {
    id: client.id,
    pseudonym: client.pseudonym,
    accessMethod: client.accessMethod,
    clinician: context.clinician,
    carers: context.carers,
    consentStatus: clientConsentStatus(context.consents, context.today),
    trainingConsent: consentFlag(context.consents, 'training', context.today),
    summariesConsent: consentFlag(context.consents, 'summaries', context.today),
    sampleCount: context.sampleCount,
    createdAt: client.createdAt.toISOString(),
    updatedAt: client.updatedAt.toISOString(),
  };
}

/**
 * Entity + context → the client page (clientSchema). Carers get the goals but never the notes, nor
 * the preferred name (a name the family uses, as private as the family contacts carers do not see).
 */
export function toClientDto(client: Client, context: SummaryContext, clinicalTeam: boolean): ClientDto {
  return {
    ...toClientSummary(client, context),
    preferredName: clinicalTeam ? client.preferredName : null,
    scanIntervalMs: client.scanIntervalMs,
    dwellMs: client.dwellMs,
    keyTimeMs: client.keyTimeMs,
    goals: client.goals,
    notes: clinicalTeam ? client.notes : null,
  };
}
