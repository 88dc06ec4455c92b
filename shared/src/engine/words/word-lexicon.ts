// A frequency list of words (e.g. SUBTLEX-US): the base vocabulary's widest
// part and a context-free word probability P_lex(w) = f(w) / Σ f. Frozen.
import { FormatError, requireDeclaredFits } from '../byte-io';
import {
  closeFrame,
  closeFrameReader,
  type FrameKind,
  openFrameReader,
  openFrameWriter,
  readText,
  writeText,
} from './framed-file';
import { wordKey } from './word-tokens';

/** 0x8B "KLL", layout 1. */
const FRAME: FrameKind = { magic: [0x8b, 0x4b, 0x4c, 0x4c], version: 1, what: 'word list', minBytes: 10 };

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
    const w = openFrameWriter(FRAME);
    w.varint(this.keys.length);
    for (let id = 0; id < this.keys.length; id++) {
      writeText(w, this.keys[id]);
      w.varint(this.frequencies[id]);
      writeText(w, this.forms.get(id) ?? '');
    }
    return closeFrame(w);
  }

  static fromBytes(bytes: Uint8Array): WordLexicon {
    const r = openFrameReader(bytes, FRAME);
    const n = r.varint();
    requireDeclaredFits(n, 'words', 3, r.remaining);
    const lex = new WordLexicon();
    for (let i = 0; i < n; i++) {
      const key = readText(r);
      const f = r.varint();
      const form = readText(r);
      if (lex.ids.has(key)) throw new FormatError(`word list: damaged (word "${key}" twice)`);
      lex.add(key, f, form === '' ? key : form);
    }
    closeFrameReader(r, FRAME);
    return lex;
  }
}
