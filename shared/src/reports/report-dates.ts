// Dates as the printed reports write them: "3 Dec 2026", the calendar day in UTC, so the print view
// and the PDF write the same day whatever the reader's time zone.
const day = new Intl.DateTimeFormat('en-GB', {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  timeZone: 'UTC',
});

/** "3 Dec 2026" from a timestamp or a calendar day (YYYY-MM-DD); null for none or not a date. */
export function reportDate(iso: string | Date | null | undefined): string | null {
  if (!iso) return null;
  const date = iso instanceof Date ? iso : new Date(iso);
  return Number.isNaN(date.getTime()) ? null : day.format(date);
}
