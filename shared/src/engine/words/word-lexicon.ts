// A frequency list of words (e.g. SUBTLEX-US): the base vocabulary's widest
// part and a context-free word probability P_lex(w) = f(w) / Σ f. Frozen.
import { ByteReader, ByteWriter, FormatError, requireDeclaredFits } from '../byte-io';
import { crc32 } from '../crc32';
import { codePointsOf, stringFromCodePoints } from '../text-preparation';
import { decodeUtf8, encodeUtf8 } from '../utf8-codec';
import { wordKey } from './word-tokens';

function readUtf8(b: Uint8Array): string {
  const cps = decodeUtf8(b);
  if (!cps) throw new FormatError('damaged: text that is not UTF-8');
  return stringFromCodePoints(cps);
}

const MAGIC = [0x8b, 0x4b, 0x4c, 0x4c]; // 0x8B "KLL"
const LAYOUT_VERSION = 1;

export class WordLexicon {
  /** Keys by descending frequency. */
  readonly keys: string[] = [];
  readonly frequencies: number[] = [];
  /** The form the list gives, when it differs from the key. */
  private readonly forms = new Map<number, string>();
  private readonly ids = new Map<string, number>();
  total = 0;

  /** Builds from (form, frequency) rows; forms with the same key are added together, the commonest form kept. */
  static fromEntries(entries: Iterable<readonly [string, number]>): WordLexicon {
    const byKey = new Map<string, { f: number; form: string; formF: number }>();
    for (const [form, f] of entries) {
      if (!(f > 0) || form === '') continue;
      const key = wordKey(form);
      const e = byKey.get(key);
      if (!e) byKey.set(key, { f, form, formF: f });
      else {
        e.f += f;
        if (f > e.formF) {
          e.form = form;
          e.formF = f;
        }
      }
    }
    const lex = new WordLexicon();
    const sorted = [...byKey].sort((a, b) => b[1].f - a[1].f || (a[0] < b[0] ? -1 : 1));
    for (const [key, e] of sorted) lex.add(key, e.f, e.form);
    return lex;
  }

  private add(key: string, f: number, form: string): void {
    const id = this.keys.length;
    this.keys.push(key);
    this.frequencies.push(f);
    this.ids.set(key, id);
    if (form !== key) this.forms.set(id, form);
    this.total += f;
  }

  get size(): number {
    return this.keys.length;
  }

  idOf(key: string): number {
    return this.ids.get(key) ?? -1;
  }

  /** P_lex(key), 0 outside the list. */
  probability(key: string): number {
    const id = this.ids.get(key);
    return id === undefined || this.total === 0 ? 0 : this.frequencies[id] / this.total;
  }

  form(id: number): string {
    return this.forms.get(id) ?? this.keys[id];
  }

  /** Magic 8B 4B 4C 4C, version, n (varint), n × (key, frequency, form or empty), CRC-32. */
  toBytes(): Uint8Array {
    const w = new ByteWriter();
    for (const b of MAGIC) w.u8(b);
    w.u8(LAYOUT_VERSION);
    const str = (s: string): void => {
      const b = encodeUtf8(codePointsOf(s));
      w.varint(b.length);
      w.raw(b);
    };
    w.varint(this.keys.length);
    for (let id = 0; id < this.keys.length; id++) {
      str(this.keys[id]);
      w.varint(this.frequencies[id]);
      str(this.forms.get(id) ?? '');
    }
    w.u32(crc32(w.result()));
    return w.result();
  }

  static fromBytes(bytes: Uint8Array): WordLexicon {
    if (bytes.length < 10) throw new FormatError('word list: too short');
    for (let i = 0; i < 4; i++)
      if (bytes[i] !== MAGIC[i]) throw new FormatError('word list: not a Keyloom word list (wrong magic)');
    const stored = new ByteReader(bytes.subarray(bytes.length - 4)).u32();
    if (crc32(bytes.subarray(0, bytes.length - 4)) !== stored)
      throw new FormatError('word list: damaged (CRC-32 does not match)');
    const r = new ByteReader(bytes, bytes.length - 4);
    r.position = 4;
    const version = r.u8();
    if (version !== LAYOUT_VERSION) throw new FormatError(`word list: layout ${version} is not supported`);
    const str = (): string => {
      const n = r.varint();
      requireDeclaredFits(n, 'bytes of text', 1, r.remaining);
      const b = bytes.subarray(r.position, r.position + n);
      r.position += n;
      return readUtf8(b);
    };
    const n = r.varint();
    requireDeclaredFits(n, 'words', 3, r.remaining);
    const lex = new WordLexicon();
    for (let i = 0; i < n; i++) {
      const key = str();
      const f = r.varint();
      const form = str();
      if (lex.ids.has(key)) throw new FormatError(`word list: damaged (word "${key}" twice)`);
      lex.add(key, f, form === '' ? key : form);
    }
    if (r.remaining !== 0) throw new FormatError('word list: damaged (bytes left over)');
    return lex;
  }
}
