import type { ReactElement } from 'react';
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

// Up to five series told apart three ways: colour (each ≥ 4.5:1 on white), dash and marker shape.
const looks = [
  { colour: '#1d2b4f', dash: undefined, shape: 'circle' },
  { colour: '#8a4300', dash: '8 4', shape: 'square' },
  { colour: '#17582f', dash: '2 4', shape: 'triangle' },
  { colour: '#9b2226', dash: '12 4 3 4', shape: 'diamond' },
  { colour: '#44506f', dash: '4 2', shape: 'cross' },
] as const;
type Shape = (typeof looks)[number]['shape'];

const marker = (shape: Shape, colour: string) =>
  function Marker(props: { cx?: number; cy?: number; index?: number }): ReactElement {
    const { cx = 0, cy = 0, index = 0 } = props;
    const common = { fill: colour, stroke: colour };
    switch (shape) {
      case 'square':
        return <rect key={index} {...common} x={cx - 4} y={cy - 4} width={8} height={8} />;
      case 'triangle':
        return (
          <path key={index} {...common} d={`M${cx} ${cy - 5} L${cx + 5} ${cy + 4} L${cx - 5} ${cy + 4} Z`} />
        );
      case 'diamond':
        return (
          <path
            key={index}
            {...common}
            d={`M${cx} ${cy - 5} L${cx + 5} ${cy} L${cx} ${cy + 5} L${cx - 5} ${cy} Z`}
          />
        );
      case 'cross':
        return (
          <path
            key={index}
            {...common}
            fill="none"
            strokeWidth={2}
            d={`M${cx - 4} ${cy - 4} L${cx + 4} ${cy + 4} M${cx + 4} ${cy - 4} L${cx - 4} ${cy + 4}`}
          />
        );
      default:
        return <circle key={index} {...common} cx={cx} cy={cy} r={4} />;
    }
  };

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
  return (
    <figure className="flex flex-col gap-4">
      <figcaption className="text-lg font-bold">{title}</figcaption>
      <div className="max-w-full overflow-x-auto" aria-hidden="true">
        <LineChart
          width={640}
          height={300}
          data={data}
          accessibilityLayer={false}
          margin={{ top: 8, right: 24, bottom: 24, left: 8 }}
        >
          <CartesianGrid stroke="#d9d0bd" />
          <XAxis
            dataKey="slots"
            stroke="#1d2b4f"
            label={{ value: 'Suggestion slots', position: 'insideBottom', offset: -12, fill: '#1d2b4f' }}
          />
          <YAxis
            stroke="#1d2b4f"
            tickFormatter={(value: number) =>
              kind === 'savings' ? `${Math.round(value * 100)}%` : value.toFixed(2)
            }
            domain={kind === 'savings' ? [0, 'auto'] : ['auto', 'auto']}
          />
          <Tooltip formatter={(value) => (typeof value === 'number' ? format(value) : String(value))} />
          <Legend verticalAlign="top" />
          {series.map((line, index) => {
            const look = looks[index % looks.length]!;
            return (
              <Line
                key={line.name}
                type="linear"
                dataKey={line.name}
                stroke={look.colour}
                strokeWidth={2.5}
                strokeDasharray={look.dash}
                dot={marker(look.shape, look.colour)}
                isAnimationActive={false}
              />
            );
          })}
        </LineChart>
      </div>
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
