import { PNG } from 'pngjs';
import { rasterImage, savingsBySlotsChart } from '../summaries/summary-chart';
import { opaqueChartPng, rgbPng } from './opaque-png';

// The PNGs are decoded with pngjs (a general-purpose PNG reader, npm pngjs 7.0.0), not with anything
// of ours, and compared pixel by pixel with what was written.

describe('opaque PNG for the PDFs', () => {
  it('writes RGB pixels that a PNG reader decodes back exactly, alpha dropped', () => {
    const width = 3;
    const height = 2;
    const rgba = Buffer.from([
      255,
      0,
      0,
      255,
      0,
      255,
      0,
      128,
      0,
      0,
      255,
      0, // row 1: red, green (half alpha), blue (clear)
      10,
      20,
      30,
      255,
      40,
      50,
      60,
      255,
      70,
      80,
      90,
      255,
    ]);
    const png = PNG.sync.read(rgbPng(rgba, width, height));
    expect([png.width, png.height]).toEqual([width, height]);
    const rgb = [...png.data].filter((_, i) => i % 4 !== 3);
    expect(rgb).toEqual([255, 0, 0, 0, 255, 0, 0, 0, 255, 10, 20, 30, 40, 50, 60, 70, 80, 90]);
    expect([...png.data].filter((_, i) => i % 4 === 3)).toEqual([255, 255, 255, 255, 255, 255]);
  });

  it('a chart keeps every pixel of resvg’s own rendering', () => {
    const chart = savingsBySlotsChart({ '1': 0.25, '2': 0.5 });
    const image = rasterImage(chart.svg, 2);
    const png = PNG.sync.read(opaqueChartPng(chart.svg, 2));
    expect([png.width, png.height]).toEqual([image.width, image.height]);
    const original = image.pixels;
    let differing = 0;
    for (let i = 0; i < original.length; i += 4) {
      if (
        original[i] !== png.data[i] ||
        original[i + 1] !== png.data[i + 1] ||
        original[i + 2] !== png.data[i + 2]
      )
        differing++;
    }
    expect(differing).toBe(0);
  });

  it('refuses pixels that are not 4 bytes each', () => {
    expect(() => rgbPng(Buffer.alloc(5), 1, 1)).toThrow(RangeError);
  });
});
