import { CartesianGrid, ErrorBar, Legend, Line, LineChart, XAxis, YAxis } from 'recharts';
import { chartSeriesLook } from '@keyloom/shared';
import type { ProfileReportView } from '../lib/profile-report';
import { chartFrame, chartInk, seriesLine, xAxisTitle } from './chart-look';

type CurvePoint = ProfileReportView['learningCurve']['points'][number];

const SERIES = 'Bits per character (mean over folds)';

/**
 * Bits per character by share of the training text, with a bar from the lowest to the highest fold
 * at each point. Drawn for sighted readers only: the table beside it holds the same figures.
 */
export const LearningCurveChart = ({ points }: { points: readonly CurvePoint[] }) => {
  const look = chartSeriesLook(0);
  const data = points.map((point) => ({
    share: Math.round(point.fraction * 100),
    [SERIES]: point.bpcIdeal,
    // Error bars take the distance below and above the plotted value.
    range: point.spread
      ? [point.bpcIdeal - point.spread.bpcMin, point.spread.bpcMax - point.bpcIdeal]
      : [0, 0],
  }));
  return (
    <div className="max-w-full overflow-x-auto" aria-hidden="true">
      <LineChart width={560} height={280} data={data} {...chartFrame}>
        <CartesianGrid stroke={chartInk.grid} />
        <XAxis
          dataKey="share"
          type="number"
          domain={[0, 100]}
          ticks={data.map((row) => row.share)}
          tickFormatter={(value: number) => `${value}%`}
          stroke={chartInk.axis}
          label={xAxisTitle('Share of the training text')}
        />
        <YAxis
          stroke={chartInk.axis}
          domain={['auto', 'auto']}
          tickFormatter={(value: number) => value.toFixed(2)}
        />
        <Legend verticalAlign="top" />
        <Line dataKey={SERIES} {...seriesLine(0)}>
          <ErrorBar dataKey="range" direction="y" width={10} stroke={look.colour} strokeWidth={2} />
        </Line>
      </LineChart>
    </div>
  );
};
