import type { ReactElement } from 'react';
import { chartColours, chartSeries, chartSeriesLook, chartSizes, type ChartMarker } from '@keyloom/shared';

// The product's chart theme (shared/src/charts/chart-theme.ts) for the profile pages' charts: one
// colour, marker and dash per series, the same marker beside the series' name in the legend.

/** How many series a chart can tell apart (one theme look each). */
export const MAX_CHART_SERIES = chartSeries.length;

/** Colours of axes, grid and labels. */
export const chartInk = chartColours;

/** The dot renderer of a line: the series' marker shape in its colour. */
export const markerDot = (shape: ChartMarker, colour: string) =>
  function Marker(props: { cx?: number; cy?: number; index?: number }): ReactElement {
    const { cx = 0, cy = 0, index = 0 } = props;
    const r = chartSizes.markerRadius;
    const common = { fill: colour, stroke: colour };
    switch (shape) {
      case 'square':
        return (
          <rect key={index} {...common} x={cx - r + 1} y={cy - r + 1} width={2 * r - 2} height={2 * r - 2} />
        );
      case 'triangle':
        return (
          <path
            key={index}
            {...common}
            d={`M${cx} ${cy - r} L${cx + r} ${cy + r - 1} L${cx - r} ${cy + r - 1} Z`}
          />
        );
      case 'diamond':
        return (
          <path
            key={index}
            {...common}
            d={`M${cx} ${cy - r} L${cx + r} ${cy} L${cx} ${cy + r} L${cx - r} ${cy} Z`}
          />
        );
      default:
        return <circle key={index} {...common} cx={cx} cy={cy} r={r - 1} />;
    }
  };

/** Props every profile chart's LineChart shares: drawn for sighted readers, the table beside it is the text. */
export const chartFrame = {
  accessibilityLayer: false,
  margin: { top: 8, right: 24, bottom: 24, left: 8 },
} as const;

/** The x axis's title below the axis. */
export const xAxisTitle = (value: string) =>
  ({ value, position: 'insideBottom', offset: -12, fill: chartColours.text }) as const;

/** A Line's look for series number `index`: the theme's colour, dash and marker, also in the legend. */
export const seriesLine = (index: number) => {
  const look = chartSeriesLook(index);
  return {
    type: 'linear',
    stroke: look.colour,
    strokeWidth: 2.5,
    strokeDasharray: look.dash,
    dot: markerDot(look.marker, look.colour),
    legendType: look.marker,
    isAnimationActive: false,
  } as const;
};
