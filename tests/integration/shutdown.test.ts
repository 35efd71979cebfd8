import { spawn } from 'node:child_process';
import { createServer } from 'node:net';
import sharp from 'sharp';
import { beforeAll, describe, expect, it } from 'vitest';
import { BuyerPhoto } from '#server/features/photos/buyer-photo.entity.ts';
import type { Studio } from '#server/features/studios/studio.entity.ts';
import { createStudio } from '../support/factories.ts';
import { useTestApp } from '../support/test-app.ts';

const freePort = () =>
  new Promise<number>((resolve) => {
    const probe = createServer().listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as { port: number };
      probe.close(() => resolve(port));
    });
  });

/**
 * Stopping a web process (SIGTERM, as a deploy does) while a photo accept is at work for a
 * buyer who has already hung up: the process waits for the handler, the photo is stored whole,
 * and it exits cleanly with no error logged.
 */
describe('a web process stopped mid-request', () => {
  const t = useTestApp();
  let studio: Studio;

  beforeAll(async () => {
    studio = await createStudio(t.orm.em.fork(), { slug: 'late-shift' });
  });

  it('finishes the work in hand before it closes the database', async () => {
    const port = await freePort();
    const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
      env: {
        ...process.env,
        NODE_ENV: 'test',
        PROCESS_ROLE: 'web',
        PORT: String(port),
        DATABASE_URL: t.env.DATABASE_URL,
        LOG_LEVEL: 'warn',
      },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let output = '';
    child.stdout.on('data', (chunk) => (output += chunk));
    child.stderr.on('data', (chunk) => (output += chunk));
    const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
    const base = `http://127.0.0.1:${port}/api/storefront/late-shift`;
    try {
      for (
        let i = 0;
        i < 300 &&
        !(await fetch(`http://127.0.0.1:${port}/api/health`).then(
          (r) => r.ok,
          () => false,
        ));
        i++
      )
        await new Promise((r) => setTimeout(r, 100));
      // A large photo, so that its accept is still at work when the stop comes.
      const jpeg = await sharp({
        create: { width: 6000, height: 4000, channels: 3, background: '#808080', noise: { type: 'gaussian', mean: 128, sigma: 40 } },
      })
        .jpeg()
        .toBuffer();
      const ticket = await (
        await fetch(`${base}/photo-uploads`, {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify({ contentType: 'image/jpeg', contentLength: jpeg.length }),
        })
      ).json();
      expect((await fetch(ticket.url, { method: 'PUT', headers: ticket.headers, body: new Uint8Array(jpeg) })).status).toBe(200);

      const buyer = new AbortController();
      const accept = fetch(`${base}/buyer-photos`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ key: ticket.key }),
        signal: buyer.signal,
      }).catch(() => 'hung up');
      await new Promise((r) => setTimeout(r, 150));
      buyer.abort();
      expect(await accept).toBe('hung up');
      child.kill('SIGTERM');
      expect(await exited).toBe(0);
    } finally {
      child.kill('SIGKILL');
    }
    expect(output).not.toMatch(/"level":50/);
    const photos = await t.orm.em.fork().find(BuyerPhoto, { studio }, { filters: false });
    expect(photos).toHaveLength(1);
    expect(photos[0]).toMatchObject({ width: 6000, height: 4000 });
    for (const key of [photos[0]!.originalKey, photos[0]!.previewKey, photos[0]!.thumbKey]) expect(await t.storage.head(key)).toBeDefined();
  }, 60_000);
});
