import { createServer } from 'node:http';
import { createApp } from './app.ts';
import { EnvError, loadEnv } from './env.ts';
import { createLogger } from './logger.ts';
import { initOrm } from './db/orm.ts';
import { appVersion } from './version.ts';
import { createMailer } from './adapters/mailer.ts';
import { startOutboxSender } from './features/outbox/outbox.service.ts';
import { createAuth } from './auth/auth.ts';
import { createStorage } from './adapters/storage.ts';
import { createPayments } from './adapters/payments.ts';

/** The only place that listens. Started by the stack scripts, the Docker image and `npm run dev`. */
async function main(): Promise<void> {
  const env = loadEnv();
  const logger = createLogger(env);
  const orm = await initOrm(env.DATABASE_URL);
  const auth = createAuth({ orm, env, logger });
  const app = createApp({ env, orm, logger, version: appVersion, auth, storage: createStorage(env), payments: createPayments(env) });
  // E-mails leave through the outbox; this process sends what is due (any number may).
  const outbox = startOutboxSender(orm, createMailer(env), logger);
  const server = createServer(app);
  server.listen(env.PORT, env.HOST, () => {
    const address = server.address();
    const port = typeof address === 'object' && address ? address.port : env.PORT;
    logger.info({ port }, `Etchwell listening on http://${env.HOST}:${port}`);
  });

  let closing = false;
  const shutdown = (signal: string) => {
    if (closing) return;
    closing = true;
    logger.info({ signal }, 'shutting down');
    server.close(() => void outbox.stop().then(() => Promise.all([orm.close(), auth.close()])).then(() => process.exit(0)));
    server.closeIdleConnections();
    // Keep-alive connections from browsers must not hold the shutdown for long.
    setTimeout(() => process.exit(0), 3000).unref();
  };
  process.on('SIGINT', () => shutdown('SIGINT'));
  process.on('SIGTERM', () => shutdown('SIGTERM'));
}

main().catch((error) => {
  console.error(error instanceof EnvError ? error.message : error);
  process.exit(1);
});
