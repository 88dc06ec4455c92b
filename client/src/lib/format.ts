const dateTime = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

/** "3 Feb 2026, 14:05" from an ISO timestamp; the text itself when it is not a date. */
export const formatDateTime = (iso: string): string => {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : dateTime.format(date);
};

/** Today as YYYY-MM-DD in the reader's own time zone. */
export const todayIso = (now = new Date()): string =>
  `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`;

const day = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeZone: 'UTC' });

/** "3 Feb 2026" from a calendar day (YYYY-MM-DD) or a timestamp; "—" for none. */
export const formatDate = (iso: string | null): string => {
  if (!iso) return '—';
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : day.format(date);
};

/** "1 Nov 2026 to 30 Nov 2026" from two calendar days; "…" stands for an open end, "—" when both are open. */
export const formatDateRange = (from: string | null, to: string | null): string =>
  from || to ? `${from ? formatDate(from) : '…'} to ${to ? formatDate(to) : '…'}` : '—';

const partWords: Partial<Record<Intl.DateTimeFormatPartTypes, string>> = {
  day: 'day',
  month: 'month',
  year: 'year',
};

/**
 * What a browser's date box asks for, in the order it shows the parts for the reader's language (a
 * date box follows the browser's language, not the page's): "Day, month, year, e.g. 14/09/2026" in
 * en-GB, "Month, day, year, e.g. 09/14/2026" in en-US.
 */
export const dateInputHint = (locale: string = globalThis.navigator?.language ?? 'en-GB'): string => {
  const parts = new Intl.DateTimeFormat(locale, {
    day: '2-digit',
    month: '2-digit',
    year: 'numeric',
    timeZone: 'UTC',
  }).formatToParts(new Date('2026-09-14'));
  const named = parts.filter((part) => partWords[part.type]).map((part) => partWords[part.type]);
  const words = named.join(', ');
  return `${words.charAt(0).toUpperCase()}${words.slice(1)}, e.g. ${parts.map((part) => part.value).join('')}`;
};

/** "6,467": a count with thousands separators. */
export const formatCount = (value: number): string => value.toLocaleString('en-GB');
