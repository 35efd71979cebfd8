import { appendFileSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { startStorageFake } from '#fakes/storage/server.ts';
import { startPaymentsFake } from '#fakes/payments/server.ts';
import { startMailFake } from '#fakes/mail/server.ts';
import { consoleLogger, type RequestLogger } from '#fakes/support/request-log.ts';
import type { Env } from '#server/env.ts';

/**
 * The local stand-ins for object storage, payments and e-mail, configured from the same
 * environment the app reads, so keys and addresses always agree.
 */
export type FakeName = 'storage' | 'payments' | 'mail';
export type RunningFake = { name: FakeName; describe: string; stop(): Promise<void> };

const portOf = (url: string) => Number(new URL(url).port);

export async function startFake(
  name: FakeName,
  env: Env,
  options: { dataDir: string; mailInboxPort: number; webhookUrl?: string; logFile?: string },
): Promise<RunningFake> {
  const log: RequestLogger = options.logFile
    ? (line) => appendFileSync(options.logFile!, `${new Date().toISOString()} [fake:${name}] ${line}\n`)
    : consoleLogger(name);
  if (options.logFile) mkdirSync(join(options.logFile, '..'), { recursive: true });
  const dataDir = join(options.dataDir, name);
  switch (name) {
    case 'storage': {
      const fake = await startStorageFake({
        port: portOf(env.S3_ENDPOINT),
        dataDir,
        credentials: { [env.S3_ACCESS_KEY_ID]: env.S3_SECRET_ACCESS_KEY },
        log,
      });
      return { name, describe: `object storage (S3 API) ${fake.url}`, stop: fake.stop };
    }
    case 'payments': {
      const fake = await startPaymentsFake({
        port: portOf(env.STRIPE_API_URL),
        dataDir,
        secretKeys: [env.STRIPE_SECRET_KEY],
        webhooks: options.webhookUrl ? [{ url: options.webhookUrl, secret: env.STRIPE_WEBHOOK_SECRET }] : [],
        log,
      });
      return { name, describe: `payments API            ${fake.url}`, stop: fake.stop };
    }
    case 'mail': {
      const fake = await startMailFake({ smtpPort: portOf(env.SMTP_URL), httpPort: options.mailInboxPort, dataDir, log });
      return { name, describe: `mail inbox              ${fake.url}  (SMTP ${fake.smtpUrl})`, stop: fake.stop };
    }
  }
}
