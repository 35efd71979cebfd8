import { z } from 'zod';

/**
 * Every setting the server reads, with a default that is safe on a developer's machine: the
 * embedded stack listens on loopback only. A bad value stops the boot with a message that
 * names the variable, rather than failing later somewhere far from the cause.
 */
const httpUrl = z.url({ protocol: /^https?$/, error: 'must be an http:// or https:// URL' });

/** Keys of the local stand-ins. Public on purpose; refused when NODE_ENV=production. */
export const LOCAL_SECRETS = {
  S3_ACCESS_KEY_ID: 'etchwell-local',
  S3_SECRET_ACCESS_KEY: 'etchwell-local-secret',
  STRIPE_SECRET_KEY: 'sk_test_etchwell_local',
  STRIPE_WEBHOOK_SECRET: 'whsec_etchwell_local',
  AUTH_SECRET: 'etchwell-local-auth-secret-not-for-production',
} as const;

const envSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
    HOST: z.string().min(1).default('127.0.0.1'),
    PORT: z.coerce.number().int().min(0).max(65535).default(3000),
    DATABASE_URL: z
      .url({ protocol: /^postgres(ql)?$/, error: 'must be a postgres:// URL' })
      .default('postgres://postgres@127.0.0.1:54329/etchwell'),
    LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
    /** Where the built client lives; the server serves it when the folder exists. */
    CLIENT_DIST: z.string().min(1).default('dist'),
    /** Largest JSON body the API accepts. */
    JSON_BODY_LIMIT: z
      .string()
      .regex(/^\d+(b|kb|mb)$/, 'must look like 100kb or 1mb')
      .default('100kb'),
    /** The address people use to reach the app: links in e-mails, allowed origin for uploads. */
    APP_URL: httpUrl.default('http://127.0.0.1:3000'),

    /** Signs and encrypts session cookies. 32+ random characters in production. */
    AUTH_SECRET: z.string().min(32, 'must be at least 32 characters').default(LOCAL_SECRETS.AUTH_SECRET),

    // Object storage, S3 API. Defaults: the local stand-in started by `npm start`.
    S3_ENDPOINT: httpUrl.default('http://127.0.0.1:54380'),
    S3_REGION: z.string().min(1).default('us-east-1'),
    S3_ACCESS_KEY_ID: z.string().min(1).default(LOCAL_SECRETS.S3_ACCESS_KEY_ID),
    S3_SECRET_ACCESS_KEY: z.string().min(1).default(LOCAL_SECRETS.S3_SECRET_ACCESS_KEY),
    S3_BUCKET: z
      .string()
      .regex(/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/, 'must be a valid bucket name')
      .default('etchwell'),
    S3_FORCE_PATH_STYLE: z.stringbool({ error: 'must be true or false' }).default(true),

    // Payments API. STRIPE_API_URL is the local stand-in by default; https://api.stripe.com in production.
    STRIPE_API_URL: httpUrl.default('http://127.0.0.1:54381'),
    STRIPE_SECRET_KEY: z
      .string()
      .regex(/^(sk|rk)_(test|live)_\w+$/, 'must be a secret key (sk_test_… or sk_live_…)')
      .default(LOCAL_SECRETS.STRIPE_SECRET_KEY),
    STRIPE_WEBHOOK_SECRET: z
      .string()
      .regex(/^whsec_\w+$/, 'must start with whsec_')
      .default(LOCAL_SECRETS.STRIPE_WEBHOOK_SECRET),

    // E-mail over SMTP (smtp:// or smtps://, credentials in the URL).
    SMTP_URL: z.url({ protocol: /^smtps?$/, error: 'must be an smtp:// or smtps:// URL' }).default('smtp://127.0.0.1:54325'),
    MAIL_FROM: z.string().min(3).default('Etchwell <no-reply@etchwell.localhost>'),

    /** What this process does: serve the web app, work background jobs, or both (one machine). */
    PROCESS_ROLE: z.enum(['all', 'web', 'worker']).default('all'),
    /** A render still running after this long is taken for dead and handed to another worker. */
    RENDER_TIMEOUT_SECONDS: z.coerce.number().int().min(2).max(3600).default(900),
    /** The first wait before an e-mail that could not be sent is tried again; it doubles each time, up to an hour. */
    OUTBOX_RETRY_SECONDS: z.coerce.number().int().min(1).max(3600).default(30),
    /** How often the job queue looks for timed-out jobs. */
    JOBS_MAINTENANCE_SECONDS: z.coerce.number().int().min(1).max(3600).default(30),
  })
  .superRefine((env, ctx) => {
    // The built-in keys are for the local stand-ins only: production must bring its own.
    if (env.NODE_ENV !== 'production') return;
    for (const [name, value] of Object.entries(LOCAL_SECRETS)) {
      if (env[name as keyof typeof LOCAL_SECRETS] === value) {
        ctx.addIssue({
          code: 'custom',
          path: [name],
          message: `must be set in production (the default ${name} is for local development only)`,
        });
      }
    }
  });

export type Env = z.infer<typeof envSchema>;

export class EnvError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'EnvError';
  }
}

/** Parses the environment; throws EnvError naming each bad variable. */
export function loadEnv(source: Record<string, string | undefined> = process.env): Env {
  // An empty variable means "not set", as in most shells' `FOO= cmd`.
  const cleaned = Object.fromEntries(Object.entries(source).filter(([, v]) => v !== undefined && v !== ''));
  const result = envSchema.safeParse(cleaned);
  if (result.success) return result.data;
  const lines = result.error.issues.map((issue) => `  ${issue.path.join('.')}: ${issue.message}`);
  throw new EnvError(`Invalid environment:\n${lines.join('\n')}`);
}
