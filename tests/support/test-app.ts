import { afterAll, beforeAll } from 'vitest';
import type { Express } from 'express';
import { createApp } from '#server/app.ts';
import { loadEnv, type Env } from '#server/env.ts';
import { createLogger } from '#server/logger.ts';
import type { DestinationStream } from 'pino';
import { initOrm, type Orm } from '#server/db/orm.ts';
import { createTestDatabase } from './test-database.ts';
import { createMailer } from '#server/adapters/mailer.ts';
import { startOutboxSender } from '#server/features/outbox/outbox.service.ts';
import { createAuth, type Auth } from '#server/auth/auth.ts';
import { createStorage, type Storage } from '#server/adapters/storage.ts';
import { createPayments, type Payments } from '#server/adapters/payments.ts';
import { createJobs, type Jobs } from '#server/adapters/jobs.ts';
import { startWorker } from '#server/worker.ts';
import { createRateLimits, type RateLimits } from '#server/lib/rate-limits.ts';

export type TestApp = {
  app: Express;
  orm: Orm;
  env: Env;
  databaseUrl: string;
  auth: Auth;
  storage: Storage;
  payments: Payments;
  jobs: Jobs;
  limits: RateLimits;
};

/**
 * Builds the app as the server does, on a database of its own. `databasePort` makes the app
 * reach that database through another port (a test's proxy) instead of directly.
 */
export async function buildTestApp(
  overrides: Record<string, string> = {},
  { databasePort, worker = false, logDestination }: { databasePort?: number; worker?: boolean; logDestination?: DestinationStream } = {},
): Promise<TestApp & { close(): Promise<void> }> {
  const database = await createTestDatabase();
  const url = new URL(database.url);
  if (databasePort) url.port = String(databasePort);
  // The test stack's stand-ins (storage, payments, mail), unless a test brings its own.
  const services = Object.fromEntries(
    ['S3_ENDPOINT', 'STRIPE_API_URL', 'SMTP_URL'].flatMap((name) => (process.env[name] ? [[name, process.env[name]!]] : [])),
  );
  const env = loadEnv({
    ...services,
    NODE_ENV: 'test',
    LOG_LEVEL: process.env.TEST_LOG_LEVEL ?? 'silent',
    DATABASE_URL: url.toString(),
    CLIENT_DIST: 'dist',
    ...overrides,
  });
  const orm = await initOrm(env.DATABASE_URL);
  const logger = createLogger(env, logDestination);
  const limits = createRateLimits(env.DATABASE_URL);
  const auth = createAuth({ orm, env, logger, limits });
  const storage = createStorage(env);
  const payments = createPayments(env);
  const jobs = createJobs(env, logger);
  const app = createApp({ env, orm, logger, version: 'test', auth, storage, payments, jobs, limits });
  // As in the server: e-mails go out through the outbox, here checked often; renders are
  // worked in this process only when the test asks (a test may bring worker processes of its own).
  const mailer = createMailer(env);
  const outbox = worker
    ? await startWorker({ env, orm, logger, storage, jobs, mailer, outboxIntervalMs: 100 })
    : startOutboxSender(orm, mailer, logger, 100, env.OUTBOX_RETRY_SECONDS);
  return {
    app,
    orm,
    env,
    auth,
    storage,
    payments,
    jobs,
    limits,
    databaseUrl: database.url,
    async close() {
      await outbox.stop();
      await jobs.stop();
      mailer.close();
      await limits.close();
      await orm.close();
      await database.drop();
    },
  };
}

/**
 * For a test file: one app and database, built before its tests and dropped after them.
 * `overrides` may be a function run first (to start a stand-in and hand over its address).
 */
export function useTestApp(
  overrides: Record<string, string> | (() => Promise<Record<string, string>>) = {},
  options: { worker?: boolean } = {},
): TestApp {
  const holder = {} as TestApp & { close(): Promise<void> };
  beforeAll(async () => {
    Object.assign(holder, await buildTestApp(typeof overrides === 'function' ? await overrides() : overrides, options));
  });
  afterAll(async () => {
    await holder.close?.();
  });
  return holder;
}
