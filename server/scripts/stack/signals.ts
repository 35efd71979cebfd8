import { log } from './run.ts';

/**
 * Calls `cleanup` once on SIGINT, SIGTERM or SIGHUP, then exits. A second signal while the
 * cleanup runs is ignored: stopping the database half-way would leave it to recover next time.
 */
export function onShutdown(cleanup: () => Promise<void>): void {
  let stopping = false;
  const handler = (signal: NodeJS.Signals) => {
    if (stopping) return;
    stopping = true;
    log(`${signal}: stopping everything this run started…`);
    cleanup()
      .catch((error) => log(`cleanup failed: ${(error as Error).message}`))
      .finally(() => process.exit(signal === 'SIGINT' ? 130 : 143));
  };
  for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) process.on(signal, handler);
}
