import { readFileSync } from 'node:fs';
import { parse, type Font } from 'opentype.js';

// Lettering for the summary charts as SVG paths. The rasteriser (resvg) would look for fonts on the
// server, which may have none or others; turning each string into outlines of the app's own font,
// Atkinson Hyperlegible (npm @fontsource/atkinson-hyperlegible, its WOFF files, which opentype.js
// 1.3.4 reads; it cannot read WOFF2), makes the picture the same on every machine.

export type FontWeight = 400 | 700;

/** The font files (WOFF) of each weight, as require.resolve finds them: the charts' and the PDFs' lettering. */
export const atkinsonFontFiles: Record<FontWeight, string> = {
  400: '@fontsource/atkinson-hyperlegible/files/atkinson-hyperlegible-latin-400-normal.woff',
  700: '@fontsource/atkinson-hyperlegible/files/atkinson-hyperlegible-latin-700-normal.woff',
};

const fonts = new Map<FontWeight, Font>();

/** The parsed font of a weight, read from node_modules once per process. */
export function chartFont(weight: FontWeight): Font {
  let font = fonts.get(weight);
  if (!font) {
    const bytes = readFileSync(require.resolve(atkinsonFontFiles[weight]));
    font = parse(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength));
    fonts.set(weight, font);
  }
  return font;
}

export type TextStyle = {
  /** Font size in CSS px. */
  size: number;
  weight?: FontWeight;
  colour: string;
  /** Which point of the text x is: its start, middle or end. */
  anchor?: 'start' | 'middle' | 'end';
  /** A background-coloured outline behind the letters, so grid lines and series never cut through them. */
  halo?: string;
};

/** Width of a string in CSS px at a size (advance widths with kerning). */
export function textWidth(text: string, size: number, weight: FontWeight = 400): number {
  return chartFont(weight).getAdvanceWidth(text, size, { kerning: true });
}

/** Height above the baseline of capitals and figures, in CSS px (the font's ascender). */
export function textAscent(size: number, weight: FontWeight = 400): number {
  const font = chartFont(weight);
  return (font.ascender / font.unitsPerEm) * size;
}

/**
 * One line of text as SVG path elements, its baseline at y.
 * Characters the font lacks come out as its empty "missing" glyph; chart wording is Latin only.
 */
export function textPath(text: string, x: number, y: number, style: TextStyle): string {
  const weight = style.weight ?? 400;
  const width = textWidth(text, style.size, weight);
  const start = style.anchor === 'middle' ? x - width / 2 : style.anchor === 'end' ? x - width : x;
  const d = chartFont(weight).getPath(text, start, y, style.size, { kerning: true }).toPathData(2);
  if (d === '') return '';
  const halo = style.halo
    ? `<path d="${d}" fill="none" stroke="${style.halo}" stroke-width="${Math.max(3, style.size / 4)}" stroke-linejoin="round"/>`
    : '';
  return `${halo}<path d="${d}" fill="${style.colour}"/>`;
}
