import { keyboardLayoutLabels, keyboardLayouts, type ProfileVersion } from '@keyloom/shared';
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
  percent,
  type ProfileReportView,
  readReport,
  SCAN_STEPS_NOT_MEASURED,
  SCAN_STEPS_NOTE,
  type SlotSeries,
} from '../lib/profile-report';
import { EngineDetails } from '@/components/ui/engine-details';
import { VocabularyDifferences } from '@/features/vocabulary/components/vocabulary-differences';
import { SlotsChart } from './slots-chart';

type Column = { name: string; report: ProfileReportView | null; base: boolean };

type MetricRow = { label: string; value: (report: ProfileReportView, base: boolean) => string };

// The base model alone has bits, keystroke and hit figures only; the rest shows "—" in its column.
/** The figures in the clinic's words, shown first. */
const rows = (slots: number): MetricRow[] => [
  { label: 'Characters of text', value: (r, base) => (base ? '—' : count(r.chars)) },
  {
    label: `Keystroke savings at ${slots} slots`,
    value: (r, base) =>
      percent(atSlots(base ? (r.baseOnly?.keystrokeSavings ?? {}) : r.keystrokeSavings, slots)),
  },
  {
    label: `Keystrokes per character at ${slots} slots`,
    value: (r, base) => fixed(atSlots(base ? (r.baseOnly?.kspc ?? {}) : r.kspc, slots), 3),
  },
  {
    label: `Selections per word at ${slots} slots`,
    value: (r, base) =>
      base ? '—' : r.selectionsPerWord ? fixed(atSlots(r.selectionsPerWord, slots), 1) : 'Not measured',
  },
  {
    label: `Hit rate at ${slots} slots`,
    value: (r, base) => {
      const rates = base ? r.baseOnly?.hitRate : r.hitRate;
      return rates ? percent(atSlots(rates, slots), 0) : 'Not measured';
    },
  },
  // One row per keyboard layout, named as the keyboard's layout setting names it.
  ...keyboardLayouts.map((layout): MetricRow => ({
    label: `Scan steps per character, ${keyboardLayoutLabels[layout]}`,
    value: (r, base) =>
      base ? '—' : r.scanStepsByLayout ? fixed(r.scanStepsByLayout[layout], 2) : 'Not measured',
  })),
  {
    label: 'Words per minute without suggestions',
    value: (r, base) => (base ? '—' : fixed(r.rates.wpmWithout, 1)),
  },
  {
    label: 'Words per minute with suggestions',
    value: (r, base) => (base ? '—' : fixed(r.rates.wpmWith, 1)),
  },
];

/** The engine's own settings and figures, under "Engine details". */
const engineRows: MetricRow[] = [
  { label: 'Context order', value: (r, base) => (base ? '—' : String(r.order)) },
  { label: 'Escape method', value: (r, base) => (base ? '—' : r.escape) },
  { label: 'Weight of general English', value: (r, base) => (base ? '1.00' : fixed(r.baseWeight, 2)) },
  {
    label: 'Bits per character (ideal)',
    value: (r, base) => (base ? fixed(r.baseOnly?.bpcIdeal ?? null, 3) : fixed(r.bpcIdeal, 3)),
  },
  { label: 'Bits per character (coded)', value: (r, base) => (base ? '—' : fixed(r.bpcCoded, 3)) },
];

/** One table of versions side by side, a row per measure. */
const MeasuresTable = ({
  caption,
  rows,
  columns,
}: {
  caption: string;
  rows: MetricRow[];
  columns: Column[];
}) => (
  <Table caption={caption}>
    <TableHead>
      <ColumnHeader>Measure</ColumnHeader>
      {columns.map((column) => (
        <ColumnHeader key={column.name}>{column.name}</ColumnHeader>
      ))}
    </TableHead>
    <TableBody>
      {rows.map((row) => (
        <TableRow key={row.label}>
          <RowHeader label="Measure">{row.label}</RowHeader>
          {columns.map((column) => (
            <TableCell key={column.name} label={column.name}>
              {column.report ? row.value(column.report, column.base) : 'Not trained'}
            </TableCell>
          ))}
        </TableRow>
      ))}
    </TableBody>
  </Table>
);

/**
 * Two or more versions side by side, with the general English model alone (measured on the first
 * version's held-out text) as the last column, and keystroke savings by list size as one chart.
 */
export const CompareView = ({ versions }: { versions: readonly ProfileVersion[] }) => {
  const columns: Column[] = versions.map((version) => ({
    name: `Version ${version.number}`,
    report: readReport(version.metrics),
    base: false,
  }));
  const first = columns.find((column) => column.report?.baseOnly);
  if (first) columns.push({ name: 'General English alone', report: first.report, base: true });
  const slots = versions[0]?.settings.slots ?? 5;
  const series: SlotSeries[] = columns.flatMap((column) => {
    if (!column.report) return [];
    const values = column.base ? column.report.baseOnly?.keystrokeSavings : column.report.keystrokeSavings;
    return values ? [{ name: column.name, values }] : [];
  });

  return (
    <div className="flex flex-col gap-10">
      <MeasuresTable caption="Versions compared" rows={rows(slots)} columns={columns} />
      <p className="max-w-3xl text-ink-soft">
        {SCAN_STEPS_NOTE}
        {columns.some((column) => column.report && !column.base && !column.report.scanStepsByLayout) &&
          ` Not measured: ${SCAN_STEPS_NOT_MEASURED}`}
      </p>
      {first && (
        <p className="max-w-3xl text-ink-soft">
          The general English model alone was measured on {first.name.toLowerCase()}’s held-out text; each
          version is measured on its own samples, so compare versions trained on the same samples where you
          can.
        </p>
      )}
      {series.length > 0 && (
        <SlotsChart
          title="Keystroke savings for 1 to 10 suggestion slots, by version"
          series={series}
          kind="savings"
        />
      )}
      <VocabularyDifferences versions={versions} />
      <EngineDetails description="The model settings and bits per character of each version.">
        <MeasuresTable caption="Engine settings and bits per character" rows={engineRows} columns={columns} />
      </EngineDetails>
    </div>
  );
};
