// The request and status schemas of shared/src/schemas/summaries.schema.ts (kept here to stay in this folder).
import { createSummarySchema, summaryStatusOf } from '@keyloom/shared';

const contact = '7f1d7a52-4a2e-4c55-9b2c-1f0e8c6d2a11';

describe('createSummarySchema', () => {
  it('defaults versionIds and note and keeps the period', () => {
    const parsed = createSummarySchema.parse({ from: '2026-10-01', to: '2026-11-30', contactIds: [contact] });
    expect(parsed).toEqual({
      from: '2026-10-01',
      to: '2026-11-30',
      versionIds: [],
      contactIds: [contact],
      note: '',
      includeComments: [],
    });
  });

  it('refuses a period that ends before it starts, no recipients and a bad date', () => {
    const backwards = createSummarySchema.safeParse({
      from: '2026-11-30',
      to: '2026-10-01',
      contactIds: [contact],
    });
    expect(backwards.error?.issues.map((issue) => issue.path.join('.'))).toEqual(['to']);
    const none = createSummarySchema.safeParse({ from: '2026-10-01', to: '2026-10-02', contactIds: [] });
    expect(none.error?.issues[0]?.message).toBe('Choose at least one family contact.');
    const bad = createSummarySchema.safeParse({
      from: '2026-13-01',
      to: '2026-10-02',
      contactIds: [contact],
    });
    expect(bad.success).toBe(false);
  });
});

describe('summaryStatusOf', () => {
  it('is sending while any recipient waits, then sent, partly_failed or failed', () => {
    expect(summaryStatusOf(['sent', 'queued'])).toBe('sending');
    expect(summaryStatusOf(['sent', 'sent'])).toBe('sent');
    expect(summaryStatusOf(['sent', 'failed'])).toBe('partly_failed');
    expect(summaryStatusOf(['failed'])).toBe('failed');
  });
});
