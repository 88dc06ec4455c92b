import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import * as shared from '../index';
import {
  AUDIT_DATE_RANGE_MESSAGE,
  auditFilterSchema,
  auditQuerySchema,
  createClientSchema,
  createConsentSchema,
  createUserSchema,
  EARLIEST_DATE,
  isoDateField,
  isoDateTimeField,
  LATEST_DATE,
  loginSchema,
  pageQuerySchema,
  PASTE_MAX_BYTES,
  pasteSampleSchema,
  profileSettingsSchema,
  safeText,
  summaryPreviewRequestSchema,
  updateUserSchema,
} from '../index';

describe('loginSchema', () => {
  it('trims and lower-cases the e-mail before checking it', () => {
    const parsed = loginSchema.parse({ email: '  Admin@Willowmere.Example ', password: 'x' });
    expect(parsed.email).toBe('admin@willowmere.example');
  });

  it('names the problem of each empty field', () => {
    const result = loginSchema.safeParse({ email: '', password: '' });
    expect(result.success).toBe(false);
    const messages = result.error?.issues.map((issue) => `${issue.path.join('.')}: ${issue.message}`);
    expect(messages).toEqual(['email: Enter a valid e-mail address.', 'password: Enter your password.']);
  });
});

describe('createUserSchema', () => {
  it('refuses a short password and an unknown role', () => {
    const result = createUserSchema.safeParse({
      email: 'a@b.example',
      name: 'A',
      role: 'owner',
      password: 'short',
    });
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((issue) => issue.path[0]).sort()).toEqual(['password', 'role']);
  });
});

describe('updateUserSchema', () => {
  it('refuses an empty change', () => {
    expect(updateUserSchema.safeParse({}).success).toBe(false);
    expect(updateUserSchema.safeParse({ active: false }).success).toBe(true);
  });
});

// The shared text rule: PostgreSQL cannot store U+0000 (PostgreSQL documentation, "Character Types"),
// and a lone surrogate has no UTF-8 form (Unicode Standard, chapter 3, D76/D92).
describe('safeText', () => {
  const single = safeText();
  const multi = safeText({ multiline: true });

  it('refuses NUL and names it', () => {
    const result = single.safeParse('Nul\u0000Client');
    expect(result.success).toBe(false);
    expect(result.error?.issues[0].message).toBe('Contains a character that cannot be stored (NUL).');
  });

  it('refuses other C0 controls and DEL, naming the code point', () => {
    expect(single.safeParse('a\u0001b').error?.issues[0].message).toContain('(U+0001)');
    expect(single.safeParse('a\u007fb').error?.issues[0].message).toContain('(DEL)');
    expect(multi.safeParse('a\u001bb').error?.issues[0].message).toContain('(ESC)');
  });

  it('lets tab and line breaks through only where several lines are allowed', () => {
    expect(multi.safeParse('one\ttwo\r\nthree\n').success).toBe(true);
    expect(single.safeParse('one\ttwo').success).toBe(false);
    expect(single.safeParse('one\ntwo').success).toBe(false);
  });

  it('refuses unpaired surrogates, high or low, anywhere, and keeps paired ones', () => {
    for (const text of ['hello \ud800 there', 'end \udbff', '\udc00 start', 'a\udfffb']) {
      expect(multi.safeParse(text).error?.issues[0].message).toBe(
        'Contains a broken character (unpaired surrogate).',
      );
    }
    // U+1F600 as its surrogate pair, and accented letters: kept.
    expect(multi.safeParse('smile \ud83d\ude00 café').success).toBe(true);
  });

  it('is attached to every string field of every request schema (a NUL and a lone surrogate refused)', () => {
    const requestSchema =
      /^(?!uploadResult|withdrawalPreview)(create|update|paste|upload|withdraw|flagDecision|exclude|signOff|approve|sendBack|reportProblem|summaryPreviewRequest|auditQuery|setPassword)\w*Schema$/;
    const schemas = Object.entries(shared).filter(
      ([name, value]) => requestSchema.test(name) && value instanceof z.ZodType,
    ) as [string, z.ZodType][];
    expect(schemas.length).toBeGreaterThanOrEqual(20);
    const leaves: string[] = [];
    const unsafe: string[] = [];
    const walk = (schema: z.ZodType, path: string): void => {
      const def = (schema as unknown as { _zod: { def: Record<string, unknown> } })._zod.def;
      const inner = (key: string) => walk(def[key] as z.ZodType, path);
      switch (def.type) {
        case 'object':
          for (const [key, field] of Object.entries(def.shape as Record<string, z.ZodType>))
            walk(field, `${path}.${key}`);
          return;
        case 'optional':
        case 'nullable':
        case 'default':
        case 'prefault':
        case 'readonly':
          return inner('innerType');
        case 'pipe':
          inner('in');
          return inner('out');
        case 'array':
          return walk(def.element as z.ZodType, `${path}[]`);
        case 'union':
          for (const option of def.options as z.ZodType[]) walk(option, path);
          return;
        case 'string': {
          // Passwords belong to the sign-in rules (any character a person can type is kept).
          if (def.format || /password$/.test(path)) return;
          leaves.push(path);
          const nul = schema.safeParse('a\u0000b').success;
          const lone = schema.safeParse('a\ud800b').success;
          if (nul || lone) unsafe.push(path);
          return;
        }
        default:
          return;
      }
    };
    for (const [name, schema] of schemas) walk(schema, name);
    expect(leaves.length).toBeGreaterThan(30);
    expect(unsafe).toEqual([]);
  });
});

describe('isoDateField', () => {
  it('takes real calendar dates between 1900 and 2100', () => {
    for (const date of ['1900-01-01', '2024-02-29', '2000-02-29', '2100-12-31'])
      expect(isoDateField.safeParse(date).success).toBe(true);
  });

  it('refuses year 0000, other shapes, days the calendar lacks and dates out of range', () => {
    const message = (value: unknown) => isoDateField.safeParse(value).error?.issues[0].message;
    // The range's ends as the web app writes days: the en-GB medium date of the reference library Intl.
    const day = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeZone: 'UTC' });
    const range = `Enter a date between ${day.format(new Date(EARLIEST_DATE))} and ${day.format(new Date(LATEST_DATE))}.`;
    const noSuchDay = 'is not a day of the calendar: enter a day, month and year that exist (YYYY-MM-DD).';
    expect(message('0000-06-01')).toBe(range);
    expect(message('1899-12-31')).toBe(range);
    expect(message('2101-01-01')).toBe(range);
    // 1900 and 2023 are not leap years (Gregorian rule: century years only when divisible by 400).
    expect(message('1900-02-29')).toBe(`1900-02-29 ${noSuchDay}`);
    expect(message('2023-02-29')).toBe(`2023-02-29 ${noSuchDay}`);
    expect(message('2024-04-31')).toBe(`2024-04-31 ${noSuchDay}`);
    expect(message('2024-13-01')).toBe(`2024-13-01 ${noSuchDay}`);
    for (const bad of [
      '2024-1-01',
      '20240101',
      '2024-01-01T00:00:00Z',
      ' 2024-01-01',
      ['2024-01-01'],
      20240101,
    ])
      expect(message(bad)).toBe('Enter a date with its day, month and year (YYYY-MM-DD).');
  });

  it('is the rule of every date field: consents, samples, summaries, audit filters, trial times', () => {
    const zeroYear = '0000-06-01';
    expect(
      createConsentSchema.safeParse({ givenBy: 'client', scopes: ['training'], givenOn: zeroYear }).success,
    ).toBe(false);
    expect(
      pasteSampleSchema.safeParse({ sourceKind: 'diary', title: 't', text: 'x', periodStart: zeroYear })
        .success,
    ).toBe(false);
    expect(summaryPreviewRequestSchema.safeParse({ from: zeroYear, to: '2026-01-01' }).success).toBe(false);
    expect(auditQuerySchema.safeParse({ from: '0000-01-01' }).success).toBe(false);
    // A reversed range of the audit filters is refused on "to"; the same day at both ends is a range.
    const reversed = auditFilterSchema.safeParse({ from: '2026-09-15', to: '2026-09-14' });
    expect(reversed.error?.issues.map((issue) => [issue.path, issue.message])).toEqual([
      [['to'], AUDIT_DATE_RANGE_MESSAGE],
    ]);
    expect(auditQuerySchema.safeParse({ from: '2026-09-15', to: '2026-09-14' }).success).toBe(false);
    expect(auditFilterSchema.safeParse({ from: '2026-09-15', to: '2026-09-15' }).success).toBe(true);
    expect(isoDateTimeField.safeParse('0000-01-01T10:00:00Z').success).toBe(false);
    expect(isoDateTimeField.safeParse('2026-05-01T10:00:00+01:00').success).toBe(true);
  });
});

describe('numbers from query strings and forms', () => {
  it('takes numbers and numeric text, refuses arrays, objects and empty text', () => {
    expect(pageQuerySchema.parse({ page: '2', pageSize: 10 })).toEqual({ page: 2, pageSize: 10 });
    expect(pageQuerySchema.parse({})).toEqual({ page: 1, pageSize: 50 });
    for (const bad of [['1'], [1], { n: 1 }, '', 'two', true]) {
      expect(pageQuerySchema.safeParse({ page: bad }).success).toBe(false);
    }
    const client = { pseudonym: 'Ash', accessMethod: 'direct' };
    expect(createClientSchema.safeParse({ ...client, keyTimeMs: '1500' }).success).toBe(true);
    expect(createClientSchema.safeParse({ ...client, keyTimeMs: [1500] }).success).toBe(false);
    expect(profileSettingsSchema.partial().safeParse({ order: ['5'] }).success).toBe(false);
    expect(profileSettingsSchema.partial().safeParse({ baseWeight: [0.5] }).success).toBe(false);
  });
});

describe('pasted text', () => {
  const paste = (text: string) => pasteSampleSchema.safeParse({ sourceKind: 'diary', title: 'T', text });
  it('takes up to 100 kB of UTF-8 and refuses more', () => {
    expect(paste('a'.repeat(PASTE_MAX_BYTES)).success).toBe(true);
    const over = paste('a'.repeat(PASTE_MAX_BYTES + 1));
    expect(over.error?.issues[0].message).toBe(
      'Pasted text is limited to 100 kB; upload longer text as a file.',
    );
    // "é" is 2 bytes in UTF-8: half as many characters reach the limit.
    expect(paste('é'.repeat(PASTE_MAX_BYTES / 2)).success).toBe(true);
    expect(paste('é'.repeat(PASTE_MAX_BYTES / 2 + 1)).success).toBe(false);
  });
});
