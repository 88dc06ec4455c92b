import {
  ColumnHeader,
  RowHeader,
  Table,
  TableBody,
  TableCell,
  TableHead,
  TableRow,
} from '@/components/ui/table';
import {
  atSlots,
  count,
  fixed,
  mixtureDescription,
  percent,
  type ProfileReportView,
} from '../lib/profile-report';

const BASE = 'General English model alone';

/** Heading inside the engine details (one level under the results' sections). */
const Heading = ({ children }: { children: string }) => <h4 className="text-xl font-bold">{children}</h4>;

/**
 * The engine's own figures, each with a one-line plain explanation: bits per character (ideal and
 * coded), the general English weight and the list's mixture, and the folds of the cross-validation.
 */
export const EngineFigures = ({ report }: { report: ProfileReportView }) => {
  const slots = report.rates.assumptions.slots;
  const mixture = mixtureDescription(report);
  return (
    <>
      <section className="flex flex-col gap-3">
        <Heading>Bits per character</Heading>
        <p className="max-w-3xl">
          How surprised the model is by each letter of the client’s writing: lower is better. “Ideal” is what
          the model’s own probabilities imply (information content); “coded” is what real arithmetic coding of
          the text took, a check that the ideal figure is honest.
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
      </section>

      <section className="flex flex-col gap-3">
        <Heading>Sources of the suggestions</Heading>
        <p className="max-w-3xl">
          Weight of the general English model (λ): {fixed(report.baseWeight, 2)}, from 0 (the client’s writing
          alone) to 1 (general English alone).
        </p>
        {mixture && <p className="max-w-3xl">{mixture}</p>}
        <p className="max-w-3xl">
          Context order {report.order} (letters the model looks back), escape method {report.escape} (how it
          falls back to shorter contexts).
        </p>
      </section>

      <section className="flex flex-col gap-3">
        <Heading>How the text was split for testing</Heading>
        <p className="max-w-3xl">
          {report.folds}-fold cross-validation: the writing is cut into {report.folds} parts (folds); each is
          predicted by a model trained on the others. {report.foldNote} {report.ksNote}
        </p>
        <Table caption={`Each fold’s figures (keystroke savings at ${slots} slots)`} scrollable>
          <TableHead>
            <ColumnHeader>Fold</ColumnHeader>
            <ColumnHeader>Training characters</ColumnHeader>
            <ColumnHeader>Test characters</ColumnHeader>
            <ColumnHeader>Bits per character</ColumnHeader>
            <ColumnHeader>Keystroke savings</ColumnHeader>
          </TableHead>
          <TableBody>
            {report.perFold.map((fold, index) => (
              <TableRow key={index}>
                <RowHeader label="Fold">{`Fold ${index + 1}`}</RowHeader>
                <TableCell label="Training characters">{count(fold.trainChars)}</TableCell>
                <TableCell label="Test characters">{count(fold.testChars)}</TableCell>
                <TableCell label="Bits per character">{fixed(fold.bpcIdeal, 3)}</TableCell>
                <TableCell label="Keystroke savings">
                  {percent(atSlots(fold.keystrokeSavings, slots))}
                </TableCell>
              </TableRow>
            ))}
          </TableBody>
        </Table>
      </section>
    </>
  );
};
