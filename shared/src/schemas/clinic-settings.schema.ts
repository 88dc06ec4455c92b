import { z } from 'zod';
import { safeText } from './common';
import { personRefSchema } from './clients.schema';

// The clinic's own details (one row for the installation): named in progress e-mails to families and
// on the page behind their stop link. Only admins change them.

export const CLINIC_NAME_MAX = 120;
export const CLINIC_PHONE_MAX = 30;
export const CLINIC_ADDRESS_MAX = 500;
export const CLINIC_WEBSITE_MAX = 200;

/**
 * A phone number as people write it: digits with spaces, brackets, hyphens or dots between them, an
 * optional leading "+" or bracket, 7–15 digits (ITU-T E.164 allows at most 15 digits,
 * docs/references.md §6; fewer than 7 is no number a family could call: common practice, no source,
 * like the separators).
 */
export const PHONE_PATTERN = /^\+?\(?[0-9](?:[0-9 ().-]*[0-9])?$/;
export const PHONE_MESSAGE = 'Enter a phone number of digits, spaces and brackets, e.g. 01632 960 418.';
const digitCount = (text: string) => text.replace(/\D/g, '').length;

/** Optional text that may arrive as "" from an empty form field: "" and null are stored as null. */
const optionalInput = (max: number, tooLong: string) =>
  safeText()
    .trim()
    .max(max, { error: tooLong })
    .transform((value) => (value === '' ? null : value))
    .nullable()
    .optional()
    .transform((value) => value ?? null);

// PUT /api/clinic-settings (admin): every field at once.
export const updateClinicSettingsSchema = z.object({
  name: safeText({ error: 'Enter the clinic’s name.' })
    .trim()
    .min(1, { error: 'Enter the clinic’s name.' })
    .max(CLINIC_NAME_MAX, { error: `Keep the name under ${CLINIC_NAME_MAX} characters.` }),
  phone: safeText({ error: 'Enter the clinic’s phone number.' })
    .trim()
    .min(1, { error: 'Enter the clinic’s phone number.' })
    .max(CLINIC_PHONE_MAX, { error: `Keep the phone number under ${CLINIC_PHONE_MAX} characters.` })
    .refine((value) => PHONE_PATTERN.test(value) && digitCount(value) >= 7 && digitCount(value) <= 15, {
      error: PHONE_MESSAGE,
    }),
  address: safeText({ error: 'Enter the clinic’s address.', multiline: true })
    .trim()
    .min(1, { error: 'Enter the clinic’s address.' })
    .max(CLINIC_ADDRESS_MAX, { error: `Keep the address under ${CLINIC_ADDRESS_MAX} characters.` }),
  email: optionalInput(254, 'That e-mail address is too long.')
    .transform((value) => value?.toLowerCase() ?? null)
    .pipe(z.email({ error: 'Enter a valid e-mail address, or leave it empty.' }).nullable()),
  website: optionalInput(CLINIC_WEBSITE_MAX, `Keep the address under ${CLINIC_WEBSITE_MAX} characters.`).pipe(
    z
      .url({
        protocol: /^https?$/,
        hostname: z.regexes.domain,
        error: 'Enter the website’s full address, starting with https://, or leave it empty.',
      })
      .nullable(),
  ),
});
export type UpdateClinicSettingsInput = z.input<typeof updateClinicSettingsSchema>;
export type ClinicSettingsChanges = z.output<typeof updateClinicSettingsSchema>;

// GET /api/clinic-settings (any signed-in staff). `configured` is false until an admin saves the
// details; the name then reads "the clinic" and the other fields are empty.
export const clinicSettingsSchema = z.object({
  configured: z.boolean(),
  name: z.string(),
  phone: z.string(),
  address: z.string(),
  email: z.string().nullable(),
  website: z.string().nullable(),
  updatedAt: z.string().nullable(),
  updatedBy: personRefSchema.nullable(),
});
export type ClinicSettings = z.infer<typeof clinicSettingsSchema>;

/** What GET answers before an admin has saved the clinic's details. */
export const DEFAULT_CLINIC_SETTINGS: ClinicSettings = {
  configured: false,
  name: 'the clinic',
  phone: '',
  address: '',
  email: null,
  website: null,
  updatedAt: null,
  updatedBy: null,
};
