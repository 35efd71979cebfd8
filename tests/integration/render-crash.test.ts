import { spawn } from 'node:child_process';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { createMailer } from '#server/adapters/mailer.ts';
import { seedDemo } from '#server/db/seed.ts';
import { DEMO_PASSWORD } from '#server/db/demo-scenario.ts';
import { TENANT_FILTER } from '#server/db/tenant.ts';
import { Blank } from '#server/features/catalog/catalog.entity.ts';
import { Render } from '#server/features/production/production.entity.ts';
import { renderKeys } from '#server/features/production/render.service.ts';
import { Studio } from '#server/features/studios/studio.entity.ts';
import { createLogger } from '#server/logger.ts';
import { startWorker } from '#server/worker.ts';
import { signIn } from '../support/factories.ts';
import { placePaidOrder, uploadBuyerPhoto } from '../support/orders.ts';
import { pillowImageInfo } from '../support/pillow.ts';
import { useTestApp } from '../support/test-app.ts';

/**
 * A worker process killed in the middle of a render: the job times out, is handed to the next
 * worker, and exactly one complete file set results, marked done once.
 */
const TIMEOUT_SECONDS = 8;

describe('a render whose worker dies', () => {
  const t = useTestApp({ RENDER_TIMEOUT_SECONDS: String(TIMEOUT_SECONDS), JOBS_MAINTENANCE_SECONDS: '1' });
  const work = '/api/studios/harbour-light';
  let staff: ReturnType<typeof request.agent>;
  let glass: Blank;

  beforeAll(async () => {
    await seedDemo(t.orm.em.fork());
    const em = t.orm.em.fork();
    const studio = await em.findOneOrFail(Studio, { slug: 'harbour-light' });
    // Masters at the line density keep each attempt well inside the short job timeout used here
    // (a 1000 ppi master of 8 × 10 in takes longer than the 8 s this test allows a render).
    await em.nativeUpdate(Studio, { id: studio.id }, { proofsRequired: false, masterResolution: 'recipe' });
    glass = await em.findOneOrFail(
      Blank,
      { name: 'Black-backed glass portrait' },
      { populate: ['sizes'], filters: { [TENANT_FILTER]: { studioId: studio.id } } },
    );
    staff = request.agent(t.app);
    await signIn(staff, 'tobias@harbour-light.test', DEMO_PASSWORD);
  });

  const renderRow = async (id: string) => t.orm.em.fork().findOneOrFail(Render, { id }, { filters: false });

  async function waitFor<T>(what: string, seconds: number, probe: () => Promise<T | undefined>): Promise<T> {
    const until = Date.now() + seconds * 1000;
    while (Date.now() < until) {
      const found = await probe();
      if (found !== undefined) return found;
      await new Promise((r) => setTimeout(r, 20));
    }
    throw new Error(`${what}: not within ${seconds} s`);
  }

  it('is retried by the next worker and leaves exactly one file set', async () => {
    const photo = await uploadBuyerPhoto(t, 'harbour-light', 2400, 3000);
    const orderId = await placePaidOrder(
      t,
      'harbour-light',
      [{ blankId: glass.id, sizeId: glass.sizes.getItems().find((s) => s.label === '8 × 10 in')!.id, photo }],
      { email: 'dot@buyers.test', name: 'Dot Hale' },
    );
    const itemId = (await staff.get(`${work}/orders/${orderId}`).expect(200)).body.items[0].id as string;
    await staff.post(`${work}/items/${itemId}/approve-photo`).expect(200);
    await staff.post(`${work}/items/${itemId}/approve-without-proof`).expect(200);
    const batchId = (
      await staff
        .post(`${work}/production/batches`)
        .send({ itemIds: [itemId] })
        .expect(201)
    ).body.id as string;
    const renderId = (await staff.get(`${work}/production/batches/${batchId}`).expect(200)).body.items[0].render.id as string;

    // A worker of its own, as `PROCESS_ROLE=worker` runs in production, killed with SIGKILL once
    // the engrave file is stored and before the rest: no chance to clean up or say anything.
    const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
      env: {
        ...process.env,
        NODE_ENV: 'test',
        PROCESS_ROLE: 'worker',
        DATABASE_URL: t.env.DATABASE_URL,
        LOG_LEVEL: 'warn',
        RENDER_TIMEOUT_SECONDS: String(TIMEOUT_SECONDS),
        JOBS_MAINTENANCE_SECONDS: '1',
      },
      stdio: ['ignore', 'ignore', 'pipe'],
    });
    let stderr = '';
    child.stderr.on('data', (chunk) => (stderr += chunk));
    const exited = new Promise((resolve) => child.on('exit', resolve));
    const midway = await waitFor('the first worker halfway', 60, async () => {
      const render = await renderRow(renderId);
      return render.status === 'running' && render.progress >= 55 && render.progress < 100 ? render : undefined;
    }).catch((error: Error) => {
      child.kill('SIGKILL');
      throw new Error(`${error.message}\n${stderr}`);
    });
    child.kill('SIGKILL');
    await exited;
    const keys = renderKeys(midway.keyPrefix);
    const halfSet = await t.storage.list(midway.keyPrefix);
    expect(halfSet).toContain(keys.engrave);
    expect(halfSet).not.toContain(keys.sheet);
    expect((await renderRow(renderId)).status).toBe('running');
    await staff.get(`${work}/production/renders/${renderId}/files/engrave`).expect(409);

    // The next worker (here, in the test's own process) gets the job once it has timed out.
    const worker = await startWorker({
      env: t.env,
      orm: t.orm,
      logger: createLogger(t.env),
      storage: t.storage,
      jobs: t.jobs,
      mailer: createMailer(t.env),
    });
    try {
      const done = await waitFor('the retried render', TIMEOUT_SECONDS + 60, async () => {
        const render = await renderRow(renderId);
        return render.status === 'done' ? render : undefined;
      });
      expect(done.attempts).toBe(2);
      expect((await t.storage.list(midway.keyPrefix)).sort()).toEqual(Object.values(keys).sort());
      const job = await t.orm.em
        .getConnection()
        .execute<Array<{ state: string; retry_count: number }>>(
          `select "state", "retry_count" from "pgboss"."job" where "name" = 'render-item' and "data"->>'renderId' = ?`,
          [renderId],
        );
      expect(job).toEqual([{ state: 'completed', retry_count: 1 }]);
      const link = (await staff.get(`${work}/production/renders/${renderId}/files/engrave`).expect(200)).body as { url: string };
      // 8 × 10 in has a 7.5 × 9.5 in area: 2700 × 3420 pixels at 360 lines per inch, bit depth 1 (read by Pillow).
      expect(pillowImageInfo(new Uint8Array(await (await fetch(link.url)).arrayBuffer()))).toMatchObject({
        mode: '1',
        width: 2700,
        height: 3420,
      });
    } finally {
      await worker.stop();
    }
  }, 120_000);
});
