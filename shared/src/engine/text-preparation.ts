// Turning text into the code points the models read, and back.

/** Options for prepareText. */
export type PrepareOptions = {
  /**
   * Fold case with String.prototype.toLowerCase (locale-independent Unicode
   * default mapping; not full case folding: e.g. "ß" stays "ß").
   */
  caseFold?: boolean;
};

/**
 * Normalises text for a model: CRLF and lone CR become LF, optional case
 * folding, then Unicode NFC (applied last because lower-casing can produce
 * decomposed sequences). Returns the code points.
 */
export function prepareText(text: string, options: PrepareOptions = {}): Uint32Array {
  let s = text.replace(/\r\n?/g, '\n');
  if (options.caseFold) s = s.toLowerCase();
  return codePointsOf(s.normalize('NFC'));
}

/**
 * The code points of a string exactly as they are (no normalisation); a lone
 * surrogate becomes its own code unit value.
 */
export function codePointsOf(text: string): Uint32Array {
  // Two passes (count, then fill) so a large text is held only once more.
  let count = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c >= 0xd800 && c < 0xdc00 && i + 1 < text.length) {
      const d = text.charCodeAt(i + 1);
      if (d >= 0xdc00 && d < 0xe000) i++;
    }
    count++;
  }
  const out = new Uint32Array(count);
  let n = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c >= 0xd800 && c < 0xdc00 && i + 1 < text.length) {
      const d = text.charCodeAt(i + 1);
      if (d >= 0xdc00 && d < 0xe000) {
        out[n++] = 0x10000 + ((c - 0xd800) << 10) + (d - 0xdc00);
        i++;
        continue;
      }
    }
    out[n++] = c;
  }
  return out;
}

/** The string of code points cps[start..end) (each 0..0x10FFFF). */
export function stringFromCodePoints(cps: ArrayLike<number>, start = 0, end = cps.length): string {
  const parts: string[] = [];
  const chunk = 8192; // keeps the spread argument list small
  for (let i = start; i < end; i += chunk) {
    const slice: number[] = [];
    for (let j = i; j < Math.min(end, i + chunk); j++) slice.push(cps[j]);
    parts.push(String.fromCodePoint(...slice));
  }
  return parts.join('');
}
