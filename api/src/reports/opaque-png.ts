import { crc32, deflateSync } from 'node:zlib';
import { rasterImage } from '../summaries/summary-chart';

// A chart's SVG as an opaque PNG (8-bit RGB, no alpha) for the PDFs. pdfkit copies such a PNG's
// compressed data into the PDF as it is; a PNG with an alpha channel (what resvg writes) it decodes
// and splits pixel by pixel in JavaScript, which took most of a report's second or two. The chart has
// an opaque background, so dropping alpha loses nothing. Layout: PNG (ISO/IEC 15948), filter type 0
// on every row.

const SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

function chunk(type: string, data: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([length, body, crc]);
}

/** RGBA pixels (row by row, 4 bytes each) as an RGB PNG; alpha is dropped. */
export function rgbPng(rgba: Buffer, width: number, height: number): Buffer {
  if (rgba.length !== width * height * 4) throw new RangeError('Expected 4 bytes per pixel.');
  const rows = Buffer.alloc(height * (1 + width * 3));
  let out = 0;
  for (let y = 0; y < height; y++) {
    rows[out++] = 0; // filter type 0: none
    for (let x = 0, i = y * width * 4; x < width; x++, i += 4) {
      rows[out++] = rgba[i] ?? 0;
      rows[out++] = rgba[i + 1] ?? 0;
      rows[out++] = rgba[i + 2] ?? 0;
    }
  }
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header[8] = 8; // bit depth
  header[9] = 2; // colour type 2: RGB
  // compression 0, filter 0, interlace 0
  return Buffer.concat([
    SIGNATURE,
    chunk('IHDR', header),
    chunk('IDAT', deflateSync(rows)),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

/** The SVG rasterised at `zoom` device pixels per CSS px on the charts' background, as an RGB PNG. */
export function opaqueChartPng(svg: string, zoom: number): Buffer {
  const image = rasterImage(svg, zoom);
  return rgbPng(image.pixels, image.width, image.height);
}
