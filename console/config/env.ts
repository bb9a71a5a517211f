import { z } from 'zod';

// Build-time settings, parsed once; a bad value stops the console with a readable list instead of failing later.
const envSchema = z.object({
  VITE_API_BASE_PATH: z
    .string()
    .regex(/^\/[a-z0-9/-]*$/, 'must be a same-origin path such as /v1')
    .default('/v1'),
  VITE_DOCS_PATH: z
    .string()
    .regex(/^\/[a-z0-9/-]*$/, 'must be a same-origin path such as /docs')
    .default('/docs'),
});

function parseEnv(source: Record<string, unknown>) {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((issue) => `- ${issue.path.join('.')}: ${issue.message}`);
    throw new Error(`Invalid console environment:\n${problems.join('\n')}`);
  }
  return {
    apiBasePath: parsed.data.VITE_API_BASE_PATH.replace(/\/$/, ''),
    docsPath: parsed.data.VITE_DOCS_PATH,
  };
}

export const env = parseEnv(import.meta.env);
