import PgBoss from 'pg-boss';
import type { Env } from '../env.ts';
import type { Logger } from '../logger.ts';

/**
 * The job queue: pg-boss on the app's own PostgreSQL, in its own schema. Web processes only send;
 * worker processes also work. A job whose worker dies stays active until its time runs out, then
 * pg-boss's maintenance fails it and, while retries remain, hands it to the next worker. Handlers
 * must therefore be safe to run again from the start (see production/render.service.ts).
 */
export const QUEUES = {
  render: 'render-item',
} as const;
export type QueueName = (typeof QUEUES)[keyof typeof QUEUES];

export type Jobs = ReturnType<typeof createJobs>;

export function createJobs(env: Pick<Env, 'DATABASE_URL' | 'RENDER_TIMEOUT_SECONDS' | 'JOBS_MAINTENANCE_SECONDS'>, logger: Logger) {
  const boss = new PgBoss({
    connectionString: env.DATABASE_URL,
    schema: 'pgboss',
    max: 4,
    maintenanceIntervalSeconds: env.JOBS_MAINTENANCE_SECONDS,
    monitorStateIntervalSeconds: Math.max(env.JOBS_MAINTENANCE_SECONDS, 10),
    application_name: 'etchwell-jobs',
  });
  boss.on('error', (error) => logger.error({ err: error }, 'job queue error'));
  // Started on first use, so a process that never sends or works a job never touches the schema.
  let started: Promise<void> | undefined;
  const ready = () =>
    (started ??= boss.start().then(async () => {
      await boss.createQueue(QUEUES.render, {
        name: QUEUES.render,
        retryLimit: 3,
        retryDelay: 2,
        retryBackoff: true,
        expireInSeconds: env.RENDER_TIMEOUT_SECONDS,
      });
    }));

  return {
    async send<T extends object>(queue: QueueName, data: T): Promise<string> {
      await ready();
      const id = await boss.send(queue, data);
      if (!id) throw new Error(`job not queued on ${queue}`);
      return id;
    },
    /** Runs `handler` for each job of the queue, one at a time in this process. */
    async work<T extends object>(
      queue: QueueName,
      handler: (data: T, job: { id: string; retryCount: number; retryLimit: number }) => Promise<void>,
    ): Promise<void> {
      await ready();
      await boss.work<T>(queue, { pollingIntervalSeconds: 1, batchSize: 1, includeMetadata: true }, async ([job]) => {
        if (job) await handler(job.data, { id: job.id, retryCount: job.retryCount, retryLimit: job.retryLimit });
      });
    },
    async stop(): Promise<void> {
      if (started) await started.catch(() => undefined).then(() => boss.stop({ graceful: true, timeout: 5000, wait: true }));
    },
  };
}
