import { execFile } from 'node:child_process';
import { existsSync, mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import { promisify } from 'node:util';

/**
 * Backups with PostgreSQL's own tools, from the same server package as the database (Debian's
 * postgresql-15): pg_dump in its custom format (compressed, restorable table by table) and
 * pg_restore. Object storage (photos and rendered files) is backed up by the store itself.
 */
const run = promisify(execFile);
const BIN = process.env.PG_BIN_DIR ?? '/usr/lib/postgresql/15/bin';
const tool = (name: 'pg_dump' | 'pg_restore') => {
  const path = `${BIN}/${name}`;
  if (!existsSync(path)) throw new Error(`${path} is missing: install Debian's postgresql-15 (npm start does), or set PG_BIN_DIR`);
  return path;
};

/** Writes a dump of the whole database to `file`. */
export async function backupDatabase(databaseUrl: string, file: string): Promise<void> {
  mkdirSync(dirname(file), { recursive: true });
  await run(tool('pg_dump'), ['--format=custom', '--no-owner', '--no-privileges', `--file=${file}`, databaseUrl], {
    maxBuffer: 16 * 1024 * 1024,
  });
}

/**
 * Restores a dump into `databaseUrl`, replacing what is there (tables are dropped first and the
 * restore runs in one transaction: it succeeds whole or leaves the database as it was).
 */
export async function restoreDatabase(databaseUrl: string, file: string): Promise<void> {
  if (!existsSync(file)) throw new Error(`no backup at ${file}`);
  await run(
    tool('pg_restore'),
    ['--clean', '--if-exists', '--no-owner', '--no-privileges', '--single-transaction', '--exit-on-error', `--dbname=${databaseUrl}`, file],
    { maxBuffer: 16 * 1024 * 1024 },
  );
}
