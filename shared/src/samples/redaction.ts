// Replacing one flagged span with Keyloom's placeholder token and keeping the other flags' offsets right.
import { type PersonalDataKind, redactionToken } from '../schemas/samples.schema';

/** The least a flag needs for redaction: its id, kind and code-unit span in the current text. */
export type RedactableFlag = { id: string; kind: PersonalDataKind; start: number; end: number };

export type RedactionResult<F extends RedactableFlag> = {
  text: string;
  /** Every flag, with the redacted one now covering its token and later ones shifted. */
  flags: F[];
  /** The changed flag as it is now (start/end of the token, or of the original text after an undo). */
  redacted: F;
};

/**
 * Replaces the span of flag `flagId` in `text` with `redactionToken(kind)`; flags that start at or
 * after its end move by the change in length. Flags never overlap (the detector guarantees it).
 * @throws Error when the flag is missing or its span lies outside the text.
 */
export function applyRedaction<F extends RedactableFlag>(
  text: string,
  flags: F[],
  flagId: string,
): RedactionResult<F> {
  return replaceFlagSpan(text, flags, flagId, (flag) => redactionToken(flag.kind));
}

/**
 * Reverses `applyRedaction` for flag `flagId`: its token span in `text` becomes `original` again and
 * flags that start at or after the token's end move back by the change in length.
 * @throws Error when the flag is missing or its span lies outside the text.
 */
export function undoRedaction<F extends RedactableFlag>(
  text: string,
  flags: F[],
  flagId: string,
  original: string,
): RedactionResult<F> {
  return replaceFlagSpan(text, flags, flagId, () => original);
}

function replaceFlagSpan<F extends RedactableFlag>(
  text: string,
  flags: F[],
  flagId: string,
  replacementFor: (flag: F) => string,
): RedactionResult<F> {
  const flag = flags.find((f) => f.id === flagId);
  if (!flag) throw new Error(`No flag ${flagId} on this text.`);
  if (flag.start < 0 || flag.end > text.length || flag.start >= flag.end)
    throw new Error('The flag lies outside the text.');
  const replacement = replacementFor(flag);
  const shift = replacement.length - (flag.end - flag.start);
  const redacted = { ...flag, end: flag.start + replacement.length };
  const moved = flags.map((f) => {
    if (f.id === flagId) return redacted;
    if (f.start >= flag.end) return { ...f, start: f.start + shift, end: f.end + shift };
    return f;
  });
  return { text: text.slice(0, flag.start) + replacement + text.slice(flag.end), flags: moved, redacted };
}
