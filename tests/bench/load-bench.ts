import { fork } from 'node:child_process';
import { join } from 'node:path';
import autocannon from 'autocannon';
import pLimit from 'p-limit';
import sharp from 'sharp';
import type Stripe from 'stripe';
import { orientedArea } from '#shared/imaging/sizing.ts';
import { fillCrop } from '../support/orders.ts';

/**
 * The load run: many connections at once on the storefront's busiest calls, measured with
 * autocannon. Used by `npm run bench:load` (full length, on its own stack) and by a short run in
 * the tests (which checks only that nothing failed; figures are never asserted).
 */
export type LoadTarget = {
  name: string;
  method: 'GET' | 'POST';
  path: string;
  /** A fresh body and headers for each request (e.g. the next upload to accept). */
  next?: () => { body?: string; headers?: Record<string, string> };
};

export type LoadResult = {
  name: string;
  requests: number;
  perSecond: number;
  p50Ms: number;
  p99Ms: number;
  maxMs: number;
  /** Connection errors, timeouts and answers outside 2xx: all must be zero. */
  failures: number;
  non2xx: number;
  timeouts: number;
  errors: number;
};

export type LoadOptions = { connections: number; durationSeconds: number };

const STUDIO = 'harbour-light';

/**
 * For scale: the same tool against one bare Express route (`GET /hello`, a tiny JSON answer) in
 * a process of its own, as the app runs in its own.
 */
export async function startBareExpress(): Promise<{ url: string; target: LoadTarget; stop(): Promise<void> }> {
  const child = fork(join(import.meta.dirname, 'bare-express.ts'), [], {
    execArgv: ['--import', 'tsx'],
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  });
  const port = await new Promise<number>((resolve, reject) => {
    child.once('message', (message) => resolve((message as { port: number }).port));
    child.once('exit', (code) => reject(new Error(`the bare Express process exited (${code})`)));
  });
  return {
    url: `http://127.0.0.1:${port}`,
    target: { name: 'bare Express route', method: 'GET', path: '/hello' },
    stop: () => new Promise((done) => (child.exitCode !== null ? done() : (child.once('exit', () => done()), child.kill('SIGTERM')))),
  };
}

/** Runs one target for the whole duration and sums up what autocannon measured. */
export async function runLoad(baseUrl: string, target: LoadTarget, { connections, durationSeconds }: LoadOptions): Promise<LoadResult> {
  const result = await autocannon({
    url: baseUrl,
    connections,
    duration: durationSeconds,
    // A photo accept under 200 connections queues for seconds on two cores; it must not be
    // counted as failed for waiting.
    timeout: 60,
    requests: [
      {
        method: target.method,
        path: target.path,
        headers: { 'content-type': 'application/json' },
        setupRequest: (request) => {
          const next = target.next?.();
          return { ...request, ...(next?.body ? { body: next.body } : {}), headers: { ...request.headers, ...next?.headers } };
        },
      },
    ],
  });
  return {
    name: target.name,
    requests: result.requests.total,
    perSecond: result.requests.average,
    p50Ms: result.latency.p50,
    p99Ms: result.latency.p99,
    maxMs: result.latency.max,
    failures: result.errors + result.timeouts + result.non2xx,
    non2xx: result.non2xx,
    timeouts: result.timeouts,
    errors: result.errors,
  };
}

async function json<T>(response: Response, what: string): Promise<T> {
  if (!response.ok) throw new Error(`${what}: ${response.status} ${await response.text()}`);
  return (await response.json()) as T;
}

/** A buyer's photo as the storefront sends it: a ticket, then a PUT straight to storage. */
async function uploadPhoto(baseUrl: string, jpeg: Buffer): Promise<string> {
  const ticket = await json<{ url: string; key: string; headers: Record<string, string> }>(
    await fetch(`${baseUrl}/api/storefront/${STUDIO}/photo-uploads`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ contentType: 'image/jpeg', contentLength: jpeg.length }),
    }),
    'upload ticket',
  );
  const put = await fetch(ticket.url, { method: 'PUT', headers: ticket.headers, body: new Uint8Array(jpeg) });
  if (!put.ok) throw new Error(`upload: ${put.status}`);
  return ticket.key;
}

/**
 * What the run needs on the demo studio: an order with its private link, and a pool of uploaded
 * photos waiting to be accepted (each accept uses one up). The photo is 1200 × 900 px, about
 * the size of a phone picture scaled for messaging.
 */
export async function prepareStorefrontLoad(
  baseUrl: string,
  stripe: Stripe,
  { uploads }: { uploads: number },
): Promise<{ targets: LoadTarget[]; uploadsLeft(): number }> {
  const jpeg = await sharp({ create: { width: 1200, height: 900, channels: 3, background: '#6a7b8c' } })
    .jpeg({ quality: 85 })
    .toBuffer();
  const accept = async (key: string) =>
    json<{ id: string; width: number; height: number }>(
      await fetch(`${baseUrl}/api/storefront/${STUDIO}/buyer-photos`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ key }),
      }),
      'accept',
    );

  const { blanks } = await json<{ blanks: Array<{ id: string; sizes: Array<{ id: string; areaWidthMm: number; areaHeightMm: number }> }> }>(
    await fetch(`${baseUrl}/api/storefront/${STUDIO}/blanks`),
    'catalog',
  );
  const blank = blanks.find((b) => b.sizes.length > 0)!;
  const photo = await accept(await uploadPhoto(baseUrl, jpeg));
  const placed = await json<{ orderId: string; paymentUrl: string }>(
    await fetch(`${baseUrl}/api/storefront/${STUDIO}/orders`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({
        items: [
          {
            blankId: blank.id,
            sizeId: blank.sizes[0]!.id,
            orientation: 'landscape',
            quantity: 1,
            photoId: photo.id,
            placement: { crop: fillCrop(photo, orientedArea(blank.sizes[0]!, 'landscape')) },
            rightsConfirmed: true,
          },
        ],
        buyer: { email: 'load.run@buyers.test', name: 'Lena Oakes' },
        delivery: { method: 'pickup' },
      }),
    }),
    'order',
  );
  // The order's private link is where the payment provider sends the buyer back.
  const session = await stripe.checkout.sessions.retrieve(new URL(placed.paymentUrl).pathname.split('/').pop()!);
  const accessKey = new URL(session.success_url!).searchParams.get('key')!;
  const orderPage = `/api/storefront/${STUDIO}/orders/${placed.orderId}?key=${encodeURIComponent(accessKey)}`;

  const sixteenAtATime = pLimit(16);
  const keys = await Promise.all(Array.from({ length: uploads }, () => sixteenAtATime(() => uploadPhoto(baseUrl, jpeg))));
  let used = 0;
  return {
    uploadsLeft: () => keys.length - used,
    targets: [
      { name: 'storefront catalog', method: 'GET', path: `/api/storefront/${STUDIO}/blanks` },
      { name: 'order page', method: 'GET', path: orderPage },
      {
        name: 'upload accept',
        method: 'POST',
        path: `/api/storefront/${STUDIO}/buyer-photos`,
        // Each buyer comes from an address of their own (through the app's trusted proxy), as
        // they would in a shop: the per-address limit is for one caller, not for the crowd.
        next: () => {
          const i = used++;
          return {
            body: JSON.stringify({ key: keys[i % keys.length] }),
            headers: { 'x-forwarded-for': `10.${(i >> 16) & 255}.${(i >> 8) & 255}.${i & 255}` },
          };
        },
      },
    ],
  };
}

export function formatLoadTable(results: LoadResult[], { connections, durationSeconds }: LoadOptions): string {
  const head = `${'call'.padEnd(24)} ${'req/s'.padStart(8)} ${'p50 ms'.padStart(8)} ${'p99 ms'.padStart(8)} ${'max ms'.padStart(8)} ${'requests'.padStart(9)} ${'failed'.padStart(7)}`;
  const rows = results.map(
    (r) =>
      `${r.name.padEnd(24)} ${r.perSecond.toFixed(0).padStart(8)} ${String(r.p50Ms).padStart(8)} ${String(r.p99Ms).padStart(8)} ${String(r.maxMs).padStart(8)} ${String(r.requests).padStart(9)} ${String(r.failures).padStart(7)}`,
  );
  return [`${connections} connections, ${durationSeconds} s per call (autocannon)`, head, ...rows].join('\n');
}
