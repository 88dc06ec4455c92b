// The .klprofile file: one self-describing file per exported profile version, our own layout.
// Plain TypeScript (no Node-only API) so the browser can read it as well as the API.
//
// Layout version 1 (unsigned; still read, reported as not signed):
//   offset  size  field
//   0       4     magic "KLPF"
//   4       2     layout version, u16 little-endian (1)
//   6       4     header length H, u32 LE
//   10      H     header: JSON, UTF-8 (ProfileFileHeader)
//   10+H    4     model length M, u32 LE
//   14+H    M     model: serializeModel bytes of the personal PPM model
//   14+H+M  4     CRC-32 (zip/PNG polynomial) of every byte before it, u32 LE
//
// Layout version 2 (signed): the same, with layout version 2 and, between the model and the CRC,
//   14+H+M  32    signature: HMAC-SHA-256 (RFC 2104, FIPS 198-1) of bytes 0 .. 14+H+M−1 under the
//                 clinic's export key (computed by the API; this module only carries the bytes)
//   46+H+M  4     CRC-32 of every byte before it (the signature included), u32 LE
// The CRC tells damage; only the signature tells who made the file.
//
// Layout versions 3 (unsigned) and 4 (signed) add the client's word model (the vocabulary and the
// word counts of the word-aware list) after the PPM model:
//   14+H+M  4     word model length W, u32 LE
//   18+H+M  W     word model: WordNgramModel bytes (words/word-ngram-model.ts)
// then, in version 4, the 32-byte signature of everything before it, then the CRC-32. A profile
// trained with words is written as 3 or 4; one without (made before the word-aware list) as 1 or 2,
// byte for byte as before. Versions 1 and 2 are still read: their `words` is null.
import { crc32 } from '../crc32';
import { deserializeModel } from '../model-serialization';
import { codePointsOf, stringFromCodePoints } from '../text-preparation';
import { decodeUtf8, encodeUtf8 } from '../utf8-codec';
import {
  blockPartsOf,
  checkClientVocabulary,
  EMPTY_VOCABULARY,
  type BlockParts,
  type ClientVocabulary,
} from '../words/client-vocabulary';
import { WordNgramModel } from '../words/word-ngram-model';

export const PROFILE_FILE_MAGIC = 'KLPF';
/** The unsigned layout (written when there is no signer). */
export const PROFILE_FILE_VERSION = 1;
/** The signed layout: a 32-byte signature between the model and the CRC. */
export const PROFILE_FILE_SIGNED_VERSION = 2;
/** The unsigned layout carrying the client's word model. */
export const PROFILE_FILE_WORDS_VERSION = 3;
/** The signed layout carrying the client's word model. */
export const PROFILE_FILE_SIGNED_WORDS_VERSION = 4;
/** Bytes of the signature in a signed file (HMAC-SHA-256). */
export const PROFILE_SIGNATURE_BYTES = 32;
export const PROFILE_FILE_FORMAT = 'keyloom-profile';
export const PROFILE_FILE_EXTENSION = '.klprofile';
/** Largest header accepted on reading (a header is a few kB; this stops a damaged length from allocating). */
const MAX_HEADER_BYTES = 16 * 1024 * 1024;
const FIXED_BYTES = 4 + 2 + 4 + 4 + 4;

/** What a profile file says about itself. Free-form JSON beyond these fields is kept as read. */
export type ProfileFileHeader = {
  format: typeof PROFILE_FILE_FORMAT;
  client: { pseudonym: string };
  version: { id: string; number: number; status: string; note: string | null };
  settings: Record<string, unknown>;
  /** λ: weight of the base model when blending (0..1). Files written before the rename call it `blendWeight`; they read the same. */
  baseWeight: number;
  /** Weights of the word-aware list's mixture (layouts 3 and 4; absent in older files). */
  wordWeights?: { personal: number; base: number; lexicon: number; cache: number };
  /**
   * The clinician's additions and blocks the version was trained with (layouts 3 and 4; absent in
   * older files, read as none). Additions are already learned into the word model; blocks are
   * applied by whatever builds the list from the file (profileBlockParts).
   */
  vocabulary?: ClientVocabulary;
  /** SHA-256 (hex) of the base model file the profile was trained beside, or null. */
  baseModelSha256: string | null;
  /** SHA-256 (hex) of the base vocabulary file the word model was trained beside (layouts 3 and 4 only). */
  baseWordsSha256?: string;
  engineVersion: string;
  /** The headline figures of the engine's report (same names as `model evaluate --json`). */
  metrics: Record<string, unknown>;
  samples: { title: string; sha256: string; characters: number }[];
  createdAt: string;
  trainedAt: string | null;
  approvedBy: string | null;
  approvedAt: string | null;
  exportedAt: string;
  exportedBy: string;
};

/** A file that is not a readable profile file; the message says what is wrong, for a person. */
export class ProfileFileError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ProfileFileError';
  }
}

/** What verifyProfileFile found in a good file. */
export type ProfileFileContents = {
  header: ProfileFileHeader;
  model: Uint8Array;
  modelBytes: number;
  /** The model's own settings, read back from the model bytes. */
  modelOrder: number;
  modelContexts: number;
  checksum: string;
  /** The client's word model bytes (layouts 3 and 4), null in older files. */
  words: Uint8Array | null;
  /** Words in the client's vocabulary (0 without a word model). */
  vocabularyWords: number;
  /** The signature bytes of a signed (version 2 or 4) file; null for an unsigned one. */
  signature: Uint8Array | null;
  /** The bytes the signature covers: everything before it. */
  signedBytes: Uint8Array;
};

/** Computes a file's signature over the given bytes (the API passes an HMAC-SHA-256 under its key). */
export type ProfileFileSigner = (bytes: Uint8Array) => Uint8Array;

function utf8Bytes(text: string): Uint8Array {
  return encodeUtf8(codePointsOf(text));
}

/**
 * Writes a profile file from its header, the serialised personal model and, when the profile has
 * one, the client's word model: layout version 1 or 3 (with words), or 2 or 4 signed by `sign`
 * when given (it must return PROFILE_SIGNATURE_BYTES bytes).
 */
export function writeProfileFile(
  header: ProfileFileHeader,
  model: Uint8Array,
  sign?: ProfileFileSigner,
  words?: Uint8Array | null,
): Uint8Array {
  const headerBytes = utf8Bytes(JSON.stringify(header));
  const signatureBytes = sign ? PROFILE_SIGNATURE_BYTES : 0;
  const wordBytes = words ? 4 + words.length : 0;
  const out = new Uint8Array(FIXED_BYTES + headerBytes.length + model.length + wordBytes + signatureBytes);
  const view = new DataView(out.buffer);
  for (let i = 0; i < 4; i++) out[i] = PROFILE_FILE_MAGIC.charCodeAt(i);
  const layout = words
    ? sign
      ? PROFILE_FILE_SIGNED_WORDS_VERSION
      : PROFILE_FILE_WORDS_VERSION
    : sign
      ? PROFILE_FILE_SIGNED_VERSION
      : PROFILE_FILE_VERSION;
  view.setUint16(4, layout, true);
  view.setUint32(6, headerBytes.length, true);
  out.set(headerBytes, 10);
  const modelAt = 10 + headerBytes.length;
  view.setUint32(modelAt, model.length, true);
  out.set(model, modelAt + 4);
  let signatureAt = modelAt + 4 + model.length;
  if (words) {
    view.setUint32(signatureAt, words.length, true);
    out.set(words, signatureAt + 4);
    signatureAt += 4 + words.length;
  }
  if (sign) {
    const signature = sign(out.subarray(0, signatureAt));
    if (signature.length !== PROFILE_SIGNATURE_BYTES) {
      throw new Error(
        `A profile file signature is ${PROFILE_SIGNATURE_BYTES} bytes, not ${signature.length}.`,
      );
    }
    out.set(signature, signatureAt);
  }
  const crcAt = signatureAt + signatureBytes;
  view.setUint32(crcAt, crc32(out, 0, 0, crcAt), true);
  return out;
}

const hex8 = (n: number) => n.toString(16).padStart(8, '0');

/**
 * Reads the layout and checks the checksum; throws ProfileFileError naming the first problem
 * (not a profile file, newer layout, truncated, damaged, header unreadable).
 */
export function readProfileFile(bytes: Uint8Array): {
  header: ProfileFileHeader;
  model: Uint8Array;
  words: Uint8Array | null;
  checksum: string;
  signature: Uint8Array | null;
  signedBytes: Uint8Array;
} {
  const magic = String.fromCharCode(...bytes.subarray(0, 4));
  if (bytes.length < 4 || magic !== PROFILE_FILE_MAGIC) {
    throw new ProfileFileError(
      `This is not a Keyloom profile file: it does not start with "${PROFILE_FILE_MAGIC}".`,
    );
  }
  if (bytes.length < FIXED_BYTES) {
    throw new ProfileFileError(`The file is cut short: ${bytes.length} bytes, too few for a profile file.`);
  }
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const layout = view.getUint16(4, true);
  if (layout < PROFILE_FILE_VERSION || layout > PROFILE_FILE_SIGNED_WORDS_VERSION) {
    throw new ProfileFileError(
      `The file uses layout version ${layout}; this Keyloom reads versions ${PROFILE_FILE_VERSION} ` +
        `to ${PROFILE_FILE_SIGNED_WORDS_VERSION}.`,
    );
  }
  const signed = layout === PROFILE_FILE_SIGNED_VERSION || layout === PROFILE_FILE_SIGNED_WORDS_VERSION;
  const hasWords = layout >= PROFILE_FILE_WORDS_VERSION;
  const signatureBytes = signed ? PROFILE_SIGNATURE_BYTES : 0;
  const headerLength = view.getUint32(6, true);
  const expectedAtLeast = FIXED_BYTES + headerLength;
  if (headerLength > MAX_HEADER_BYTES || bytes.length < expectedAtLeast) {
    throw new ProfileFileError(
      `The file is cut short or damaged: its header should be ${headerLength} bytes, ` +
        `but the file has only ${bytes.length} bytes in all.`,
    );
  }
  const modelAt = 10 + headerLength;
  const modelLength = view.getUint32(modelAt, true);
  const wordsAt = modelAt + 4 + modelLength;
  if (hasWords && bytes.length < wordsAt + 4) {
    throw new ProfileFileError(`The file is cut short: it ends before its word model.`);
  }
  const wordsLength = hasWords ? view.getUint32(wordsAt, true) : 0;
  const total = FIXED_BYTES + headerLength + modelLength + (hasWords ? 4 + wordsLength : 0) + signatureBytes;
  if (bytes.length < total) {
    throw new ProfileFileError(
      `The file is cut short: it should be ${total} bytes long but has ${bytes.length}.`,
    );
  }
  if (bytes.length > total) {
    throw new ProfileFileError(
      `The file has ${bytes.length - total} bytes more than its layout describes (damaged or joined to another file).`,
    );
  }
  const crcAt = total - 4;
  const stored = view.getUint32(crcAt, true);
  const actual = crc32(bytes, 0, 0, crcAt);
  if (stored !== actual) {
    throw new ProfileFileError(
      `The checksum does not match (stored ${hex8(stored)}, computed ${hex8(actual)}): ` +
        'the file was damaged or changed after export.',
    );
  }
  const codePoints = decodeUtf8(bytes.subarray(10, modelAt));
  if (!codePoints) throw new ProfileFileError('The header is not valid UTF-8.');
  let header: unknown;
  try {
    header = JSON.parse(stringFromCodePoints(codePoints));
  } catch {
    throw new ProfileFileError('The header is not valid JSON.');
  }
  if (
    typeof header !== 'object' ||
    header === null ||
    (header as { format?: unknown }).format !== PROFILE_FILE_FORMAT
  ) {
    throw new ProfileFileError(`The header does not describe a ${PROFILE_FILE_FORMAT}.`);
  }
  const signatureAt = crcAt - signatureBytes;
  return {
    header: withCurrentNames(header as ProfileFileHeader & { blendWeight?: number }),
    model: bytes.slice(modelAt + 4, wordsAt),
    words: hasWords ? bytes.slice(wordsAt + 4, wordsAt + 4 + wordsLength) : null,
    checksum: hex8(stored),
    signature: signatureBytes > 0 ? bytes.slice(signatureAt, crcAt) : null,
    signedBytes: bytes.subarray(0, signatureAt),
  };
}

/**
 * The header with today's field names: the base model's weight was `blendWeight` in files written
 * before it had one name everywhere. Only the returned object changes; the signed bytes are as read.
 */
function withCurrentNames(header: ProfileFileHeader & { blendWeight?: number }): ProfileFileHeader {
  if (header.baseWeight !== undefined || header.blendWeight === undefined) return header;
  const { blendWeight, ...rest } = header;
  return { ...rest, baseWeight: blendWeight };
}

/** readProfileFile, then loads the model to be sure it deserialises (ProfileFileError when it does not). */
export function verifyProfileFile(bytes: Uint8Array): ProfileFileContents {
  const { header, model, words, checksum, signature, signedBytes } = readProfileFile(bytes);
  headerVocabulary(header);
  let loaded;
  try {
    loaded = deserializeModel(model);
  } catch (error) {
    const why = error instanceof Error ? error.message : String(error);
    throw new ProfileFileError(`The checksum matches but the model inside cannot be read: ${why}`);
  }
  let vocabularyWords = 0;
  if (words) {
    try {
      vocabularyWords = WordNgramModel.fromBytes(words).vocabularySize;
    } catch (error) {
      const why = error instanceof Error ? error.message : String(error);
      throw new ProfileFileError(`The checksum matches but the word model inside cannot be read: ${why}`);
    }
  }
  return {
    header,
    model,
    modelBytes: model.length,
    modelOrder: loaded.settings.order,
    modelContexts: loaded.contextCount,
    words,
    vocabularyWords,
    checksum,
    signature,
    signedBytes,
  };
}

function isStringOrAbsent(x: unknown): boolean {
  return x === undefined || typeof x === 'string';
}

/**
 * The additions and blocks a profile file's header carries (none for an older file without the
 * field); ProfileFileError when the field is there but not a usable vocabulary.
 */
export function headerVocabulary(header: ProfileFileHeader): ClientVocabulary {
  const v: unknown = (header as { vocabulary?: unknown }).vocabulary;
  if (v === undefined) return EMPTY_VOCABULARY;
  const o = v as { additions?: unknown; blocks?: unknown };
  const ok =
    typeof v === 'object' &&
    v !== null &&
    Array.isArray(o.additions) &&
    Array.isArray(o.blocks) &&
    o.additions.every(
      (a: unknown) =>
        typeof a === 'object' &&
        a !== null &&
        typeof (a as VocabularyShape).text === 'string' &&
        ((a as VocabularyShape).weight === undefined || typeof (a as VocabularyShape).weight === 'number'),
    ) &&
    o.blocks.every(
      (b: unknown) =>
        typeof b === 'object' &&
        b !== null &&
        typeof (b as VocabularyShape).word === 'string' &&
        isStringOrAbsent((b as VocabularyShape).replacement),
    );
  if (!ok) throw new ProfileFileError('The header’s vocabulary must list additions and blocks.');
  const vocabulary = v as ClientVocabulary;
  try {
    checkClientVocabulary(vocabulary);
  } catch (error) {
    throw new ProfileFileError(`The header’s vocabulary cannot be used: ${(error as Error).message}`);
  }
  return vocabulary;
}

type VocabularyShape = { text?: unknown; weight?: unknown; word?: unknown; replacement?: unknown };

/**
 * The blocks of a profile file as WordPredictor parts (`blocked`, `replacements`): spread them into
 * the parts of every list built from the file. Replacements are lower-cased for a case-folded
 * profile (settings.caseFold).
 */
export function profileBlockParts(header: ProfileFileHeader): BlockParts {
  const settings = header.settings as { caseFold?: unknown } | null;
  return blockPartsOf(headerVocabulary(header).blocks, { caseFold: settings?.caseFold === true });
}
