import { type ClientReport, trialsSentence } from '@keyloom/shared';
import {
  ColumnHeader,
  RowHeader,
  Table,
  TableBody,
  TableCell,
  TableHead,
  TableRow,
} from '@/components/ui/table';
import { ReportArticle, ReportChartFigure, ReportSection } from './report-parts';

/** A client's report over a period, as printed: the same content as its PDF. */
export const ClientReportView = ({ report }: { report: ClientReport }) => (
  <ReportArticle label={`Client report for ${report.client.pseudonym}`} report={report}>
    <dl className="report-keep grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1">
      <dt className="font-bold">Client</dt>
      <dd>{report.client.pseudonym}</dd>
      <dt className="font-bold">Period</dt>
      <dd>
        {report.period.fromOn} to {report.period.toOn}
      </dd>
    </dl>

    <ReportSection id="report-versions" title="Versions trained or approved in the period">
      {report.versions.length === 0 ? (
        <p>No version was trained or approved in this period.</p>
      ) : (
        <Table
          caption={`Versions of ${report.client.pseudonym}, ${report.period.fromOn} to ${report.period.toOn}`}
        >
          <TableHead>
            <ColumnHeader>Version</ColumnHeader>
            <ColumnHeader>Status</ColumnHeader>
            <ColumnHeader>Trained</ColumnHeader>
            <ColumnHeader>Approved</ColumnHeader>
            <ColumnHeader>Keystroke savings</ColumnHeader>
            <ColumnHeader>Hit rate</ColumnHeader>
            <ColumnHeader>Estimated words per minute</ColumnHeader>
          </TableHead>
          <TableBody>
            {report.versions.map((v) => (
              <TableRow key={v.id} className="report-keep">
                <RowHeader label="Version">Version {v.number}</RowHeader>
                <TableCell label="Status">{v.statusLabel}</TableCell>
                <TableCell label="Trained">{v.trainedOn ?? '—'}</TableCell>
                <TableCell label="Approved">{v.approvedOn ?? '—'}</TableCell>
                <TableCell label="Keystroke savings">{v.keystrokeSavings ?? '—'}</TableCell>
                <TableCell label="Hit rate">{v.hitRate ?? '—'}</TableCell>
                <TableCell label="Estimated words per minute">{v.wpm ?? '—'}</TableCell>
              </TableRow>
            ))}
          </TableBody>
        </Table>
      )}
      {report.charts.map((chart) => (
        <ReportChartFigure key={chart.alt} chart={chart} />
      ))}
    </ReportSection>

    <ReportSection id="report-trials" title="Trials on the test keyboard in the period">
      {report.trials.length === 0 ? (
        <p>No trials in this period.</p>
      ) : (
        <ul className="flex flex-col gap-1">
          {report.trials.map((t) => (
            <li key={t.versionNumber}>
              <span className="font-bold">Version {t.versionNumber}</span>: {trialsSentence(t)}
              {t.notes.map((note) => (
                <span key={note} className="block text-ink-soft">
                  {note}
                </span>
              ))}
            </li>
          ))}
        </ul>
      )}
    </ReportSection>
  </ReportArticle>
);
