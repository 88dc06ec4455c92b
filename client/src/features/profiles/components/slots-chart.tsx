import { CartesianGrid, Legend, Line, LineChart, Tooltip, XAxis, YAxis } from 'recharts';
import {
  ColumnHeader,
  RowHeader,
  Table,
  TableBody,
  TableCell,
  TableHead,
  TableRow,
} from '@/components/ui/table';
import { fixed, percent, SLOT_COUNTS, type SlotSeries } from '../lib/profile-report';
import { chartFrame, chartInk, MAX_CHART_SERIES, seriesLine, xAxisTitle } from './chart-look';

type SlotsChartProps = {
  /** The chart's title (also the figure's accessible name). */
  title: string;
  series: readonly SlotSeries[];
  /** Keystroke savings are fractions shown as percent; KSPC is keystrokes per character. */
  kind: 'savings' | 'kspc';
};

/**
 * A figure per suggestion-list size (1–10), one line per series, with the same numbers in a
 * visible table below it (the text alternative).
 */
export const SlotsChart = ({ title, series, kind }: SlotsChartProps) => {
  const format = (value: number | null) => (kind === 'savings' ? percent(value) : fixed(value, 3));
  const data = SLOT_COUNTS.map((slots) => {
    const row: Record<string, number | null> = { slots };
    for (const line of series) row[line.name] = line.values[String(slots)] ?? null;
    return row;
  });
  const drawn = series.slice(0, MAX_CHART_SERIES);
  const left = series.slice(MAX_CHART_SERIES);
  return (
    <figure className="flex flex-col gap-4">
      <figcaption className="text-lg font-bold">{title}</figcaption>
      <div className="max-w-full overflow-x-auto" aria-hidden="true">
        <LineChart width={640} height={300} data={data} {...chartFrame}>
          <CartesianGrid stroke={chartInk.grid} />
          <XAxis dataKey="slots" stroke={chartInk.axis} label={xAxisTitle('Suggestion slots')} />
          <YAxis
            stroke={chartInk.axis}
            tickFormatter={(value: number) =>
              kind === 'savings' ? `${Math.round(value * 100)}%` : value.toFixed(2)
            }
            domain={kind === 'savings' ? [0, 'auto'] : ['auto', 'auto']}
          />
          <Tooltip formatter={(value) => (typeof value === 'number' ? format(value) : String(value))} />
          <Legend verticalAlign="top" />
          {drawn.map((line, index) => (
            <Line key={line.name} dataKey={line.name} {...seriesLine(index)} />
          ))}
        </LineChart>
      </div>
      {left.length > 0 && (
        <p className="max-w-3xl text-ink-soft">
          The chart draws the first {MAX_CHART_SERIES} series; {left.map((line) => line.name).join(', ')} only
          in the table below.
        </p>
      )}
      <Table caption={`${title}: the figures`}>
        <TableHead>
          <ColumnHeader>Slots</ColumnHeader>
          {series.map((line) => (
            <ColumnHeader key={line.name}>{line.name}</ColumnHeader>
          ))}
        </TableHead>
        <TableBody>
          {data.map((row) => (
            <TableRow key={row.slots}>
              <RowHeader label="Slots">{row.slots}</RowHeader>
              {series.map((line) => (
                <TableCell key={line.name} label={line.name}>
                  {format(row[line.name] ?? null)}
                </TableCell>
              ))}
            </TableRow>
          ))}
        </TableBody>
      </Table>
    </figure>
  );
};
