import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { healthSchema } from '#shared/health.ts';
import { buildTestApp } from '../support/test-app.ts';
import { startTcpProxy } from '../support/tcp-proxy.ts';

describe('GET /api/health', () => {
  let proxy: Awaited<ReturnType<typeof startTcpProxy>>;
  let t: Awaited<ReturnType<typeof buildTestApp>>;

  beforeAll(async () => {
    const server = new URL(process.env.TEST_DATABASE_TEMPLATE_URL!);
    proxy = await startTcpProxy({ host: server.hostname, port: Number(server.port) });
    t = await buildTestApp({}, { databasePort: proxy.port });
  });

  afterAll(async () => {
    await proxy?.restore();
    await t?.close();
    proxy?.close();
  });

  it('answers 200 with the database up, after a real query', async () => {
    const res = await request(t.app).get('/api/health').expect(200);
    expect(healthSchema.parse(res.body)).toEqual({ status: 'ok', db: 'up', version: 'test' });
  });

  it('answers 503 when the database cannot be reached', async () => {
    await proxy.cut();
    const res = await request(t.app).get('/api/health').expect(503);
    expect(healthSchema.parse(res.body)).toMatchObject({ status: 'degraded', db: 'down' });
  });

  it('recovers without a restart once the database is back', async () => {
    await proxy.restore();
    const res = await request(t.app).get('/api/health').expect(200);
    expect(res.body.db).toBe('up');
  });
});
