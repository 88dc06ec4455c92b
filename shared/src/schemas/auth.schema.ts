import { z } from 'zod';
import { emailField } from './email';
import { roleSchema } from './roles';

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
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

export const csrfTokenSchema = z.object({ token: z.string().min(16) });
export type CsrfToken = z.infer<typeof csrfTokenSchema>;

// The JSON body of every error the API returns (401, 403, 400, 404, 409, 429, 500).
export const apiErrorSchema = z.object({
  statusCode: z.number().int(),
  message: z.string(),
  error: z.string().optional(),
  // Field-level problems of a 400, keyed by dotted path ("email", "items.0.name").
  issues: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
});
export type ApiError = z.infer<typeof apiErrorSchema>;
