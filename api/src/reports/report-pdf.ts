import PDFDocument from 'pdfkit';
import {
  type ClientReport,
  doneOn,
  REPORT_CAUTIONS_TITLE,
  trialsSentence,
  type ReportChart,
  type ReportPaper,
  type VersionReport,
} from '@keyloom/shared';
import { atkinsonFontFiles } from '../summaries/chart-text';
import { opaqueChartPng } from './opaque-png';

// The printed reports as PDFs, laid out with pdfkit: the app's own font (Atkinson Hyperlegible, the
// WOFF files of @fontsource/atkinson-hyperlegible, which pdfkit's fontkit reads and embeds as a
// subset), the charts' SVG rasterised at print resolution, and on every page a footer with the
// date printed and "Page n of m". Every word comes from the report data; this file only lays it out.

export type ReportPdfOptions = { paper: ReportPaper };

/** pdfkit's names of the paper sizes (A4 595×842 pt, US Letter 612×792 pt). */
const PAPER_SIZES: Record<ReportPaper, string> = { a4: 'A4', letter: 'LETTER' };
/** 18 mm in points, the print stylesheet's page margin. */
const MARGIN = Math.round((18 / 25.4) * 72);
/** Room under the text for the footer. */
const FOOTER = 28;
/** Chart pixels per CSS px: 600 CSS px over the text width (about 7 in) comes to about 340 dpi. */
export const PRINT_ZOOM = 4;

const REGULAR = 'Atkinson';
const BOLD = 'Atkinson-Bold';
const INK = '#000000';
const SOFT = '#3a3a3a';
const RULE = '#8a8a8a';

type Doc = PDFKit.PDFDocument;

function newDocument(paper: ReportPaper, title: string, author: string): Doc {
  const doc = new PDFDocument({
    size: PAPER_SIZES[paper],
    margins: { top: MARGIN, left: MARGIN, right: MARGIN, bottom: MARGIN + FOOTER },
    bufferPages: true,
    info: { Title: title, Author: author, Creator: 'Keyloom' },
    lang: 'en-GB',
    displayTitle: true,
  });
  doc.registerFont(REGULAR, require.resolve(atkinsonFontFiles[400]));
  doc.registerFont(BOLD, require.resolve(atkinsonFontFiles[700]));
  doc.font(REGULAR).fontSize(11).fillColor(INK);
  return doc;
}

const contentWidth = (doc: Doc): number => doc.page.width - doc.page.margins.left - doc.page.margins.right;
const pageBottom = (doc: Doc): number => doc.page.height - doc.page.margins.bottom;

/** A new page unless `height` more points fit on this one. */
function keepRoom(doc: Doc, height: number): void {
  if (doc.y + height > pageBottom(doc)) doc.addPage();
}

function paragraph(doc: Doc, text: string, options: { bold?: boolean; size?: number; soft?: boolean } = {}) {
  doc
    .font(options.bold ? BOLD : REGULAR)
    .fontSize(options.size ?? 11)
    .fillColor(options.soft ? SOFT : INK)
    .text(text, doc.page.margins.left, doc.y, { width: contentWidth(doc) });
}

/** A section heading with a rule under it, kept with at least a few lines of what follows. */
function heading(doc: Doc, text: string): void {
  doc.moveDown(0.8);
  keepRoom(doc, 70);
  paragraph(doc, text, { bold: true, size: 14 });
  const y = doc.y + 2;
  doc
    .moveTo(doc.page.margins.left, y)
    .lineTo(doc.page.margins.left + contentWidth(doc), y)
    .lineWidth(0.75)
    .strokeColor(RULE)
    .stroke();
  doc.y = y + 6;
}

/** A "label: value" line, the label bold. */
function fact(doc: Doc, label: string, value: string): void {
  doc
    .font(BOLD)
    .fontSize(11)
    .fillColor(INK)
    .text(`${label}: `, doc.page.margins.left, doc.y, { width: contentWidth(doc), continued: true })
    .font(REGULAR)
    .text(value);
}

function bullets(doc: Doc, items: readonly string[]): void {
  for (const item of items) {
    keepRoom(doc, 30);
    const y = doc.y;
    doc.font(REGULAR).fontSize(11).fillColor(INK).text('•', doc.page.margins.left, y, { lineBreak: false });
    doc.text(item, doc.page.margins.left + 14, y, { width: contentWidth(doc) - 14 });
    doc.moveDown(0.3);
  }
}

/** The clinic's letterhead and the report's title. */
function letterhead(doc: Doc, report: { clinic: VersionReport['clinic'] }, title: string, subtitle: string) {
  paragraph(doc, report.clinic.name, { bold: true, size: 13 });
  if (report.clinic.address) paragraph(doc, report.clinic.address, { soft: true, size: 10 });
  if (report.clinic.phone) paragraph(doc, `Phone ${report.clinic.phone}`, { soft: true, size: 10 });
  doc.moveDown(1);
  paragraph(doc, title, { bold: true, size: 20 });
  paragraph(doc, subtitle, { size: 12 });
}

/** A chart across the text width, kept whole on one page, its alt text under it. */
function chart(doc: Doc, picture: ReportChart): void {
  const width = contentWidth(doc);
  const height = (picture.height / picture.width) * width;
  keepRoom(doc, height + 10);
  doc.image(opaqueChartPng(picture.svg, PRINT_ZOOM), doc.page.margins.left, doc.y, { width, height });
  doc.y += height + 4;
  paragraph(doc, picture.alt, { soft: true, size: 9 });
  doc.moveDown(0.5);
}

function cautions(doc: Doc, items: readonly string[]): void {
  heading(doc, REPORT_CAUTIONS_TITLE);
  bullets(doc, items);
}

/** "Printed 3 Dec 2026" and "Page n of m" at the foot of every page. */
function footers(doc: Doc, printedOn: string, name: string): void {
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0; // writing under the bottom margin would start a new page
    const y = doc.page.height - MARGIN - 10;
    const width = contentWidth(doc);
    doc.font(REGULAR).fontSize(9).fillColor(SOFT);
    doc.text(`${name} · Printed ${printedOn}`, doc.page.margins.left, y, { width, lineBreak: false });
    doc.text(`Page ${i - range.start + 1} of ${range.count}`, doc.page.margins.left, y, {
      width,
      align: 'right',
      lineBreak: false,
    });
    doc.page.margins.bottom = bottom;
  }
}

function finish(doc: Doc, printedOn: string, name: string): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    footers(doc, printedOn, name);
    doc.end();
  });
}

const count = (n: number): string => n.toLocaleString('en-GB');

/** The version report: letterhead, the version's facts and approval trail, figures, chart, trials, samples, cautions. */
export function renderVersionReportPdf(report: VersionReport, options: ReportPdfOptions): Promise<Buffer> {
  const { version } = report;
  const title = `Version ${version.number} report`;
  const doc = newDocument(options.paper, `${report.client.pseudonym}: ${title}`, report.clinic.name);
  letterhead(doc, report, title, `Client: ${report.client.pseudonym}`);
  doc.moveDown(0.6);
  fact(doc, 'Status', version.statusLabel);
  fact(doc, 'Created', doneOn(version.createdOn, version.createdBy));
  fact(doc, 'Trained', doneOn(version.trainedOn, version.trainedBy));

  heading(doc, 'Approval trail');
  for (const step of report.trail) {
    fact(doc, step.step, doneOn(step.on, step.by));
  }

  heading(doc, 'Results');
  if (report.figures.length === 0) {
    paragraph(doc, 'This version uses general English alone, so it has no figures of its own.');
  }
  for (const figure of report.figures) {
    keepRoom(doc, 40);
    fact(doc, figure.label, figure.value);
    paragraph(doc, figure.explanation, { soft: true, size: 10 });
    doc.moveDown(0.4);
  }
  if (report.chart) chart(doc, report.chart);

  heading(doc, 'Trials on the test keyboard');
  paragraph(doc, `${trialsSentence(report.trials)}.`);
  for (const note of report.trials.notes) paragraph(doc, note, { soft: true, size: 10 });

  heading(doc, 'Samples it was trained on');
  if (report.samples.length === 0) paragraph(doc, 'None: general English alone.');
  for (const sample of report.samples) {
    keepRoom(doc, 16);
    fact(doc, sample.title, `${count(sample.characters)} characters`);
  }

  cautions(doc, report.cautions);
  return finish(doc, report.printedOn, `${report.client.pseudonym}, version ${version.number}`);
}

/** Columns of the client report's table of versions: heading, share of the width, the cell's text. */
const VERSION_COLUMNS: {
  heading: string;
  share: number;
  cell: (v: ClientReport['versions'][number]) => string;
}[] = [
  { heading: 'Version', share: 0.09, cell: (v) => String(v.number) },
  { heading: 'Status', share: 0.15, cell: (v) => v.statusLabel },
  { heading: 'Trained', share: 0.13, cell: (v) => v.trainedOn ?? '—' },
  { heading: 'Approved', share: 0.13, cell: (v) => v.approvedOn ?? '—' },
  { heading: 'Keystroke savings', share: 0.14, cell: (v) => v.keystrokeSavings ?? '—' },
  { heading: 'Hit rate', share: 0.12, cell: (v) => v.hitRate ?? '—' },
  { heading: 'Estimated words per minute', share: 0.24, cell: (v) => v.wpm ?? '—' },
];

function tableRow(doc: Doc, cells: string[], bold: boolean): void {
  const width = contentWidth(doc);
  doc
    .font(bold ? BOLD : REGULAR)
    .fontSize(9.5)
    .fillColor(INK);
  const widths = VERSION_COLUMNS.map((c) => c.share * width - 6);
  const height = Math.max(...cells.map((text, i) => doc.heightOfString(text, { width: widths[i] })));
  keepRoom(doc, height + 8);
  const y = doc.y;
  let x = doc.page.margins.left;
  cells.forEach((text, i) => {
    doc.text(text, x, y, { width: widths[i] });
    x += (widths[i] ?? 0) + 6;
  });
  doc.y = y + height + 4;
  doc
    .moveTo(doc.page.margins.left, doc.y - 2)
    .lineTo(doc.page.margins.left + width, doc.y - 2)
    .lineWidth(0.5)
    .strokeColor(RULE)
    .stroke();
  doc.y += 2;
}

/** The client report: letterhead, the period's versions as a table, the summary charts, trials, cautions. */
export function renderClientReportPdf(report: ClientReport, options: ReportPdfOptions): Promise<Buffer> {
  const period = `${report.period.fromOn} to ${report.period.toOn}`;
  const doc = newDocument(options.paper, `${report.client.pseudonym}: client report`, report.clinic.name);
  letterhead(doc, report, 'Client report', `Client: ${report.client.pseudonym} · ${period}`);

  heading(doc, 'Versions trained or approved in the period');
  if (report.versions.length === 0) {
    paragraph(doc, 'No version was trained or approved in this period.');
  } else {
    tableRow(
      doc,
      VERSION_COLUMNS.map((c) => c.heading),
      true,
    );
    for (const version of report.versions)
      tableRow(
        doc,
        VERSION_COLUMNS.map((c) => c.cell(version)),
        false,
      );
  }
  for (const picture of report.charts) chart(doc, picture);

  heading(doc, 'Trials on the test keyboard in the period');
  if (report.trials.length === 0) paragraph(doc, 'No trials in this period.');
  for (const t of report.trials) {
    fact(doc, `Version ${t.versionNumber}`, trialsSentence(t));
    for (const note of t.notes) paragraph(doc, note, { soft: true, size: 10 });
  }

  cautions(doc, report.cautions);
  return finish(doc, report.printedOn, `${report.client.pseudonym}, ${period}`);
}
