import { readFileSync } from 'node:fs';
import { chartColours, chartSeries, chartSizes, hexToRgb, type HexColour } from '@keyloom/shared';
import { PNG } from 'pngjs';
import { chartFont, textWidth } from './chart-text';
import {
  fittingSize,
  lineLabels,
  niceScale,
  PLOT_HEIGHT,
  renderChart,
  savingsChart,
  speedChart,
  type ChartSpec,
} from './summary-chart';

// The PNGs are decoded with pngjs (a general-purpose PNG reader, npm pngjs 7.0.0), not with anything
// of ours, and read back pixel by pixel.

type Image = { width: number; height: number; rgb: (x: number, y: number) => [number, number, number] };

function decode(png: Buffer): Image {
  const image = PNG.sync.read(png);
  return {
    width: image.width,
    height: image.height,
    rgb: (x, y) => {
      const i = (y * image.width + x) * 4;
      return [image.data[i] ?? 0, image.data[i + 1] ?? 0, image.data[i + 2] ?? 0];
    },
  };
}

/** Within a few levels of a colour on every channel (inside a shape; edges are smoothed). */
function near(rgb: readonly number[], hex: HexColour, tolerance = 6): boolean {
  return hexToRgb(hex).every((c, i) => Math.abs(c - (rgb[i] ?? -999)) <= tolerance);
}

/** Runs of a colour along row y: [start, end) pixel columns of each. */
function runs(image: Image, y: number, hex: HexColour): [number, number][] {
  const found: [number, number][] = [];
  let start = -1;
  for (let x = 0; x <= image.width; x++) {
    const inside = x < image.width && near(image.rgb(x, y), hex);
    if (inside && start < 0) start = x;
    if (!inside && start >= 0) {
      found.push([start, x]);
      start = -1;
    }
  }
  return found;
}

/** The lowest row with the most pixels of a colour (for a bar chart: the row just above the axis). */
function fullestRow(image: Image, hex: HexColour): number {
  let best = 0;
  let bestCount = -1;
  for (let y = 0; y < image.height; y++) {
    const count = runs(image, y, hex).reduce((sum, [a, b]) => sum + b - a, 0);
    if (count >= bestCount) [best, bestCount] = [y, count];
  }
  return best;
}

function countPixels(image: Image, hex: HexColour): number {
  let count = 0;
  for (let y = 0; y < image.height; y++) {
    for (let x = 0; x < image.width; x++) if (near(image.rgb(x, y), hex)) count++;
  }
  return count;
}

const bar = chartSeries[0].colour;
const second = chartSeries[1].colour;

describe('savingsChart', () => {
  // An invented data set: four versions of a client's suggestions.
  const savings = [0.31, 0.42, 0.5, 0.18];
  const chart = savingsChart(savings.map((s, i) => ({ number: i + 1, savings: s })));
  const image = decode(chart.png);

  it('is 600 CSS px wide, drawn at twice that in pixels', () => {
    expect(chart.width).toBe(600);
    expect(image.width).toBe(1200);
    expect(image.height).toBe(chart.height * 2);
    expect(chart.height).toBeGreaterThan(200);
  });

  it('draws one bar per version, their heights in proportion to the savings', () => {
    const row = fullestRow(image, bar);
    const found = runs(image, row, bar);
    expect(found).toHaveLength(savings.length);
    // Each bar's height, read by walking up its middle column from that row.
    const heights = found.map(([a, b]) => {
      const x = Math.floor((a + b) / 2);
      let y = row;
      while (y > 0 && near(image.rgb(x, y - 1), bar)) y--;
      return row - y + 1;
    });
    const tallest = Math.max(...heights);
    // 50 % is half the plot's height on the 0–100 % scale (2 pixels per CSS px; derived).
    expect(Math.abs(tallest - 0.5 * PLOT_HEIGHT * 2)).toBeLessThanOrEqual(3);
    heights.forEach((h, i) => expect(h / tallest).toBeCloseTo(savings[i] / 0.5, 1));
    // Bars are the same width and left to right in version order.
    const widths = found.map(([a, b]) => b - a);
    expect(Math.max(...widths) - Math.min(...widths)).toBeLessThanOrEqual(1);
  });

  it('writes its lettering in the theme text colour and keeps a clear margin (nothing cut off)', () => {
    expect(countPixels(image, chartColours.text)).toBeGreaterThan(2000);
    for (let x = 0; x < image.width; x++) {
      for (const y of [0, 1, image.height - 2, image.height - 1]) {
        expect(near(image.rgb(x, y), chartColours.background)).toBe(true);
      }
    }
    for (let y = 0; y < image.height; y++) {
      for (const x of [0, 1, image.width - 2, image.width - 1]) {
        expect(near(image.rgb(x, y), chartColours.background)).toBe(true);
      }
    }
  });

  it('states the same values in its alt text as on the bars', () => {
    const expected = savings.map((s, i) => `version ${i + 1}: ${Math.round(s * 100)}%`).join('; ');
    expect(chart.alt).toBe(`Key presses saved by suggestions, by version: ${expected}.`);
  });

  it('has no legend for its one series', () => {
    // The only pixels in the bar colour are the bars: nothing above the tallest bar's top.
    const rows = [...Array(image.height).keys()].filter((y) => runs(image, y, bar).length > 0);
    expect(runs(image, rows[0], bar)).toHaveLength(1);
  });
});

describe('speedChart', () => {
  const versions = [
    { number: 3, withSuggestions: 2.2, without: 1.9 },
    { number: 4, withSuggestions: 2.72, without: 1.9 },
    { number: 5, withSuggestions: 6.26, without: 2.4 },
  ];
  const chart = speedChart(versions);
  const image = decode(chart.png);

  it('is 1200 px wide and draws both series in their own colours', () => {
    expect(image.width).toBe(1200);
    expect(countPixels(image, bar)).toBeGreaterThan(500);
    expect(countPixels(image, second)).toBeGreaterThan(500);
  });

  it('marks each version once per series, plus one marker each in the legend', () => {
    // Circles mark the first series and squares the second (the theme's markers).
    expect(chart.svg.match(/<circle /g)).toHaveLength(versions.length + 1);
    expect(chart.svg.match(/<rect x=/g)).toHaveLength(versions.length + 1);
  });

  it('states every value in its alt text with one decimal, as written on the points', () => {
    expect(chart.alt).toBe(
      'Estimated words a minute, by version: version 3: 2.2 with suggestions, 1.9 without suggestions; ' +
        'version 4: 2.7 with suggestions, 1.9 without suggestions; ' +
        'version 5: 6.3 with suggestions, 2.4 without suggestions.',
    );
  });
});

describe('chart parts', () => {
  it('reads the app font from its WOFF file (the family the @fontsource stylesheet names)', () => {
    const css = readFileSync(require.resolve('@fontsource/atkinson-hyperlegible'), 'utf8');
    expect(css).toContain(`font-family: '${chartFont(400).names.fontFamily.en}'`);
    expect(chartFont(700).names.fontFamily.en).toBe(chartFont(400).names.fontFamily.en);
    // Advance widths add up: "11" is twice "1" (no kerning between equal figures; derived).
    expect(textWidth('11', 20)).toBeCloseTo(2 * textWidth('1', 20), 5);
  });

  it('shrinks labels to fit their slot, never below the smallest size', () => {
    expect(fittingSize(['7'], 500)).toBe(chartSizes.labelFont);
    const size = fittingSize(['100%'], 40);
    expect(size).toBeLessThan(chartSizes.labelFont);
    expect(textWidth('100%', size)).toBeLessThanOrEqual(40);
    expect(fittingSize(['a very long label'], 5)).toBe(chartSizes.smallestLabelFont);
  });

  it('picks a scale from 0 with at most 5 round steps that reaches the largest value', () => {
    const tick = String;
    expect(niceScale(2.7, tick)).toMatchObject({ max: 3, step: 1 });
    expect(niceScale(13.4, tick)).toMatchObject({ max: 15, step: 5 });
    expect(niceScale(5, tick)).toMatchObject({ max: 5, step: 1 });
    expect(niceScale(0, tick)).toMatchObject({ max: 0.5, step: 0.5 });
    for (const max of [0.3, 1.7, 9.9, 42, 180]) {
      const scale = niceScale(max, tick);
      expect(scale.max).toBeGreaterThanOrEqual(max);
      expect(scale.max / scale.step).toBeLessThanOrEqual(5);
    }
  });

  it('keeps value labels of one version apart, and above the axis', () => {
    const labels = lineLabels(
      [
        { text: '2.0', x: 100, y: 150 },
        { text: '1.9', x: 100, y: 152 },
      ],
      16,
      300,
    );
    const [high, low] = labels;
    expect(high.y).toBeLessThan(150); // above the higher point
    expect(low.y - high.y).toBeGreaterThan(12); // a line apart
    // Near the axis both go above their points instead.
    const nearAxis = lineLabels(
      [
        { text: '3.0', x: 100, y: 200 },
        { text: '0.0', x: 100, y: 300 },
      ],
      16,
      300,
    );
    expect(Math.max(...nearAxis.map((l) => l.y))).toBeLessThan(300);
  });

  it('refuses what it cannot draw', () => {
    const spec: ChartSpec = {
      kind: 'bar',
      title: 'T',
      valueAxis: 'V',
      categoryAxis: 'C',
      categories: ['1'],
      series: [{ name: 'S', values: [1] }],
      scale: { max: 1, step: 0.5, tick: String },
      format: String,
      categoryName: String,
    };
    expect(() => renderChart({ ...spec, categories: [], series: [{ name: 'S', values: [] }] })).toThrow(
      RangeError,
    );
    expect(() => renderChart({ ...spec, series: [{ name: 'S', values: [Number.NaN] }] })).toThrow(RangeError);
    const many = Array.from({ length: 21 }, (_, i) => String(i));
    expect(() =>
      renderChart({ ...spec, categories: many, series: [{ name: 'S', values: many.map(Number) }] }),
    ).toThrow(RangeError);
    expect(renderChart(spec).png.length).toBeGreaterThan(1000);
  });
});
