import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { errorBodySchema } from '#shared/errors.ts';
import { workspaceRoutes, type AppDeps } from '#server/app.ts';
import { seedDemo } from '#server/db/seed.ts';
import { DEMO_PASSWORD } from '#server/db/demo-scenario.ts';
import type { WorkspaceFixtures } from '#server/middleware/workspace-routes.ts';
import { signIn } from '../support/factories.ts';
import { useTestApp } from '../support/test-app.ts';

/**
 * Bad input on every API route, found by walking the app's own router: wrong types, missing
 * fields, huge strings, deep nesting, unicode, `__proto__` and `constructor` keys, wrong content
 * types and oversized bodies. No answer may be a 5xx; what is malformed must be refused with a
 * 4xx carrying the error body and a message, and a route whose every attempt was refused must
 * leave every table as it was. Bodies start from each workspace route's own sample (routes
 * without one get a generic body); awkward text that is valid may be stored, and is only
 * checked not to break anything. A seeded generator makes every run send the same requests.
 */
type Route = { method: string; path: string };

/** Every route the app answers under /api, from Express's own routing table. */
function walk(stack: unknown[], prefix = ''): Route[] {
  const routes: Route[] = [];
  for (const layer of stack as Array<{
    rawPath?: string;
    route?: { path: string; methods: Record<string, boolean> };
    handle?: { stack?: unknown[] };
  }>) {
    if (layer.route) for (const method of Object.keys(layer.route.methods)) routes.push({ method, path: prefix + layer.route.path });
    else if (layer.handle?.stack)
      routes.push(...walk(layer.handle.stack, prefix + (typeof layer.rawPath === 'string' ? layer.rawPath : '')));
  }
  return routes;
}

/** A small seeded generator (mulberry32), so failures can be replayed. */
function generator(seed: number) {
  let a = seed;
  const next = () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return { next, pick: <T>(items: readonly T[]) => items[Math.floor(next() * items.length)]! };
}

const deep = (levels: number): unknown => (levels ? { a: deep(levels - 1) } : 'bottom');
/** Text that is valid in a free-text field and must simply be stored and shown safely. */
const AWKWARD_TEXT = [
  '\u202e evil \u202c',
  '👩‍👩‍👧‍👦🔥',
  'ǅ ß ﬁ ẞ',
  '<script>alert(1)</script>',
  '\'; drop table "order"; --',
  '../../etc/passwd',
  '{{7*7}}',
  ' ',
];
/** Values of the wrong kind for a field whose sample value is of `kind`: never valid there. */
const WRONG_KIND: Record<string, unknown[]> = {
  string: [42, true, [], ['a'], {}, deep(300), 'x'.repeat(20_000)],
  number: ['many', true, [], {}, 1e308, -1e308, 'x'.repeat(20_000)],
  boolean: ['yes', 2, [], {}],
  object: ['text', 7, [1, 2], true],
  array: ['text', 7, {}, true, Array.from({ length: 5000 }, () => 'x')],
};
const HOSTILE_KEYS = ['__proto__', 'constructor', 'prototype', 'toString', 'hasOwnProperty', '$where', '$ne'];

type Attempt = { body?: unknown; raw?: string; type?: string; mustRefuse: boolean };

/**
 * Requests for one route: whole bodies of the wrong shape, broken JSON, other content types,
 * an oversized body and hostile keys (all to be refused), then each field of the route's sample
 * missing, of the wrong kind (refused) or holding awkward text (which may be valid: it must not
 * break anything).
 */
function attemptsFor(sample: unknown, random: ReturnType<typeof generator>): Attempt[] {
  const takesInput = sample !== undefined;
  const out: Attempt[] = [];
  for (const value of [42, 'text', true, null, [], [sample ?? 1], deep(500)]) out.push({ body: value, mustRefuse: takesInput });
  out.push({ raw: '{"unterminated": ', type: 'application/json', mustRefuse: true });
  out.push({ raw: JSON.stringify({ padding: 'x'.repeat(150_000) }), type: 'application/json', mustRefuse: true });
  out.push({ raw: 'a=1&b=2', type: 'application/x-www-form-urlencoded', mustRefuse: takesInput });
  out.push({ raw: 'plain words', type: 'text/plain', mustRefuse: takesInput });
  out.push({ raw: '<x>1</x>', type: 'application/xml', mustRefuse: takesInput });
  out.push({ raw: '{"a":1}', type: 'application/json; charset=utf-7', mustRefuse: takesInput });
  for (const key of HOSTILE_KEYS)
    out.push({
      raw: `{"${key}": {"polluted": true}, "constructor": {"prototype": {"polluted": true}}}`,
      type: 'application/json',
      mustRefuse: takesInput,
    });
  if (sample && typeof sample === 'object' && !Array.isArray(sample)) {
    for (const [field, value] of Object.entries(sample)) {
      const { [field]: _dropped, ...missing } = sample as Record<string, unknown>;
      out.push({ body: missing, mustRefuse: false }); // the field may be optional
      const kind = Array.isArray(value) ? 'array' : value === null ? 'object' : typeof value;
      for (const wrong of WRONG_KIND[kind] ?? []) out.push({ body: { ...(sample as object), [field]: wrong }, mustRefuse: true });
      if (typeof value === 'string') out.push({ body: { ...(sample as object), [field]: random.pick(AWKWARD_TEXT) }, mustRefuse: false });
    }
  }
  return out;
}

describe('bad input on every API route', () => {
  const t = useTestApp();
  let owner: ReturnType<typeof request.agent>;
  let routes: Route[];
  const samples = new Map<string, unknown>();

  /** Rows and the newest change of every table: what must not move (rate-limit counters are meant to count attempts). */
  async function fingerprint(): Promise<string> {
    const tables = await t.orm.em.getConnection().execute<Array<{ table_name: string; has_updated: boolean }>>(
      `select t.table_name, exists (select 1 from information_schema.columns c where c.table_schema = 'public' and c.table_name = t.table_name and c.column_name = 'updated_at') as has_updated
       from information_schema.tables t where t.table_schema = 'public' and t.table_type = 'BASE TABLE' and t.table_name not in ('mikro_orm_migrations', 'rate_limit') order by 1`,
    );
    const parts = [];
    for (const { table_name: table, has_updated } of tables) {
      const [row] = await t.orm.em
        .getConnection()
        .execute(`select count(*)::int as n${has_updated ? ', max("updated_at")::text as at' : ''} from "${table}"`);
      parts.push(`${table}:${row?.n}:${row?.at ?? ''}`);
    }
    return parts.join('\n');
  }

  beforeAll(async () => {
    await seedDemo(t.orm.em.fork());
    owner = request.agent(t.app);
    await signIn(owner, 'maren@harbour-light.test', DEMO_PASSWORD);
    // Auth.js owns /api/auth (its own checks and counters); the webhook is covered by its
    // signature tests; signing out everywhere takes no input and would end the fuzzer's session.
    const skipped = new Set(['/api/payments/webhook', '/api/me/sign-out-everywhere']);
    routes = walk((t.app as unknown as { router: { stack: unknown[] } }).router.stack).filter(
      (r) => r.path.startsWith('/api/') && !r.path.startsWith('/api/auth') && !skipped.has(r.path),
    );
    // The workspace routes' own samples, with made-up ids: shapes only, nothing is created.
    const id = () => randomUUID();
    const fixtures: WorkspaceFixtures = {
      studioId: id(),
      ownerId: id(),
      staffId: id(),
      makeMember: async () => id(),
      makeInvite: async () => id(),
      shippingRate: async () => id(),
      catalog: async () => id(),
      upload: async () => `uploads/${id()}/blank-photos/${id()}`,
      orderItem: async () => ({ orderId: id(), itemId: id(), photoId: id() }),
      production: async () => ({ orderId: id(), itemId: id(), batchId: id(), renderId: id() }),
    };
    for (const route of workspaceRoutes({ ...t, logger: undefined, version: 'test' } as unknown as AppDeps)) {
      samples.set(
        `${route.method} /api/studios/:studioSlug${route.path === '/' ? '' : route.path}`,
        (await route.sample?.(fixtures))?.body,
      );
    }
  });

  it('never answers 5xx, refuses what is malformed with a message, and leaves no trace of it (at least 10,000 requests)', async () => {
    const random = generator(20261202);
    const failures: string[] = [];
    let sent = 0;
    const param = (name: string) =>
      name === 'studioSlug' || name === 'slug'
        ? 'harbour-light'
        : random.pick([randomUUID(), 'not-an-id', '%F0%9F%94%A5', 'x'.repeat(300), '..%2F..']);
    const mutations = routes.filter((r) => r.method !== 'get');
    const reads = routes.filter((r) => r.method === 'get');
    for (let round = 0; sent < 10_000 && round < 50; round++) {
      for (const route of mutations) {
        const sample = samples.get(`${route.method} ${route.path}`);
        // Routes outside the workspace list carry no sample: a generic body stands in for theirs.
        const known = samples.has(`${route.method} ${route.path}`) ? sample : { name: 'x', email: 'a@b.test', items: [] };
        const first = round === 0 ? await fingerprint() : undefined;
        let accepted = 0;
        for (const attempt of attemptsFor(known, random)) {
          const path = route.path.replace(/:(\w+)/g, (_, name: string) => param(name));
          let req = (owner as unknown as Record<string, (url: string) => request.Test>)[route.method]!(path);
          if (attempt.raw !== undefined) req = req.set('content-type', attempt.type!).send(attempt.raw);
          else if (attempt.body !== undefined) req = req.set('content-type', 'application/json').send(JSON.stringify(attempt.body));
          const res = await req;
          sent++;
          if (res.status < 400) accepted++;
          const what = `${route.method} ${route.path} (${(attempt.raw ?? JSON.stringify(attempt.body) ?? '').slice(0, 80)}) → ${res.status} ${JSON.stringify(res.body).slice(0, 160)}`;
          if (res.status >= 500) failures.push(what);
          else if (res.status >= 400 && !errorBodySchema.safeParse(res.body).data?.message) failures.push(`no message: ${what}`);
          else if (res.status < 400 && attempt.mustRefuse) failures.push(`accepted: ${what}`);
        }
        // What was refused left no trace: the tables are as they were (checked on the first round).
        if (first !== undefined && !accepted && (await fingerprint()) !== first)
          failures.push(`changed records: ${route.method} ${route.path}`);
      }
      // Reads with hostile query strings: never a 5xx.
      for (const route of reads) {
        const path = route.path.replace(/:(\w+)/g, (_, name: string) => param(name));
        const res = await owner.get(path).query({
          [random.pick(['search', 'page', 'pageSize', 'stage', 'key', '__proto__', 'constructor[prototype]'])]: String(
            random.pick([...AWKWARD_TEXT, 'x'.repeat(5000), '-1', '1e308', '[]']),
          ),
        });
        sent++;
        if (res.status >= 500) failures.push(`GET ${route.path} → ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`);
      }
    }
    expect(failures.slice(0, 20), `${failures.length} bad answers of ${sent}`).toEqual([]);
    // Still signed in: the workspace routes were tried past the sign-in check.
    await owner.get('/api/studios/harbour-light').expect(200);
    expect(sent).toBeGreaterThanOrEqual(10_000);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect((Object.prototype as Record<string, unknown>).admin).toBeUndefined();
  }, 600_000);
});

export type { Express };
