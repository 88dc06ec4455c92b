import { crc32, deflateSync } from 'node:zlib';

// Small charts for the summary e-mail, drawn into an RGB pixel buffer and encoded as PNG by hand
// (node:zlib for deflate and CRC-32), so mail programs show them as ordinary embedded images.

export type Rgb = readonly [number, number, number];

/** An RGB image, 3 bytes per pixel, rows top to bottom. */
export type Canvas = { width: number; height: number; pixels: Uint8Array };

const PNG_SIGNATURE = Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

/** A canvas filled with one colour. @param width 1..4096 @param height 1..4096 */
export function createCanvas(width: number, height: number, background: Rgb): Canvas {
  if (
    !Number.isInteger(width) ||
    !Number.isInteger(height) ||
    width < 1 ||
    height < 1 ||
    width > 4096 ||
    height > 4096
  ) {
    throw new RangeError('Canvas sides must be whole numbers from 1 to 4096.');
  }
  const pixels = new Uint8Array(width * height * 3);
  for (let i = 0; i < pixels.length; i += 3) pixels.set(background, i);
  return { width, height, pixels };
}

/** Sets one pixel; points outside the canvas are ignored (lines may run off the edge). */
export function setPixel(canvas: Canvas, x: number, y: number, colour: Rgb): void {
  if (x < 0 || y < 0 || x >= canvas.width || y >= canvas.height) return;
  canvas.pixels.set(colour, (y * canvas.width + x) * 3);
}

/** Reads one pixel (for tests and checks). */
export function getPixel(canvas: Canvas, x: number, y: number): Rgb {
  const i = (y * canvas.width + x) * 3;
  return [canvas.pixels[i] ?? 0, canvas.pixels[i + 1] ?? 0, canvas.pixels[i + 2] ?? 0];
}

/** Fills the rectangle [x0, x1) × [y0, y1), clipped to the canvas. */
export function fillRect(canvas: Canvas, x0: number, y0: number, x1: number, y1: number, colour: Rgb): void {
  for (let y = Math.max(0, Math.round(y0)); y < Math.min(canvas.height, Math.round(y1)); y++) {
    for (let x = Math.max(0, Math.round(x0)); x < Math.min(canvas.width, Math.round(x1)); x++) {
      setPixel(canvas, x, y, colour);
    }
  }
}

/** A line `thickness` pixels wide (Bresenham's algorithm with a square pen). */
export function drawLine(
  canvas: Canvas,
  from: { x: number; y: number },
  to: { x: number; y: number },
  colour: Rgb,
  thickness = 1,
): void {
  let x = Math.round(from.x);
  let y = Math.round(from.y);
  const x1 = Math.round(to.x);
  const y1 = Math.round(to.y);
  const dx = Math.abs(x1 - x);
  const dy = -Math.abs(y1 - y);
  const sx = x < x1 ? 1 : -1;
  const sy = y < y1 ? 1 : -1;
  const half = Math.floor((thickness - 1) / 2);
  let err = dx + dy;
  for (;;) {
    fillRect(canvas, x - half, y - half, x - half + thickness, y - half + thickness, colour);
    if (x === x1 && y === y1) return;
    const e2 = 2 * err;
    if (e2 >= dy) {
      err += dy;
      x += sx;
    }
    if (e2 <= dx) {
      err += dx;
      y += sy;
    }
  }
}

function chunk(type: string, data: Uint8Array): Buffer {
  const head = Buffer.alloc(8);
  head.writeUInt32BE(data.length, 0);
  head.write(type, 4, 'ascii');
  const body = Buffer.concat([head.subarray(4), data]);
  const crc = Buffer.alloc(4);
  // The CRC covers the chunk type and data, not the length (PNG specification, section 5.3).
  crc.writeUInt32BE(crc32(body) >>> 0, 0);
  return Buffer.concat([head.subarray(0, 4), body, crc]);
}

/** Encodes the canvas as an 8-bit truecolour PNG without interlacing, filter type 0 on every row. */
export function encodePng(canvas: Canvas): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(canvas.width, 0);
  ihdr.writeUInt32BE(canvas.height, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 2; // colour type: truecolour
  ihdr[10] = 0; // compression: deflate
  ihdr[11] = 0; // filter method 0
  ihdr[12] = 0; // no interlace
  const stride = canvas.width * 3;
  const raw = Buffer.alloc((stride + 1) * canvas.height);
  for (let y = 0; y < canvas.height; y++) {
    raw[y * (stride + 1)] = 0; // filter type None: the charts are flat colours and deflate well anyway
    raw.set(canvas.pixels.subarray(y * stride, (y + 1) * stride), y * (stride + 1) + 1);
  }
  return Buffer.concat([
    PNG_SIGNATURE,
    chunk('IHDR', ihdr),
    chunk('IDAT', deflateSync(raw, { level: 9 })),
    chunk('IEND', new Uint8Array(0)),
  ]);
}

// Colours of the charts (Keyloom's own choice; dark enough on white for a 3:1 contrast of graphics).
export const chartColours = {
  background: [255, 255, 255],
  axis: [60, 60, 60],
  grid: [222, 222, 222],
  bar: [31, 94, 140],
  lineWith: [31, 94, 140],
  lineWithout: [176, 84, 30],
} as const satisfies Record<string, Rgb>;

/** Plot area inside the canvas, leaving a margin for the axes. */
export type PlotArea = { left: number; top: number; right: number; bottom: number };

export const CHART_WIDTH = 480;
export const CHART_HEIGHT = 240;
export const PLOT: PlotArea = { left: 40, top: 16, right: CHART_WIDTH - 16, bottom: CHART_HEIGHT - 32 };

/** y pixel of a value on a 0..max scale inside the plot area. */
export function valueToY(value: number, max: number, plot: PlotArea = PLOT): number {
  const clamped = Math.min(max, Math.max(0, value));
  return Math.round(plot.bottom - (clamped / max) * (plot.bottom - plot.top));
}

function drawFrame(canvas: Canvas, gridLines: number): void {
  for (let i = 1; i <= gridLines; i++) {
    const y = Math.round(PLOT.bottom - (i / gridLines) * (PLOT.bottom - PLOT.top));
    drawLine(canvas, { x: PLOT.left, y }, { x: PLOT.right, y }, chartColours.grid);
  }
  drawLine(canvas, { x: PLOT.left, y: PLOT.top }, { x: PLOT.left, y: PLOT.bottom }, chartColours.axis, 2);
  drawLine(canvas, { x: PLOT.left, y: PLOT.bottom }, { x: PLOT.right, y: PLOT.bottom }, chartColours.axis, 2);
}

/** x centre of slot i of n across the plot area. */
export function slotCentre(i: number, n: number): number {
  return Math.round(PLOT.left + ((i + 0.5) / n) * (PLOT.right - PLOT.left));
}

/**
 * "Keystroke savings over versions": one bar per version on a 0..100 % scale with grid lines every 25 %.
 * The numbers themselves go in the e-mail text and the image's alt text (the PNG has no lettering).
 * @param savings fractions 0..1, oldest version first; 1..20 bars
 */
export function savingsBarChart(savings: readonly number[]): Canvas {
  if (savings.length < 1 || savings.length > 20) throw new RangeError('Draw 1 to 20 bars.');
  const canvas = createCanvas(CHART_WIDTH, CHART_HEIGHT, chartColours.background);
  drawFrame(canvas, 4);
  const slot = (PLOT.right - PLOT.left) / savings.length;
  const barWidth = Math.max(4, Math.round(slot * 0.6));
  savings.forEach((value, i) => {
    const centre = slotCentre(i, savings.length);
    fillRect(
      canvas,
      centre - barWidth / 2,
      valueToY(value, 1),
      centre + barWidth / 2,
      PLOT.bottom,
      chartColours.bar,
    );
  });
  return canvas;
}

/**
 * "Speed over versions": estimated words a minute with suggestions (solid) and without (second colour),
 * one point per version, on a 0..max scale rounded up to a whole number of 5 wpm.
 * @param points wpm ≥ 0, oldest version first; 1..20 points
 */
export function speedLineChart(points: readonly { withSuggestions: number; without: number }[]): Canvas {
  if (points.length < 1 || points.length > 20) throw new RangeError('Draw 1 to 20 points.');
  const top = Math.max(
    5,
    Math.ceil(Math.max(...points.flatMap((p) => [p.withSuggestions, p.without])) / 5) * 5,
  );
  const canvas = createCanvas(CHART_WIDTH, CHART_HEIGHT, chartColours.background);
  drawFrame(canvas, top / 5);
  const series: [keyof (typeof points)[number], Rgb][] = [
    ['without', chartColours.lineWithout],
    ['withSuggestions', chartColours.lineWith],
  ];
  for (const [key, colour] of series) {
    const xy = points.map((p, i) => ({ x: slotCentre(i, points.length), y: valueToY(p[key], top) }));
    xy.forEach((p, i) => {
      const next = xy[i + 1];
      if (next) drawLine(canvas, p, next, colour, 3);
      fillRect(canvas, p.x - 4, p.y - 4, p.x + 5, p.y + 5, colour);
    });
  }
  return canvas;
}
