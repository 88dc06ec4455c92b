import { z } from 'zod';
import { safeText } from './common';
import { emailField } from './email';
import { roleSchema } from './roles';

// Minimum length for staff passwords: long passphrases over composition rules
// (common practice, no source).
export const PASSWORD_MIN_LENGTH = 12;

const nameField = safeText({ error: 'Enter a name.' })
  .trim()
  .min(1, { error: 'Enter a name.' })
  .max(120, { error: 'Keep the name under 120 characters.' });

export const passwordField = z
  .string({ error: 'Enter a password.' })
  .min(PASSWORD_MIN_LENGTH, { error: `Use at least ${PASSWORD_MIN_LENGTH} characters.` })
  .max(200, { error: 'That password is too long.' });

// A staff account as the admin screens see it.
export const userSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  active: z.boolean(),
  createdAt: z.string(),
  lastSignInAt: z.string().nullable(),
});
export type User = z.infer<typeof userSchema>;

// POST /api/users (admin only).
export const createUserSchema = z.object({
  email: emailField,
  name: nameField,
  role: roleSchema,
  password: passwordField,
});
export type CreateUserInput = z.infer<typeof createUserSchema>;

// PATCH /api/users/:id (admin only): any subset of these. A new password is
// set by the admin when a colleague has forgotten theirs; it ends their sessions.
export const updateUserSchema = z
  .object({
    name: nameField,
    role: roleSchema,
    active: z.boolean(),
    password: passwordField,
  })
  .partial()
  .refine((value) => Object.keys(value).length > 0, { error: 'Nothing to change.' });
export type UpdateUserInput = z.infer<typeof updateUserSchema>;

// The admin's "Set a new password" form.
export const setPasswordSchema = z.object({ password: passwordField });
export type SetPasswordInput = z.infer<typeof setPasswordSchema>;
