import { resolve } from 'node:path';
import { ensureDatabase, withDatabaseName } from '../../db/database-admin.ts';
import { initOrm, migrate } from '../../db/orm.ts';
import { seedDemo } from '../../db/seed.ts';
import { log } from './run.ts';
import { startPostgres } from './postgres.ts';

/**
 * The local stack: every service the app needs, started in order and stopped in reverse.
 * `dev` is what `npm start` and `npm run dev` use; `test` runs beside it on other ports and other
 * data folders, so a test run never touches the demo data or clashes with a running app.
 * New services (storage, payments, mail stand-ins) are added here, each with its stop function.
 */
export type StackMode = 'dev' | 'test';

export type Stack = {
  /** Environment for the app and the tests: connection URLs and keys of the running services. */
  env: Record<string, string>;
  stop(): Promise<void>;
};

const PORTS = {
  dev: { postgres: 54329 },
  test: { postgres: 54339 },
} as const;

export const projectDir = resolve(import.meta.dirname, '../../..');

export async function startStack(mode: StackMode): Promise<Stack> {
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
    const databaseUrl = postgres.url(mode === 'dev' ? 'etchwell' : 'etchwell_test_template');
    await prepareDatabase(databaseUrl, { seed: mode === 'dev' });
    return { env: { DATABASE_URL: databaseUrl }, stop };
  } catch (error) {
    await stop();
    throw error;
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

export { withDatabaseName };
