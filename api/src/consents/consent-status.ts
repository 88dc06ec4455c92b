import { type ConsentScope, type ConsentStatus, localTodayIso } from '@keyloom/shared';

/** The parts of a consent record that decide whether it is in force. Dates are "YYYY-MM-DD". */
export type ConsentTerms = {
  scopes: readonly ConsentScope[];
  givenOn: string;
  expiresOn: string | null;
  withdrawnAt: Date | string | null;
  /** Set when the record was voided as made in error; absent counts as not voided. */
  voidedAt?: Date | string | null;
};

/** Today's calendar date on the server's clock, as "YYYY-MM-DD" (local time, like the clinic's forms). */
export const todayIso = localTodayIso;

/**
 * Status of one record on `today`: voided (recorded in error) beats everything, then withdrawn (it
 * cannot be undone), then an expiry date before today; otherwise active. ISO dates compare correctly
 * as strings.
 */
export function consentRecordStatus(
  terms: ConsentTerms,
  today: string,
): 'active' | 'expired' | 'withdrawn' | 'voided' {
  if (terms.voidedAt != null) return 'voided';
  if (terms.withdrawnAt !== null) return 'withdrawn';
  if (terms.expiresOn !== null && terms.expiresOn < today) return 'expired';
  return 'active';
}

/** True when the record covers `today`: not withdrawn, already given (givenOn ≤ today), not expired. */
export function isInForce(terms: ConsentTerms, today: string): boolean {
  return consentRecordStatus(terms, today) === 'active' && terms.givenOn <= today;
}

/** True when some record in force covers `scope` (e.g. "training": uploads and training are allowed). */
export function coversScope(records: readonly ConsentTerms[], scope: ConsentScope, today: string): boolean {
  return records.some((record) => isInForce(record, today) && record.scopes.includes(scope));
}

/**
 * Where consent stands for a client: "active" when any record is in force; otherwise the status of
 * the newest record ("withdrawn" or "expired"); "none" without records (or with only a record whose
 * givenOn is still ahead). A voided record was never consent: it is left out. `newestFirst` must be
 * ordered by creation, newest first.
 */
export function clientConsentStatus(newestFirst: readonly ConsentTerms[], today: string): ConsentStatus {
  if (newestFirst.some((record) => isInForce(record, today))) return 'active';
  const newest = newestFirst.find((record) => record.voidedAt == null);
  if (!newest) return 'none';
  const status = consentRecordStatus(newest, today);
  return status === 'active' || status === 'voided' ? 'none' : status;
}

/**
 * What withdrawing one record releases: the scopes it lists that no OTHER record in force still
 * covers. The data of a released scope is removed; a scope another record covers keeps its data
 * (two training consents: withdrawing one deletes nothing). A record given in the future or expired
 * is not in force, so it keeps nothing.
 */
export function releasedScopes(
  withdrawn: Pick<ConsentTerms, 'scopes'>,
  others: readonly ConsentTerms[],
  today: string,
): ConsentScope[] {
  return withdrawn.scopes.filter((scope) => !coversScope(others, scope, today));
}
