import { rmSync } from 'node:fs';
import { cpus, totalmem } from 'node:os';
import { resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { setTimeout as sleep } from 'node:timers/promises';
import pg from 'pg';
import { loadEnv } from '../env.ts';
import { createPayments } from '../adapters/payments.ts';
import { log } from './stack/run.ts';
import { onShutdown } from './stack/signals.ts';
import { projectDir, startStack } from './stack/stack.ts';
import { startAppProcess } from './stack/app-process.ts';
import { formatLoadTable, prepareStorefrontLoad, runLoad, startBareExpress, type LoadResult } from '#tests/bench/load-bench.ts';

/**
 * `npm run bench:load [-- --duration 60 --connections 200]`: `npm start`'s stack (PostgreSQL,
 * the stand-ins, the app in its own process) on ports and data of its own, the demo scenario
 * seeded fresh, then autocannon on a bare Express route, the storefront catalog, the order page
 * and the photo accept, one after the other. Exits 1 when any request failed.
 */
const { values } = parseArgs({ options: { duration: { type: 'string', default: '60' }, connections: { type: 'string', default: '200' } } });
const options = { durationSeconds: Number(values.duration), connections: Number(values.connections) };
const port = '54300';
const appUrl = `http://127.0.0.1:${port}`;

// The stand-ins' stored files from an earlier run go: each run starts as empty as its database.
rmSync(resolve(projectDir, '.data', 'fakes-bench'), { recursive: true, force: true });
const stack = await startStack('bench', { appUrl });
let stopApp: () => Promise<void> = async () => {};
const bare = await startBareExpress();
onShutdown(async () => {
  await bare.stop();
  await stopApp();
  await stack.stop();
});

/** Waits until the count of stored buyer photos has not changed for two seconds (at most a minute). */
async function settled(databaseUrl: string): Promise<void> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    let last = -1;
    for (let i = 0; i < 60; i++) {
      const { rows } = await client.query<{ n: string }>('select count(*) as n from buyer_photo');
      if (Number(rows[0]!.n) === last) return;
      last = Number(rows[0]!.n);
      await sleep(2000);
    }
  } finally {
    await client.end();
  }
}

let failed: boolean;
try {
  // The app as `npm start` runs it, with request lines off: writing 10,000 lines a second to this
  // terminal would measure the terminal.
  const app = await startAppProcess({ ...stack.env, PORT: port, NODE_ENV: 'development', LOG_LEVEL: 'warn' });
  stopApp = app.stop;
  const env = loadEnv({ ...process.env, ...stack.env });
  // Enough photos waiting for the fastest accept rate two cores reach, with room to spare.
  const uploads = 250 * options.durationSeconds;
  log(`preparing: an order and ${uploads} uploaded photos…`);
  const load = await prepareStorefrontLoad(appUrl, createPayments(env).stripe, { uploads });

  const results: LoadResult[] = [];
  log(`running ${bare.target.name} for ${options.durationSeconds} s…`);
  results.push(await runLoad(bare.url, bare.target, options));
  for (const target of load.targets) {
    log(`running ${target.name} for ${options.durationSeconds} s…`);
    results.push(await runLoad(appUrl, target, options));
  }
  // Accepts still queued when the last run stopped are finished before the app is stopped.
  await settled(stack.env.DATABASE_URL!);
  console.log(
    `\nLoad run on ${cpus().length} × ${cpus()[0]?.model ?? 'CPU'}, ${(totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}`,
  );
  console.log(formatLoadTable(results, options));
  if (load.uploadsLeft() < 0) console.log(`\nThe uploaded photos ran out (${-load.uploadsLeft()} accepts reused one): raise the pool.`);
  for (const r of results.filter((r) => r.failures > 0))
    console.log(`\n${r.name}: ${r.non2xx} answers outside 2xx, ${r.timeouts} timeouts, ${r.errors} connection errors`);
  failed = results.some((r) => r.failures > 0);
} catch (error) {
  log(`load run failed: ${(error as Error).message}`);
  failed = true;
}
await bare.stop();
await stopApp();
await stack.stop();
process.exit(failed ? 1 : 0);
