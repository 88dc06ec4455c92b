import { type RenderedImage, Resvg } from '@resvg/resvg-js';
import { chartColours, chartSeriesLook, chartSizes, type ChartMarker } from '@keyloom/shared';
import { textAscent, textPath, textWidth } from './chart-text';

// The charts of the summary e-mail: each drawn as SVG (lettering as outlines of the app's font, see
// chart-text.ts) and rasterised by resvg (@resvg/resvg-js) to a PNG at twice its CSS size, so mail
// programs show an ordinary embedded image that stays sharp on a phone. Colours, markers and sizes
// come from the shared chart theme.

/** One series: its name (the legend's words) and one value per category. */
export type ChartSeries = { name: string; values: readonly number[] };

/** A value axis from 0 to `max` with a grid line every `step`. */
export type ChartScale = { max: number; step: number; tick: (value: number) => string };

export type ChartSpec = {
  kind: 'bar' | 'line';
  title: string;
  /** The value axis's name with its unit, written above the axis, e.g. "Words a minute (wpm)". */
  valueAxis: string;
  /** The category axis's name, written under it, e.g. "Version". */
  categoryAxis: string;
  /** One label per category, in order (e.g. version numbers). */
  categories: readonly string[];
  series: readonly ChartSeries[];
  scale: ChartScale;
  /** How a value is written on the chart and in the alt text (the same words in both). */
  format: (value: number) => string;
  /** How a category is named in the alt text, e.g. "version 2". */
  categoryName: (category: string) => string;
};

/** A rendered chart: the PNG, its size in CSS px (the PNG has `pixelRatio` times as many pixels). */
export type RenderedChart = { svg: string; png: Buffer; width: number; height: number; alt: string };

export const CHART_WIDTH = chartSizes.maxWidth;
export const MAX_CATEGORIES = 20;
const PAD = 16;
/** Height of the plot area in CSS px (the scale from 0 to its top). */
export const PLOT_HEIGHT = 170;
const GAP = 8;

const fmt = (n: number): string => String(Math.round(n * 100) / 100);

/** The largest size ≤ `size` at which every string fits in `room` CSS px, never below the smallest size. */
export function fittingSize(
  texts: readonly string[],
  room: number,
  size: number = chartSizes.labelFont,
): number {
  const widest = Math.max(...texts.map((t) => textWidth(t, 1)));
  if (!(widest > 0)) return size;
  return Math.max(chartSizes.smallestLabelFont, Math.min(size, Math.floor((room / widest) * 10) / 10));
}

/**
 * A scale from 0 with at most 5 grid steps of 0.5, 1, 2, 5, 10, 20 or 50, reaching at least `max`
 * (at least one step when everything is 0).
 */
export function niceScale(max: number, tick: (value: number) => string): ChartScale {
  const steps = [0.5, 1, 2, 5, 10, 20, 50, 100, 200, 500];
  const top = Math.max(0, max);
  for (const step of steps) {
    const scaleMax = Math.max(step, Math.ceil(top / step - 1e-9) * step);
    if (scaleMax / step <= 5) return { max: scaleMax, step, tick };
  }
  const step = 10 ** Math.ceil(Math.log10(top / 5));
  return { max: Math.max(step, Math.ceil(top / step) * step), step, tick };
}

/** A marker shape centred on (x, y), radius r, in a colour with a white outline. */
export function markerPath(marker: ChartMarker, x: number, y: number, r: number, colour: string): string {
  const paint = `fill="${colour}" stroke="${chartColours.background}" stroke-width="1.5"`;
  switch (marker) {
    case 'square':
      return `<rect x="${fmt(x - r)}" y="${fmt(y - r)}" width="${fmt(2 * r)}" height="${fmt(2 * r)}" ${paint}/>`;
    case 'triangle':
      return `<path d="M${fmt(x)} ${fmt(y - r * 1.2)}L${fmt(x + r * 1.1)} ${fmt(y + r * 0.8)}L${fmt(x - r * 1.1)} ${fmt(y + r * 0.8)}Z" ${paint}/>`;
    case 'diamond':
      return `<path d="M${fmt(x)} ${fmt(y - r * 1.3)}L${fmt(x + r * 1.3)} ${fmt(y)}L${fmt(x)} ${fmt(y + r * 1.3)}L${fmt(x - r * 1.3)} ${fmt(y)}Z" ${paint}/>`;
    default:
      return `<circle cx="${fmt(x)}" cy="${fmt(y)}" r="${fmt(r)}" ${paint}/>`;
  }
}

/** The alt text: the title, then every category with every series' value, written as on the chart. */
export function chartAlt(spec: ChartSpec): string {
  const single = spec.series.length === 1;
  const items = spec.categories.map((category, i) => {
    const values = spec.series.map((s) => {
      const value = spec.format(s.values[i] ?? 0);
      return single ? value : `${value} ${s.name.toLowerCase()}`;
    });
    return `${spec.categoryName(category)}: ${values.join(', ')}`;
  });
  return `${spec.title}, by ${spec.categoryAxis.toLowerCase()}: ${items.join('; ')}.`;
}

function checkSpec(spec: ChartSpec): void {
  const n = spec.categories.length;
  if (n < 1 || n > MAX_CATEGORIES) throw new RangeError(`Draw 1 to ${MAX_CATEGORIES} categories.`);
  if (spec.series.length < 1) throw new RangeError('Draw at least one series.');
  chartSeriesLook(spec.series.length - 1); // throws past the palette
  for (const s of spec.series) {
    if (s.values.length !== n || s.values.some((v) => !Number.isFinite(v))) {
      throw new RangeError(`Series "${s.name}" needs one finite value per category.`);
    }
  }
  if (!(spec.scale.max > 0 && spec.scale.step > 0))
    throw new RangeError('The scale needs a positive top and step.');
}

/** Label placed at (x, baseline y). */
type Label = { text: string; x: number; y: number };

/**
 * Value labels of one category of a line chart, kept apart: the highest value's label above its
 * point, the others below theirs, each at least a line under the one before. When that would run
 * into the axis, every label goes above its point instead, each at least a line over the one below.
 */
export function lineLabels(
  points: readonly { text: string; x: number; y: number }[],
  size: number,
  plotBottom: number,
): Label[] {
  const ascent = textAscent(size);
  const clear = chartSizes.markerRadius + 5;
  const lineGap = ascent + 4;
  const order = [...points].sort((a, b) => a.y - b.y); // highest value first (smallest y)
  const below: Label[] = [];
  order.forEach((p, i) => {
    const wanted = i === 0 ? p.y - clear : p.y + clear + ascent;
    const prev = below[i - 1];
    below.push({ text: p.text, x: p.x, y: prev ? Math.max(wanted, prev.y + lineGap) : wanted });
  });
  if ((below.at(-1)?.y ?? 0) <= plotBottom - 4) return below;
  const above: Label[] = [];
  [...order].reverse().forEach((p, i) => {
    const prev = above[i - 1];
    above.push({ text: p.text, x: p.x, y: prev ? Math.min(p.y - clear, prev.y - lineGap) : p.y - clear });
  });
  return above;
}

/**
 * Draws a chart to SVG and PNG: title, legend (more than one series), the value axis's name and unit
 * above it with a number at each grid line, the category labels and axis name under it, and the
 * value written at each bar or point. 600 CSS px wide; the height follows from the parts.
 */
export function renderChart(spec: ChartSpec): RenderedChart {
  checkSpec(spec);
  const width = CHART_WIDTH;
  const label = chartSizes.labelFont;
  const parts: string[] = [];
  let y = PAD;

  // Title.
  y += textAscent(chartSizes.titleFont, 700);
  parts.push(
    textPath(spec.title, PAD, y, { size: chartSizes.titleFont, weight: 700, colour: chartColours.text }),
  );

  // Legend, one item per series: marker (and line) in the series' look, then its name.
  if (spec.series.length > 1) {
    y += GAP + 4 + textAscent(label);
    let x = PAD;
    spec.series.forEach((s, i) => {
      const look = chartSeriesLook(i);
      const mid = y - textAscent(label) / 3;
      if (spec.kind === 'line') {
        parts.push(
          `<line x1="${x}" y1="${fmt(mid)}" x2="${x + 28}" y2="${fmt(mid)}" stroke="${look.colour}" stroke-width="${chartSizes.lineWidth}"${look.dash ? ` stroke-dasharray="${look.dash}"` : ''}/>`,
        );
      }
      parts.push(markerPath(look.marker, x + 14, mid, chartSizes.markerRadius, look.colour));
      x += 36;
      parts.push(textPath(s.name, x, y, { size: label, colour: chartColours.text }));
      x += textWidth(s.name, label) + 24;
    });
  }

  // The value axis's name and unit, above the numbers of the axis.
  y += GAP + 6 + textAscent(label);
  parts.push(textPath(spec.valueAxis, PAD, y, { size: label, colour: chartColours.textSoft }));

  // Plot area: room above the top grid line for a value label.
  const ticks: number[] = [];
  for (let v = 0; v <= spec.scale.max + spec.scale.step / 1000; v += spec.scale.step) ticks.push(v);
  const tickTexts = ticks.map(spec.scale.tick);
  const top = y + GAP + textAscent(label) + 12;
  const bottom = top + PLOT_HEIGHT;
  const left = PAD + Math.max(...tickTexts.map((t) => textWidth(t, label))) + 10;
  const right = width - PAD;
  const yOf = (v: number) =>
    bottom - (Math.min(spec.scale.max, Math.max(0, v)) / spec.scale.max) * (bottom - top);

  // Grid lines and their numbers.
  ticks.forEach((v, i) => {
    const gy = Math.round(yOf(v));
    if (i > 0)
      parts.push(
        `<line x1="${fmt(left)}" y1="${gy}" x2="${right}" y2="${gy}" stroke="${chartColours.grid}" stroke-width="1"/>`,
      );
    parts.push(
      textPath(tickTexts[i] ?? '', left - 10, gy + textAscent(label) / 2 - 1, {
        size: label,
        colour: chartColours.textSoft,
        anchor: 'end',
      }),
    );
  });

  // Categories: a slot each, labelled under the axis.
  const n = spec.categories.length;
  const slot = (right - left) / n;
  const centre = (i: number) => left + (i + 0.5) * slot;
  const categorySize = fittingSize(spec.categories, slot - 4);
  spec.categories.forEach((c, i) => {
    parts.push(
      textPath(c, centre(i), bottom + GAP + textAscent(categorySize), {
        size: categorySize,
        colour: chartColours.text,
        anchor: 'middle',
      }),
    );
  });
  const categoryAxisY = bottom + GAP + textAscent(categorySize) + GAP + textAscent(label) + 2;
  parts.push(
    textPath(spec.categoryAxis, (left + right) / 2, categoryAxisY, {
      size: label,
      colour: chartColours.textSoft,
      anchor: 'middle',
    }),
  );

  // The series, then the value labels over everything.
  const valueTexts = spec.series.flatMap((s) => s.values.map(spec.format));
  const valueSize = fittingSize(valueTexts, slot - 4);
  const halo = chartColours.background;
  const labels: Label[] = [];
  if (spec.kind === 'bar') {
    // Bars side by side within a slot, whole CSS px wide so their edges are crisp.
    const group = Math.min(slot * 0.7, 72 * spec.series.length);
    const barWidth = Math.max(2, Math.floor(group / spec.series.length));
    spec.series.forEach((s, si) => {
      const look = chartSeriesLook(si);
      s.values.forEach((v, i) => {
        const x0 = Math.round(centre(i) - (barWidth * spec.series.length) / 2 + si * barWidth);
        const y0 = Math.round(yOf(v));
        if (bottom - y0 > 0) {
          parts.push(
            `<rect x="${x0}" y="${y0}" width="${barWidth}" height="${fmt(bottom - y0)}" fill="${look.colour}"/>`,
          );
        }
        labels.push({ text: spec.format(v), x: x0 + barWidth / 2, y: y0 - 6 });
      });
    });
  } else {
    spec.series.forEach((s, si) => {
      const look = chartSeriesLook(si);
      const points = s.values.map((v, i) => `${fmt(centre(i))},${fmt(yOf(v))}`).join(' ');
      parts.push(
        `<polyline points="${points}" fill="none" stroke="${look.colour}" stroke-width="${chartSizes.lineWidth}" stroke-linejoin="round"${look.dash ? ` stroke-dasharray="${look.dash}"` : ''}/>`,
      );
    });
    spec.series.forEach((s, si) => {
      const look = chartSeriesLook(si);
      s.values.forEach((v, i) =>
        parts.push(markerPath(look.marker, centre(i), yOf(v), chartSizes.markerRadius, look.colour)),
      );
    });
    spec.categories.forEach((_, i) => {
      const points = spec.series.map((s) => ({
        text: spec.format(s.values[i] ?? 0),
        x: centre(i),
        y: yOf(s.values[i] ?? 0),
      }));
      labels.push(...lineLabels(points, valueSize, bottom));
    });
  }
  // Axes last but under the labels: the value axis's 0 line and the left edge.
  parts.push(
    `<path d="M${fmt(left)} ${fmt(top)}V${bottom}H${right}" fill="none" stroke="${chartColours.axis}" stroke-width="2"/>`,
  );
  for (const l of labels) {
    parts.push(
      textPath(l.text, l.x, l.y, {
        size: valueSize,
        weight: 700,
        colour: chartColours.text,
        anchor: 'middle',
        halo,
      }),
    );
  }

  const height = Math.ceil(categoryAxisY + PAD);
  const svg =
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}">` +
    `<rect width="${width}" height="${height}" fill="${chartColours.background}"/>${parts.join('')}</svg>`;
  return { svg, png: rasterise(svg), width, height, alt: chartAlt(spec) };
}

/**
 * A chart's SVG rasterised, `zoom` device pixels per CSS px, on the charts' background: the e-mail's
 * twice, the PDF's more, for print. The lettering is already outlines, so no font is looked up.
 */
export function rasterImage(svg: string, zoom: number = chartSizes.pixelRatio): RenderedImage {
  return new Resvg(svg, {
    fitTo: { mode: 'zoom', value: zoom },
    font: { loadSystemFonts: false },
    background: chartColours.background,
  }).render();
}

/** A chart's SVG as a PNG (RGBA), `zoom` device pixels per CSS px. */
export function rasterise(svg: string, zoom: number = chartSizes.pixelRatio): Buffer {
  return rasterImage(svg, zoom).asPng();
}

const percent = (fraction: number): string => `${Math.round(fraction * 100)}%`;

/** What every chart over versions shares: one category per version, named "version n" in words. */
const overVersions = (versions: readonly { number: number }[]) => ({
  categoryAxis: 'Version',
  categories: versions.map((v) => String(v.number)),
  categoryName: (category: string) => `version ${category}`,
});

/**
 * "Key presses saved by suggestions": one bar per version on a 0–100 % scale.
 * @param versions oldest first, 1..20; savings as fractions 0..1
 */
export function savingsChart(versions: readonly { number: number; savings: number }[]): RenderedChart {
  return renderChart({
    kind: 'bar',
    title: 'Key presses saved by suggestions',
    valueAxis: 'Key presses saved (%)',
    ...overVersions(versions),
    series: [{ name: 'Key presses saved', values: versions.map((v) => v.savings) }],
    scale: { max: 1, step: 0.25, tick: percent },
    format: percent,
  });
}

/**
 * "Estimated words a minute": with and without suggestions, one point per version each.
 * @param versions oldest first, 1..20; rates in words a minute ≥ 0
 */
export function speedChart(
  versions: readonly { number: number; withSuggestions: number; without: number }[],
): RenderedChart {
  const max = Math.max(...versions.flatMap((v) => [v.withSuggestions, v.without]));
  const oneDecimal = (wpm: number): string => wpm.toFixed(1);
  return renderChart({
    kind: 'line',
    title: 'Estimated words a minute',
    valueAxis: 'Words a minute (wpm)',
    ...overVersions(versions),
    series: [
      { name: 'With suggestions', values: versions.map((v) => v.withSuggestions) },
      { name: 'Without suggestions', values: versions.map((v) => v.without) },
    ],
    scale: niceScale(max, (v) => (Number.isInteger(v) ? String(v) : v.toFixed(1))),
    format: oneDecimal,
  });
}

/**
 * "Key presses saved by the number of suggestions": one bar per list size (1..10 slots) of a
 * version's report, on a 0–100 % scale.
 * @param perSlot fractions 0..1 keyed "1".."10" (the report's `keystrokeSavings`); at least one
 */
export function savingsBySlotsChart(perSlot: Readonly<Record<string, number>>): RenderedChart {
  const slots = Object.keys(perSlot)
    .map(Number)
    .filter((n) => Number.isInteger(n) && n >= 1)
    .sort((a, b) => a - b)
    .slice(0, MAX_CATEGORIES);
  return renderChart({
    kind: 'bar',
    title: 'Key presses saved, by number of suggestions',
    valueAxis: 'Key presses saved (%)',
    categoryAxis: 'Suggestion slots',
    categories: slots.map(String),
    categoryName: (category) => `${category} ${category === '1' ? 'slot' : 'slots'}`,
    series: [{ name: 'Key presses saved', values: slots.map((n) => perSlot[String(n)] ?? 0) }],
    scale: { max: 1, step: 0.25, tick: percent },
    format: percent,
  });
}
