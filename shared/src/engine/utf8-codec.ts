// Strict UTF-8 to code points and back (RFC 3629). Validity is decided in one place: the platform's
// WHATWG decoder (Encoding Standard, "utf-8" with fatal error mode; in Node and every browser), which
// rejects overlong forms, surrogates (U+D800..U+DFFF), values above U+10FFFF and cut-off sequences.
// A byte-order mark is kept as the code point U+FEFF (ignoreBOM).

// The shared package's ES2022 lib has no DOM types, so the decoder's shape is declared here.
type StrictDecoder = { decode(input: Uint8Array, options?: { stream?: boolean }): string };
type StrictDecoderClass = new (
  label: string,
  options: { fatal: boolean; ignoreBOM: boolean },
) => StrictDecoder;
const PlatformTextDecoder = (globalThis as unknown as { TextDecoder: StrictDecoderClass }).TextDecoder;

function strictUtf8Decoder(): StrictDecoder {
  return new PlatformTextDecoder('utf-8', { fatal: true, ignoreBOM: true });
}

// Made once, when the module loads; a non-streaming decode leaves it ready for the next call.
const decoder = strictUtf8Decoder();

/** The text of strict UTF-8 `bytes` (a BOM kept as U+FEFF), or undefined when they are not valid UTF-8. */
export function decodeUtf8Text(bytes: Uint8Array): string | undefined {
  try {
    return decoder.decode(bytes);
  } catch {
    return undefined;
  }
}

/** The code points of strict UTF-8 `bytes`, or undefined when they are not valid UTF-8. */
export function decodeUtf8(bytes: Uint8Array): Uint32Array | undefined {
  const text = decodeUtf8Text(bytes);
  if (text === undefined) return undefined;
  const out = new Uint32Array(text.length);
  let n = 0;
  for (let i = 0; i < text.length; i++) {
    const unit = text.charCodeAt(i);
    // The decoder's output is well-formed: a high surrogate is always followed by a low one.
    if (unit >= 0xd800 && unit <= 0xdbff) {
      out[n++] = ((unit - 0xd800) << 10) + (text.charCodeAt(++i) - 0xdc00) + 0x10000;
    } else {
      out[n++] = unit;
    }
  }
  return n === out.length ? out : out.slice(0, n);
}

const isContinuation = (b: number) => (b & 0xc0) === 0x80;

/**
 * The 0-based offset of the first bad byte of `bytes`, which decodeUtf8Text refused: where the decoder
 * stops (the longest prefix it accepts while streaming, found by halving), reported as the byte that
 * breaks the sequence: a byte that cannot start one, the first byte of a sequence that is not a
 * continuation byte (bytes.length when the input ends first), or the sequence's lead byte when its
 * continuation bytes are all there but name an overlong form, a surrogate or a value above U+10FFFF.
 */
export function firstInvalidUtf8Byte(bytes: Uint8Array): number {
  // Accepted while streaming: no error within the first k bytes (a sequence cut off at k may continue).
  const acceptsPrefix = (k: number) => {
    try {
      strictUtf8Decoder().decode(bytes.subarray(0, k), { stream: true });
      return true;
    } catch {
      return false;
    }
  };
  if (acceptsPrefix(bytes.length)) return bytes.length; // only the end cut the last sequence off
  let ok = 0; // the longest prefix known to be accepted
  let bad = bytes.length; // the shortest prefix known to be refused
  while (bad - ok > 1) {
    const mid = (ok + bad) >>> 1;
    if (acceptsPrefix(mid)) ok = mid;
    else bad = mid;
  }
  const at = ok; // the decoder stopped at bytes[at]
  if (!isContinuation(bytes[at])) return at;
  let lead = at - 1;
  while (lead >= 0 && isContinuation(bytes[lead])) lead--;
  const length =
    lead < 0 ? 1 : bytes[lead] >= 0xf0 ? 4 : bytes[lead] >= 0xe0 ? 3 : bytes[lead] >= 0xc2 ? 2 : 1;
  if (lead < 0 || lead + length <= at) return at; // a stray continuation byte
  for (let k = at + 1; k < lead + length; k++) if (k >= bytes.length || !isContinuation(bytes[k])) return k;
  return lead;
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
