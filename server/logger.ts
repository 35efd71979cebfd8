import { pino, type DestinationStream, type Logger } from 'pino';
import type { Env } from './env.ts';

export type { Logger };

/** JSON lines on stdout (or `destination`); secrets in headers are never written. */
export function createLogger(env: Pick<Env, 'LOG_LEVEL'>, destination?: DestinationStream): Logger {
  const options = {
    level: env.LOG_LEVEL,
    redact: {
      paths: ['req.headers.authorization', 'req.headers.cookie', 'res.headers["set-cookie"]', '*.password', '*.secret', '*.token'],
      censor: '[redacted]',
    },
  };
  return destination ? pino(options, destination) : pino(options);
}

/** Query parameters whose values open something: private order links, signatures, tokens. */
const SECRET_PARAMS = /([?&](?:key|token|code|signature|x-amz-signature|x-amz-credential|x-amz-security-token)=)[^&#]*/gi;
/** Path segments that are link tokens (256-bit, base64url): proofs, replacements, invites. */
const TOKEN_SEGMENT = /\/[A-Za-z0-9_-]{40,}(?=[/?#]|$)/g;

/** A URL as it may be logged: the parts that would open something are replaced. */
export function loggableUrl(url: string): string {
  return url.replace(SECRET_PARAMS, '$1[redacted]').replace(TOKEN_SEGMENT, '/[redacted]');
}
