import { z } from 'zod';

// A calendar date as ISO "YYYY-MM-DD" (consent dates, sample periods).
export const isoDateField = z.iso.date({ error: 'Enter a date as YYYY-MM-DD.' });

// Optional free text that arrives as "" from an empty form field: stored as null.
export const optionalText = (max: number, tooLong: string) =>
  z
    .string()
    .trim()
    .max(max, { error: tooLong })
    .transform((value) => (value === '' ? null : value))
    .nullable()
    .optional();

// One page of a list and its total, for every paged GET.
export const pageQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});
