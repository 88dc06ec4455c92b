// Reads a PDF from standard input and prints its pages as JSON: [{ width, height, text }], sizes in
// points, the text of each page joined with spaces. Uses pdfjs-dist's legacy build (Mozilla's PDF
// reader, an independent reference for what pdfkit wrote), which is an ES module: the HTTP tests
// (CommonJS under jest) run this file with node rather than importing it.
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';

const chunks = [];
for await (const chunk of process.stdin) chunks.push(chunk);
const data = new Uint8Array(Buffer.concat(chunks));
const pdf = await getDocument({ data, useSystemFonts: false, isEvalSupported: false, verbosity: 0 }).promise;
const pages = [];
for (let n = 1; n <= pdf.numPages; n++) {
  const page = await pdf.getPage(n);
  const [x0, y0, x1, y1] = page.view;
  const content = await page.getTextContent();
  const text = content.items
    .map((item) => ('str' in item ? item.str + (item.hasEOL ? '\n' : '') : ''))
    .join('');
  pages.push({ width: Math.round(x1 - x0), height: Math.round(y1 - y0), text });
}
process.stdout.write(JSON.stringify(pages));
