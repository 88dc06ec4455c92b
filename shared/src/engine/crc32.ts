// CRC-32 as used by zip, gzip and PNG (reflected polynomial 0xEDB88320,
// initial value and final xor 0xFFFFFFFF), table-driven, one byte at a time.
// Written here so the engine core needs no Node-only API.

const TABLE = buildTable();

function buildTable(): Uint32Array {
  const table = new Uint32Array(256);
  for (let n = 0; n < 256; n++) {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    table[n] = c >>> 0;
  }
  return table;
}

/**
 * CRC-32 of bytes[start..end), continuing from a previous result `crc`
 * (0 to start). Returns an unsigned 32-bit integer.
 */
export function crc32(bytes: Uint8Array, crc = 0, start = 0, end = bytes.length): number {
  let c = ~crc;
  for (let i = start; i < end; i++) c = TABLE[(c ^ bytes[i]) & 0xff] ^ (c >>> 8);
  return ~c >>> 0;
}
