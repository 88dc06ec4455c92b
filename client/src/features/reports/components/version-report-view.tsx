import { doneOn, trialsSentence, type VersionReport } from '@keyloom/shared';
import { ReportArticle, ReportChartFigure, ReportSection } from './report-parts';

const count = (n: number): string => n.toLocaleString('en-GB');

/** A trained version's report, as printed: the same content as its PDF. */
export const VersionReportView = ({ report }: { report: VersionReport }) => {
  const { version } = report;
  return (
    <ReportArticle label={`Version ${version.number} report`} report={report}>
      <dl className="report-keep grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1">
        <dt className="font-bold">Client</dt>
        <dd>{report.client.pseudonym}</dd>
        <dt className="font-bold">Version</dt>
        <dd>Version {version.number}</dd>
        <dt className="font-bold">Status</dt>
        <dd>{version.statusLabel}</dd>
        <dt className="font-bold">Created</dt>
        <dd>{doneOn(version.createdOn, version.createdBy)}</dd>
        <dt className="font-bold">Trained</dt>
        <dd>{doneOn(version.trainedOn, version.trainedBy)}</dd>
      </dl>

      <ReportSection id="report-trail" title="Approval trail" keep>
        <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1">
          {report.trail.map((step) => (
            <div key={step.step} className="contents">
              <dt className="font-bold">{step.step}</dt>
              <dd>{doneOn(step.on, step.by)}</dd>
            </div>
          ))}
        </dl>
      </ReportSection>

      <ReportSection id="report-results" title="Results">
        {report.figures.length === 0 ? (
          <p>This version uses general English alone, so it has no figures of its own.</p>
        ) : (
          <dl className="flex flex-col gap-3">
            {report.figures.map((figure) => (
              <div key={figure.key} className="report-keep">
                <dt className="font-bold">{figure.label}</dt>
                <dd>{figure.value}</dd>
                <dd className="text-ink-soft">{figure.explanation}</dd>
              </div>
            ))}
          </dl>
        )}
        {report.chart && <ReportChartFigure chart={report.chart} />}
      </ReportSection>

      <ReportSection id="report-trials" title="Trials on the test keyboard" keep>
        <p>{trialsSentence(report.trials)}.</p>
        {report.trials.notes.map((note) => (
          <p key={note} className="text-ink-soft">
            {note}
          </p>
        ))}
      </ReportSection>

      <ReportSection id="report-samples" title="Samples it was trained on" newPage>
        {report.samples.length === 0 ? (
          <p>None: general English alone.</p>
        ) : (
          <ul className="flex flex-col gap-1">
            {report.samples.map((sample, i) => (
              <li key={`${i}-${sample.title}`}>
                <span className="font-bold">{sample.title}</span>: {count(sample.characters)} characters
              </li>
            ))}
          </ul>
        )}
      </ReportSection>
    </ReportArticle>
  );
};
