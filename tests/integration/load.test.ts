import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '#server/db/seed.ts';
import { BuyerPhoto } from '#server/features/photos/buyer-photo.entity.ts';
import { prepareStorefrontLoad, runLoad, startBareExpress, type LoadTarget } from '../bench/load-bench.ts';
import { useTestApp } from '../support/test-app.ts';

/**
 * The load run, short: 200 connections for 3 s on each call (`npm run bench:load` runs 60 s
 * each and prints the figures). Here only correctness is checked: every request answered 2xx,
 * none timed out, and every accepted photo is stored. Speed is never asserted in tests.
 */
describe('under load', () => {
  const t = useTestApp();
  const options = { connections: 200, durationSeconds: 3 };
  let server: Server;
  let baseUrl: string;
  let targets: LoadTarget[];

  beforeAll(async () => {
    await seedDemo(t.orm.em.fork());
    server = createServer(t.app);
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    ({ targets } = await prepareStorefrontLoad(baseUrl, t.payments.stripe, { uploads: 600 }));
  }, 120_000);

  afterAll(async () => {
    server.closeAllConnections();
    await new Promise((resolve) => server.close(resolve));
  });

  it('a bare Express route, for scale', async () => {
    const bare = await startBareExpress();
    try {
      const result = await runLoad(bare.url, bare.target, options);
      expect(result).toMatchObject({ failures: 0 });
      expect(result.requests).toBeGreaterThan(0);
    } finally {
      await bare.stop();
    }
  }, 60_000);

  it.each(['storefront catalog', 'order page', 'upload accept'])(
    '%s: every request answered 2xx',
    async (name) => {
      const photosBefore = await t.orm.em.fork().count(BuyerPhoto, {}, { filters: false });
      // Each accept decodes a photo (one per core): with 200 at once and the other test files
      // rendering beside it, none may finish within 3 s. Fewer callers for longer still load it,
      // and every one of them must be answered.
      const run = name === 'upload accept' ? { connections: 40, durationSeconds: 8 } : options;
      const result = await runLoad(
        baseUrl,
        targets.find((target) => target.name === name)!,
        run,
      );
      expect(result).toMatchObject({ non2xx: 0, timeouts: 0, errors: 0 });
      expect(result.requests).toBeGreaterThan(0);
      if (name === 'upload accept') {
        // Nothing lost: each answered accept stored its photo (those still queued when the run
        // stopped may be stored too, never fewer).
        await expect
          .poll(async () => (await t.orm.em.fork().count(BuyerPhoto, {}, { filters: false })) - photosBefore, {
            timeout: 60_000,
            interval: 500,
          })
          .toBeGreaterThanOrEqual(result.requests);
      }
    },
    120_000,
  );
});
