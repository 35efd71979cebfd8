import { pino, type Logger } from 'pino';
import type { Env } from './env.ts';

export type { Logger };

/** JSON lines on stdout; secrets in headers are never written. */
export function createLogger(env: Pick<Env, 'LOG_LEVEL'>): Logger {
  return pino({
    level: env.LOG_LEVEL,
    redact: {
      paths: ['req.headers.authorization', 'req.headers.cookie', 'res.headers["set-cookie"]'],
      censor: '[redacted]',
    },
  });
}
