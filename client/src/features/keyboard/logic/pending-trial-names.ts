// Trials queued in localStorage by an earlier release use the old field names: `clientTrialId`
// (now `localTrialId`) and `settings.method` (now `settings.selectionMode`). They are renamed on
// reading, so a trial queued before an update is still sent instead of being dropped as invalid.

const rename = (record: Record<string, unknown>, from: string, to: string): Record<string, unknown> => {
  if (!(from in record) || to in record) return record;
  const { [from]: value, ...rest } = record;
  return { ...rest, [to]: value };
};

const isRecord = (value: unknown): value is Record<string, unknown> =>
  typeof value === 'object' && value !== null && !Array.isArray(value);

/** The stored queue with each trial's old field names replaced by the current ones; anything else as it was. */
export function withCurrentNames(queue: unknown): unknown {
  if (!Array.isArray(queue)) return queue;
  return queue.map((item: unknown) => {
    if (!isRecord(item) || !isRecord(item.input)) return item;
    const input = rename(item.input, 'clientTrialId', 'localTrialId');
    if (isRecord(input.settings)) input.settings = rename(input.settings, 'method', 'selectionMode');
    return { ...item, input };
  });
}
