import { z } from 'zod';

/**
 * The process environment, validated when read. Read lazily (not at import) so scripts and
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
  /**
   * Proxies whose `x-forwarded-for` is believed (addresses or CIDR ranges, comma-separated;
   * lib/auth/client-address.ts). Empty: the socket's address is the client's.
   */
  TRUSTED_PROXIES: z.string().default(''),
  // Several processes (docs/deployment.md): PostgreSQL's pool size per process, and PDFs in an
  // S3-compatible object store when S3_BUCKET is set (else on the local disk under STORAGE_DIR).
  PG_POOL_MAX: z.coerce.number().int().positive().default(10),
  S3_BUCKET: z.string().trim().optional(),
  S3_ENDPOINT: z.string().url().optional(),
  S3_REGION: z.string().default('us-east-1'),
  S3_ACCESS_KEY_ID: z.string().optional(),
  S3_SECRET_ACCESS_KEY: z.string().optional(),
  S3_FORCE_PATH_STYLE: z
    .enum(['true', 'false'])
    .optional()
    .transform((v) => (v === undefined ? undefined : v === 'true')),
  // The evidence watch (lib/watch): the bibliographic registry's REST API and the contact it asks
  // polite clients to send (`npm run dev` points the URL at the local fake).
  CROSSREF_BASE_URL: z.string().url().default('https://api.crossref.org'),
  CROSSREF_MAILTO: z.string().email().optional(),
  CROSSREF_FAKE_PORT: z.coerce.number().int().positive().default(2581),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  // Unset: secure cookies exactly in production; 'false' serves a production build over plain http.
  COOKIE_SECURE: z.enum(['true', 'false']).optional(),
  DOI_BASE_URL: z.string().trim().optional(),
  STORAGE_DIR: z.string().trim().optional(),
  ALLOW_DEMO_SEED: z.string().optional(),
});

export type Env = z.infer<typeof schema>;

const NAMES = Object.keys(schema.shape) as Array<keyof Env>;
let last: { key: string; value: Env } | undefined;

/**
 * The validated environment. Every request reads it several times, so the parse is reused for
 * as long as the variables it reads are unchanged (a test or script that sets one gets a fresh
 * parse on its next read); parsing it each time cost about a millisecond a request.
 */
export function env(): Env {
  const key = NAMES.map((name) => process.env[name] ?? '\u0000').join('\u0001');
  if (last?.key === key) return last.value;
  const parsed = schema.safeParse(process.env);
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    throw new Error(`Invalid environment: ${first.path.join('.')}: ${first.message}`);
  }
  last = { key, value: Object.freeze(parsed.data) };
  return last.value;
}

export const isProduction = () => process.env.NODE_ENV === 'production';
