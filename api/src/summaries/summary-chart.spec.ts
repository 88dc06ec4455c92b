import { crc32, inflateSync } from 'node:zlib';
import {
  chartColours,
  createCanvas,
  drawLine,
  encodePng,
  getPixel,
  PLOT,
  savingsBarChart,
  slotCentre,
  speedLineChart,
  valueToY,
} from './summary-chart';

type Chunk = { type: string; data: Buffer; crc: number };

// A minimal PNG reader written from the PNG specification (W3C PNG 2nd ed., sections 5.2–5.4), so the
// encoder is checked against the format, with node:zlib doing the CRC-32 and the inflate.
function readChunks(png: Buffer): Chunk[] {
  const chunks: Chunk[] = [];
  let at = 8;
  while (at < png.length) {
    const length = png.readUInt32BE(at);
    chunks.push({
      type: png.toString('ascii', at + 4, at + 8),
      data: png.subarray(at + 8, at + 8 + length),
      crc: png.readUInt32BE(at + 8 + length),
    });
    at += 12 + length;
  }
  return chunks;
}

function decode(png: Buffer): { width: number; height: number; pixel: (x: number, y: number) => number[] } {
  const chunks = readChunks(png);
  const ihdr = chunks[0].data;
  const width = ihdr.readUInt32BE(0);
  const height = ihdr.readUInt32BE(4);
  const raw = inflateSync(Buffer.concat(chunks.filter((c) => c.type === 'IDAT').map((c) => c.data)));
  expect(raw.length).toBe(height * (1 + width * 3));
  return {
    width,
    height,
    pixel: (x, y) => {
      const row = y * (1 + width * 3);
      expect(raw[row]).toBe(0); // filter type None
      return [...raw.subarray(row + 1 + x * 3, row + 4 + x * 3)];
    },
  };
}

describe('CRC-32 from node:zlib', () => {
  it('gives the published check value', () => {
    // CRC-32 (ISO-HDLC) of "123456789" is 0xCBF43926 (Greg Cook's CRC catalogue; from memory).
    expect(crc32('123456789') >>> 0).toBe(0xcbf43926);
  });
});

describe('encodePng', () => {
  const canvas = createCanvas(3, 2, [255, 255, 255]);
  canvas.pixels.set([10, 20, 30], 0);
  canvas.pixels.set([200, 100, 50], 5 * 3);
  const png = encodePng(canvas);

  it('starts with the PNG signature and an IHDR for 8-bit truecolour', () => {
    // Signature 89 50 4E 47 0D 0A 1A 0A (PNG specification, section 5.2).
    expect([...png.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    const chunks = readChunks(png);
    expect(chunks.map((c) => c.type)).toEqual(['IHDR', 'IDAT', 'IEND']);
    const ihdr = chunks[0].data;
    expect(ihdr.length).toBe(13);
    expect([ihdr.readUInt32BE(0), ihdr.readUInt32BE(4), ...ihdr.subarray(8)]).toEqual([3, 2, 8, 2, 0, 0, 0]);
  });

  it('writes a correct CRC over type and data on every chunk', () => {
    for (const c of readChunks(png)) {
      expect(c.crc).toBe(crc32(Buffer.concat([Buffer.from(c.type, 'ascii'), c.data])) >>> 0);
    }
    // Every PNG ends with the same empty IEND chunk: 00 00 00 00 49 45 4E 44 AE 42 60 82 (from memory).
    expect(png.subarray(-12).toString('hex')).toBe('0000000049454e44ae426082');
  });

  it('stores the pixels row by row, readable after inflate', () => {
    const image = decode(png);
    expect(image.pixel(0, 0)).toEqual([10, 20, 30]);
    expect(image.pixel(2, 1)).toEqual([200, 100, 50]);
    expect(image.pixel(1, 1)).toEqual([255, 255, 255]);
  });

  it('refuses a canvas of zero size', () => {
    expect(() => createCanvas(0, 10, [0, 0, 0])).toThrow(RangeError);
  });
});

describe('drawLine', () => {
  it('draws a diagonal through its end points and nothing off it', () => {
    const c = createCanvas(5, 5, [0, 0, 0]);
    drawLine(c, { x: 0, y: 0 }, { x: 4, y: 4 }, [9, 9, 9]);
    for (let i = 0; i < 5; i++) expect(getPixel(c, i, i)).toEqual([9, 9, 9]);
    expect(getPixel(c, 4, 0)).toEqual([0, 0, 0]);
  });
});

describe('savingsBarChart', () => {
  it('draws bars whose heights follow the savings (read back from the PNG)', () => {
    const savings = [0.31, 0.42, 0.5];
    const image = decode(encodePng(savingsBarChart(savings)));
    expect([image.width, image.height]).toEqual([480, 240]);
    const bar = [...chartColours.bar];
    savings.forEach((value, i) => {
      const x = slotCentre(i, savings.length);
      const top = valueToY(value, 1);
      expect(image.pixel(x, top)).toEqual(bar);
      expect(image.pixel(x, PLOT.bottom - 3)).toEqual(bar);
      expect(image.pixel(x, top - 2)).not.toEqual(bar);
    });
    // Half of the plot height for 0.5 (derived from the scale).
    expect(valueToY(0.5, 1)).toBe(Math.round((PLOT.top + PLOT.bottom) / 2));
  });
});

describe('speedLineChart', () => {
  it('marks each point of both series at its value on a scale rounded up to 5 wpm', () => {
    const points = [
      { withSuggestions: 2.2, without: 1.9 },
      { withSuggestions: 6.2, without: 1.9 },
    ];
    const image = decode(encodePng(speedLineChart(points)));
    // Largest value 6.2 → scale 0..10.
    expect(image.pixel(slotCentre(1, 2), valueToY(6.2, 10))).toEqual([...chartColours.lineWith]);
    expect(image.pixel(slotCentre(0, 2), valueToY(1.9, 10))).toEqual([...chartColours.lineWithout]);
  });
});
