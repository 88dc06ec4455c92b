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
import { isListableEarlyWord, rateChangeSentence, versionFigures } from '@keyloom/shared';
import { Alert } from '@/components/ui/alert';
import { EngineDetails } from '@/components/ui/engine-details';
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
import { EngineFigures } from './engine-figures';
import { SlotsChart } from './slots-chart';

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
  // Reports made before numbers and short words were left out still hold them: filtered here too.
  const earlyWords = report.earlyWords?.filter((item) => isListableEarlyWord(item.word)) ?? null;
  return (
    <div className="flex flex-col gap-10">
      <p className="max-w-3xl text-lg">
        Measured on {count(report.chars)} characters of the client’s own writing: each part of the text is
        predicted by a version that never saw it, so the figures show how the list does on new writing.
      </p>
      {report.roundTrip === false && (
        <Alert tone="error" title="A check failed: a coded text did not decode back exactly.">
          <p>Train the version again; if it happens again, report it with the version number.</p>
        </Alert>
      )}

      <Section id="glance-heading" title="At a glance">
        <Table caption={`The version’s figures at ${slots} suggestion slots`}>
          <TableHead>
            <ColumnHeader>Figure</ColumnHeader>
            <ColumnHeader>Result</ColumnHeader>
            <ColumnHeader>What it means</ColumnHeader>
          </TableHead>
          <TableBody>
            {versionFigures(report).map((figure) => (
              <TableRow key={figure.key}>
                <RowHeader label="Figure">{figure.label}</RowHeader>
                <TableCell label="Result" className="font-bold">
                  {figure.value}
                </TableCell>
                <TableCell label="What it means">{figure.explanation}</TableCell>
              </TableRow>
            ))}
          </TableBody>
        </Table>
      </Section>

      <Section id="ks-heading" title="Keystroke savings by list size">
        <p className="max-w-3xl">
          At {slots} slots this version saves{' '}
          <strong>{percent(atSlots(report.keystrokeSavings, slots))}</strong> of keystrokes
          {report.baseOnly
            ? `; the general English model alone saves ${percent(atSlots(report.baseOnly.keystrokeSavings, slots))}.`
            : '.'}
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
            <dt>Change</dt>
            <dd className="font-bold">{rateChangeSentence(report.rates)}</dd>
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
        {earlyWords && earlyWords.length > 0 ? (
          <>
            <p className="max-w-3xl">
              Words this version offered before their second letter where the general English model alone did
              not, most frequent first (times offered early in the test text). Numbers and words shorter than
              three letters are left out.
            </p>
            <ul aria-label="Words offered early" className="flex flex-wrap gap-2">
              {earlyWords.map((item) => (
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

      <EngineDetails description="Bits per character, how the text was split for testing, and how the list weighs its sources: for whoever tunes the engine.">
        <EngineFigures report={report} />
      </EngineDetails>
    </div>
  );
};
