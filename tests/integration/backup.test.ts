import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { randomBytes } from 'node:crypto';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '#server/db/seed.ts';
import { dropDatabase, ensureDatabase, withDatabaseName } from '#server/db/database-admin.ts';
import { initOrm } from '#server/db/orm.ts';
import { TENANT_FILTER } from '#server/db/tenant.ts';
import { Blank } from '#server/features/catalog/catalog.entity.ts';
import { Studio } from '#server/features/studios/studio.entity.ts';
import { placePaidOrder, uploadBuyerPhoto } from '../support/orders.ts';
import { useTestApp } from '../support/test-app.ts';

/**
 * Backups made and restored with PostgreSQL's pg_dump and pg_restore through the npm scripts,
 * and the migrations run forward over a copy of the demo data without losing any of it.
 */
const run = promisify(execFile);

describe('database backups and migrations', () => {
  const t = useTestApp();
  const work = mkdtempSync(join(tmpdir(), 'etchwell-backup-'));
  const made: string[] = [];
  const freshDatabase = async () => {
    const url = withDatabaseName(t.databaseUrl, `etchwell_restore_${randomBytes(4).toString('hex')}`);
    await ensureDatabase(url);
    made.push(url);
    return url;
  };
  const query = async (url: string, sql: string) => {
    const client = new pg.Client({ connectionString: url });
    await client.connect();
    try {
      return (await client.query(sql)).rows;
    } finally {
      await client.end();
    }
  };
  /** What must survive: every order, item and event, by their own columns. */
  const snapshot = (url: string) =>
    Promise.all([
      query(url, 'select "id", "number", "status", "buyer_email", "total_minor" from "order" order by "id"'),
      query(
        url,
        'select "id", "order_id", "stage", "snapshot"::text, "placement"::text, "prep_versions"::text from "order_item" order by "id"',
      ),
      query(url, 'select "id", "type", "text" from "order_event" order by "id"'),
      query(url, 'select "id", "email" from "app_user" order by "id"'),
    ]);
  const script = (command: string, url: string, file: string) =>
    run(process.execPath, ['--import', 'tsx', 'server/scripts/db.ts', command, file], { env: { ...process.env, DATABASE_URL: url } });

  beforeAll(async () => {
    await seedDemo(t.orm.em.fork());
    const em = t.orm.em.fork();
    const studio = await em.findOneOrFail(Studio, { slug: 'harbour-light' });
    const glass = await em.findOneOrFail(
      Blank,
      { name: 'Black-backed glass portrait' },
      { populate: ['sizes'], filters: { [TENANT_FILTER]: { studioId: studio.id } } },
    );
    for (const email of ['kit@buyers.test', 'lou@buyers.test']) {
      const photo = await uploadBuyerPhoto(t, 'harbour-light', 1500, 2100);
      await placePaidOrder(t, 'harbour-light', [{ blankId: glass.id, sizeId: glass.sizes[0]!.id, photo }], { email, name: 'Kit Harrow' });
    }
  });
  afterAll(async () => {
    for (const url of made) await dropDatabase(url);
    rmSync(work, { recursive: true, force: true });
  });

  it('backs up with npm run db:backup and restores into a fresh database with npm run db:restore', async () => {
    const file = join(work, 'etchwell.dump');
    const backup = await script('backup', t.databaseUrl, file);
    expect(backup.stdout).toMatch(/^backup written: .*etchwell\.dump \(\d+ bytes\)/);
    expect(statSync(file).size).toBeGreaterThan(10_000);
    const target = await freshDatabase();
    const restore = await script('restore', target, file);
    expect(restore.stdout).toMatch(/^restored from /);
    const [before, after] = await Promise.all([snapshot(t.databaseUrl), snapshot(target)]);
    expect(after[0].map((o) => o.buyer_email).sort()).toEqual(['kit@buyers.test', 'lou@buyers.test']);
    expect(after).toEqual(before);
    // The restored database is one the app opens and finds its orders in.
    const orm = await initOrm(target);
    try {
      expect(await orm.em.fork().getConnection().execute('select count(*)::int as n from "order" where "status" = \'paid\'')).toEqual([
        { n: 2 },
      ]);
    } finally {
      await orm.close();
    }
  });

  it('runs the migrations forward over a copy of the demo data without losing any of it', async () => {
    const file = join(work, 'copy.dump');
    await script('backup', t.databaseUrl, file);
    const copy = await freshDatabase();
    await script('restore', copy, file);
    // Back to the schema before production (batches, renders, hand-overs, proofs, positions, the
    // audit log and the shared rate-limit table)…
    expect((await script('rollback', copy, 'Migration20261202002223')).stdout).toMatch(
      /^rolled back: Migration20261203140000, Migration20261203131000, Migration20261203130000, Migration20261203074038, Migration20261202025704, Migration20261202005233, Migration20261202004544, Migration20261202002223$/m,
    );
    const tables = async () =>
      (
        await query(
          copy,
          "select table_name from information_schema.tables where table_name in ('render', 'audit_entry', 'rate_limit', 'sign_in_limit') order by 1",
        )
      ).map((r) => r.table_name);
    expect(await tables()).toEqual(['sign_in_limit']);
    // …then forward again to the newest, as a deployment would run them.
    expect((await script('migrate', copy, '')).stdout).toContain('migrations: up to date');
    expect(await tables()).toEqual(['audit_entry', 'rate_limit', 'render']);
    expect(await snapshot(copy)).toEqual(await snapshot(t.databaseUrl));
    expect(await query(copy, 'select distinct "position" from "order_item"')).toEqual([{ position: 0 }]);
  });
});
