import * as z from 'zod';

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().default('127.0.0.1'),
  DATABASE_URL: z.string().url(),
  /**
   * Connections the API keeps to PostgreSQL. Each request holds one while it queries, so fewer
   * than the concurrent requests makes them queue; 20 serves 20 concurrent clients and stays far
   * below PostgreSQL's default 100 connections.
   */
  DATABASE_POOL_SIZE: z.coerce.number().int().min(1).max(100).default(20),
  JWT_SECRET: z.string().min(32, 'JWT_SECRET must be at least 32 characters'),
  ACCESS_TOKEN_SECONDS: z.coerce.number().int().positive().default(900),
  REFRESH_TOKEN_DAYS: z.coerce.number().int().positive().default(14),
  APP_URL: z.string().url().default('http://127.0.0.1:3000'),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  MAIL_FROM: z.string().default('Batchproof <no-reply@batchproof.example>'),
  SIGN_IN_LIMIT: z.coerce.number().int().positive().default(10),
  /**
   * The proxy in front of the API whose X-Forwarded-For to believe: a hop count or addresses and
   * subnets (Express's `trust proxy`, e.g. `1` or `loopback` or `10.0.0.1`). Unset: none, and the
   * socket's address is the client's. `true` (believe anyone) is refused: any client could then
   * choose its own address and slip past the rate limits.
   */
  TRUST_PROXY: z
    .string()
    .trim()
    .optional()
    .refine(
      (v) => v !== 'true',
      'TRUST_PROXY=true would let any client forge its address; name the proxy or a hop count',
    )
    .transform((v) => (!v || v === 'false' ? false : /^\d+$/.test(v) ? Number(v) : v)),
  WEB_DIST: z.string().optional(),
  MIGRATIONS_DIR: z.string().default('drizzle'),
});

/** The validated environment the API runs with. */
export type Env = z.infer<typeof envSchema>;

/** Validates the process environment once at start-up; throws a readable error when it is wrong. */
export function loadEnv(source: Record<string, string | undefined> = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`The environment is not valid:\n${lines.join('\n')}`);
  }
  return parsed.data;
}
