// The compressed-file container written by `model compress`.
//
// Layout (integers little-endian):
//   0   4  magic 0x8B 'K' 'L' 'C'
//   4   1  container version (1)
//   5   1  order k (0..12)
//   6   1  escape method, ASCII 'A'..'D'
//   7   1  flags: bit0 exclusion, bit1 update exclusion (other bits 0)
//   8   4  alphabetSize of the model's order -1 (literals always on)
//  12   4  number of code points in the text
//  16   4  number of bytes of the original UTF-8 text
//  20   4  CRC-32 of the original bytes
//  24   4  number of payload bytes P
//  28   4  CRC-32 of bytes 0..27 (the header)
//  32   P  range-coded payload: the code points, coded adaptively from an
//          empty PPM model with the settings above
// The text is read with every code point kept as it is (a byte-order
// mark and lone CRs included; strict UTF-8, see utf8-codec.ts), so decoding
// and re-encoding to UTF-8 gives the original bytes, which the length and
// CRC then confirm.
import { crc32 } from './crc32';
import { ByteReader, ByteWriter, FormatError } from './byte-io';
import { PpmModel } from './ppm-model';
import { type EscapeMethod, type PpmSettings } from './ppm-settings';
import { decodeText, encodeText } from './text-coding';
import { decodeUtf8, encodeUtf8 } from './utf8-codec';

const MAGIC = [0x8b, 0x4b, 0x4c, 0x43];
const VERSION = 1;
const HEADER_BYTES = 32;
/**
 * Most code points one payload byte can carry, with room to spare (derived, no outside source): an
 * entry's count stays under MAX_COUNT (1023) and every context keeps a non-zero escape, so the likeliest
 * symbol has probability at most 2045/2046 (escape method D) and costs at least 0.0007 bits, i.e. at
 * most about 11,300 code points per byte. The range coder reads up to 8 bytes past a short stream.
 */
const MAX_CODE_POINTS_PER_BYTE = 65_536;
const CODER_SLACK_BYTES = 8;

export type ContainerSettings = Pick<PpmSettings, 'order' | 'escape'> &
  Partial<Pick<PpmSettings, 'exclusion' | 'updateExclusion' | 'alphabetSize'>>;

/**
 * Compresses UTF-8 bytes. Throws FormatError when they are not valid UTF-8
 * (the container holds text only).
 */
export function compressBytes(input: Uint8Array, settings: ContainerSettings): Uint8Array {
  const codePoints = decodeUtf8(input);
  if (!codePoints) throw new FormatError('input is not valid UTF-8 text');
  const model = new PpmModel({ ...settings, adaptive: true, literals: true });
  const s = model.settings;
  const payload = encodeText(model, codePoints);
  const w = new ByteWriter();
  for (const b of MAGIC) w.u8(b);
  w.u8(VERSION);
  w.u8(s.order);
  w.u8(s.escape.charCodeAt(0));
  w.u8((s.exclusion ? 1 : 0) | (s.updateExclusion ? 2 : 0));
  w.u32(s.alphabetSize);
  w.u32(codePoints.length);
  w.u32(input.length);
  w.u32(crc32(input));
  w.u32(payload.length);
  w.u32(crc32(w.result()));
  w.raw(payload);
  return w.result();
}

/** Restores the original bytes; throws FormatError for a damaged, truncated or foreign file. */
export function decompressBytes(file: Uint8Array): Uint8Array {
  if (file.length < 4 || MAGIC.some((b, i) => file[i] !== b))
    throw new FormatError('not a Keyloom compressed file (wrong magic bytes)');
  if (file.length < HEADER_BYTES) throw new FormatError('truncated file: header incomplete');
  const r = new ByteReader(file);
  r.position = 4;
  const version = r.u8();
  if (version !== VERSION)
    throw new FormatError(`unsupported container version ${version} (expected ${VERSION})`);
  const order = r.u8();
  const escape = String.fromCharCode(r.u8());
  const flags = r.u8();
  const alphabetSize = r.u32();
  const length = r.u32();
  const byteLength = r.u32();
  const contentCrc = r.u32();
  const payloadLength = r.u32();
  const headerCrc = r.u32();
  if (headerCrc !== crc32(file, 0, 0, 28)) throw new FormatError('damaged file: header checksum mismatch');
  if (file.length < HEADER_BYTES + payloadLength)
    throw new FormatError(
      `truncated file: ${file.length - HEADER_BYTES} of ${payloadLength} payload bytes present`,
    );
  if (file.length > HEADER_BYTES + payloadLength)
    throw new FormatError('damaged file: unexpected bytes after the payload');
  if (!['A', 'B', 'C', 'D'].includes(escape) || order > 12 || (flags & ~3) !== 0)
    throw new FormatError('damaged file: bad settings');
  if (length > byteLength || byteLength > 4 * length)
    throw new FormatError('damaged file: inconsistent lengths');
  // The decoder sizes its output by `length`: checked against the payload before it allocates.
  if (length > (payloadLength + CODER_SLACK_BYTES) * MAX_CODE_POINTS_PER_BYTE)
    throw new FormatError(`damaged: declares ${length} code points but holds only ${payloadLength} bytes`);
  const model = new PpmModel({
    order,
    escape: escape as EscapeMethod,
    exclusion: (flags & 1) !== 0,
    updateExclusion: (flags & 2) !== 0,
    alphabetSize,
    adaptive: true,
    literals: true,
  });
  const codePoints = decodeText(model, file.subarray(HEADER_BYTES), length);
  const bytes = encodeUtf8(codePoints);
  if (bytes.length !== byteLength || crc32(bytes) !== contentCrc)
    throw new FormatError('damaged file: content checksum mismatch');
  return bytes;
}
