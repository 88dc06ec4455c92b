import { describe, expect, it } from 'vitest';
import { dateInputHint, formatDate, formatDateRange, formatDateTime } from './format';

// Expected strings follow Unicode CLDR's en-GB medium patterns: date "d MMM y" (September is "Sept"),
// date and time "d MMM y, HH:mm". Timestamps are read in the test machine's zone, UTC here.
describe('date formats', () => {
  it('writes a calendar day and a timestamp the same way, the day never shifted by the zone', () => {
    expect(formatDate('2026-12-03')).toBe('3 Dec 2026');
    expect(formatDate('2026-09-14')).toBe('14 Sept 2026');
    expect(formatDate('2026-12-03T23:30:00.000Z')).toBe('3 Dec 2026');
    expect(formatDateTime('2026-12-03T14:05:00.000Z')).toBe('3 Dec 2026, 14:05');
  });

  it('keeps text that is not a date and shows a dash for none', () => {
    expect(formatDate(null)).toBe('—');
    expect(formatDate('soon')).toBe('soon');
    expect(formatDateTime('soon')).toBe('soon');
  });

  it('writes a period with both ends in the same format, an open end as "…"', () => {
    expect(formatDateRange('2026-11-01', '2026-11-30')).toBe('1 Nov 2026 to 30 Nov 2026');
    expect(formatDateRange('2026-11-01', null)).toBe('1 Nov 2026 to …');
    expect(formatDateRange(null, '2026-11-30')).toBe('… to 30 Nov 2026');
    expect(formatDateRange(null, null)).toBe('—');
  });
});

describe('date box hint', () => {
  // CLDR short dates: en-GB "dd/MM/y", en-US "M/d/y" (Unicode CLDR); a date box shows its parts in
  // that order (Chromium: dd/mm/yyyy in en-GB, mm/dd/yyyy in en-US).
  it('names the parts in the order the reader’s date box shows them, with an example', () => {
    expect(dateInputHint('en-GB')).toBe('Day, month, year, e.g. 14/09/2026');
    expect(dateInputHint('en-US')).toBe('Month, day, year, e.g. 09/14/2026');
  });
});
