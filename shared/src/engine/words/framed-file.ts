// The frame the word files share: magic (4 bytes), layout version (1 byte), the body, CRC-32 of
// every byte before it. Readers check all of it before the body is read, and the body's strings
// are varint-length UTF-8.
import { ByteReader, ByteWriter, FormatError, requireDeclaredFits } from '../byte-io';
import { crc32 } from '../crc32';
import { codePointsOf, stringFromCodePoints } from '../text-preparation';
import { decodeUtf8, encodeUtf8 } from '../utf8-codec';

/** One kind of framed file: its magic, layout version, name in messages, and smallest valid size. */
export type FrameKind = { magic: readonly number[]; version: number; what: string; minBytes: number };

/** A writer with the frame's magic and version written. */
export function openFrameWriter(kind: FrameKind): ByteWriter {
  const w = new ByteWriter();
  for (const b of kind.magic) w.u8(b);
  w.u8(kind.version);
  return w;
}

/** The file: what was written, then its CRC-32. */
export function closeFrame(w: ByteWriter): Uint8Array {
  w.u32(crc32(w.result()));
  return w.result();
}

/**
 * Checks size, magic, CRC-32 and version, and returns a reader of the body (the CRC excluded).
 * @throws FormatError naming the first problem
 */
export function openFrameReader(bytes: Uint8Array, kind: FrameKind): ByteReader {
  const { what } = kind;
  if (bytes.length < kind.minBytes) throw new FormatError(`${what}: too short`);
  for (let i = 0; i < kind.magic.length; i++)
    if (bytes[i] !== kind.magic[i]) throw new FormatError(`${what}: not a Keyloom ${what} (wrong magic)`);
  const stored = new ByteReader(bytes.subarray(bytes.length - 4)).u32();
  if (crc32(bytes.subarray(0, bytes.length - 4)) !== stored)
    throw new FormatError(`${what}: damaged (CRC-32 does not match)`);
  const r = new ByteReader(bytes, bytes.length - 4);
  r.position = kind.magic.length;
  const version = r.u8();
  if (version !== kind.version) throw new FormatError(`${what}: layout ${version} is not supported`);
  return r;
}

/** Checks that the body was read to its end. */
export function closeFrameReader(r: ByteReader, kind: FrameKind): void {
  if (r.remaining !== 0) throw new FormatError(`${kind.what}: damaged (bytes left over)`);
}

export function writeText(w: ByteWriter, s: string): void {
  const b = encodeUtf8(codePointsOf(s));
  w.varint(b.length);
  w.raw(b);
}

export function readText(r: ByteReader): string {
  const n = r.varint();
  requireDeclaredFits(n, 'bytes of text', 1, r.remaining);
  const cps = decodeUtf8(r.take(n));
  if (!cps) throw new FormatError('damaged: text that is not UTF-8');
  return stringFromCodePoints(cps);
}
