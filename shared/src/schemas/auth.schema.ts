import { z } from 'zod';
import { emailField } from './email';
import { roleSchema } from './roles';
import { passwordField } from './users.schema';

// Sign-in body, validated by the sign-in form and by POST /api/auth/login.
export const loginSchema = z.object({
  email: emailField,
  password: z
    .string({ error: 'Enter your password.' })
    .min(1, { error: 'Enter your password.' })
    .max(200, { error: 'That password is too long.' }),
});
export type LoginInput = z.infer<typeof loginSchema>;

// What GET /api/auth/me and POST /api/auth/login return.
export const sessionUserSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  // Present (true) only while the account must choose a new password before anything else.
  mustChangePassword: z.literal(true).optional(),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

export const csrfTokenSchema = z.object({ token: z.string().min(16) });
export type CsrfToken = z.infer<typeof csrfTokenSchema>;

// POST /api/auth/password: a signed-in user changes their own password (the account page, and the
// "Choose a new password" page of an account that must change it). The new one is typed twice.
export const changePasswordSchema = z
  .object({
    currentPassword: z
      .string({ error: 'Enter your current password.' })
      .min(1, { error: 'Enter your current password.' })
      .max(200, { error: 'That password is too long.' }),
    newPassword: passwordField,
    confirmPassword: z.string({ error: 'Type the new password again.' }),
  })
  .refine((value) => value.confirmPassword === value.newPassword, {
    error: 'The two new passwords are not the same.',
    path: ['confirmPassword'],
  })
  .refine((value) => value.newPassword !== value.currentPassword, {
    error: 'Choose a password different from the current one.',
    path: ['newPassword'],
  });
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;

// The `code` of the 403 an account gets, on every route but a few, while it must change its password.
export const PASSWORD_CHANGE_REQUIRED_CODE = 'password-change-required';

// The JSON body of every error the API returns (401, 403, 400, 404, 409, 429, 500).
export const apiErrorSchema = z.object({
  statusCode: z.number().int(),
  message: z.string(),
  error: z.string().optional(),
  // A machine-readable reason where the client acts on it (PASSWORD_CHANGE_REQUIRED_CODE).
  code: z.string().optional(),
  // Field-level problems of a 400, keyed by dotted path ("email", "items.0.name").
  issues: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
});
export type ApiError = z.infer<typeof apiErrorSchema>;
