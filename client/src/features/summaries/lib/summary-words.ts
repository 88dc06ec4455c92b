import type { Contact, SummaryRecipient } from '@keyloom/shared';
import type { BadgeTone } from '@/components/ui/badge';

// Words for what happened to each e-mail, and why a contact cannot be chosen: the clinician reads
// these, so SMTP codes and socket errors become sentences (the original is kept beside them).

export type RecipientState = 'queued' | 'retrying' | 'sent' | 'failed' | 'stopped';

/**
 * One state per recipient row: "stopped" (the contact used the stop link) wins over the delivery
 * status, because it is what matters for the next summary; a queued row that has tried is "retrying".
 */
export const recipientState = (
  r: Pick<SummaryRecipient, 'status' | 'attempts' | 'stopped'>,
): RecipientState => {
  if (r.stopped) return 'stopped';
  if (r.status === 'queued') return r.attempts > 0 ? 'retrying' : 'queued';
  return r.status;
};

export const recipientStateLabels: Record<RecipientState, string> = {
  queued: 'Waiting to send',
  retrying: 'Waiting — will try again',
  sent: 'Sent',
  failed: 'Not delivered',
  stopped: 'Stopped summaries',
};

export const recipientStateTones: Record<RecipientState, BadgeTone> = {
  queued: 'neutral',
  retrying: 'warn',
  sent: 'good',
  failed: 'bad',
  stopped: 'warn',
};

/**
 * A delivery error in plain words. SMTP reply codes: 5xx permanent, 4xx transient (RFC 5321
 * §4.2.1); connection errors are Node's socket codes. Messages the server already wrote in words
 * (they start with "Not sent" or "Not queued") are kept as they are.
 */
export const failureWords = (lastError: string | null): string | null => {
  if (lastError === null || lastError.trim() === '') return null;
  const text = lastError.trim();
  if (/^Not (sent|queued)/.test(text)) return text;
  if (
    /ECONNREFUSED|ETIMEDOUT|ECONNRESET|ENOTFOUND|EHOSTUNREACH|Greeting never received|connect/i.test(text)
  ) {
    return `The mail server could not be reached (${text}).`;
  }
  const code = /^(\d{3})\b/.exec(text)?.[1] ?? /\b([45]\d\d)[ -]/.exec(text)?.[1];
  if (code?.startsWith('5')) return `The receiving mail server refused this e-mail for good (${text}).`;
  if (code?.startsWith('4')) return `The receiving mail server asked to try later (${text}).`;
  return `The mail server answered: ${text}`;
};

/** Why a contact cannot be chosen as a recipient; null when they can. */
export const contactBlockedReason = (
  contact: Pick<Contact, 'consentToSummaries' | 'unsubscribedAt'>,
): string | null => {
  if (contact.unsubscribedAt !== null) return 'Stopped summaries with the link in an earlier e-mail.';
  if (!contact.consentToSummaries) return 'Has not agreed to receive summaries.';
  return null;
};
