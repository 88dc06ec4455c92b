// Finding likely personal data in a sample before any model sees it. Rules (each a regular
// expression plus a check; all common practice, no source):
// - email: local@domain.tld (ASCII letters, digits and ._%+- before @; a dotted domain, TLD ≥ 2 letters).
// - url: starts with http://, https:// or www.; runs to white space; trailing punctuation dropped.
// - phone and long_digits come from one scan of number runs (digit groups joined by single spaces,
//   dashes or dots, optionally with a leading +country code, "(0)" or an area code in brackets;
//   never touching letters, or ",digit" / ":digit" / ".digit" — so prices, times and decimals are
//   not runs). A run is a phone when it has a + and 8–15 digits (E.164 allows at most 15), starts
//   with 0 and has 10–11 digits (UK national numbers), or has the US shape 3-3-4 digits (10) or
//   1-3-3-4 (11, leading 1), or (area) 3-4 — so a US-shaped 3-3-4 identity number reads as a
//   phone (it is flagged either way). Otherwise, with ≥ 9 digits, only spaces or dashes
//   between groups and not just a list of years, it is long_digits (card or identity numbers).
// - street_address: a house number (1–5 digits, optional letter) then 1–4 capitalised words and a
//   street-type word (Street, St, Road, Rd, Avenue, Lane, Close, Way, …).
// - postcode: UK postcode shape (outward code, optional space, digit + two letters of the unit set)
//   in capitals; US ZIP (5 digits, optional -4) only right after a US state code ("OR 97201"),
//   after "ZIP"/"zip code", or within 60 characters after a street address on the same line.
// - date_of_birth: a date (12/03/1992, 1992-03-12, 12 March 1992, March 12, 1992, 12th of March;
//   numeric dates need a year) with "born", "DOB", "birthday", "date of birth" or "birth date" in
//   the 40 characters before it on the same line, or "birthday" in the 30 after it.
// Overlaps are settled by priority (email, url, date_of_birth, phone, long_digits, street_address,
// postcode): a lower-priority match that overlaps an accepted one is dropped. Sorted by start.
import type { PersonalDataKind } from '../schemas/samples.schema';

/** One likely piece of personal data: code-unit offsets [start, end) and the matched text. */
export type PersonalDataMatch = { kind: PersonalDataKind; start: number; end: number; text: string };

// The lookbehind lets a match start only where a run of local-part characters starts: without it
// a long run without "@" is rescanned from every position (quadratic time).
const EMAIL = /(?<![A-Za-z0-9._%+-])[A-Za-z0-9._%+-]+@[A-Za-z0-9-]+(?:\.[A-Za-z0-9-]+)*\.[A-Za-z]{2,}/g;
const URL = /\b(?:https?:\/\/|www\.)[^\s<>"]+/gi;
const NUMBER_RUN =
  /(?<![\p{L}\p{N}_@/.,:+-])(\+\d{1,3}[ .-]?(?:\(0\)[ .-]?)?|\(\d{2,5}\)[ .-]?)?\d+(?:[ .-]\d+)*(?![\p{L}\p{N}_@]|[.,:-]\d)/gu;
const STREET_TYPES =
  'Street|St|Road|Rd|Avenue|Ave|Lane|Ln|Drive|Dr|Close|Way|Place|Pl|Court|Ct|Crescent|Terrace|Boulevard|Blvd|Gardens|Grove|Square|Sq|Mews|Parade|Row|Walk|Highway|Hwy|Parkway|Pkwy|Circle|Quay|Wharf|Hill';
const STREET_ADDRESS = new RegExp(
  String.raw`(?<![\p{L}\p{N}])\d{1,5}[A-Za-z]?,?[ \t]+(?:\p{Lu}[\p{L}'’-]*[ \t]+){1,4}(?:${STREET_TYPES})\b\.?`,
  'gu',
);
// UK: outward code (A9, A99, A9A, AA9, AA99, AA9A), space optional, inward code digit + 2 letters
// (the unit letters never include C, I, K, M, O, V).
const UK_POSTCODE = /\b[A-Z]{1,2}\d[A-Z\d]? ?\d[ABD-HJLNP-UW-Z]{2}\b/g;
const US_STATES =
  'AL|AK|AZ|AR|CA|CO|CT|DE|DC|FL|GA|HI|ID|IL|IN|IA|KS|KY|LA|ME|MD|MA|MI|MN|MS|MO|MT|NE|NV|NH|NJ|NM|NY|NC|ND|OH|OK|OR|PA|RI|SC|SD|TN|TX|UT|VT|VA|WA|WV|WI|WY';
const ZIP = /(?<![\p{N}-])\d{5}(?:-\d{4})?(?![\p{L}\p{N}]|-\d)/gu;
const ZIP_LEAD = new RegExp(String.raw`(?:\b(?:${US_STATES})|\b(?:ZIP|zip|Zip)(?: [Cc]ode)?:?)[ ,]*$`);

const MONTHS =
  'January|February|March|April|May|June|July|August|September|October|November|December|Jan|Feb|Mar|Apr|Jun|Jul|Aug|Sep|Sept|Oct|Nov|Dec';
const DAY = String.raw`(?:[12]\d|3[01]|0?[1-9])(?:st|nd|rd|th)?`;
const DATE = new RegExp(
  [
    String.raw`\b(?:[12]\d|3[01]|0?[1-9])[/.-](?:1[0-2]|0?[1-9])[/.-](?:\d{4}|\d{2})\b`, // 12/03/1992
    String.raw`\b(?:1[0-2]|0?[1-9])[/.-](?:[12]\d|3[01]|0?[1-9])[/.-](?:\d{4}|\d{2})\b`, // 03/12/1992 (US)
    String.raw`\b\d{4}-(?:1[0-2]|0[1-9])-(?:[12]\d|3[01]|0[1-9])\b`, // 1992-03-12
    String.raw`\b${DAY}(?: of)? (?:${MONTHS})\.?(?:,? \d{4})?\b`, // 12 March 1992, 12th of March
    String.raw`\b(?:${MONTHS})\.? ${DAY}(?:,? \d{4})?\b`, // March 12, 1992
  ].join('|'),
  'g',
);
const BIRTH_BEFORE = /\b(?:born|DOB|D\.O\.B\.?|birthday|date of birth|birth date|birthdate)\b/i;
const BIRTH_AFTER = /\bbirthday\b/i;

const priority: PersonalDataKind[] = [
  'email',
  'url',
  'date_of_birth',
  'phone',
  'long_digits',
  'street_address',
  'postcode',
];

function* matchesOf(re: RegExp, text: string): Generator<RegExpExecArray> {
  re.lastIndex = 0;
  for (let m = re.exec(text); m; m = re.exec(text)) {
    if (m[0].length === 0) re.lastIndex++;
    else yield m;
  }
}

const digitsOf = (s: string) => s.replace(/\D/g, '');

/** 'phone', 'long_digits' or null for one number run (see the rules at the top of the file). */
export function classifyNumberRun(run: string): 'phone' | 'long_digits' | null {
  const digits = digitsOf(run.replace('(0)', ''));
  if (run.startsWith('+')) return digits.length >= 8 && digits.length <= 15 ? 'phone' : null;
  const groups = run
    .replace(/[()]/g, ' ')
    .split(/[ .-]+/)
    .filter((g) => g.length > 0)
    .map((g) => g.length);
  const shape = groups.join('-');
  if (run.startsWith('(') && (shape === '3-3-4' || shape === '3-7')) return 'phone';
  if (!/[.]/.test(run) || shape === '3-3-4' || shape === '1-3-3-4') {
    if (
      digits.startsWith('0') &&
      !digits.startsWith('00') &&
      (digits.length === 10 || digits.length === 11) &&
      groups.length <= 4
    ) {
      return 'phone';
    }
    if (digits.startsWith('00') && digits.length >= 10 && digits.length <= 17) return 'phone';
    if (shape === '3-3-4') return 'phone';
    if (shape === '1-3-3-4' && digits.startsWith('1')) return 'phone';
  }
  if (digits.length < 9 || /[.()+]/.test(run)) return null;
  // 12345-6789 is a ZIP+4 code: left to the postcode rule, which wants an address around it.
  if (shape === '5-4') return null;
  // "1998 2004 2019": a list of years, not one number.
  const parts = run.split(/[ -]+/);
  if (parts.length > 1 && parts.every((p) => /^(?:19|20)\d\d$/.test(p))) return null;
  return 'long_digits';
}

function lineStartBefore(text: string, index: number): number {
  return text.lastIndexOf('\n', index - 1) + 1;
}

function candidates(text: string): PersonalDataMatch[] {
  const found: PersonalDataMatch[] = [];
  const add = (kind: PersonalDataKind, start: number, matched: string) =>
    found.push({ kind, start, end: start + matched.length, text: matched });

  for (const m of matchesOf(EMAIL, text)) add('email', m.index, m[0]);
  for (const m of matchesOf(URL, text)) add('url', m.index, m[0].replace(/[.,;:!?)\]'’]+$/, ''));
  for (const m of matchesOf(NUMBER_RUN, text)) {
    const kind = classifyNumberRun(m[0]);
    if (kind) add(kind, m.index, m[0]);
  }
  const addresses: PersonalDataMatch[] = [];
  for (const m of matchesOf(STREET_ADDRESS, text)) {
    add('street_address', m.index, m[0]);
    addresses.push(found[found.length - 1]);
  }
  for (const m of matchesOf(UK_POSTCODE, text)) add('postcode', m.index, m[0]);
  for (const m of matchesOf(ZIP, text)) {
    const lineStart = lineStartBefore(text, m.index);
    const before = text.slice(Math.max(lineStart, m.index - 60), m.index);
    const afterAddress = addresses.some(
      (a) => a.end <= m.index && a.end >= Math.max(lineStart, m.index - 60),
    );
    if (ZIP_LEAD.test(before) || afterAddress) add('postcode', m.index, m[0]);
  }
  for (const m of matchesOf(DATE, text)) {
    const lineStart = lineStartBefore(text, m.index);
    const before = text.slice(Math.max(lineStart, m.index - 40), m.index);
    const lineEnd = text.indexOf('\n', m.index);
    const after = text.slice(
      m.index + m[0].length,
      Math.min(lineEnd < 0 ? text.length : lineEnd, m.index + m[0].length + 30),
    );
    if (BIRTH_BEFORE.test(before) || BIRTH_AFTER.test(after)) add('date_of_birth', m.index, m[0]);
  }
  return found;
}

/**
 * Likely personal data in `text` (any length), without overlaps, sorted by start offset.
 * Offsets are UTF-16 code-unit offsets, the same as String.prototype.slice uses.
 */
export function detectPersonalData(text: string): PersonalDataMatch[] {
  const all = candidates(text).sort(
    (a, b) => priority.indexOf(a.kind) - priority.indexOf(b.kind) || a.start - b.start || b.end - a.end,
  );
  // One byte per code unit marks what is taken: linear in the text, however many matches.
  const taken = new Uint8Array(text.length);
  const accepted: PersonalDataMatch[] = [];
  for (const c of all) {
    if (taken.subarray(c.start, c.end).includes(1)) continue;
    taken.fill(1, c.start, c.end);
    accepted.push(c);
  }
  return accepted.sort((a, b) => a.start - b.start);
}
