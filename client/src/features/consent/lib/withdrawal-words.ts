import type { WithdrawalReport } from '@keyloom/shared';

// Plain words for each kind of row a withdrawal deletes or stops (the API's hook names). A kind
// not listed here shows its name, so a new kind is still reported.
const kindWords: Record<string, readonly [one: string, many: string]> = {
  samples: ['language sample', 'language samples'],
  sampleFlags: ['personal-data flag on those samples', 'personal-data flags on those samples'],
  profileVersions: [
    'profile version (its model and measures)',
    'profile versions (their models and measures)',
  ],
  trials: ['test keyboard trial', 'test keyboard trials'],
  practicePhrases: ['practice phrase of the client’s own', 'practice phrases of the client’s own'],
  summaryEmails: ['queued summary e-mail', 'queued summary e-mails'],
};

/** "3 language samples", "1 test keyboard trial". */
export const countWords = (kind: string, count: number): string => {
  const words = kindWords[kind];
  if (!words) return `${count} ${kind}`;
  return `${count} ${count === 1 ? words[0] : words[1]}`;
};

/** The report's deleted kinds with a count above 0, samples first, in plain words. */
export const deletedItems = (report: WithdrawalReport): string[] => {
  const items = report.samplesDeleted > 0 ? [countWords('samples', report.samplesDeleted)] : [];
  for (const [kind, count] of Object.entries(report.derived)) {
    // Reports stored before samples had their own field may repeat them under "samples".
    if (kind !== 'samples' && count > 0) items.push(countWords(kind, count));
  }
  return items;
};

/** The stopped kinds (queued e-mails) with a count above 0. */
export const cancelledItems = (report: WithdrawalReport): string[] =>
  Object.entries(report.cancelled ?? {})
    .filter(([, count]) => count > 0)
    .map(([kind, count]) => countWords(kind, count));

/** One sentence for after the withdrawal: what was deleted and what will not be sent. */
export const reportSentence = (report: WithdrawalReport): string => {
  const deleted = deletedItems(report);
  const cancelled = cancelledItems(report);
  const parts = [deleted.length > 0 ? `Deleted: ${deleted.join(', ')}.` : 'Nothing was deleted.'];
  if (cancelled.length > 0) parts.push(`Not sent: ${cancelled.join(', ')}.`);
  return parts.join(' ');
};
