import type { AuditDetails } from './audit-event.entity';

/**
 * Detail keys that hold free text about a client: what they wrote (sample, phrase and trial text),
 * what staff wrote about them (notes, comments, reasons), and names that can identify them or their
 * family (file names, titles, contacts' names, addresses and relationships). An event about a client
 * keeps ids, counts, sizes, hashes and field names only: the log is read by admins who may not read
 * the record, and it outlives a withdrawal that deletes the text. Source: OWASP Cheat Sheet Series,
 * Logging Cheat Sheet, "Data to exclude" (sensitive personal data such as health information is not
 * to be recorded directly). The exact list of keys is ours: common practice, no source.
 */
export const CLIENT_TEXT_KEYS: ReadonlySet<string> = new Set([
  'text',
  'phrase',
  'sample',
  'note',
  'notes',
  'comment',
  'reason',
  'withdrawalReason',
  'sentBackReason',
  'redaction',
  'redactedText',
  'match',
  'fileName',
  'documentName',
  'title',
  'name',
  'preferredName',
  'email',
  'relationship',
  'representativeName',
  'representativeRelationship',
]);

/** Details without any CLIENT_TEXT_KEYS, at any depth (objects and arrays); `removed` lists the paths. */
export function withoutClientText(details: AuditDetails): { details: AuditDetails; removed: string[] } {
  const removed: string[] = [];
  const clean = (value: unknown, path: string): unknown => {
    if (Array.isArray(value)) return value.map((item, index) => clean(item, `${path}[${index}]`));
    if (value === null || typeof value !== 'object' || value instanceof Date) return value;
    const out: Record<string, unknown> = {};
    for (const [key, inner] of Object.entries(value)) {
      const at = path ? `${path}.${key}` : key;
      if (CLIENT_TEXT_KEYS.has(key)) removed.push(at);
      else out[key] = clean(inner, at);
    }
    return out;
  };
  return { details: clean(details, '') as AuditDetails, removed };
}
