// A trained PpmModel as a compact, versioned, checksummed byte layout that
// loads back (in Node or a browser) with identical predictions.
//
// Layout (integers little-endian; "varint" = 7 bits per byte, low first):
//   0  4  magic 0x8B 'K' 'L' 'M'
//   4  1  layout version (1)
//   5  1  order k (0..12)
//   6  1  escape method, ASCII 'A'..'D'
//   7  1  flags: bit0 exclusion, bit1 update exclusion, bit2 adaptive, bit3 literals
//   8  4  alphabetSize (order -1 base alphabet)
//  12  4  context total limit the counts were kept under (CONTEXT_TOTAL_LIMIT)
//  16  4  number of context nodes written (N)
//  20  4  number of entries written (M)
//  24  …  the context trie, depth first from the root (order 0). Each node:
//         varint q (entries), then q entries in the node's order, each
//         varint symbol, varint (count * 2 + hasChild); then, for each entry
//         with hasChild = 1 in that order, its child node (recursively).
//         Empty child nodes are not written (they predict nothing).
//  end-4  4  CRC-32 of every byte before it
// Two trainings of the same text with the same settings give the same bytes.
import { PpmModel, CONTEXT_TOTAL_LIMIT } from './ppm-model';
import { ContextTrie, MAX_COUNT, NONE } from './context-trie';
import { crc32 } from './crc32';
import { ByteReader, ByteWriter, FormatError, requireDeclaredFits } from './byte-io';
import { type EscapeMethod } from './ppm-settings';

const MAGIC = [0x8b, 0x4b, 0x4c, 0x4d];
const VERSION = 1;
/** Bytes before the trie (magic to entry count). */
const HEADER_BYTES = 24;

/** Serialises a PpmModel (see the layout above). */
export function serializeModel(model: PpmModel): Uint8Array {
  const s = model.settings;
  const trie = model.storage;
  const body = new ByteWriter();
  let nodes = 0;
  let entries = 0;
  const writeNode = (ctx: number, depth: number): void => {
    nodes++;
    const q = trie.sizeOf(ctx);
    const start = trie.blockOf(ctx);
    body.varint(q);
    // Order-k nodes have no children: their entries' links are shortcuts to
    // the next order-k context (see ppm-model.ts), rebuilt while learning.
    const leaf = depth >= s.order;
    for (let e = start; e < start + q; e++) {
      const child = trie.childAt(e);
      const hasChild = !leaf && child !== NONE && trie.sizeOf(child) > 0 ? 1 : 0;
      body.varint(trie.symbolAt(e));
      body.varint(trie.countAt(e) * 2 + hasChild);
      entries++;
    }
    if (leaf) return;
    for (let e = start; e < start + q; e++) {
      const child = trie.childAt(e);
      if (child !== NONE && trie.sizeOf(child) > 0) writeNode(child, depth + 1);
    }
  };
  writeNode(0, 0);
  const out = new ByteWriter();
  for (const b of MAGIC) out.u8(b);
  out.u8(VERSION);
  out.u8(s.order);
  out.u8(s.escape.charCodeAt(0));
  out.u8(
    (s.exclusion ? 1 : 0) | (s.updateExclusion ? 2 : 0) | (model.adaptive ? 4 : 0) | (s.literals ? 8 : 0),
  );
  out.u32(s.alphabetSize);
  out.u32(CONTEXT_TOTAL_LIMIT);
  out.u32(nodes);
  out.u32(entries);
  out.raw(body.result());
  const withoutCrc = out.result();
  out.u32(crc32(withoutCrc));
  return out.result();
}

/** Loads bytes written by serializeModel; throws FormatError naming what is wrong. */
export function deserializeModel(bytes: Uint8Array): PpmModel {
  if (bytes.length < 28) throw new FormatError('not a Keyloom model: too short');
  for (let i = 0; i < 4; i++)
    if (bytes[i] !== MAGIC[i]) throw new FormatError('not a Keyloom model: wrong magic bytes');
  const r = new ByteReader(bytes, bytes.length - 4);
  r.position = 4;
  const version = r.u8();
  if (version !== VERSION)
    throw new FormatError(`unsupported model layout version ${version} (expected ${VERSION})`);
  const stored = new ByteReader(bytes);
  stored.position = bytes.length - 4;
  if (stored.u32() !== crc32(bytes, 0, 0, bytes.length - 4))
    throw new FormatError('model checksum mismatch: the file is damaged');
  const order = r.u8();
  const escape = String.fromCharCode(r.u8());
  const flags = r.u8();
  const alphabetSize = r.u32();
  const limit = r.u32();
  if (limit !== CONTEXT_TOTAL_LIMIT)
    throw new FormatError(`model kept counts under ${limit}, this engine uses ${CONTEXT_TOTAL_LIMIT}`);
  const nodes = r.u32();
  const entries = r.u32();
  // Each node takes at least one byte (its entry count) and each entry at least two (symbol and
  // count), so the declared sizes must fit in the trie's bytes before anything is sized by them.
  const trieBytes = bytes.length - 4 - HEADER_BYTES;
  requireDeclaredFits(nodes, 'contexts', 1, trieBytes);
  requireDeclaredFits(entries, 'entries', 2, trieBytes);
  requireDeclaredFits(nodes + 2 * entries, 'bytes of contexts and entries', 1, trieBytes);
  if (!['A', 'B', 'C', 'D'].includes(escape))
    throw new FormatError(`bad escape method ${JSON.stringify(escape)}`);
  let model: PpmModel;
  try {
    model = new PpmModel({
      order,
      escape: escape as EscapeMethod,
      exclusion: (flags & 1) !== 0,
      updateExclusion: (flags & 2) !== 0,
      adaptive: (flags & 4) !== 0,
      literals: (flags & 8) !== 0,
      alphabetSize,
    });
  } catch (error) {
    throw new FormatError(`damaged model: ${error instanceof Error ? error.message : String(error)}`);
  }
  const trie = new ContextTrie(Math.max(nodes, 1), Math.max(2 * entries, 1));
  // depth[c] and, for the suffix pass, each node's parent and last symbol.
  const depth = new Uint8Array(Math.max(nodes, 1));
  const parent = new Int32Array(Math.max(nodes, 1)).fill(NONE);
  const lastSymbol = new Int32Array(Math.max(nodes, 1));
  const readNode = (ctx: number): void => {
    const q = r.varint();
    if (q > entries) throw new FormatError('damaged model: impossible entry count');
    const children: number[] = [];
    for (let i = 0; i < q; i++) {
      const symbol = r.varint();
      const v = r.varint();
      const count = Math.floor(v / 2);
      if (symbol >= 0x110000 || count < 1 || count > MAX_COUNT)
        throw new FormatError('damaged model: bad entry');
      const e = trie.append(ctx, symbol, count);
      if (v % 2 === 1) children.push(e - trie.blockOf(ctx));
    }
    if (depth[ctx] >= order && children.length > 0)
      throw new FormatError('damaged model: context deeper than the order');
    for (const index of children) {
      if (trie.contextCount >= nodes) throw new FormatError('damaged model: more contexts than declared');
      const child = trie.newContext(NONE);
      trie.setChild(trie.blockOf(ctx) + index, child);
      depth[child] = depth[ctx] + 1;
      parent[child] = ctx;
      lastSymbol[child] = trie.symbolAt(trie.blockOf(ctx) + index);
      readNode(child);
    }
  };
  readNode(0);
  if (trie.contextCount !== nodes || r.remaining !== 0)
    throw new FormatError('damaged model: sizes do not match the header');
  // Suffix links, shallow nodes first: suffix(s·y) = child of y in suffix(s).
  const byDepth = Array.from({ length: nodes }, (_, i) => i).sort((a, b) => depth[a] - depth[b] || a - b);
  for (const c of byDepth) {
    if (c === 0) continue;
    const p = parent[c];
    trie.setSuffix(c, p === 0 ? 0 : trie.childOf(trie.suffixOf(p), lastSymbol[c]));
    if (trie.suffixOf(c) === NONE) throw new FormatError('damaged model: a context lacks its suffix');
  }
  model.adoptStorage(trie);
  return model;
}
