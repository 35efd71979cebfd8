import { createServer, type Server } from 'node:http';
import { createApp } from './app.ts';
import { EnvError, loadEnv } from './env.ts';
import { createLogger } from './logger.ts';
import { initOrm } from './db/orm.ts';
import { appVersion } from './version.ts';
import { createMailer } from './adapters/mailer.ts';
import { createAuth } from './auth/auth.ts';
import { createStorage } from './adapters/storage.ts';
import { createPayments } from './adapters/payments.ts';
import { createJobs } from './adapters/jobs.ts';
import { startWorker } from './worker.ts';
import { createRateLimits, type RateLimits } from './lib/rate-limits.ts';
import { trackInFlight } from './lib/in-flight.ts';

/**
 * The only place that listens. Started by the stack scripts, the Docker image and `npm run dev`.
 * PROCESS_ROLE picks the web side, the worker side (renders, e-mail), or both.
 */
async function main(): Promise<void> {
  const env = loadEnv();
  const logger = createLogger(env);
  const orm = await initOrm(env.DATABASE_URL);
  const storage = createStorage(env);
  const jobs = createJobs(env, logger);
  const worker = env.PROCESS_ROLE === 'web' ? undefined : await startWorker({ env, orm, logger, storage, jobs, mailer: createMailer(env) });

  let server: Server | undefined;
  let inFlight: ReturnType<typeof trackInFlight> | undefined;
  let limits: RateLimits | undefined;
  if (env.PROCESS_ROLE !== 'worker') {
    limits = createRateLimits(env.DATABASE_URL);
    const auth = createAuth({ orm, env, logger, limits });
    const app = createApp({ env, orm, logger, version: appVersion, auth, storage, payments: createPayments(env), jobs, limits });
    server = createServer(app);
    inFlight = trackInFlight(server);
    server.listen(env.PORT, env.HOST, () => {
      const address = server!.address();
      const port = typeof address === 'object' && address ? address.port : env.PORT;
      logger.info({ port }, `Etchwell listening on http://${env.HOST}:${port}`);
    });
  } else {
    logger.info('Etchwell worker started');
  }

  let closing = false;
  const shutdown = (signal: string) => {
    if (closing) return;
    closing = true;
    logger.info({ signal }, 'shutting down');
    const finish = async () => {
      // Handlers still at work (for callers who hung up too) finish before the database closes.
      await inFlight?.drained(5000);
      await Promise.all([worker?.stop(), jobs.stop()]);
      await Promise.all([orm.close(), limits?.close()]);
      process.exit(0);
    };
    if (server) {
      server.close(() => void finish());
      server.closeIdleConnections();
    } else void finish();
    // Keep-alive connections from browsers must not hold the shutdown for long.
    setTimeout(() => process.exit(0), 8000).unref();
  };
  process.on('SIGINT', () => shutdown('SIGINT'));
  process.on('SIGTERM', () => shutdown('SIGTERM'));
}

main().catch((error) => {
  console.error(error instanceof EnvError ? error.message : error);
  process.exit(1);
});
