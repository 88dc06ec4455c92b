// The personal-data detector on a table of invented examples. Phone numbers use ranges set aside
// for drama by Ofcom (07700 900xxx, 020 7946 0xxx, 0161 496 0xxx) and the US 555-01xx range;
// e-mail domains are example.org/example.com (RFC 2606). Expected spans are hand-marked (derived).
import { describe, expect, it } from 'vitest';
import type { PersonalDataKind } from '../schemas/samples.schema';
import { detectPersonalData } from './personal-data-detector';
import { applyRedaction, undoRedaction } from './redaction';

type Row = { text: string; found: [PersonalDataKind, string][] };

const positives: Row[] = [
  { text: 'Write to r.ashby@example.org soon', found: [['email', 'r.ashby@example.org']] },
  { text: 'cc: Hannah_A+club@mail.example.com.', found: [['email', 'Hannah_A+club@mail.example.com']] },
  { text: 'Ring me on 07700 900123 tonight', found: [['phone', '07700 900123']] },
  { text: 'mobile 07700900456.', found: [['phone', '07700900456']] },
  { text: 'Office: 020 7946 0018', found: [['phone', '020 7946 0018']] },
  { text: 'Club line 0161 496 0000 (evenings)', found: [['phone', '0161 496 0000']] },
  { text: 'From abroad +44 7700 900123', found: [['phone', '+44 7700 900123']] },
  { text: 'or +44 (0)20 7946 0018', found: [['phone', '+44 (0)20 7946 0018']] },
  { text: 'US cousin: (555) 010-4477', found: [['phone', '(555) 010-4477']] },
  {
    text: 'call 555-010-4477 or 555.010.4478',
    found: [
      ['phone', '555-010-4477'],
      ['phone', '555.010.4478'],
    ],
  },
  { text: 'toll free 1-800-555-0199', found: [['phone', '1-800-555-0199']] },
  { text: 'Paris +33 1 23 45 67 89', found: [['phone', '+33 1 23 45 67 89']] },
  { text: 'We live at 14 Harbour Road now', found: [['street_address', '14 Harbour Road']] },
  { text: 'Flat 3, 27b Gull Lane, Southsea', found: [['street_address', '27b Gull Lane']] },
  { text: 'meet at 221 Old Quay St. later', found: [['street_address', '221 Old Quay St.']] },
  { text: 'Postcode PO4 9ZZ', found: [['postcode', 'PO4 9ZZ']] },
  {
    text: 'London SW1A 2AA and M1 1AE',
    found: [
      ['postcode', 'SW1A 2AA'],
      ['postcode', 'M1 1AE'],
    ],
  },
  { text: 'Portland, OR 97201-1234', found: [['postcode', '97201-1234']] },
  { text: 'zip code: 90210', found: [['postcode', '90210']] },
  {
    text: '88 Maple Avenue, Springfield 62704',
    found: [
      ['street_address', '88 Maple Avenue'],
      ['postcode', '62704'],
    ],
  },
  { text: 'DOB: 14/03/1992', found: [['date_of_birth', '14/03/1992']] },
  { text: 'I was born on 3 May 1991 in Leeds', found: [['date_of_birth', '3 May 1991']] },
  { text: 'date of birth 1992-03-14', found: [['date_of_birth', '1992-03-14']] },
  { text: 'Her birthday is March 12th', found: [['date_of_birth', 'March 12th']] },
  { text: '12th of June is Hannah’s birthday', found: [['date_of_birth', '12th of June']] },
  { text: 'Card 4111 1111 1111 1111 expires', found: [['long_digits', '4111 1111 1111 1111']] },
  { text: 'passport 123-456-789', found: [['long_digits', '123-456-789']] },
  { text: 'ID 12 3456 7890 12', found: [['long_digits', '12 3456 7890 12']] },
  { text: 'ref 123456789', found: [['long_digits', '123456789']] },
  {
    text: 'See https://sailing.example.org/results?race=4.',
    found: [['url', 'https://sailing.example.org/results?race=4']],
  },
  { text: '(www.example.com/pepper)', found: [['url', 'www.example.com/pepper']] },
];

const negatives: string[] = [
  'The race starts at 10:30 and ends by 14:45.',
  'I started sailing in 1998, then again in 2019 2020 2021.',
  'It cost £1,250.00 and the sail was $349.99.',
  'We drove Route 66 and the M25 and the A3.',
  'Update to version 10.2.3 or 4.18.2.1 please.',
  'We won 12-3 and then 21-19.',
  'Chapter 12 of 400 pages; 5 boats; 3 dogs.',
  'Her 2nd race was on 14/03/2020 at the club.',
  '1600 Things To Do before 40.',
  'He sold 12345 copies.',
  'Pepper is 7 years old; Hannah turns 31 in May.',
  'Temperature 21.5 degrees at 06:00, wind 12 knots.',
  'Page 3 of 9: items 10-20.',
  'the 2 of us walked down the road',
  'Born free, as they say.',
  'Score 3.14159265358',
];

describe('detectPersonalData', () => {
  it.each(positives)('finds $found in "$text"', ({ text, found }) => {
    const matches = detectPersonalData(text);
    expect(matches.map((m) => [m.kind, m.text])).toEqual(found);
    for (const m of matches) expect(text.slice(m.start, m.end)).toBe(m.text);
  });

  it.each(negatives)('finds nothing in "%s"', (text) => {
    expect(detectPersonalData(text)).toEqual([]);
  });

  it('returns sorted matches without overlaps in a longer text', () => {
    const text = [
      'Hannah, DOB 02/11/1994, lives at 14 Harbour Road, Southsea PO4 9ZZ.',
      'Email hannah.ashby@example.org or see https://example.org/hannah.',
      'Phone 07700 900123; card 4111-1111-1111-1111.',
    ].join('\n');
    const matches = detectPersonalData(text);
    expect(matches.map((m) => m.kind)).toEqual([
      'date_of_birth',
      'street_address',
      'postcode',
      'email',
      'url',
      'phone',
      'long_digits',
    ]);
    for (let i = 1; i < matches.length; i++)
      expect(matches[i].start).toBeGreaterThanOrEqual(matches[i - 1].end);
  });
});

describe('applyRedaction', () => {
  it('replaces one span with the token and shifts later flags', () => {
    const text = 'Ring 07700 900123 or mail r.ashby@example.org today';
    const flags = detectPersonalData(text).map((m, i) => ({ ...m, id: `f${i}` }));
    const first = applyRedaction(text, flags, 'f0');
    expect(first.text).toBe('Ring ⟪phone⟫ or mail r.ashby@example.org today');
    const email = first.flags[1];
    expect(first.text.slice(email.start, email.end)).toBe('r.ashby@example.org');
    const second = applyRedaction(first.text, first.flags, 'f1');
    expect(second.text).toBe('Ring ⟪phone⟫ or mail ⟪email⟫ today');
    expect(second.text.slice(second.redacted.start, second.redacted.end)).toBe('⟪email⟫');
    expect(() => applyRedaction(text, flags, 'nope')).toThrow();
  });
});

describe('undoRedaction', () => {
  it('puts the original back and moves later flags back, after other redactions too', () => {
    const text = 'Ring 07700 900123 or mail r.ashby@example.org today';
    const flags = detectPersonalData(text).map((m, i) => ({ ...m, id: `f${i}` }));
    const first = applyRedaction(text, flags, 'f0');
    const second = applyRedaction(first.text, first.flags, 'f1');
    const undone = undoRedaction(second.text, second.flags, 'f0', '07700 900123');
    expect(undone.text).toBe('Ring 07700 900123 or mail ⟪email⟫ today');
    expect(undone.text.slice(undone.redacted.start, undone.redacted.end)).toBe('07700 900123');
    const email = undone.flags[1];
    expect(undone.text.slice(email.start, email.end)).toBe('⟪email⟫');
    const both = undoRedaction(undone.text, undone.flags, 'f1', 'r.ashby@example.org');
    expect(both.text).toBe(text);
    expect(both.flags.map(({ start, end }) => [start, end])).toEqual(
      flags.map(({ start, end }) => [start, end]),
    );
    expect(() => undoRedaction(text, flags, 'nope', 'x')).toThrow();
  });
});

describe('detectPersonalData on long runs', () => {
  it('stays linear on a long word without "@" (no rescanning from every position)', () => {
    // 200k characters: a quadratic scan would take minutes; a linear one takes milliseconds.
    const text = 'x'.repeat(200_000) + ' write to a@example.org';
    const matches = detectPersonalData(text);
    expect(matches.map((m) => m.text)).toEqual(['a@example.org']);
  });
});
