// Strict UTF-8 to code points and back (RFC 3629), without any platform
// API: rejects overlong forms, surrogates (U+D800..U+DFFF), values above
// U+10FFFF and cut-off sequences, exactly like a fatal TextDecoder. A
// byte-order mark is kept as the code point U+FEFF.

/** The code points of strict UTF-8 `bytes`, or undefined when they are not valid UTF-8. */
export function decodeUtf8(bytes: Uint8Array): Uint32Array | undefined {
  const out = new Uint32Array(bytes.length);
  let n = 0;
  let i = 0;
  while (i < bytes.length) {
    const b = bytes[i];
    if (b < 0x80) {
      out[n++] = b;
      i++;
      continue;
    }
    let need: number;
    let cp: number;
    let min: number;
    if (b >= 0xc2 && b <= 0xdf) [need, cp, min] = [1, b & 0x1f, 0x80];
    else if (b >= 0xe0 && b <= 0xef) [need, cp, min] = [2, b & 0x0f, 0x800];
    else if (b >= 0xf0 && b <= 0xf4) [need, cp, min] = [3, b & 0x07, 0x10000];
    else return undefined;
    if (i + need >= bytes.length) return undefined; // sequence cut off by the end
    for (let k = 1; k <= need; k++) {
      const c = bytes[i + k];
      if ((c & 0xc0) !== 0x80) return undefined;
      cp = (cp << 6) | (c & 0x3f);
    }
    if (cp < min || cp > 0x10ffff || (cp >= 0xd800 && cp <= 0xdfff)) return undefined;
    out[n++] = cp;
    i += need + 1;
  }
  return out.slice(0, n);
}

/** UTF-8 bytes of code points (each 0..0x10FFFF; surrogate values are written as-is in 3 bytes). */
export function encodeUtf8(codePoints: ArrayLike<number>): Uint8Array {
  let size = 0;
  for (let i = 0; i < codePoints.length; i++) {
    const c = codePoints[i];
    size += c < 0x80 ? 1 : c < 0x800 ? 2 : c < 0x10000 ? 3 : 4;
  }
  const out = new Uint8Array(size);
  let j = 0;
  for (let i = 0; i < codePoints.length; i++) {
    const c = codePoints[i];
    if (c < 0x80) out[j++] = c;
    else if (c < 0x800) {
      out[j++] = 0xc0 | (c >>> 6);
      out[j++] = 0x80 | (c & 0x3f);
    } else if (c < 0x10000) {
      out[j++] = 0xe0 | (c >>> 12);
      out[j++] = 0x80 | ((c >>> 6) & 0x3f);
      out[j++] = 0x80 | (c & 0x3f);
    } else {
      out[j++] = 0xf0 | (c >>> 18);
      out[j++] = 0x80 | ((c >>> 12) & 0x3f);
      out[j++] = 0x80 | ((c >>> 6) & 0x3f);
      out[j++] = 0x80 | (c & 0x3f);
    }
  }
  return out;
}
