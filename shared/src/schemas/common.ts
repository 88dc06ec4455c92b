import { z } from 'zod';

// ---------------------------------------------------------------------------------------------------
// Text: one rule for every string a person sends.
//
// PostgreSQL cannot store the character U+0000 in a text value (PostgreSQL documentation, "Character
// Types": "the character with code zero cannot be stored"); the other C0 control characters and DEL are
// invisible and never typed. A lone UTF-16 surrogate (U+D800–U+DFFF outside a pair) is not a Unicode
// scalar value and has no UTF-8 encoding (Unicode Standard, chapter 3, D76 and D92), so it would be
// turned into U+FFFD or refused by the database. Tab, line feed and carriage return are allowed in
// fields that hold several lines.

/** Short names of the C0 controls, for the message ("NUL", "BEL"…); others are shown as U+XXXX. */
const controlNames: Record<number, string> = {
  0x00: 'NUL',
  0x07: 'BEL',
  0x08: 'BS',
  0x1b: 'ESC',
  0x7f: 'DEL',
};

/** `U+0041`-style label of a code unit or code point. */
const codeLabel = (code: number) => `U+${code.toString(16).toUpperCase().padStart(4, '0')}`;

/**
 * The first character `text` may not hold, as a message, or null when the text can be stored.
 * `multiline` lets tab, line feed and carriage return through.
 */
export function unsafeTextProblem(text: string, multiline: boolean): string | null {
  for (let i = 0; i < text.length; i++) {
    const unit = text.charCodeAt(i);
    if (unit >= 0xd800 && unit <= 0xdbff) {
      const next = i + 1 < text.length ? text.charCodeAt(i + 1) : 0;
      if (next >= 0xdc00 && next <= 0xdfff) {
        i++;
        continue;
      }
      return BROKEN_CHARACTER_MESSAGE;
    }
    if (unit >= 0xdc00 && unit <= 0xdfff) return BROKEN_CHARACTER_MESSAGE;
    const control = unit < 0x20 || unit === 0x7f;
    if (control && !(multiline && (unit === 0x09 || unit === 0x0a || unit === 0x0d))) {
      return `Contains a character that cannot be stored (${controlNames[unit] ?? codeLabel(unit)}).`;
    }
  }
  return null;
}

export const BROKEN_CHARACTER_MESSAGE = 'Contains a broken character (unpaired surrogate).';

/** The check itself, shared by every text field (one object, so tests can see it is attached). */
export const singleLineTextCheck = z.superRefine<string>((text, ctx) => {
  const problem = unsafeTextProblem(text, false);
  if (problem) ctx.addIssue({ code: 'custom', message: problem, input: text });
});
export const multiLineTextCheck = z.superRefine<string>((text, ctx) => {
  const problem = unsafeTextProblem(text, true);
  if (problem) ctx.addIssue({ code: 'custom', message: problem, input: text });
});

type TextOptions = {
  /** Message when the value is missing or not a string. */
  error?: string;
  /** Tab, line feed and carriage return allowed (notes, comments, pasted text). */
  multiline?: boolean;
};

/**
 * A string that can be stored as it is: no NUL or other control character (tab and line breaks only
 * where `multiline`), no unpaired surrogate. Every string field of every request schema starts here.
 */
export const safeText = ({ error, multiline = false }: TextOptions = {}) =>
  (error ? z.string({ error }) : z.string()).check(multiline ? multiLineTextCheck : singleLineTextCheck);

// Optional free text that arrives as "" from an empty form field: stored as null.
export const optionalText = (max: number, tooLong: string, { multiline = true } = {}) =>
  safeText({ multiline })
    .trim()
    .max(max, { error: tooLong })
    .transform((value) => (value === '' ? null : value))
    .nullable()
    .optional();

// ---------------------------------------------------------------------------------------------------
// Dates: one rule for every calendar date and time a person sends.
//
// ISO 8601 calendar dates "YYYY-MM-DD" that exist (no 31 April, 29 February only in leap years), within
// a range a clinic's records can hold. PostgreSQL's date type has no year 0 (it counts 1 BC before AD 1),
// so "0000-06-01" is out of range there. The range 1900..2100 is common practice, no source.
export const EARLIEST_DATE = '1900-01-01';
export const LATEST_DATE = '2100-12-31';
const DATE_SHAPE = /^(\d{4})-(\d{2})-(\d{2})$/;
// The messages name the parts a person fills in (a date box asks for day, month and year) and the
// text form a request carries; the range is written as the web app writes every day ("1 Jan 1900").
export const DATE_FORMAT_MESSAGE = 'Enter a date with its day, month and year (YYYY-MM-DD).';
export const DATE_RANGE_MESSAGE = 'Enter a date between 1 Jan 1900 and 31 Dec 2100.';

/** True when "YYYY-MM-DD" names a day of the (proleptic Gregorian) calendar. */
function isCalendarDay(year: number, month: number, day: number): boolean {
  if (month < 1 || month > 12 || day < 1) return false;
  const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
  const days = [31, leap ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][month - 1];
  return day <= days;
}

/** The problem with an ISO date string, or null when it is a real date within range. */
export function dateProblem(value: string): string | null {
  const match = DATE_SHAPE.exec(value);
  if (!match) return DATE_FORMAT_MESSAGE;
  const [year, month, day] = match.slice(1).map(Number);
  if (!isCalendarDay(year, month, day))
    return `${value} is not a day of the calendar: enter a day, month and year that exist (YYYY-MM-DD).`;
  // ISO dates compare correctly as strings.
  if (value < EARLIEST_DATE || value > LATEST_DATE) return DATE_RANGE_MESSAGE;
  return null;
}

const dateCheck = z.superRefine<string>((value, ctx) => {
  const problem = dateProblem(value);
  if (problem) ctx.addIssue({ code: 'custom', message: problem, input: value });
});

// A calendar date as ISO "YYYY-MM-DD" (consent dates, sample periods, summary periods, audit filters).
export const isoDateField = z.string({ error: DATE_FORMAT_MESSAGE }).check(dateCheck);

/** Today's calendar date on this machine's clock, as "YYYY-MM-DD" (local time, like the clinic's forms). */
export function localTodayIso(now: Date = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}

// A calendar date that has already come: the day something was given or signed (never after today).
export const pastDateField = (futureMessage: string) =>
  isoDateField.check(
    z.superRefine<string>((value, ctx) => {
      if (dateProblem(value) === null && value > localTodayIso()) {
        ctx.addIssue({ code: 'custom', message: futureMessage, input: value });
      }
    }),
  );

// A moment as ISO 8601 date and time with its offset ("2026-05-01T10:00:00Z"), its date within range.
export const isoDateTimeField = z.iso
  .datetime({ offset: true, error: 'Enter a date and time as YYYY-MM-DDTHH:MM:SSZ.' })
  .check(
    z.superRefine<string>((value, ctx) => {
      const problem = dateProblem(value.slice(0, 10));
      if (problem) ctx.addIssue({ code: 'custom', message: problem, input: value });
    }),
  );

// ---------------------------------------------------------------------------------------------------
// Numbers: a number, or a string of digits from a form or a query string; never an array or object
// (`Number(["1"])` is 1, which z.coerce would take).

const fromText = (value: unknown) =>
  typeof value === 'string' && value.trim() !== '' ? Number(value) : value;

/** `schema` (a number schema) also taking numbers that arrive as text (query strings, form fields). */
export const numberField = <T extends z.ZodType>(schema: T) => z.preprocess(fromText, schema);

// One page of a list and its total, for every paged GET.
export const pageQuerySchema = z.object({
  page: numberField(z.number({ error: 'Give the page as a whole number.' }).int().min(1)).default(1),
  pageSize: numberField(
    z.number({ error: 'Give the page size as a whole number.' }).int().min(1).max(200),
  ).default(50),
});
