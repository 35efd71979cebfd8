import pg from 'pg';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { AppError } from '#shared/errors.ts';

/**
 * Every rate limit of the app, kept in PostgreSQL (table `rate_limit`, created by a migration in
 * the shape the library expects) so that every web process counts the same attempts.
 *
 * Each limit counts only well-formed attempts: a request its schema refuses costs nothing and
 * creates nothing, so it is answered 400 before it is counted.
 */
export type RateLimits = ReturnType<typeof createRateLimits>;

const MINUTE = 60;
const HOUR = 3600;
const DAY = 24 * HOUR;

/** The limits outside sign-in, with the words the caller reads when one is spent. */
const RULES = {
  /** Studios opened from one address. */
  signUp: { points: 10, duration: HOUR, what: 'Too many studios have been opened from this address.' },
  /** Invitations sent by one studio: each is an e-mail to someone who never asked for it. */
  invite: { points: 40, duration: DAY, what: 'This studio has sent too many invitations today.' },
  /** Accounts made from invitation links, from one address. */
  inviteAccount: { points: 10, duration: HOUR, what: 'Too many accounts have been made from this address.' },
  /** Buyers' photos taken in from one address (a studio's counter may serve several buyers). */
  photoAccept: { points: 120, duration: 10 * MINUTE, what: 'Too many photos have been uploaded from this address.' },
} as const;
export type RateRule = keyof typeof RULES;

/** "3 minutes", "2 hours": how long until the limit lets the next attempt through. */
function waitWords(ms: number): string {
  const minutes = Math.max(1, Math.ceil(ms / 60_000));
  if (minutes < 90) return `${minutes} minute${minutes === 1 ? '' : 's'}`;
  const hours = Math.ceil(minutes / 60);
  return `${hours} hours`;
}

/** The 429 for a spent limit: what happened, how long to wait in words and in Retry-After. */
const tooMany = (message: string, msBeforeNext: number) =>
  new AppError('RATE_LIMITED', `${message} Try again in ${waitWords(msBeforeNext)}.`, {
    retryAfterSeconds: Math.ceil(msBeforeNext / 1000),
  });

export function createRateLimits(databaseUrl: string) {
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 3 });
  const limiter = (keyPrefix: string, points: number, duration: number, blockDuration = 0) =>
    new RateLimiterPostgres({
      storeClient: pool,
      tableName: 'rate_limit',
      tableCreated: true,
      clearExpiredByTimeout: false,
      keyPrefix,
      points,
      duration,
      blockDuration,
    });

  /** Throws RATE_LIMITED with `message` when the limiter is spent for this key; consumes one point otherwise. */
  async function take(limit: RateLimiterPostgres, key: string, message: string): Promise<void> {
    try {
      await limit.consume(key);
    } catch (error) {
      if (error instanceof RateLimiterRes) throw tooMany(message, error.msBeforeNext);
      throw error;
    }
  }

  const rules = Object.fromEntries(
    Object.entries(RULES).map(([name, rule]) => [name, limiter(name, rule.points, rule.duration)]),
  ) as Record<RateRule, RateLimiterPostgres>;

  const signInMessage = 'Too many sign-in attempts.';
  /** Wrong passwords per account: 5 in 15 minutes, then 15 minutes' wait. */
  const failuresPerAccount = limiter('account', 5, 15 * MINUTE, 15 * MINUTE);
  /** Password attempts per address: 30 in 15 minutes. */
  const attemptsPerIp = limiter('ip', 30, 15 * MINUTE, 15 * MINUTE);
  /** E-mailed sign-in links: 5 per address per hour, 20 per IP per hour. */
  const linksPerEmail = limiter('link-email', 5, HOUR);
  const linksPerIp = limiter('link-ip', 20, HOUR);

  return {
    /** Counts one attempt under `rule` for `key` (an address, a studio); refuses with 429 when spent. */
    consume: (rule: RateRule, key: string) => take(rules[rule], key, RULES[rule].what),
    /** How many attempts `rule` allows in its window, for tests and the docs. */
    allowance: (rule: RateRule) => ({ points: RULES[rule].points, seconds: RULES[rule].duration }),
    signIn: {
      /** Before a password attempt: refuses when the address or the account is blocked. */
      async checkPasswordAttempt(ip: string, email: string): Promise<void> {
        const account = await failuresPerAccount.get(email);
        if (account && account.consumedPoints >= failuresPerAccount.points) throw tooMany(signInMessage, account.msBeforeNext);
        await take(attemptsPerIp, ip, signInMessage);
      },
      async recordPasswordFailure(email: string): Promise<void> {
        await failuresPerAccount.penalty(email, 1);
      },
      async recordPasswordSuccess(email: string): Promise<void> {
        await failuresPerAccount.delete(email);
      },
      async checkLinkRequest(ip: string, email: string): Promise<void> {
        await take(linksPerIp, ip, signInMessage);
        await take(linksPerEmail, email, signInMessage);
      },
    },
    close: () => pool.end(),
  };
}
