import { initOrm, migrate } from '../db/orm.ts';
import { ensureDatabase } from '../db/database-admin.ts';
import { seedDemo } from '../db/seed.ts';
import { loadEnv } from '../env.ts';
import { resolve } from 'node:path';
import { statSync } from 'node:fs';
import { backupDatabase, restoreDatabase } from '../db/backup.ts';

/**
 * `npm run db:migrate`, `db:rollback <migration>`, `db:seed`, `db:backup [file]` and `db:restore <file>` against
 * DATABASE_URL (the database server must be running: `npm start` or `npm run dev` start the
 * embedded one). Backups go to .data/backups/ unless a file is named.
 */
const [command, fileArgument] = process.argv.slice(2);
const env = loadEnv();
if (command === 'backup' || command === 'restore') {
  const file = resolve(
    fileArgument ?? (command === 'backup' ? `.data/backups/etchwell-${new Date().toISOString().replace(/[:.]/g, '-')}.dump` : ''),
  );
  if (command === 'restore' && !fileArgument) {
    console.error('name the backup to restore: npm run db:restore -- .data/backups/<file>.dump');
    process.exit(2);
  }
  if (command === 'backup') await backupDatabase(env.DATABASE_URL, file);
  else await restoreDatabase(env.DATABASE_URL, file);
  console.log(command === 'backup' ? `backup written: ${file} (${statSync(file).size} bytes)` : `restored from ${file}`);
  process.exit(0);
}
await ensureDatabase(env.DATABASE_URL);
const orm = await initOrm(env.DATABASE_URL);
try {
  if (command === 'migrate') {
    await migrate(orm);
    console.log('migrations: up to date');
  } else if (command === 'rollback') {
    // Undoes the named migration and every later one: for a deployment that must step back.
    if (!fileArgument) throw new Error('name the oldest migration to undo: npm run db:rollback -- Migration20261202002223');
    const undone = await orm.getMigrator().down({ to: fileArgument });
    console.log(`rolled back: ${undone.map((m) => m.name).join(', ') || 'nothing'}`);
  } else if (command === 'seed') {
    const added = await seedDemo(orm.em.fork());
    console.log(`seed: ${added} row(s) added`);
  } else {
    throw new Error(`unknown command ${command}; use migrate, rollback, seed, backup or restore`);
  }
} finally {
  await orm.close();
}
