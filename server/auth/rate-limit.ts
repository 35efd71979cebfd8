import pg from 'pg';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { AppError } from '../../shared/errors.ts';

/**
 * Limits on sign-in, kept in PostgreSQL so that every web process counts the same attempts.
 * Table `sign_in_limit` is created by a migration in the shape the library expects.
 */
export type SignInLimits = ReturnType<typeof createSignInLimits>;

const FIFTEEN_MINUTES = 15 * 60;

export function createSignInLimits(databaseUrl: string) {
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 3 });
  const common = { storeClient: pool, tableName: 'sign_in_limit', tableCreated: true, clearExpiredByTimeout: false };
  /** Wrong passwords per account: 5 in 15 minutes, then 15 minutes' wait. */
  const failuresPerAccount = new RateLimiterPostgres({ ...common, keyPrefix: 'account', points: 5, duration: FIFTEEN_MINUTES, blockDuration: FIFTEEN_MINUTES });
  /** Password attempts per address: 30 in 15 minutes. */
  const attemptsPerIp = new RateLimiterPostgres({ ...common, keyPrefix: 'ip', points: 30, duration: FIFTEEN_MINUTES, blockDuration: FIFTEEN_MINUTES });
  /** E-mailed sign-in links: 5 per address per hour, 20 per IP per hour. */
  const linksPerEmail = new RateLimiterPostgres({ ...common, keyPrefix: 'link-email', points: 5, duration: 3600 });
  const linksPerIp = new RateLimiterPostgres({ ...common, keyPrefix: 'link-ip', points: 20, duration: 3600 });

  const tooMany = (msBeforeNext: number) => {
    const minutes = Math.max(1, Math.ceil(msBeforeNext / 60_000));
    return new AppError('RATE_LIMITED', `Too many sign-in attempts. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`);
  };

  /** Throws RATE_LIMITED when the limiter is spent for this key; consumes one point otherwise. */
  async function consume(limiter: RateLimiterPostgres, key: string): Promise<void> {
    try {
      await limiter.consume(key);
    } catch (error) {
      if (error instanceof RateLimiterRes) throw tooMany(error.msBeforeNext);
      throw error;
    }
  }

  return {
    /** Before a password attempt: refuses when the address or the account is blocked. */
    async checkPasswordAttempt(ip: string, email: string): Promise<void> {
      const account = await failuresPerAccount.get(email);
      if (account && account.consumedPoints >= failuresPerAccount.points) throw tooMany(account.msBeforeNext);
      await consume(attemptsPerIp, ip);
    },
    async recordPasswordFailure(email: string): Promise<void> {
      await failuresPerAccount.penalty(email, 1);
    },
    async recordPasswordSuccess(email: string): Promise<void> {
      await failuresPerAccount.delete(email);
    },
    async checkLinkRequest(ip: string, email: string): Promise<void> {
      await consume(linksPerIp, ip);
      await consume(linksPerEmail, email);
    },
    close: () => pool.end(),
  };
}
