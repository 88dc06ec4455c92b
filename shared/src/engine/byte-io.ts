// Little helpers to write and read the binary layouts (little-endian
// integers and LEB128-style unsigned varints), with bounds checks that
// report truncation.

/** Raised when bytes do not form a valid layout (wrong magic, checksum, truncated...). */
export class FormatError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'FormatError';
  }
}

/**
 * Checks a count read from a file against the bytes that could hold it, before anything is allocated
 * for it: `count` items of at least `minBytesEach` bytes need that many bytes. A forged count ("400
 * million contexts" in a 6 kB file) is refused here instead of allocating gigabytes.
 */
export function requireDeclaredFits(
  count: number,
  what: string,
  minBytesEach: number,
  available: number,
): void {
  if (!Number.isSafeInteger(count) || count < 0 || count * minBytesEach > available) {
    throw new FormatError(`damaged: declares ${count} ${what} but holds only ${available} bytes`);
  }
}

export class ByteWriter {
  private bytes = new Uint8Array(1024);
  length = 0;

  private room(n: number): void {
    if (this.length + n <= this.bytes.length) return;
    const grown = new Uint8Array(Math.max(this.length + n, this.bytes.length * 2));
    grown.set(this.bytes.subarray(0, this.length));
    this.bytes = grown;
  }

  u8(v: number): void {
    this.room(1);
    this.bytes[this.length++] = v;
  }

  u32(v: number): void {
    this.room(4);
    for (let i = 0; i < 4; i++) this.bytes[this.length++] = (v >>> (8 * i)) & 0xff;
  }

  /** IEEE 754 double, little-endian (8 bytes). */
  f64(v: number): void {
    this.room(8);
    new DataView(this.bytes.buffer).setFloat64(this.length, v, true);
    this.length += 8;
  }

  /** Unsigned integer 0..2^53, 7 bits per byte, low bits first. */
  varint(v: number): void {
    this.room(8);
    while (v >= 0x80) {
      this.bytes[this.length++] = (v % 0x80) | 0x80;
      v = Math.floor(v / 0x80);
    }
    this.bytes[this.length++] = v;
  }

  raw(b: Uint8Array): void {
    this.room(b.length);
    this.bytes.set(b, this.length);
    this.length += b.length;
  }

  result(): Uint8Array {
    return this.bytes.slice(0, this.length);
  }
}

export class ByteReader {
  position = 0;

  constructor(
    private readonly bytes: Uint8Array,
    private readonly limit = bytes.length,
  ) {}

  private need(n: number): void {
    if (this.position + n > this.limit) throw new FormatError('truncated data');
  }

  u8(): number {
    this.need(1);
    return this.bytes[this.position++];
  }

  u32(): number {
    this.need(4);
    let v = 0;
    for (let i = 0; i < 4; i++) v += this.bytes[this.position++] * 2 ** (8 * i);
    return v;
  }

  f64(): number {
    this.need(8);
    const v = new DataView(this.bytes.buffer, this.bytes.byteOffset, this.bytes.byteLength).getFloat64(
      this.position,
      true,
    );
    this.position += 8;
    return v;
  }

  /** The next `n` bytes (a view, not a copy). */
  take(n: number): Uint8Array {
    this.need(n);
    const out = this.bytes.subarray(this.position, this.position + n);
    this.position += n;
    return out;
  }

  varint(): number {
    let v = 0;
    let scale = 1;
    for (let i = 0; i < 8; i++) {
      const b = this.u8();
      v += (b & 0x7f) * scale;
      if (b < 0x80) return v;
      scale *= 0x80;
    }
    throw new FormatError('varint too long');
  }

  get remaining(): number {
    return this.limit - this.position;
  }
}
