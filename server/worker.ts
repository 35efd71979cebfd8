import type { Jobs } from './adapters/jobs.ts';
import { QUEUES } from './adapters/jobs.ts';
import type { Mailer } from './adapters/mailer.ts';
import type { Storage } from './adapters/storage.ts';
import type { Env } from './env.ts';
import type { Logger } from './logger.ts';
import type { Orm } from './db/orm.ts';
import { startOutboxSender } from './features/outbox/outbox.service.ts';
import { runRender } from './features/production/render.service.ts';

/**
 * The background side of the app: renders from the job queue and e-mails from the outbox. Runs
 * in the web process on one machine (PROCESS_ROLE=all) or in processes of its own (=worker).
 */
export async function startWorker(deps: {
  env: Env;
  orm: Orm;
  logger: Logger;
  storage: Storage;
  jobs: Jobs;
  mailer: Mailer;
  outboxIntervalMs?: number;
}): Promise<{ stop(): Promise<void> }> {
  const { jobs, logger } = deps;
  const outbox = startOutboxSender(deps.orm, deps.mailer, logger, deps.outboxIntervalMs, deps.env.OUTBOX_RETRY_SECONDS);
  await jobs.work<{ renderId: string }>(QUEUES.render, async ({ renderId }, job) => {
    logger.info({ renderId, jobId: job.id, retryCount: job.retryCount }, 'render started');
    await runRender(deps, renderId, { retryCount: job.retryCount, retryLimit: job.retryLimit });
    logger.info({ renderId, jobId: job.id }, 'render finished');
  });
  return { stop: () => outbox.stop() };
}
