import { defineConfig } from '@mikro-orm/postgresql';
import { Migrator } from '@mikro-orm/migrations';
import { entities } from './server/db/entities.ts';

/**
 * The one ORM configuration, used by the server, the scripts and the MikroORM CLI.
 * The connection comes from DATABASE_URL (see server/env.ts for the default).
 */
export default defineConfig({
  clientUrl: process.env.DATABASE_URL || 'postgres://postgres@127.0.0.1:54329/etchwell',
  entities,
  extensions: [Migrator],
  migrations: {
    path: 'migrations',
    pathTs: 'migrations',
    glob: '!(*.d).{js,ts}',
    emit: 'ts',
    snapshot: true,
    snapshotName: '.snapshot-etchwell',
    transactional: true,
    allOrNothing: true,
  },
  // Fail fast and clearly when the database is away, instead of hanging a request.
  pool: { min: 0, max: 10, acquireTimeoutMillis: 5000 },
  driverOptions: { connection: { connectionTimeoutMillis: 3000 } },
  debug: false,
});
