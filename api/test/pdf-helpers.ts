import { spawnSync } from 'node:child_process';
import { join } from 'node:path';

/** One page of a PDF as pdfjs-dist reads it: its size in points and its text. */
export type PdfPage = { width: number; height: number; text: string };

/** The pages of a PDF, read back by pdfjs-dist (scripts/pdf-text.mjs, run by node: it is an ES module). */
export function readPdf(bytes: Buffer): PdfPage[] {
  const run = spawnSync(process.execPath, [join(__dirname, '..', 'scripts', 'pdf-text.mjs')], {
    input: bytes,
    maxBuffer: 64 * 1024 * 1024,
    encoding: 'utf8',
  });
  if (run.status !== 0) throw new Error(`pdf-text.mjs failed: ${run.stderr}`);
  return JSON.parse(run.stdout) as PdfPage[];
}

/** All the text of a PDF, whitespace runs (line and page breaks) as single spaces. */
export const pdfText = (pages: PdfPage[]): string =>
  pages
    .map((p) => p.text)
    .join(' ')
    .replace(/\s+/g, ' ');
