import { auditActionLabels } from '@keyloom/shared';

/** Plain words for an action; unknown actions show their name. */
export const describeAction = (action: string): string =>
  (auditActionLabels as Record<string, string>)[action] ?? action;

// The filter's choices: groups (prefixes ending in ".") first, then each known action.
export const auditActionOptions = [
  { value: '', label: 'Any action' },
  { value: 'auth.', label: 'All sign-ins and sign-outs' },
  { value: 'client.', label: 'All client record changes' },
  { value: 'assignment.', label: 'All carer assignments' },
  { value: 'consent.', label: 'All consent events' },
  { value: 'contact.', label: 'All family contact changes' },
  { value: 'sample.', label: 'All language sample events' },
  { value: 'profile.', label: 'All profile version events' },
  { value: 'trial.', label: 'All test keyboard trials' },
  { value: 'practice-phrase.', label: 'All practice phrase changes' },
  { value: 'summary.', label: 'All progress summary events' },
  { value: 'report.', label: 'All report downloads' },
  ...Object.entries(auditActionLabels).map(([value, label]) => ({ value, label })),
];

/** A one-line summary of an event's details: "key: value" pairs, objects and lists shortened. */
export const summariseDetails = (details: Record<string, unknown>): string =>
  Object.entries(details)
    .map(([key, value]) => {
      if (value === null || value === undefined) return `${key}: —`;
      if (Array.isArray(value))
        return `${key}: ${value.length > 3 ? `${value.length} items` : value.join(', ')}`;
      if (typeof value === 'object') return `${key}: ${Object.keys(value).length} fields`;
      const text = String(value);
      // Hashes and ids are for matching, not reading: the first characters are enough on screen.
      return `${key}: ${/^[0-9a-f-]{32,}$/i.test(text) ? `${text.slice(0, 12)}…` : text}`;
    })
    .join('; ');
