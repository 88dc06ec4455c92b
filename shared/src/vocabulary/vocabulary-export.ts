// The client's vocabulary as open generic files for an everyday device: CSV (RFC 4180, written by
// papaparse's `unparse`, UTF-8) and plain text, one word per line. One writer for the API and tests.
// Sources: docs/references.md §6.
import Papa from 'papaparse';
import type { VocabularyAddition } from '../engine/words/client-vocabulary';
import { wordKey } from '../engine/words/word-tokens';
import type { VocabularyEntry, WordPair } from './vocabulary-listing';

/** One row of the vocabulary export. */
export type VocabularyRow = { word: string; count: number; sources: string[] };

/** Source named for a clinician's addition. */
export const ADDED_SOURCE = 'added';

/**
 * CSV as RFC 4180 writes it (CRLF line ends, fields with a comma, quote or line break quoted, quotes
 * doubled), with a header row. Cells that a spreadsheet would run as a formula (starting with
 * = + - @, a tab or a carriage return) get a leading ' (OWASP, "CSV Injection"): papaparse's
 * `escapeFormulae`.
 */
function csvOf(fields: string[], rows: (string | number)[][]): string {
  return Papa.unparse({ fields, data: rows }, { newline: '\r\n', escapeFormulae: true, header: true });
}

/** Most written first, then by word: the order of every export. */
function ranked<T extends { count: number; word: string }>(rows: readonly T[]): T[] {
  return [...rows].sort((a, b) => b.count - a.count || (a.word < b.word ? -1 : a.word > b.word ? 1 : 0));
}

/**
 * The rows of a vocabulary export: each listed word with the titles of the samples it occurs in
 * (`titleOf` a document id), and each addition (source "added"; its count is its weight when the
 * samples never had it, else the samples' count, and "added" joins the sources).
 */
export function vocabularyRows(
  entries: readonly VocabularyEntry[],
  titleOf: (documentId: string) => string,
  additions: readonly VocabularyAddition[] = [],
): VocabularyRow[] {
  const rows = new Map<string, VocabularyRow>();
  for (const e of entries)
    rows.set(e.key, { word: e.form, count: e.count, sources: e.documents.map((d) => titleOf(d.id)) });
  for (const a of additions) {
    const text = a.text.trim().replace(/\s+/g, ' ');
    const key = wordKey(text);
    const row = rows.get(key);
    if (row) row.sources.push(ADDED_SOURCE);
    else rows.set(key, { word: text, count: a.weight ?? 0, sources: [ADDED_SOURCE] });
  }
  return ranked([...rows.values()]);
}

/** `word,count,source` (source: the sample titles and "added", joined by "; "), most written first. */
export function vocabularyCsv(rows: readonly VocabularyRow[]): string {
  return csvOf(
    ['word', 'count', 'source'],
    ranked(rows).map((r) => [r.word, r.count, r.sources.join('; ')]),
  );
}

/** Plain text: one word per line (LF), most written first, ending with a line break. */
export function vocabularyText(rows: readonly VocabularyRow[]): string {
  return ranked(rows)
    .map((r) => `${r.word}\n`)
    .join('');
}

/** `previous,word,count`, most frequent first. */
export function wordPairsCsv(pairs: readonly WordPair[]): string {
  const sorted = [...pairs].sort(
    (a, b) => b.count - a.count || (a.previous + ' ' + a.word < b.previous + ' ' + b.word ? -1 : 1),
  );
  return csvOf(
    ['previous', 'word', 'count'],
    sorted.map((p) => [p.previous, p.word, p.count]),
  );
}
