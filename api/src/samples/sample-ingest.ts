// Turning uploaded files or pasted text into stored samples. Plain functions over an EntityManager,
// so the upload route and the demo seed store samples the same way.
import {
  blankRedactionTokens,
  decodeTextBytes,
  detectPersonalData,
  normaliseSampleText,
  type PersonalDataMatch,
  SampleTextError,
  type SourceKind,
  textStatistics,
  type TextStatistics,
} from '@keyloom/shared';
import { createHash } from 'node:crypto';
import { extname } from 'node:path';
import Papa from 'papaparse';
import type { EntityManager } from 'typeorm';
import { SampleFlag } from './sample-flag.entity';
import { Sample } from './sample.entity';

export const WRONG_EXTENSION_MESSAGE = 'Keyloom takes .txt, .md or .csv files.';

/** A file or paste that cannot become a sample; `message` is for the person uploading. */
export class SampleInputError extends Error {}

/** One file as multer hands it over (memory storage). */
export type IncomingFile = { originalname: string; buffer: Buffer };

/** A sample ready to store: text normalised, statistics counted, personal data found. */
export type PreparedSample = {
  title: string;
  fileName: string | null;
  encoding: string;
  sha256: string;
  byteSize: number;
  text: string;
  statistics: TextStatistics;
  matches: PersonalDataMatch[];
};

export type SampleMeta = {
  sourceKind: SourceKind;
  periodStart?: string | null;
  periodEnd?: string | null;
  note?: string | null;
};

/** "20 MB", "1.5 MB", "64 kB": a byte count for messages. */
export function sizeLabel(bytes: number): string {
  const mb = bytes / (1024 * 1024);
  return mb >= 1 ? `${Math.round(mb * 10) / 10} MB` : `${Math.round(bytes / 1024)} kB`;
}

const FLAG_BATCH = 1000;

const sha256Hex = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

/** Statistics of a sample's current text (redaction tokens left out), unknown words by `isKnownWord`. */
export function sampleStatistics(text: string, isKnownWord: (word: string) => boolean): TextStatistics {
  return textStatistics(blankRedactionTokens(text), { isKnownWord });
}

/** The text cells of `column` of a CSV with a header row, joined with blank lines. */
export function csvColumnText(text: string, column: string | null | undefined): string {
  const parsed = Papa.parse<Record<string, string | undefined>>(text, {
    header: true,
    skipEmptyLines: 'greedy',
  });
  const columns = (parsed.meta.fields ?? []).filter((name) => name.trim() !== '');
  const listed = columns.length > 0 ? columns.join(', ') : '(none)';
  if (!column)
    throw new SampleInputError(`Choose the CSV column that holds the text. Its columns are: ${listed}.`);
  if (!columns.includes(column)) {
    throw new SampleInputError(`The CSV has no column "${column}". Its columns are: ${listed}.`);
  }
  const cells = parsed.data.map((row) => (row[column] ?? '').trim()).filter((cell) => cell !== '');
  if (cells.length === 0) throw new SampleInputError(`The column "${column}" has no text.`);
  return cells.join('\n\n');
}

// multer reads file names as latin1; browsers send UTF-8. Re-read when the bytes are valid UTF-8.
function fileNameOf(file: IncomingFile): string {
  const asUtf8 = Buffer.from(file.originalname, 'latin1').toString('utf8');
  return asUtf8.includes('\ufffd') ? file.originalname : asUtf8;
}

function analyse(
  text: string,
  isKnownWord: (word: string) => boolean,
): Pick<PreparedSample, 'text' | 'statistics' | 'matches'> {
  const normalised = normaliseSampleText(text);
  return {
    text: normalised,
    statistics: sampleStatistics(normalised, isKnownWord),
    matches: detectPersonalData(normalised),
  };
}

/**
 * Checks and prepares one uploaded file (.txt, .md: the text; .csv: the chosen column).
 * @throws SampleInputError with the reason.
 */
export function prepareFile(
  file: IncomingFile,
  csvColumn: string | null | undefined,
  isKnownWord: (word: string) => boolean,
): PreparedSample {
  const fileName = fileNameOf(file);
  const bytes = new Uint8Array(file.buffer.buffer, file.buffer.byteOffset, file.buffer.byteLength);
  const extension = extname(fileName).toLowerCase();
  try {
    // Binary formats first: "this is a PDF" helps more than "wrong extension".
    if (bytes.length > 0 && extension !== '.txt' && extension !== '.md' && extension !== '.csv') {
      decodeTextBytes(bytes);
      throw new SampleInputError(WRONG_EXTENSION_MESSAGE);
    }
    const decoded = decodeTextBytes(bytes);
    const text = extension === '.csv' ? csvColumnText(decoded.text, csvColumn) : decoded.text;
    return {
      title: fileName.slice(0, fileName.length - extension.length).trim() || fileName,
      fileName,
      encoding: decoded.encoding,
      sha256: sha256Hex(bytes),
      byteSize: bytes.length,
      ...analyse(text, isKnownWord),
    };
  } catch (error) {
    if (error instanceof SampleTextError) throw new SampleInputError(error.message);
    throw error;
  }
}

/** Prepares pasted text; its hash is of the text as UTF-8 (before normalisation). */
export function preparePaste(
  title: string,
  text: string,
  isKnownWord: (word: string) => boolean,
): PreparedSample {
  const bytes = Buffer.from(text, 'utf8');
  return {
    title,
    fileName: null,
    encoding: 'pasted',
    sha256: sha256Hex(bytes),
    byteSize: bytes.length,
    ...analyse(text, isKnownWord),
  };
}

/** Inserts one prepared sample and its open flags (call inside a transaction). */
export async function insertSample(
  manager: EntityManager,
  clientId: string,
  uploadedById: string | null,
  meta: SampleMeta,
  prepared: PreparedSample,
): Promise<Sample> {
  const samples = manager.getRepository(Sample);
  const sample = await samples.save(
    samples.create({
      clientId,
      title: prepared.title,
      fileName: prepared.fileName,
      sourceKind: meta.sourceKind,
      periodStart: meta.periodStart ?? null,
      periodEnd: meta.periodEnd ?? null,
      note: meta.note ?? null,
      status: prepared.matches.length > 0 ? 'needs_review' : 'ready',
      excludedReason: null,
      encoding: prepared.encoding,
      sha256: prepared.sha256,
      byteSize: prepared.byteSize,
      text: prepared.text,
      characters: prepared.statistics.characters,
      words: prepared.statistics.words,
      distinctWords: prepared.statistics.distinctWords,
      topWords: prepared.statistics.topWords,
      unknownWords: prepared.statistics.unknownWords,
      uploadedById,
    }),
  );
  // In batches: one INSERT may carry at most 65,535 parameters (PostgreSQL's protocol limit).
  for (let i = 0; i < prepared.matches.length; i += FLAG_BATCH) {
    await manager.getRepository(SampleFlag).insert(
      prepared.matches.slice(i, i + FLAG_BATCH).map((m) => ({
        sampleId: sample.id,
        kind: m.kind,
        start: m.start,
        end: m.end,
        text: m.text,
        status: 'open' as const,
      })),
    );
  }
  return sample;
}

/** How many flags of each kind (audit details: kinds and counts, never the text). */
export function countKinds(matches: { kind: string }[]): Record<string, number> {
  const counts: Record<string, number> = {};
  for (const { kind } of matches) counts[kind] = (counts[kind] ?? 0) + 1;
  return counts;
}
