// `model compress` / `model decompress` spawned exactly as users run them
// (the command-line contract): byte-exact round trip, exit code 2 with
// one line for bad input. The round trip is checked with cmp-like byte
// equality; node:zlib's crc32 (reference library) confirms the stored CRC.
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import * as zlib from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { model } from './run-model';

const dir = mkdtempSync(join(tmpdir(), 'keyloom-compress-'));

describe('model compress / decompress', () => {
  it('restores a file byte for byte (BOM, CRLF, lone CR, emoji) and stores its CRC-32', () => {
    // Invented demo text.
    const original = Buffer.from(
      '\uFEFFNote for Mo:\r\nBiscuit walked twice.\rTea at four 🫖.\n'.repeat(30),
      'utf8',
    );
    const input = join(dir, 'note.txt');
    const packed = join(dir, 'note.klc');
    const back = join(dir, 'note.back.txt');
    writeFileSync(input, original);
    const c = model('compress', '--order', '4', '--escape', 'D', input, packed);
    expect(c.status, c.stderr).toBe(0);
    const stored = readFileSync(packed);
    expect(stored.length).toBeLessThan(original.length / 4);
    expect(stored.readUInt32LE(20)).toBe(zlib.crc32(original)); // container offset 20: CRC-32 of the original
    const d = model('decompress', packed, back);
    expect(d.status, d.stderr).toBe(0);
    expect(readFileSync(back).equals(original)).toBe(true);
  });

  it('refuses bad arguments, non-UTF-8 input and damaged files with exit code 2 and one line', () => {
    const bad = join(dir, 'bad.bin');
    writeFileSync(bad, Buffer.from([0x61, 0xc3, 0x28]));
    const good = join(dir, 'good.txt');
    writeFileSync(good, 'hello hello hello\n');
    const packed = join(dir, 'good.klc');
    expect(model('compress', good, packed).status).toBe(0);
    const damaged = join(dir, 'damaged.klc');
    const bytes = readFileSync(packed);
    bytes[bytes.length - 1] ^= 0x40;
    writeFileSync(damaged, bytes);
    const truncated = join(dir, 'truncated.klc');
    writeFileSync(truncated, readFileSync(packed).subarray(0, 20));
    const cases: Array<[string[], RegExp]> = [
      [['compress', bad, join(dir, 'x')], /not valid UTF-8/],
      [['compress', '--order', '13', good, join(dir, 'x')], /--order/],
      [['compress', '--escape', 'Q', good, join(dir, 'x')], /--escape/],
      [['compress', good], /usage/],
      [['compress', join(dir, 'missing.txt'), join(dir, 'x')], /cannot read/],
      [['decompress', good, join(dir, 'x')], /magic/],
      [['decompress', damaged, join(dir, 'x')], /damaged/],
      [['decompress', truncated, join(dir, 'x')], /truncated/],
    ];
    for (const [args, message] of cases) {
      const run = model(...args);
      expect(run.status, args.join(' ')).toBe(2);
      expect(run.stderr.trim().split('\n')).toHaveLength(1);
      expect(run.stderr).toMatch(message);
    }
  });
});
