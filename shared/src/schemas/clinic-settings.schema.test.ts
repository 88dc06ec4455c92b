import { describe, expect, it } from 'vitest';
import { PHONE_MESSAGE, updateClinicSettingsSchema } from '../index';

const valid = { name: 'Willowmere', phone: '01632 960 418', address: 'Unit 4\nWillowmere' };
const phoneProblem = (phone: string) =>
  updateClinicSettingsSchema.safeParse({ ...valid, phone }).error?.issues.map((issue) => issue.message) ?? [];

describe('updateClinicSettingsSchema', () => {
  it('takes phone numbers as people write them: spaces, brackets, hyphens, dots, a leading + or bracket', () => {
    for (const phone of [
      '01632 960 418',
      '+44 (0)1632 960418',
      '01632-960-418',
      '01632.960.418',
      '1632960',
    ]) {
      expect(phoneProblem(phone), phone).toEqual([]);
    }
  });

  it('refuses more than 15 digits (ITU-T E.164, docs/references.md §6), fewer than 7, and letters', () => {
    expect(phoneProblem('+44 1632 960 418 1234')).toEqual([PHONE_MESSAGE]); // 16 digits
    expect(phoneProblem('+44 1632 960 418 123')).toEqual([]); // 15 digits
    expect(phoneProblem('960 41')).toEqual([PHONE_MESSAGE]);
    expect(phoneProblem('01632 WILLOW')).toEqual([PHONE_MESSAGE]);
    expect(phoneProblem('-01632 960 418')).toEqual([PHONE_MESSAGE]); // starts with +, a bracket or a digit
  });

  it('stores empty e-mail and website as null, lower-cases the e-mail, and keeps the address’s lines', () => {
    expect(
      updateClinicSettingsSchema.parse({ ...valid, email: ' Desk@Willowmere.Example ', website: '' }),
    ).toEqual({ ...valid, email: 'desk@willowmere.example', website: null });
  });

  it('takes only http and https websites with a domain', () => {
    const website = (value: string) =>
      updateClinicSettingsSchema.safeParse({ ...valid, website: value }).success;
    expect(website('https://willowmere.example/clinic')).toBe(true);
    expect(website('http://willowmere.example')).toBe(true);
    expect(website('ftp://willowmere.example')).toBe(false);
    expect(website('javascript:alert(1)')).toBe(false);
    expect(website('willowmere.example')).toBe(false);
  });
});
