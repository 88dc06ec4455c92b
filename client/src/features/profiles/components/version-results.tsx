import type { ReactNode } from 'react';
import {
  ColumnHeader,
  RowHeader,
  Table,
  TableBody,
  TableCell,
  TableHead,
  TableRow,
} from '@/components/ui/table';
import { Alert } from '@/components/ui/alert';
import {
  atSlots,
  count,
  fixed,
  learningCurveSpreadNote,
  learningCurveVerdict,
  listDescription,
  percent,
  type ProfileReportView,
  SCAN_STEPS_NOT_MEASURED,
  SCAN_STEPS_NOTE,
  scanStepsByLayout,
  slotSeries,
} from '../lib/profile-report';
import { LearningCurveChart } from './learning-curve-chart';
import { SlotsChart } from './slots-chart';

const BASE = 'General English model alone';

const Section = ({ id, title, children }: { id: string; title: string; children: ReactNode }) => (
  <section aria-labelledby={id} className="flex flex-col gap-4">
    <h3 id={id} className="text-2xl font-bold">
      {title}
    </h3>
    {children}
  </section>
);

/** Everything a trained version measured, each figure in words or a table beside any chart. */
export const VersionResults = ({ report }: { report: ProfileReportView }) => {
  const slots = report.rates.assumptions.slots;
  const series = slotSeries(report);
  const curve = report.learningCurve?.points ?? [];
  const curveFolds = report.learningCurve?.folds ?? 1;
  const curveCaption =
    curveFolds > 1
      ? `Measured with part of the training text on ${curveFolds} folds (means, and lowest to highest fold)`
      : 'Measured with part of the training text (first fold)';
  const scanRows = scanStepsByLayout(report);
  return (
    <div className="flex flex-col gap-10">
      <p className="max-w-3xl text-lg">
        Measured on {count(report.chars)} characters from {report.documents ?? 'the'} samples with{' '}
        {report.folds}-fold cross-validation: each part of the text is predicted by a model that never saw it.
        {report.foldNote ? ` ${report.foldNote}` : ''}
      </p>

      <Section id="bpc-heading" title="Bits per character">
        <p className="max-w-3xl text-ink-soft">
          How surprised the model is by each letter of the client’s own writing: lower is better.
        </p>
        <Table caption="Bits per character, mean over folds with the spread">
          <TableHead>
            <ColumnHeader>Measure</ColumnHeader>
            <ColumnHeader>Mean</ColumnHeader>
            <ColumnHeader>Lowest fold</ColumnHeader>
            <ColumnHeader>Highest fold</ColumnHeader>
            <ColumnHeader>Standard deviation</ColumnHeader>
          </TableHead>
          <TableBody>
            {(
              [
                ['Ideal (information content)', report.bpcIdeal, report.bpcIdealSpread],
                ['Coded (real arithmetic coding)', report.bpcCoded, report.bpcCodedSpread],
              ] as const
            ).map(([label, mean, spread]) => (
              <TableRow key={label}>
                <RowHeader label="Measure">{label}</RowHeader>
                <TableCell label="Mean">{fixed(mean, 3)}</TableCell>
                <TableCell label="Lowest fold">{fixed(spread.min, 3)}</TableCell>
                <TableCell label="Highest fold">{fixed(spread.max, 3)}</TableCell>
                <TableCell label="Standard deviation">{fixed(spread.std, 3)}</TableCell>
              </TableRow>
            ))}
            {report.baseOnly && (
              <TableRow>
                <RowHeader label="Measure">{BASE} (ideal)</RowHeader>
                <TableCell label="Mean">{fixed(report.baseOnly.bpcIdeal, 3)}</TableCell>
                <TableCell label="Lowest fold">—</TableCell>
                <TableCell label="Highest fold">—</TableCell>
                <TableCell label="Standard deviation">—</TableCell>
              </TableRow>
            )}
          </TableBody>
        </Table>
        <p>
          Weight of the general English model: {fixed(report.baseWeight, 2)}
          {report.roundTrip === false ? '. Warning: a coded stream did not decode back exactly.' : '.'}
        </p>
      </Section>

      <Section id="ks-heading" title="Keystroke savings by list size">
        <p className="max-w-3xl">
          At {slots} slots this version saves{' '}
          <strong>{percent(atSlots(report.keystrokeSavings, slots))}</strong> of keystrokes
          {report.baseOnly
            ? `; the general English model alone saves ${percent(atSlots(report.baseOnly.keystrokeSavings, slots))}.`
            : '.'}{' '}
          {report.ksNote}
        </p>
        {listDescription(report).map((line) => (
          <p key={line} className="max-w-3xl">
            {line}
          </p>
        ))}
        <SlotsChart
          title="Keystroke savings for 1 to 10 suggestion slots"
          series={series.savings}
          kind="savings"
        />
        <SlotsChart
          title="Keystrokes per character for 1 to 10 suggestion slots"
          series={series.kspc}
          kind="kspc"
        />
      </Section>

      <Section id="scan-heading" title="Scan steps per character">
        {scanRows ? (
          <>
            <p className="max-w-3xl">{SCAN_STEPS_NOTE}</p>
            <Table caption="Scan steps per character for a switch user">
              <TableHead>
                <ColumnHeader>Key order</ColumnHeader>
                <ColumnHeader>Steps per character</ColumnHeader>
              </TableHead>
              <TableBody>
                {scanRows.map((row) => (
                  <TableRow key={row.layout}>
                    <RowHeader label="Key order">{row.label}</RowHeader>
                    <TableCell label="Steps per character">{fixed(row.steps, 2)}</TableCell>
                  </TableRow>
                ))}
              </TableBody>
            </Table>
          </>
        ) : (
          <p className="max-w-3xl">{SCAN_STEPS_NOT_MEASURED}</p>
        )}
      </Section>

      <Section id="wpm-heading" title="Estimated words per minute">
        <div className="grid gap-4 md:grid-cols-2">
          <dl className="grid grid-cols-[auto_auto] content-start gap-x-6 gap-y-2 text-lg">
            <dt>Without suggestions</dt>
            <dd className="font-bold">{fixed(report.rates.wpmWithout, 1)} words per minute</dd>
            <dt>With {slots} suggestions</dt>
            <dd className="font-bold">{fixed(report.rates.wpmWith, 1)} words per minute</dd>
          </dl>
          <Alert tone="info" title="Keystroke savings are not time savings: reading the list costs time.">
            <p>
              The estimate counts {report.rates.assumptions.listReadMs} ms to read the list before each
              selection and {Math.round(report.rates.assumptions.msPerSelection)} ms per selection
              {report.rates.assumptions.defaultTiming
                ? ' (a default timing: the client record has none)'
                : ''}
              . Watch the client use it before trusting a gain.
            </p>
          </Alert>
        </div>
      </Section>

      {curve.length > 0 && (
        <Section id="curve-heading" title="Learning curve: does more text still help?">
          <p className="max-w-3xl text-lg">{learningCurveVerdict(curve)}</p>
          <p className="max-w-3xl text-lg">{learningCurveSpreadNote(curve)}</p>
          <LearningCurveChart points={curve} />
          <Table caption={curveCaption}>
            <TableHead>
              <ColumnHeader>Share of the text</ColumnHeader>
              <ColumnHeader>Training characters</ColumnHeader>
              <ColumnHeader>Bits per character</ColumnHeader>
              <ColumnHeader>Bits per character, lowest to highest fold</ColumnHeader>
              <ColumnHeader>Keystroke savings at {report.learningCurve?.slots ?? slots} slots</ColumnHeader>
              <ColumnHeader>Keystroke savings, lowest to highest fold</ColumnHeader>
            </TableHead>
            <TableBody>
              {curve.map((point) => (
                <TableRow key={point.fraction}>
                  <RowHeader label="Share of the text">{Math.round(point.fraction * 100)}%</RowHeader>
                  <TableCell label="Training characters">{count(point.trainChars)}</TableCell>
                  <TableCell label="Bits per character">{fixed(point.bpcIdeal, 3)}</TableCell>
                  <TableCell label="Bits per character, lowest to highest fold">
                    {point.spread
                      ? `${fixed(point.spread.bpcMin, 3)} to ${fixed(point.spread.bpcMax, 3)}`
                      : 'one fold'}
                  </TableCell>
                  <TableCell label="Keystroke savings">{percent(point.keystrokeSavings)}</TableCell>
                  <TableCell label="Keystroke savings, lowest to highest fold">
                    {point.spread
                      ? `${percent(point.spread.keystrokeSavingsMin)} to ${percent(point.spread.keystrokeSavingsMax)}`
                      : 'one fold'}
                  </TableCell>
                </TableRow>
              ))}
            </TableBody>
          </Table>
        </Section>
      )}

      <Section id="early-heading" title="Words it now offers early">
        {report.earlyWords && report.earlyWords.length > 0 ? (
          <>
            <p className="max-w-3xl">
              Words this version offered before their second letter where the general English model alone did
              not, most frequent first (times offered early in the test text). Numbers and words shorter than
              three letters are left out.
            </p>
            <ul aria-label="Words offered early" className="flex flex-wrap gap-2">
              {report.earlyWords.map((item) => (
                <li key={item.word} className="rounded-full border-2 border-thread bg-surface px-3 py-1">
                  {item.word} <span className="text-ink-soft">× {item.count}</span>
                </li>
              ))}
            </ul>
          </>
        ) : (
          <p>
            No words were offered early only by this version
            {report.earlyWords ? '' : ' (no base model to compare)'}.
          </p>
        )}
      </Section>
    </div>
  );
};
