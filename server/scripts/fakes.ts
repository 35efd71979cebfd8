import { resolve } from 'node:path';
import { loadEnv } from '../env.ts';
import { createStorage } from '../adapters/storage.ts';
import { log } from './stack/run.ts';
import { onShutdown } from './stack/signals.ts';
import { projectDir } from './stack/stack.ts';
import { startFake, type FakeName, type RunningFake } from './stack/fakes.ts';

/**
 * `npm run fakes` (all three) or `npm run fake:storage|fake:payments|fake:mail`: the local
 * stand-ins on their own, on the addresses and keys of the app's environment
 * (S3_ENDPOINT, STRIPE_API_URL, SMTP_URL…), with `MAIL_INBOX_PORT` (54382) for the inbox page.
 */
const names = (process.argv.slice(2).length ? process.argv.slice(2) : ['storage', 'payments', 'mail']) as FakeName[];
for (const name of names) {
  if (!['storage', 'payments', 'mail'].includes(name)) {
    console.error(`unknown fake "${name}": use storage, payments or mail`);
    process.exit(2);
  }
}
const env = loadEnv();
const running: RunningFake[] = [];
onShutdown(async () => {
  for (const fake of running.reverse()) await fake.stop();
});
for (const name of names) {
  const fake = await startFake(name, env, {
    dataDir: resolve(projectDir, '.data', 'fakes-dev'),
    mailInboxPort: Number(process.env.MAIL_INBOX_PORT ?? 54382),
    webhookUrl: `${env.APP_URL}/api/payments/webhook`,
  });
  running.push(fake);
  log(fake.describe);
}
if (names.includes('storage')) await createStorage(env).ensureBucket([env.APP_URL, 'http://127.0.0.1:5173']);
log('Ctrl-C stops them.');
