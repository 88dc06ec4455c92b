// Decoder checks against bytes made by Node's own encoders (Buffer, TextEncoder: general-purpose
// references for UTF-8 and UTF-16) and real file signatures (node:zlib for gzip).
import { gzipSync } from 'node:zlib';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { decodeTextBytes, SampleTextError } from './sample-text-decoder';

const sample = 'Pepper barked at the gulls. Café, naïve, 👋 — and “quotes”.\nSecond line.';
const bytes = (b: Buffer | Uint8Array) => new Uint8Array(b);
const swap16 = (b: Buffer) => {
  const out = Buffer.from(b);
  out.swap16();
  return out;
};

function refusal(input: Uint8Array): string {
  try {
    decodeTextBytes(input);
  } catch (error) {
    expect(error).toBeInstanceOf(SampleTextError);
    return (error as Error).message;
  }
  throw new Error('expected a refusal');
}

describe('decodeTextBytes', () => {
  it('reads UTF-8 with and without BOM', () => {
    const utf8 = new TextEncoder().encode(sample);
    expect(decodeTextBytes(utf8)).toEqual({ text: sample, encoding: 'utf-8' });
    const withBom = bytes(Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(sample, 'utf8')]));
    expect(decodeTextBytes(withBom)).toEqual({ text: sample, encoding: 'utf-8 with BOM' });
  });

  it('reads UTF-16LE and UTF-16BE with BOM', () => {
    const le = Buffer.from('\ufeff' + sample, 'utf16le');
    expect(le[0]).toBe(0xff);
    expect(decodeTextBytes(bytes(le))).toEqual({ text: sample, encoding: 'utf-16le' });
    const be = swap16(le);
    expect(be[0]).toBe(0xfe);
    expect(decodeTextBytes(bytes(be))).toEqual({ text: sample, encoding: 'utf-16be' });
  });

  it('recognises UTF-16 without BOM by its zero bytes', () => {
    const le = Buffer.from(sample, 'utf16le');
    expect(decodeTextBytes(bytes(le))).toEqual({ text: sample, encoding: 'utf-16le' });
    expect(decodeTextBytes(bytes(swap16(le)))).toEqual({ text: sample, encoding: 'utf-16be' });
  });

  it('refuses binary formats by their signatures, with specific messages', () => {
    const pdf = Buffer.from('%PDF-1.7\n%âãÏÓ\n1 0 obj\n', 'latin1');
    expect(refusal(bytes(pdf))).toBe(
      'This is a PDF document, not plain text: export the text first (e.g. save as .txt).',
    );
    const png = Buffer.from([
      0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52,
    ]);
    expect(refusal(bytes(png))).toMatch(/PNG image/);
    expect(refusal(bytes(Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0, 16, 0x4a, 0x46])))).toMatch(/JPEG image/);
    expect(refusal(bytes(Buffer.from('GIF89a\x01\x00\x01\x00', 'latin1')))).toMatch(/GIF image/);
    expect(refusal(bytes(Buffer.from('PK\x03\x04\x14\x00\x06\x00', 'latin1')))).toMatch(/Word or Excel file/);
    expect(refusal(bytes(Buffer.from('\x7fELF\x02\x01\x01\x00', 'latin1')))).toMatch(/ELF executable/);
    const exe = Buffer.alloc(64);
    exe.write('MZ', 0, 'latin1');
    expect(refusal(bytes(exe))).toMatch(/Windows executable/);
    expect(refusal(bytes(gzipSync(Buffer.from(sample))))).toMatch(/gzip/);
  });

  it('takes a text that merely starts with "MZ"', () => {
    expect(decodeTextBytes(new TextEncoder().encode('MZ is the name of our boat.')).encoding).toBe('utf-8');
  });

  it('refuses other binary data by its zero bytes', () => {
    expect(refusal(bytes(Buffer.from([0x41, 0x42, 0x00, 0x43, 0x44, 0x45, 0x46])))).toMatch(/zero bytes/);
  });

  it('names the first invalid byte of a bad UTF-8 file', () => {
    // Latin-1 "é" (0xE9, byte 6) reads as a 3-byte lead; the space after it (byte 7) is the bad byte.
    const latin1 = Buffer.from('Hi café time', 'latin1');
    expect(latin1.indexOf(0xe9)).toBe(6);
    expect(refusal(bytes(latin1))).toBe(
      'This file is not valid UTF-8 or UTF-16 text (byte 7). Save it as UTF-8 text and upload it again.',
    );
    // A stray continuation byte is itself the bad byte; an overlong "/" (C0 AF) is refused at its lead.
    expect(refusal(bytes(Buffer.from([0x61, 0x80, 0x62])))).toMatch(/\(byte 1\)/);
    expect(refusal(bytes(Buffer.from([0x61, 0xc0, 0xaf])))).toMatch(/\(byte 1\)/);
    // A truncated 3-byte sequence at the end.
    expect(refusal(bytes(Buffer.from([0x61, 0x62, 0xe2, 0x82])))).toMatch(/\(byte 4\)/);
    // An encoded surrogate (ED A0 80) is not UTF-8 (RFC 3629 §3).
    expect(refusal(bytes(Buffer.from([0x61, 0xed, 0xa0, 0x80])))).toMatch(/\(byte 1\)/);
    // Above U+10FFFF (F4 90 80 80) is refused at its lead; an overlong 3-byte lead (E0 80) cut short by
    // "A" names the "A", and cut short by the end names the end; after the BOM, offsets still count it.
    expect(refusal(bytes(Buffer.from([0x61, 0xf4, 0x90, 0x80, 0x80])))).toMatch(/\(byte 1\)/);
    expect(refusal(bytes(Buffer.from([0x61, 0xe0, 0x80, 0x41])))).toMatch(/\(byte 3\)/);
    expect(refusal(bytes(Buffer.from([0x61, 0xe0, 0x80])))).toMatch(/\(byte 3\)/);
    expect(refusal(bytes(Buffer.from([0xef, 0xbb, 0xbf, 0x61, 0xff])))).toMatch(/\(byte 4\)/);
  });

  it('refuses empty and whitespace-only files', () => {
    expect(refusal(new Uint8Array(0))).toBe('The file is empty.');
    expect(refusal(new TextEncoder().encode(' \n\t\r\n '))).toBe('The file is empty.');
    expect(refusal(bytes(Buffer.from('\ufeff  \n', 'utf16le')))).toBe('The file is empty.');
  });

  it('decodes a large file the same way Buffer does', () => {
    const big = (sample + '\n').repeat(20_000);
    const decoded = decodeTextBytes(new TextEncoder().encode(big));
    expect(decoded.text.length).toBe(big.length);
    expect(decoded.text === Buffer.from(big, 'utf8').toString('utf8')).toBe(true);
  });
});

describe('decodeTextBytes without a global TextDecoder (UTF-16 by its own loop; UTF-8 by the decoder the engine made at load)', () => {
  afterEach(() => {
    vi.unstubAllGlobals();
  });

  it('decodes UTF-8 and UTF-16 the same way Buffer does', () => {
    vi.stubGlobal('TextDecoder', undefined);
    const text = (sample + '\n').repeat(3000);
    expect(decodeTextBytes(new Uint8Array(Buffer.from(text, 'utf8')))).toEqual({ text, encoding: 'utf-8' });
    const le = Buffer.from('\ufeff' + text, 'utf16le');
    expect(decodeTextBytes(new Uint8Array(le)).text).toBe(text);
    expect(decodeTextBytes(new Uint8Array(swap16(le))).text).toBe(text);
    expect(() => decodeTextBytes(new Uint8Array([0x61, 0xff, 0x62]))).toThrow(/\(byte 1\)/);
  });
});
