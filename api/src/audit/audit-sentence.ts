import { auditActionLabels, reportDate } from '@keyloom/shared';
import type { AuditDetails } from './audit-event.entity';

/** What an event's sentence needs: the stored event, with user ids already resolved to names. */
export type SentenceInput = {
  action: string;
  /** The actor's name; null when the account is gone or the event came from Keyloom itself. */
  actorName: string | null;
  /** The e-mail typed at the time (a refused sign-in has no account). */
  actorEmail: string | null;
  subjectType: string | null;
  subjectId: string | null;
  clientPseudonym: string | null;
  details: AuditDetails;
  /** Names of the users the event mentions (subject or details), by id. */
  userNames: ReadonlyMap<string, string>;
};

type FieldChange = { from: unknown; to: unknown };

const isChange = (value: unknown): value is FieldChange =>
  value !== null && typeof value === 'object' && 'from' in value && 'to' in value;

const possessive = (name: string): string => `${name}’s`;

/** "dateOfBirth" → "date of birth". */
const fieldWords = (field: string): string => field.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase();

/** "a", "a and b", "a, b and c". */
const listOf = (items: readonly string[]): string =>
  items.length <= 1 ? (items[0] ?? '') : `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;

const count = (n: unknown, one: string, many: string): string | null =>
  typeof n === 'number' ? `${n} ${n === 1 ? one : many}` : null;

const text = (value: unknown): string => {
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'string' || typeof value === 'number') return String(value);
  return value === null || value === undefined ? 'none' : JSON.stringify(value);
};

/** One field change of a staff account in words: "role from carer to clinician". */
function userChange(field: string, change: FieldChange): string {
  if (field === 'password') return 'password';
  if (field === 'active')
    return `account from ${change.from ? 'active' : 'inactive'} to ${change.to ? 'active' : 'inactive'}`;
  return `${fieldWords(field)} from ${text(change.from)} to ${text(change.to)}`;
}

/**
 * An event in plain words, e.g. "Imogen Hale changed Sam Okafor’s role from carer to clinician". Before
 * and after values appear where the details hold them (`changes: { field: { from, to } }`); other
 * events name the fields, counts or version numbers they stored. Actions without their own sentence
 * read "<who>: <the action's label>", with the client when there is one.
 */
export function auditSentence(event: SentenceInput): string {
  const who = event.actorName ?? event.actorEmail ?? 'Keyloom';
  const d = event.details;
  const client = event.clientPseudonym;
  const userName = (id: unknown): string =>
    (typeof id === 'string' && event.userNames.get(id)) || 'a staff member no longer listed';
  const subjectUser = userName(event.subjectId);
  const version = typeof d.number === 'number' ? `version ${d.number}` : 'a version';

  switch (event.action) {
    case 'user.create':
      return `${who} added a staff account for ${subjectUser}${typeof d.role === 'string' ? ` as ${d.role}` : ''}`;
    case 'user.update': {
      const changes = d.changes && typeof d.changes === 'object' ? Object.entries(d.changes) : [];
      const parts = changes.filter(([, c]) => isChange(c)).map(([f, c]) => userChange(f, c as FieldChange));
      if (parts.length > 0) return `${who} changed ${possessive(subjectUser)} ${listOf(parts)}`;
      return `${who} changed ${possessive(subjectUser)} account`;
    }
    case 'client.update': {
      const fields = Array.isArray(d.fields) ? d.fields.map((f) => fieldWords(String(f))) : [];
      const what = fields.length > 0 ? `: ${listOf(fields)}` : '';
      return `${who} changed ${possessive(client ?? 'a client')} record${what}`;
    }
    case 'assignment.create':
      return `${who} assigned ${userName(d.carerId)} as carer of ${client ?? 'a client'}`;
    case 'assignment.delete':
      return `${who} removed ${userName(d.carerId)} as carer of ${client ?? 'a client'}`;
    case 'consent.void':
      return `${who} voided a consent record of ${client ?? 'a client'} made in error`;
    case 'consent.withdraw':
      return `${who} recorded that ${client ?? 'a client'} withdrew consent`;
    case 'profile.approve': {
      // Events logged before the numbers were stored name no version.
      const retiring =
        typeof d.retiredNumber === 'number'
          ? `, retiring version ${d.retiredNumber}`
          : d.retired
            ? ', retiring the one before'
            : '';
      if (typeof d.number !== 'number')
        return `${who} approved a profile version of ${client ?? 'a client'}${retiring}`;
      return `${who} approved ${version} of ${possessive(client ?? 'a client')} profile${retiring}`;
    }
    case 'profile.sign-off':
      return `${who} signed off ${version} of ${possessive(client ?? 'a client')} profile after a trial`;
    case 'profile.send-back':
      return `${who} sent ${version} of ${possessive(client ?? 'a client')} profile back for changes`;
    case 'profile.report-problem':
      return `${who} reported a problem with ${version} of ${possessive(client ?? 'a client')} profile after a trial`;
    case 'profile.retire':
      return `${who} retired ${version} of ${possessive(client ?? 'a client')} profile`;
    case 'report.version-pdf':
      return `${who} downloaded the PDF report of ${version} of ${possessive(client ?? 'a client')} profile`;
    case 'report.client-pdf': {
      const from = typeof d.from === 'string' ? reportDate(d.from) : null;
      const to = typeof d.to === 'string' ? reportDate(d.to) : null;
      const period = from && to ? ` for ${from} to ${to}` : '';
      return `${who} downloaded the PDF report of ${client ?? 'a client'}${period}`;
    }
    case 'summary.send':
    case 'summary.resend': {
      const to = count(d.recipients, 'family contact', 'family contacts');
      const again = event.action === 'summary.resend' ? ' again' : '';
      return `${who} sent a progress summary about ${client ?? 'a client'}${again}${to ? ` to ${to}` : ''}`;
    }
    default: {
      const label = (auditActionLabels as Record<string, string>)[event.action] ?? event.action;
      return `${who}: ${label}${client ? ` (${client})` : ''}`;
    }
  }
}
