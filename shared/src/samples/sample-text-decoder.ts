// Turning the bytes of an uploaded file into text, or a clear refusal.
// The same checks run in the browser before upload and in the API. UTF-8 is decided by the engine's
// one strict decoder (engine/utf8-codec.ts); UTF-16 by the platform decoder or, without one, a loop here.
import { decodeUtf8Text, firstInvalidUtf8Byte } from '../engine/utf8-codec';

/** A file that cannot be taken as a text sample; `message` says what is wrong and what to do. */
export class SampleTextError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'SampleTextError';
  }
}

/** "utf-8", "utf-8 with BOM", "utf-16le", "utf-16be" (with or without BOM). */
export type SampleEncoding = 'utf-8' | 'utf-8 with BOM' | 'utf-16le' | 'utf-16be';

export type DecodedText = { text: string; encoding: SampleEncoding };

export const EMPTY_FILE_MESSAGE = 'The file is empty.';

const TEXT_FIRST = 'Upload the writing as a .txt, .md or .csv file.';

// File signatures ("magic numbers") of the binary formats people most often pick by mistake.
// Byte values from each format's specification (PDF 1.7 §7.5.2, PNG §5.2, JFIF SOI marker,
// GIF89a header, ZIP APPNOTE §4.3.7, ELF e_ident, MS-DOS "MZ" header, RFC 1952 §2.3.1, OLE2/CFB).
const signatures: { bytes: number[]; message: string }[] = [
  {
    bytes: [0x25, 0x50, 0x44, 0x46, 0x2d], // %PDF-
    message: 'This is a PDF document, not plain text: export the text first (e.g. save as .txt).',
  },
  {
    bytes: [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a],
    message: `This is a PNG image, not text. ${TEXT_FIRST}`,
  },
  { bytes: [0xff, 0xd8, 0xff], message: `This is a JPEG image, not text. ${TEXT_FIRST}` },
  { bytes: [0x47, 0x49, 0x46, 0x38], message: `This is a GIF image, not text. ${TEXT_FIRST}` }, // GIF8
  {
    bytes: [0x50, 0x4b, 0x03, 0x04], // PK.. local file header: .zip, .docx, .xlsx, .odt
    message:
      'This is a Word or Excel file (or another zip archive), not plain text: save it as plain text (.txt) or CSV and upload that.',
  },
  {
    bytes: [0x50, 0x4b, 0x05, 0x06], // empty zip archive
    message: 'This is a zip archive, not plain text: unpack it and upload the text files inside.',
  },
  {
    bytes: [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1], // OLE2: old .doc / .xls
    message:
      'This is a Word or Excel file (older format), not plain text: save it as plain text (.txt) or CSV and upload that.',
  },
  { bytes: [0x7f, 0x45, 0x4c, 0x46], message: `This is a program (ELF executable), not text. ${TEXT_FIRST}` },
  {
    bytes: [0x1f, 0x8b],
    message: 'This is a compressed (gzip) file, not text: unpack it first and upload the text.',
  },
];
const EXE_MESSAGE = `This is a program (Windows executable), not text. ${TEXT_FIRST}`;
const NUL_MESSAGE = `This file contains binary data (zero bytes), not plain text. ${TEXT_FIRST}`;

const invalidMessage = (byteOffset: number) =>
  `This file is not valid UTF-8 or UTF-16 text (byte ${byteOffset}). Save it as UTF-8 text and upload it again.`;

function startsWith(bytes: Uint8Array, prefix: number[]): boolean {
  if (bytes.length < prefix.length) return false;
  return prefix.every((b, i) => bytes[i] === b);
}

/** The binary format the bytes start with, as a refusal message; null when none is known. */
export function binaryFormatMessage(bytes: Uint8Array): string | null {
  for (const { bytes: prefix, message } of signatures) if (startsWith(bytes, prefix)) return message;
  // "MZ" alone could start an ordinary text ("MZ is ..."), so a DOS header also needs a zero byte
  // in its 64-byte header, which text never has.
  if (startsWith(bytes, [0x4d, 0x5a]) && bytes.subarray(0, 64).includes(0)) return EXE_MESSAGE;
  return null;
}

// UTF-16 without BOM: ASCII-range text has a zero in every other byte. Look at up to the first
// 4096 bytes; call it UTF-16 when at least 30 % of the bytes on one side are zero and almost none
// on the other (threshold: common practice, no source).
function guessUtf16(bytes: Uint8Array): 'utf-16le' | 'utf-16be' | null {
  if (bytes.length < 2 || bytes.length % 2 !== 0) return null;
  const n = Math.min(bytes.length, 4096);
  let evenZeros = 0;
  let oddZeros = 0;
  for (let i = 0; i + 1 < n; i += 2) {
    if (bytes[i] === 0) evenZeros++;
    if (bytes[i + 1] === 0) oddZeros++;
  }
  const pairs = Math.floor(n / 2);
  if (oddZeros >= pairs * 0.3 && evenZeros <= pairs * 0.02) return 'utf-16le';
  if (evenZeros >= pairs * 0.3 && oddZeros <= pairs * 0.02) return 'utf-16be';
  return null;
}

// Joins UTF-16 code units into a string in chunks (a spread of millions of arguments would overflow).
function unitsToString(units: Uint16Array, length: number): string {
  const parts: string[] = [];
  const chunk = 8192;
  for (let i = 0; i < length; i += chunk) {
    parts.push(String.fromCharCode(...units.subarray(i, Math.min(length, i + chunk))));
  }
  return parts.join('');
}

// The platform decoder (WHATWG Encoding; in every browser and in Node) is much faster than a loop in
// JavaScript. The shared package's ES2022 lib has no DOM types, so its shape is declared here.
type PlatformDecoder = { decode(input: Uint8Array): string };
type PlatformDecoderClass = new (
  label: string,
  options: { fatal: boolean; ignoreBOM: boolean },
) => PlatformDecoder;

// Strict UTF-16 decoding with the platform decoder; null when it is missing, lacks the label or rejects
// the bytes (the loop below then decodes or finds the offset of the first bad byte).
function platformDecode(label: string, bytes: Uint8Array): string | null {
  // Looked up on each call, so the fallback can be tested by hiding the platform's decoder.
  const PlatformTextDecoder = (globalThis as { TextDecoder?: PlatformDecoderClass }).TextDecoder;
  if (!PlatformTextDecoder) return null;
  try {
    return new PlatformTextDecoder(label, { fatal: true, ignoreBOM: true }).decode(bytes);
  } catch {
    return null;
  }
}

/** Strict UTF-8 (RFC 3629: no overlongs, no surrogates, ≤ U+10FFFF); throws at the first bad byte. */
function decodeUtf8(bytes: Uint8Array, start: number): string {
  const body = bytes.subarray(start);
  const text = decodeUtf8Text(body);
  if (text === undefined) throw new SampleTextError(invalidMessage(start + firstInvalidUtf8Byte(body)));
  return text;
}

/** UTF-16 with surrogate pairs checked; throws at the first bad byte (or an odd trailing byte). */
function decodeUtf16(bytes: Uint8Array, start: number, littleEndian: boolean): string {
  if ((bytes.length - start) % 2 !== 0) throw new SampleTextError(invalidMessage(bytes.length - 1));
  const fast = platformDecode(littleEndian ? 'utf-16le' : 'utf-16be', bytes.subarray(start));
  if (fast !== null) return fast;
  const count = (bytes.length - start) / 2;
  const units = new Uint16Array(count);
  for (let k = 0; k < count; k++) {
    const i = start + 2 * k;
    units[k] = littleEndian ? bytes[i] | (bytes[i + 1] << 8) : (bytes[i] << 8) | bytes[i + 1];
  }
  for (let k = 0; k < count; k++) {
    const u = units[k];
    if (u >= 0xd800 && u <= 0xdbff) {
      const next = units[k + 1];
      if (k + 1 >= count || next < 0xdc00 || next > 0xdfff)
        throw new SampleTextError(invalidMessage(start + 2 * k));
      k++;
    } else if (u >= 0xdc00 && u <= 0xdfff) {
      throw new SampleTextError(invalidMessage(start + 2 * k));
    }
  }
  return unitsToString(units, count);
}

/**
 * Decodes an uploaded file's bytes (any length; 0-based byte offsets in messages).
 * UTF-8 with or without BOM; UTF-16LE/BE with BOM, or without BOM when every other byte is zero.
 * Refuses known binary formats by their signature, other binary data by its zero bytes, invalid
 * UTF-8 with the offset of the first bad byte, and empty or whitespace-only files.
 * @throws SampleTextError with a message meant for the person uploading.
 */
export function decodeTextBytes(bytes: Uint8Array): DecodedText {
  if (bytes.length === 0) throw new SampleTextError(EMPTY_FILE_MESSAGE);
  let decoded: DecodedText;
  if (startsWith(bytes, [0xef, 0xbb, 0xbf])) {
    decoded = { text: decodeUtf8(bytes, 3), encoding: 'utf-8 with BOM' };
  } else if (startsWith(bytes, [0xff, 0xfe])) {
    decoded = { text: decodeUtf16(bytes, 2, true), encoding: 'utf-16le' };
  } else if (startsWith(bytes, [0xfe, 0xff])) {
    decoded = { text: decodeUtf16(bytes, 2, false), encoding: 'utf-16be' };
  } else {
    const binary = binaryFormatMessage(bytes);
    if (binary) throw new SampleTextError(binary);
    const utf16 = guessUtf16(bytes);
    if (utf16) {
      decoded = { text: decodeUtf16(bytes, 0, utf16 === 'utf-16le'), encoding: utf16 };
    } else {
      if (bytes.includes(0)) throw new SampleTextError(NUL_MESSAGE);
      decoded = { text: decodeUtf8(bytes, 0), encoding: 'utf-8' };
    }
  }
  // A decoded U+0000 means binary content even in a UTF-16 file.
  if (decoded.text.includes('\u0000')) throw new SampleTextError(NUL_MESSAGE);
  if (decoded.text.trim().length === 0) throw new SampleTextError(EMPTY_FILE_MESSAGE);
  return decoded;
}
