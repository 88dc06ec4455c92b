// The look of Keyloom's charts: one theme for every chart the product draws (today the charts of the
// progress-summary e-mail, rendered on the server). Plain data, no drawing code.

/** A colour as #rrggbb. */
export type HexColour = `#${string}`;

/** The shape drawn at each point of a series and beside its name in the legend. */
export type ChartMarker = 'circle' | 'square' | 'triangle' | 'diamond';

/** How one series looks: colour, marker and line dash, so it is told apart without colour too. */
export type ChartSeriesLook = {
  colour: HexColour;
  marker: ChartMarker;
  /** SVG stroke-dasharray of the series' line in CSS px; undefined for a solid line. */
  dash: string | undefined;
};

/**
 * The colour-blind-safe palette of M. Okabe and K. Ito, 2008, "Color Universal Design"
 * (docs/references.md §7): the eight colours they chose to stay distinct for the common kinds of
 * colour-vision deficiency.
 */
export const okabeItoPalette = {
  black: '#000000',
  orange: '#E69F00',
  skyBlue: '#56B4E9',
  bluishGreen: '#009E73',
  yellow: '#F0E442',
  blue: '#0072B2',
  vermillion: '#D55E00',
  reddishPurple: '#CC79A7',
} as const satisfies Record<string, HexColour>;

/**
 * Series looks in the order series use them. Only the palette colours with at least 3:1 against the
 * white chart background (WCAG 2.x non-text contrast) are used: orange, sky blue and yellow are
 * too light for marks on white. Each series also has its own marker and dash.
 */
export const chartSeries: readonly ChartSeriesLook[] = [
  { colour: okabeItoPalette.blue, marker: 'circle', dash: undefined },
  { colour: okabeItoPalette.vermillion, marker: 'square', dash: '10 6' },
  { colour: okabeItoPalette.bluishGreen, marker: 'triangle', dash: '3 5' },
  { colour: okabeItoPalette.reddishPurple, marker: 'diamond', dash: '14 5 3 5' },
];

/**
 * Colours of everything that is not a series. Text is Keyloom's ink on white (at least 4.5:1, WCAG
 * 2.x for normal text; checked in the theme's test); grid lines are deliberately faint.
 */
export const chartColours = {
  background: '#FFFFFF',
  text: '#1D2B4F',
  textSoft: '#44506F',
  axis: '#44506F',
  grid: '#E3DED3',
} as const satisfies Record<string, HexColour>;

/** Text pairs that must reach 4.5:1 (WCAG 2.x, normal-size text). */
export const chartTextPairs: readonly { name: string; text: HexColour; background: HexColour }[] = [
  { name: 'text', text: chartColours.text, background: chartColours.background },
  { name: 'soft text', text: chartColours.textSoft, background: chartColours.background },
];

/** Sizes in CSS px. Charts are at most 600 px wide and drawn at twice that in pixels. */
export const chartSizes = {
  maxWidth: 600,
  pixelRatio: 2,
  titleFont: 24,
  labelFont: 19,
  smallestLabelFont: 10,
  markerRadius: 5,
  lineWidth: 3,
} as const;

/** The series look for series number `index` (0-based); throws past the palette's end. */
export function chartSeriesLook(index: number): ChartSeriesLook {
  const look = chartSeries[index];
  if (!look) throw new RangeError(`Charts show at most ${chartSeries.length} series.`);
  return look;
}

/** [r, g, b] 0..255 of a #rrggbb colour. */
export function hexToRgb(hex: HexColour): [number, number, number] {
  const match = /^#([0-9a-f]{6})$/i.exec(hex);
  if (!match?.[1]) throw new RangeError(`Not a #rrggbb colour: ${hex}`);
  const n = parseInt(match[1], 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

/**
 * Relative luminance of an sRGB colour as WCAG 2.x defines it (0 for black, 1 for white): each channel
 * linearised (c/12.92 up to 0.03928, else ((c+0.055)/1.055)^2.4), weighted 0.2126 R + 0.7152 G + 0.0722 B.
 */
export function relativeLuminance(hex: HexColour): number {
  const [r, g, b] = hexToRgb(hex).map((v) => {
    const c = v / 255;
    return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  }) as [number, number, number];
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** WCAG 2.x contrast ratio (L1 + 0.05) / (L2 + 0.05), lighter over darker: 1 to 21. */
export function contrastRatio(a: HexColour, b: HexColour): number {
  const [la, lb] = [relativeLuminance(a), relativeLuminance(b)];
  return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
}
