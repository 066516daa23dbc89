import { z } from 'zod';

/**
 * The process environment, validated once per read. Read lazily (not at import) so scripts and
 * tests can set variables before the first use.
 */
const schema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  DATABASE_URL: z.string().optional(),
  SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters').optional(),
  APP_URL: z.string().url().default('http://localhost:3000'),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().positive().default(2525),
  MAIL_FROM: z.string().default('Loadbearing <no-reply@loadbearing.test>'),
  MAIL_DROP_DIR: z.string().default('db/data/mail'),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  // Unset: secure cookies exactly in production; 'false' serves a production build over plain http.
  COOKIE_SECURE: z.enum(['true', 'false']).optional(),
  DOI_BASE_URL: z.string().trim().optional(),
  STORAGE_DIR: z.string().trim().optional(),
  ALLOW_DEMO_SEED: z.string().optional(),
});

export type Env = z.infer<typeof schema>;

export function env(): Env {
  const parsed = schema.safeParse(process.env);
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    throw new Error(`Invalid environment: ${first.path.join('.')}: ${first.message}`);
  }
  return parsed.data;
}

export const isProduction = () => process.env.NODE_ENV === 'production';
