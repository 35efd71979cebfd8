import { z } from 'zod';

/**
 * Every setting the server reads, with a default that is safe on a developer's machine: the
 * embedded stack listens on loopback only. A bad value stops the boot with a message that
 * names the variable, rather than failing later somewhere far from the cause.
 */
const envSchema = z.object({
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
  JSON_BODY_LIMIT: z.string().regex(/^\d+(b|kb|mb)$/, 'must look like 100kb or 1mb').default('100kb'),
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
