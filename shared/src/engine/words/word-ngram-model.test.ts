// The word trigram model against the published definition of interpolated modified Kneser–Ney
// smoothing (S. F. Chen, J. Goodman, 1998, "An empirical study of smoothing techniques for
// language modeling", Harvard University TR-10-98, section 3.5 and the modified discounts D1, D2,
// D3+ with Y = n1 / (n1 + 2 n2); docs/references.md §4). The corpus below is invented for this test;
// every expected value is derived by hand from those definitions, step by step in the comments.
import { describe, expect, it } from 'vitest';
import { ByteWriter, FormatError } from '../byte-io';
import { crc32 } from '../crc32';
import { prepareText } from '../text-preparation';
import { modifiedDiscounts, WordNgramModel } from './word-ngram-model';
import { SENTENCE_START as S, sentencesOf, UNKNOWN_WORD } from './word-tokens';

/** Invented: nine sentences over five words, chosen so every order has n1..n4 > 0. */
const HAND_CORPUS =
  'go go. can go go. now go go. go go now. go go go. can now go. we can go. we can sail. go now go.';

function trainOn(text: string): WordNgramModel {
  return WordNgramModel.train(sentencesOf(prepareText(text)));
}

const exact = (p: number, q: number): number => p / q;

describe('WordNgramModel: interpolated modified Kneser–Ney by hand (Chen & Goodman 1998)', () => {
  const m = trainOn(HAND_CORPUS);

  // Counts, derived by hand from the nine sentences (each padded with two <s>):
  //
  // Order 3, raw counts c(u v w):
  //   (<s> <s> go) 4, (<s> <s> can) 2, (<s> <s> we) 2, (<s> <s> now) 1,
  //   (<s> go go) 3, (<s> we can) 2,
  //   count 1: (<s> go now), (<s> can go), (<s> can now), (<s> now go), (can go go), (now go go),
  //            (go go now), (go go go), (can now go), (we can go), (we can sail), (go now go)
  //            and (<s> <s> now) above: 13 trigrams.
  //   Counts of counts n1..n4 = 13, 3, 1, 1.
  // Order 2, continuation counts N1+(• v w) (distinct u before v w):
  //   (go go) 4 {<s>, can, now, go}; (now go) 3 {<s>, can, go}; (go now) 2 {<s>, go};
  //   (can go) 2 {<s>, we}; count 1: (<s> go), (<s> can), (<s> now), (<s> we), (can now),
  //   (can sail), (we can): 7.   n1..n4 = 7, 2, 1, 1.
  // Order 1, continuation counts N1+(• w) (distinct v before w):
  //   go 4 {<s>, go, can, now}; now 3 {<s>, go, can}; can 2 {<s>, we}; we 1; sail 1.
  //   n1..n4 = 2, 1, 1, 1; N1+(• •) = 4 + 3 + 2 + 1 + 1 = 11; |V| = 5.
  //
  // Discounts, D1 = 1 − 2Y·n2/n1, D2 = 2 − 3Y·n3/n2, D3+ = 3 − 4Y·n4/n3, Y = n1/(n1 + 2 n2):
  //   order 1: Y = 2/4 = 1/2;   D1 = 1 − 2·½·1/2 = 1/2;   D2 = 2 − 3·½·1 = 1/2;   D3+ = 3 − 4·½·1 = 1
  //   order 2: Y = 7/11;        D1 = 1 − 2·(7/11)·2/7 = 7/11;   D2 = 2 − 3·(7/11)·1/2 = 23/22;
  //            D3+ = 3 − 4·(7/11)·1 = 5/11
  //   order 3: Y = 13/19;       D1 = 1 − 2·(13/19)·3/13 = 13/19;  D2 = 2 − 3·(13/19)·1/3 = 25/19;
  //            D3+ = 3 − 4·(13/19)·1 = 5/19
  it('fixes the modified discounts from the counts of counts of each order (derived)', () => {
    const want = [
      [1 / 2, 1 / 2, 1],
      [7 / 11, 23 / 22, 5 / 11],
      [13 / 19, 25 / 19, 5 / 19],
    ];
    for (let order = 0; order < 3; order++)
      for (let k = 0; k < 3; k++) expect(m.discounts[order][k]).toBeCloseTo(want[order][k], 12);
    expect(m.vocabularySize).toBe(5);
  });

  // Order 1: γ1 = D1·n1 + D2·n2 + D3+·(n3 + n4) = ½·2 + ½·1 + 1·2 = 7/2; γ1/|V| = 7/10.
  //   P1(go)   = (4 − 1 + 7/10) / 11 = 37/110
  //   P1(now)  = (3 − 1 + 7/10) / 11 = 27/110
  //   P1(can)  = (2 − ½ + 7/10) / 11 = 1/5
  //   P1(sail) = P1(we) = (1 − ½ + 7/10) / 11 = 6/55          (37 + 27 + 22 + 12 + 12 = 110)
  it('P1: the continuation unigram with the freed mass spread uniformly (derived)', () => {
    expect(m.unigram(m.idOf('go'))).toBeCloseTo(exact(37, 110), 12);
    expect(m.unigram(m.idOf('now'))).toBeCloseTo(exact(27, 110), 12);
    expect(m.unigram(m.idOf('can'))).toBeCloseTo(exact(1, 5), 12);
    expect(m.unigram(m.idOf('sail'))).toBeCloseTo(exact(6, 55), 12);
    expect(m.unigram(m.idOf('we'))).toBeCloseTo(exact(6, 55), 12);
  });

  // Order 2 contexts:
  //   v = go:  followers go 4, now 2; total 6;  γ2(go) = D3+ + D2 = 5/11 + 23/22 = 3/2
  //     P2(go | go)   = (4 − 5/11 + 3/2 · 37/110) / 6 = (780/220 + 111/220) / 6 = 27/40
  //     P2(now | go)  = (2 − 23/22 + 3/2 · 27/110) / 6 = (210/220 + 81/220) / 6 = 97/440
  //     P2(sail | go) = (0 + 3/2 · 6/55) / 6 = 3/110
  //   v = can: followers go 2, now 1, sail 1; total 4;  γ2(can) = D2 + 2·D1 = 23/22 + 14/11 = 51/22
  //     P2(go | can)  = (2 − 23/22 + 51/22 · 37/110) / 4 = (2310/2420 + 1887/2420) / 4 = 4197/9680
  //   v = now: followers go 3; total 3;  γ2(now) = D3+ = 5/11
  //     P2(go | now)  = (3 − 5/11 + 5/11 · 37/110) / 3 = (616/242 + 37/242) / 3 = 653/726
  //   v = <s>: followers go, can, now, we, 1 each; total 4;  γ2(<s>) = 4 · 7/11 = 28/11
  //     P2(we | <s>)  = (1 − 7/11 + 28/11 · 6/55) / 4 = (220/605 + 168/605) / 4 = 97/605
  it('P2: continuation bigrams interpolated with P1 (derived)', () => {
    const p2 = (v: string, w: string): number => m.bigram(m.idOf(v), m.idOf(w));
    expect(p2('go', 'go')).toBeCloseTo(exact(27, 40), 12);
    expect(p2('go', 'now')).toBeCloseTo(exact(97, 440), 12);
    expect(p2('go', 'sail')).toBeCloseTo(exact(3, 110), 12);
    expect(p2('can', 'go')).toBeCloseTo(exact(4197, 9680), 12);
    expect(p2('now', 'go')).toBeCloseTo(exact(653, 726), 12);
    expect(p2(S, 'we')).toBeCloseTo(exact(97, 605), 12);
  });

  // Order 3 contexts (raw counts, discounts 13/19, 25/19, 5/19):
  //   (can go):  go 1; total 1; γ3 = 13/19
  //     P3(go | can go)   = (1 − 13/19 + 13/19 · 27/40) / 1 = 240/760 + 351/760 = 591/760
  //   (we can):  go 1, sail 1; total 2; γ3 = 26/19
  //     P3(go | we can)   = (1 − 13/19 + 26/19 · 4197/9680) / 2 = (58080 + 109122)/183920 / 2 = 83601/183920
  //   (go go):   now 1, go 1; total 2; γ3 = 26/19
  //     P3(now | go go)   = (1 − 13/19 + 26/19 · 97/440) / 2 = (2640 + 2522)/8360 / 2 = 2581/8360
  //   (now go):  go 1; total 1; γ3 = 13/19; "sail" never followed it, nor "go" as a bigram:
  //     P3(sail | now go) = 13/19 · P2(sail | go) = 13/19 · 3/110 = 39/2090
  //   (<s> <s>): go 4, can 2, we 2, now 1; total 9; γ3 = 5/19 + 2·25/19 + 13/19 = 68/19
  //     P3(we | <s> <s>)  = (2 − 25/19 + 68/19 · 97/605) / 9 = (7865 + 6596)/11495 / 9 = 14461/103455
  //   Unseen contexts back off whole: (sail now) never seen → P2(go | now) = 653/726;
  //   "sail" never followed by anything → P1(go) = 37/110; words outside the vocabulary likewise.
  it('P3: trigrams interpolated with P2, and unseen contexts backing off (derived)', () => {
    expect(m.probability('can', 'go', 'go')).toBeCloseTo(exact(591, 760), 12);
    expect(m.probability('we', 'can', 'go')).toBeCloseTo(exact(83601, 183920), 12);
    expect(m.probability('go', 'go', 'now')).toBeCloseTo(exact(2581, 8360), 12);
    expect(m.probability('now', 'go', 'sail')).toBeCloseTo(exact(39, 2090), 12);
    expect(m.probability(S, S, 'we')).toBeCloseTo(exact(14461, 103455), 12);
    expect(m.probability('sail', 'now', 'go')).toBeCloseTo(exact(653, 726), 12);
    expect(m.probability('can', 'sail', 'go')).toBeCloseTo(exact(37, 110), 12);
    expect(m.probability('harbour', 'jetty', 'go')).toBeCloseTo(exact(37, 110), 12);
    expect(m.probability('go', 'go', 'harbour')).toBe(0);
  });

  it('Σ_w P3(w | u v) = 1 over the vocabulary, in seen and unseen contexts', () => {
    for (const [u, v] of contextsOf(m)) expect(sumOver(m, u, v), `${u} ${v}`).toBeCloseTo(1, 9);
  });
});

/** Every pair of context keys (the pad included) and a pair outside the vocabulary. */
function contextsOf(m: WordNgramModel): [string, string][] {
  const keys = m.keys.filter((k) => k !== UNKNOWN_WORD);
  const out: [string, string][] = [['nowhere', 'unseen']];
  for (const u of keys) for (const v of keys) out.push([u, v]);
  return out;
}

function sumOver(m: WordNgramModel, u: string, v: string): number {
  let s = 0;
  for (let id = 2; id < m.keys.length; id++) s += m.probability(u, v, m.keys[id]);
  return s;
}

/** Learns a text's sentences word by word, as a list does when each word is typed. */
function learnWordByWord(m: WordNgramModel, text: string): void {
  for (const sentence of sentencesOf(prepareText(text))) {
    let u = S;
    let v = S;
    for (const t of sentence) {
      m.learnWord(u, v, t.key, t.form, t.sentenceStart);
      u = v;
      v = t.key;
    }
  }
}

describe('WordNgramModel: learning after training', () => {
  // Invented sentences (no corpus).
  const first = 'We sail at dawn. The boat is ready. We sail to the island and back.';
  const later = 'The island is far. We row the boat back at dusk. Dawn comes early on the island.';

  it('word-by-word learning equals training at once on the same sentences (same discounts)', () => {
    const incremental = trainOn(first);
    learnWordByWord(incremental, later);
    const atOnce = trainOn(`${first} ${later}`);
    atOnce.discounts = incremental.discounts.map((d) => [...d]) as typeof atOnce.discounts;
    expect(incremental.vocabularySize).toBe(atOnce.vocabularySize);
    let compared = 0;
    for (const [u, v] of contextsOf(atOnce)) {
      for (let id = 2; id < atOnce.keys.length; id++) {
        const w = atOnce.keys[id];
        expect(incremental.probability(u, v, w), `${u} ${v} ${w}`).toBeCloseTo(
          atOnce.probability(u, v, w),
          12,
        );
        compared++;
      }
    }
    expect(compared).toBeGreaterThan(5000);
  });

  it('stays normalised after learning, in seen and unseen contexts', () => {
    const m = trainOn(HAND_CORPUS);
    learnWordByWord(m, 'we can row. row go now. sail now.');
    expect(m.vocabularySize).toBe(6);
    for (const [u, v] of contextsOf(m)) expect(sumOver(m, u, v), `${u} ${v}`).toBeCloseTo(1, 9);
    // The new word has mass where it was seen: P3(row | we can) grew from 0.
    expect(m.probability('we', 'can', 'row')).toBeGreaterThan(0.1);
  });

  it('a static model learns nothing', () => {
    const m = trainOn(HAND_CORPUS);
    m.adaptive = false;
    const before = m.probability('we', 'can', 'go');
    learnWordByWord(m, 'we can row. we can go.');
    expect(m.has('row')).toBe(false);
    expect(m.probability('we', 'can', 'go')).toBe(before);
  });
});

describe('modifiedDiscounts', () => {
  it('matches hand values from Chen & Goodman’s estimates (derived)', () => {
    // n = 10, 4, 2, 1: Y = 10/18 = 5/9; D1 = 1 − 2·(5/9)·4/10 = 5/9; D2 = 2 − 3·(5/9)·2/4 = 7/6;
    // D3+ = 3 − 4·(5/9)·1/2 = 17/9.
    const d = modifiedDiscounts([10, 4, 2, 1]);
    expect(d[0]).toBeCloseTo(5 / 9, 12);
    expect(d[1]).toBeCloseTo(7 / 6, 12);
    expect(d[2]).toBeCloseTo(17 / 9, 12);
    // n = 100, 30, 15, 8: Y = 100/160 = 5/8; D1 = 1 − 2·(5/8)·30/100 = 5/8;
    // D2 = 2 − 3·(5/8)·15/30 = 17/16; D3+ = 3 − 4·(5/8)·8/15 = 5/3.
    const e = modifiedDiscounts([100, 30, 15, 8]);
    expect(e[0]).toBeCloseTo(5 / 8, 12);
    expect(e[1]).toBeCloseTo(17 / 16, 12);
    expect(e[2]).toBeCloseTo(5 / 3, 12);
  });

  it('falls back to 0.5, 1, 1.5 when a count of counts is zero (common practice, no source)', () => {
    for (const n of [
      [0, 3, 2, 1],
      [5, 0, 2, 1],
      [5, 3, 0, 1],
      [5, 3, 2, 0],
      [0, 0, 0, 0],
    ])
      expect(modifiedDiscounts(n), n.join(',')).toEqual([0.5, 1, 1.5]);
  });

  it('keeps each discount within [0, k] for its count k', () => {
    // n = 12, 2, 3, 1: Y = 3/4, D2 = 2 − 3·¾·3/2 = −11/8 → 0 (derived).
    expect(modifiedDiscounts([12, 2, 3, 1])[1]).toBe(0);
    // n = 1, 100, 1, 100: Y = 1/201, D1 = 1 − 2·(1/201)·100 = 1/201;
    // D3+ = 3 − 4·(1/201)·100 = 203/201 (derived, inside [0, 3]); D2 = 2 − 3·(1/201)/100 ≈ 2.
    const d = modifiedDiscounts([1, 100, 1, 100]);
    expect(d[0]).toBeCloseTo(1 / 201, 12);
    expect(d[2]).toBeCloseTo(203 / 201, 12);
    for (const n of [
      [1, 50, 1, 1],
      [3, 1, 100, 1],
      [1000, 1, 1, 1000],
    ]) {
      const x = modifiedDiscounts(n);
      x.forEach((dk, k) => {
        expect(dk, `${n} D${k + 1}`).toBeGreaterThanOrEqual(0);
        expect(dk, `${n} D${k + 1}`).toBeLessThanOrEqual(k + 1);
      });
    }
  });

  it('a model trained on too little text uses the fallback at every order', () => {
    const m = trainOn('one small sentence.');
    expect(m.discounts).toEqual([
      [0.5, 1, 1.5],
      [0.5, 1, 1.5],
      [0.5, 1, 1.5],
    ]);
    expect(sumOver(m, S, S)).toBeCloseTo(1, 12);
  });
});

describe('WordNgramModel: file layout', () => {
  const m = trainOn(`${HAND_CORPUS} Go Now. We CAN sail! Harbour’s edge.`);

  it('round-trips: same vocabulary, forms and probabilities', () => {
    const back = WordNgramModel.fromBytes(m.toBytes());
    expect(back.keys).toEqual(m.keys);
    expect(back.counts).toEqual(m.counts);
    expect(back.vocabularySize).toBe(m.vocabularySize);
    for (let id = 2; id < m.keys.length; id++) {
      expect(back.midForm(id)).toBe(m.midForm(id));
      expect(back.startForm(id)).toBe(m.startForm(id));
    }
    // Discounts are stored as doubles: the file gives the same bytes back and exactly the same
    // probabilities (a clone is a round trip).
    expect([...back.toBytes()]).toEqual([...m.toBytes()]);
    expect(back.discounts).toEqual(m.discounts);
    for (const [u, v] of contextsOf(m))
      for (let id = 2; id < m.keys.length; id++)
        expect(back.probability(u, v, m.keys[id])).toBe(m.probability(u, v, m.keys[id]));
  });

  it('round-trips a model trained on text with redaction placeholders to the same probabilities', () => {
    // Invented text; too short for counts of counts, so the discounts are the exact fallbacks.
    const redacted = trainOn(
      'We met ⟪person-name⟫ at the club. ⟪person-name⟫ waved at ⟪person-name⟫. ' +
        'We met Bertram at the club. Then we met the coach.',
    );
    expect(redacted.has('person-name')).toBe(false);
    const back = WordNgramModel.fromBytes(redacted.toBytes());
    for (const [u, v] of contextsOf(redacted))
      for (let id = 2; id < redacted.keys.length; id++) {
        const w = redacted.keys[id];
        expect(back.probability(u, v, w), `${u} ${v} ${w}`).toBe(redacted.probability(u, v, w));
      }
    // P1 is a distribution over the vocabulary, the placeholder outside it.
    let p1 = 0;
    for (let id = 2; id < redacted.keys.length; id++) p1 += redacted.unigram(id);
    expect(p1).toBeCloseTo(1, 12);
  });

  it('refuses every single flipped byte and every truncation with a FormatError', () => {
    const bytes = m.toBytes();
    expect(bytes.length).toBeLessThan(2000);
    for (let i = 0; i < bytes.length; i++) {
      const damaged = bytes.slice();
      damaged[i] ^= 0x01 << (i % 8);
      expect(() => WordNgramModel.fromBytes(damaged), `byte ${i}`).toThrow(FormatError);
    }
    for (let n = 0; n < bytes.length; n++)
      expect(() => WordNgramModel.fromBytes(bytes.subarray(0, n)), `first ${n} bytes`).toThrow(FormatError);
  });

  /** A layout-2 header (magic, version, nine discounts as doubles) for hand-made files. */
  function header(): ByteWriter {
    const w = new ByteWriter();
    for (const b of [0x8b, 0x4b, 0x4c, 0x57, 2]) w.u8(b);
    for (let i = 0; i < 9; i++) w.f64(0.5);
    return w;
  }

  it('refuses a forged word count with a good CRC before allocating for it', () => {
    const w = header();
    w.varint(2 ** 40); // "a trillion words" in a 60-byte file
    for (let i = 0; i < 8; i++) w.u8(0);
    w.u32(crc32(w.result()));
    expect(() => WordNgramModel.fromBytes(w.result())).toThrow(/declares 1099511627776 words/);
  });

  it('refuses a forged follower count with a good CRC before allocating for it', () => {
    const w = header();
    w.varint(1); // one word: "go", count 1, mid count 0, continuation 1, no other forms, no start form
    w.varint(2);
    w.raw(Uint8Array.from([0x67, 0x6f]));
    for (const x of [1, 0, 1, 0, 0]) w.varint(x);
    w.varint(1); // order 2: one table, context "go" (id 2), declaring 2^31 followers
    w.varint(2);
    w.varint(2 ** 31);
    for (let i = 0; i < 16; i++) w.u8(1);
    w.u32(crc32(w.result()));
    expect(() => WordNgramModel.fromBytes(w.result())).toThrow(/declares 2147483648 followers/);
  });

  it('pruned(n) keeps only n-grams seen n times, stays normalised and frozen', () => {
    const p = m.pruned(2);
    expect(p.adaptive).toBe(false);
    expect(p.vocabularySize).toBe(m.vocabularySize);
    for (const t of p.order3.values())
      for (let i = 0; i < t.size; i++) expect(t.counts[i]).toBeGreaterThanOrEqual(2);
    for (const [u, v] of contextsOf(p)) expect(sumOver(p, u, v), `${u} ${v}`).toBeCloseTo(1, 9);
  });
});
