import type { Server, ServerResponse } from 'node:http';
import { setTimeout as sleep } from 'node:timers/promises';

/**
 * Counts requests whose handlers are still at work, the ones whose caller has already hung up
 * included (the server forgets those connections, but their handlers still write to the database
 * and storage). A shutdown waits for them before it closes the database, so a deploy never cuts a
 * photo accept or a refund in half.
 */
export function trackInFlight(server: Server) {
  let count = 0;
  server.on('request', (_req, res: ServerResponse) => {
    count++;
    let ended = false;
    // A handler always ends its response, even to a caller who is gone: that is when it is done.
    const end = res.end;
    res.end = function (this: ServerResponse, ...args: unknown[]) {
      if (!ended) {
        ended = true;
        count--;
      }
      return (end as (...a: unknown[]) => ServerResponse).apply(this, args);
    } as ServerResponse['end'];
  });
  return {
    /** Resolves once no handler is at work, or after `timeoutMs`. */
    async drained(timeoutMs: number): Promise<void> {
      const until = Date.now() + timeoutMs;
      while (count > 0 && Date.now() < until) await sleep(25);
    },
  };
}
