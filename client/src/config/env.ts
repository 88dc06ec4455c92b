import { z } from 'zod';

// Build-time settings (VITE_ prefixed in .env files or the environment). Every key has a
// same-origin default, so a plain `vite build` served by the API needs none of them.
const envSchema = z.object({
  API_URL: z.string().startsWith('/', { error: 'VITE_API_URL must be a path on this origin, e.g. /api.' }),
  API_DOCS_URL: z.string().min(1),
});

export type Env = z.infer<typeof envSchema>;

const createEnv = (): Env => {
  const raw = import.meta.env;
  const parsed = envSchema.safeParse({
    API_URL: raw.VITE_API_URL ?? '/api',
    API_DOCS_URL: raw.VITE_API_DOCS_URL ?? '/api/docs',
  });
  if (!parsed.success) {
    const problems = parsed.error.issues.map((issue) => `- ${issue.path.join('.')}: ${issue.message}`);
    throw new Error(`Keyloom's client settings are invalid:\n${problems.join('\n')}`);
  }
  return parsed.data;
};

export const env = createEnv();
