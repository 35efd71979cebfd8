import { resolve } from 'node:path';
import { dropDatabase, ensureDatabase } from '#server/db/database-admin.ts';
import { initOrm, migrate } from '#server/db/orm.ts';
import { seedDemo } from '#server/db/seed.ts';
import { HISTORY_WEEKS, seedDemoHistory } from '#server/db/demo-history.ts';
import { loadEnv } from '#server/env.ts';
import { createStorage, type Storage } from '#server/adapters/storage.ts';
import { log } from './run.ts';
import { startPostgres } from './postgres.ts';
import { startFake, type FakeName } from './fakes.ts';

/**
 * The local stack: every service the app needs, started in order and stopped in reverse.
 * `dev` is what `npm start` and `npm run dev` use; `test` runs beside it on other ports and other
 * data folders, so a test run never touches the demo data or clashes with a running app; `bench`
 * is `npm start`'s stack again on ports and data of its own, reseeded each run, for the load run.
 * New services (storage, payments, mail stand-ins) are added here, each with its stop function.
 */
export type StackMode = 'dev' | 'test' | 'bench';

export type Stack = {
  /** Environment for the app and the tests: connection URLs and keys of the running services. */
  env: Record<string, string>;
  /** One line per running service, for the start banner. */
  services: string[];
  stop(): Promise<void>;
};

const PORTS = {
  dev: { postgres: 54329, storage: 54380, payments: 54381, mailInbox: 54382, smtp: 54325 },
  test: { postgres: 54339, storage: 54390, payments: 54391, mailInbox: 54392, smtp: 54335 },
  bench: { postgres: 54349, storage: 54370, payments: 54371, mailInbox: 54372, smtp: 54345 },
} as const;

const FAKES: FakeName[] = ['storage', 'payments', 'mail'];

export const projectDir = resolve(import.meta.dirname, '../../..');

export async function startStack(mode: StackMode, { appUrl = 'http://127.0.0.1:3000' } = {}): Promise<Stack> {
  const stops: Array<{ name: string; stop: () => Promise<void> }> = [];
  let stopping: Promise<void> | undefined;
  // Idempotent: a signal and a crashed child may both ask to stop at once.
  const stop = () =>
    (stopping ??= (async () => {
      for (const service of stops.reverse()) {
        try {
          await service.stop();
        } catch (error) {
          log(`stopping ${service.name} failed: ${(error as Error).message}`);
        }
      }
    })());
  try {
    const postgres = await startPostgres({ projectDir, name: `pg-${mode}`, port: PORTS[mode].postgres, fast: mode === 'test' });
    stops.push({ name: 'postgres', stop: postgres.stop });
    const databaseUrl = postgres.url({ dev: 'etchwell', test: 'etchwell_test_template', bench: 'etchwell_bench' }[mode]);
    // Each test and load run starts from a fresh database: nothing from an earlier run can linger.
    if (mode !== 'dev') await dropDatabase(databaseUrl);
    await prepareDatabase(databaseUrl, { seed: mode !== 'test' });

    const ports = PORTS[mode];
    const stackEnv: Record<string, string> = {
      DATABASE_URL: databaseUrl,
      APP_URL: appUrl,
      S3_ENDPOINT: `http://127.0.0.1:${ports.storage}`,
      STRIPE_API_URL: `http://127.0.0.1:${ports.payments}`,
      SMTP_URL: `smtp://127.0.0.1:${ports.smtp}`,
    };
    // Keys come from the environment as the app reads it, so both sides always agree.
    const env = loadEnv({ ...process.env, ...stackEnv });
    const services = [`PostgreSQL              127.0.0.1:${postgres.port}`];
    for (const name of FAKES) {
      const fake = await startFake(name, env, {
        dataDir: resolve(projectDir, '.data', `fakes-${mode}`),
        mailInboxPort: ports.mailInbox,
        webhookUrl: mode === 'test' ? undefined : `${appUrl}/api/payments/webhook`,
        // Test and load runs keep the fakes' request lines out of their reports.
        logFile: mode === 'dev' ? undefined : resolve(projectDir, '.data', `fakes-${mode}.log`),
      });
      stops.push({ name: fake.name, stop: fake.stop });
      services.push(fake.describe);
    }
    // Browsers upload straight to the store: allow the app's origin (any loopback port in tests).
    const origins = { dev: [appUrl, 'http://127.0.0.1:5173'], bench: [appUrl], test: ['http://127.0.0.1:*', 'http://localhost:*'] }[mode];
    await createStorage(env).ensureBucket(origins);
    log(`fakes up: ${FAKES.join(', ')}; bucket ${env.S3_BUCKET} ready`);
    // Twelve weeks of demo orders for `npm start` (their photos go to storage, so after the fakes).
    if (mode === 'dev') await seedHistory(databaseUrl, createStorage(env));
    return { env: stackEnv, services, stop };
  } catch (error) {
    await stop();
    throw error;
  }
}

/** The demo studios' past orders, once: Today's charts and the order list then look lived in. */
async function seedHistory(databaseUrl: string, storage: Storage): Promise<void> {
  const orm = await initOrm(databaseUrl);
  try {
    const added = await seedDemoHistory(orm.em.fork(), storage);
    if (added) log(`demo history: ${added} order(s) over the last ${HISTORY_WEEKS} weeks`);
  } finally {
    await orm.close();
  }
}

/** Creates the database when missing, migrates it, and (for dev) seeds the demo scenario. */
async function prepareDatabase(databaseUrl: string, { seed }: { seed: boolean }): Promise<void> {
  if (await ensureDatabase(databaseUrl)) log(`created database ${new URL(databaseUrl).pathname.slice(1)}`);
  const orm = await initOrm(databaseUrl);
  try {
    await migrate(orm);
    log('migrations up to date');
    if (seed) log(`demo scenario: ${await seedDemo(orm.em.fork())} row(s) added`);
  } finally {
    await orm.close();
  }
}
