// Each recorded action in plain words (the names are the API's, issue 4 contract and foundation).
export const auditActionLabels: Record<string, string> = {
  'auth.sign-in': 'Signed in',
  'auth.sign-out': 'Signed out',
  'auth.sign-in-failed': 'Sign-in refused',
  'user.create': 'Added a staff account',
  'user.update': 'Changed a staff account',
  'client.create': 'Opened a client record',
  'client.update': 'Changed a client record',
  'assignment.create': 'Assigned a carer',
  'assignment.delete': 'Removed a carer',
  'consent.create': 'Recorded consent',
  'consent.withdraw': 'Recorded a consent withdrawal',
  'consent.document-upload': 'Attached a scanned consent form',
  'contact.create': 'Added a family contact',
  'contact.update': 'Changed a family contact',
  'sample.upload': 'Uploaded a language sample',
  'sample.paste': 'Stored pasted text',
  'sample.duplicate-refused': 'Refused a duplicate upload',
  'sample.flag-redact': 'Redacted personal data',
  'sample.flag-keep': 'Kept flagged text',
  'sample.exclude': 'Left a sample out',
  'sample.delete': 'Deleted a sample (consent withdrawn)',
};

/** Plain words for an action; unknown actions show their name. */
export const describeAction = (action: string): string => auditActionLabels[action] ?? action;

// The filter's choices: groups (prefixes ending in ".") first, then each known action.
export const auditActionOptions = [
  { value: '', label: 'Any action' },
  { value: 'auth.', label: 'All sign-ins and sign-outs' },
  { value: 'client.', label: 'All client record changes' },
  { value: 'assignment.', label: 'All carer assignments' },
  { value: 'consent.', label: 'All consent events' },
  { value: 'contact.', label: 'All family contact changes' },
  { value: 'sample.', label: 'All language sample events' },
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
