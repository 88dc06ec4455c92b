import { REPORT_CAUTIONS_TITLE, type ReportChart, type VersionReport } from '@keyloom/shared';
import type { ReactNode } from 'react';
import { buttonClasses } from '@/components/ui/button-classes';
import { cn } from '@/lib/cn';

// The parts both printed reports share: the toolbar (Print, Download PDF), the clinic's letterhead,
// a section, a chart and the cautions. The API writes every word; these only lay it out. The classes
// `report-keep` (kept whole on one sheet) and `report-new-page` carry the print rules (index.css).

/** "Print" and "Download PDF": on screen only. */
export const ReportToolbar = ({ pdfUrl, back }: { pdfUrl: string; back: ReactNode }) => (
  <span className="flex flex-wrap items-center gap-3 print:hidden">
    <button type="button" className={buttonClasses('primary')} onClick={() => window.print()}>
      Print
    </button>
    <a href={pdfUrl} download className={buttonClasses('secondary')}>
      Download PDF
    </a>
    {back}
  </span>
);

/** The clinic's name, address and phone, as the top of a letter. */
export const ReportLetterhead = ({ clinic }: { clinic: VersionReport['clinic'] }) => (
  <div className="report-keep flex flex-col">
    <p className="text-xl font-bold">{clinic.name}</p>
    {clinic.address && <p className="whitespace-pre-line text-ink-soft">{clinic.address}</p>}
    {clinic.phone && <p className="text-ink-soft">Phone {clinic.phone}</p>}
  </div>
);

/** A section with its h2; `newPage` starts it on a new sheet when printed, `keep` keeps it whole. */
export const ReportSection = ({
  id,
  title,
  children,
  newPage = false,
  keep = false,
}: {
  id: string;
  title: string;
  children: ReactNode;
  newPage?: boolean;
  keep?: boolean;
}) => (
  <section
    aria-labelledby={id}
    className={cn('flex flex-col gap-3', newPage && 'report-new-page', keep && 'report-keep')}
  >
    <h2 id={id} className="border-b-2 border-thread pb-1 text-2xl font-bold">
      {title}
    </h2>
    {children}
  </section>
);

/** A chart the API drew (SVG), across the page, its alt text under it for print. */
export const ReportChartFigure = ({ chart }: { chart: ReportChart }) => (
  <figure className="report-keep report-chart flex flex-col gap-2">
    <img
      src={`data:image/svg+xml;charset=utf-8,${encodeURIComponent(chart.svg)}`}
      alt={chart.alt}
      width={chart.width}
      height={chart.height}
      className="h-auto w-full max-w-[600px] rounded-lg border-2 border-thread bg-surface"
    />
    <figcaption aria-hidden="true" className="text-sm text-ink-soft">
      {chart.alt}
    </figcaption>
  </figure>
);

/** "Please keep in mind" and the cautions, in the shared wording. */
export const ReportCautions = ({ cautions }: { cautions: readonly string[] }) => (
  <ReportSection id="report-cautions" title={REPORT_CAUTIONS_TITLE} keep>
    <ul className="flex list-disc flex-col gap-2 pl-6">
      {cautions.map((caution) => (
        <li key={caution}>{caution}</li>
      ))}
    </ul>
  </ReportSection>
);

/**
 * A whole report: the clinic's letterhead, the report's own parts, the cautions and "Printed 3 Dec
 * 2026" (the date the PDF's footer gives).
 */
export const ReportArticle = ({
  label,
  report,
  children,
}: {
  label: string;
  report: Pick<VersionReport, 'clinic' | 'cautions' | 'printedOn'>;
  children: ReactNode;
}) => (
  <article aria-label={label} className="report flex flex-col gap-8">
    <ReportLetterhead clinic={report.clinic} />
    {children}
    <ReportCautions cautions={report.cautions} />
    <p className="text-ink-soft">Printed {report.printedOn}</p>
  </article>
);
