import { reportCautions, type VersionReport } from '@keyloom/shared';
import { readPdf, pdfText } from '../../test/pdf-helpers';
import { savingsBySlotsChart } from '../summaries/summary-chart';
import { PRINT_ZOOM, renderClientReportPdf, renderVersionReportPdf } from './report-pdf';
import { slug } from '../profile-versions/profile-versions.service';

// The PDFs are read back with pdfjs-dist (Mozilla's PDF reader, npm pdfjs-dist 4.10.38), an
// independent reader, not with pdfkit; page sizes against ISO 216 (A4 = 210 × 297 mm = 595 × 842 pt)
// and ANSI US Letter (8.5 × 11 in = 612 × 792 pt).

const chart = savingsBySlotsChart({ '1': 0.21, '2': 0.3, '3': 0.352, '4': 0.38, '5': 0.39 });

const report: VersionReport = {
  clinic: { name: 'Willowmere Speech Clinic', address: '4 Orchard Row, Willowmere', phone: '01632 960 418' },
  client: { id: '00000000-0000-4000-8000-000000000001', pseudonym: 'R. Ashby' },
  printedOn: '4 Dec 2026',
  cautions: [...reportCautions],
  version: {
    id: '00000000-0000-4000-8000-000000000002',
    number: 3,
    status: 'active',
    statusLabel: 'Active profile',
    createdBy: 'Imogen Hale',
    createdOn: '1 Dec 2026',
    trainedBy: 'Imogen Hale',
    trainedOn: '1 Dec 2026',
  },
  trail: [
    { step: 'Trained', by: 'Imogen Hale', on: '1 Dec 2026' },
    { step: 'Signed off by the carer', by: 'Sam Okafor', on: '2 Dec 2026' },
    { step: 'Approved by the supervisor', by: null, on: null },
  ],
  figures: [
    { key: 'slots', label: 'Suggestion slots', value: '3', explanation: 'Words offered at a time.' },
    { key: 'keystrokeSavings', label: 'Keystroke savings', value: '35.2%', explanation: 'Share saved.' },
    { key: 'hitRate', label: 'Hit rate', value: '61% of words', explanation: 'How often.' },
  ],
  chart: { svg: chart.svg, width: chart.width, height: chart.height, alt: chart.alt },
  trials: { count: 2, meanWpm: '4.2', notes: [] },
  samples: [
    { title: 'Sailing diary', characters: 12345 },
    { title: 'Messages to Hannah', characters: 812 },
  ],
};

describe('report PDFs', () => {
  it('the version report holds its words, each caution, a footer on every page; A4 by default', async () => {
    const bytes = await renderVersionReportPdf(report, { paper: 'a4' });
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const pages = readPdf(bytes);
    expect(pages.map((p) => [p.width, p.height])).toEqual(pages.map(() => [595, 842]));
    const text = pdfText(pages);
    for (const words of [
      'Willowmere Speech Clinic',
      '4 Orchard Row, Willowmere',
      '01632 960 418',
      'R. Ashby',
      'Version 3',
      'Active profile',
      'Signed off by the carer: 2 Dec 2026 by Sam Okafor',
      'Approved by the supervisor: not yet',
      'Keystroke savings: 35.2%',
      'Hit rate: 61% of words',
      '2 trials; mean measured words per minute: 4.2',
      'Sailing diary: 12,345 characters',
      chart.alt,
      ...reportCautions,
    ]) {
      expect(text).toContain(words);
    }
    pages.forEach((page, i) => {
      expect(page.text).toContain('Printed 4 Dec 2026');
      expect(page.text).toContain(`Page ${i + 1} of ${pages.length}`);
    });
  });

  it('US Letter on request', async () => {
    const pages = readPdf(await renderVersionReportPdf(report, { paper: 'letter' }));
    expect(pages[0]).toMatchObject({ width: 612, height: 792 });
  });

  it('embeds the chart at print resolution (PRINT_ZOOM px per CSS px)', async () => {
    const bytes = await renderVersionReportPdf(report, { paper: 'a4' });
    // The image's width is written in its XObject's dictionary (PDF 1.7, 8.9.5).
    const widths = [...bytes.toString('latin1').matchAll(/\/Subtype \/Image[^>]*?\/Width (\d+)/g)].map((m) =>
      Number(m[1]),
    );
    expect(widths).toContain(chart.width * PRINT_ZOOM);
  });

  it('the client report prints its period, the table of versions and the cautions', async () => {
    const pages = readPdf(
      await renderClientReportPdf(
        {
          clinic: report.clinic,
          client: report.client,
          printedOn: report.printedOn,
          cautions: report.cautions,
          period: { from: '2026-09-06', to: '2026-12-04', fromOn: '6 Sept 2026', toOn: '4 Dec 2026' },
          versions: [
            {
              id: report.version.id,
              number: 3,
              statusLabel: 'Active profile',
              trainedOn: '1 Dec 2026',
              approvedOn: null,
              slots: 3,
              keystrokeSavings: '35.2%',
              hitRate: '61% of words',
              wpm: '3.1 without suggestions, 4.4 with 3',
            },
          ],
          charts: [report.chart!],
          trials: [{ versionNumber: 3, count: 1, meanWpm: null, notes: [] }],
        },
        { paper: 'a4' },
      ),
    );
    const text = pdfText(pages);
    for (const words of [
      '6 Sept 2026 to 4 Dec 2026',
      'Keystroke savings',
      '35.2%',
      'Version 3: 1 trial; mean measured words per minute: not measured',
      ...reportCautions,
    ]) {
      expect(text).toContain(words);
    }
  });

  it('file names keep letters and digits only', () => {
    expect(slug('R. Ashby')).toBe('r-ashby');
    expect(slug('"../x"\r\n')).toBe('x');
    expect(slug('***')).toBe('client');
  });
});
