import { existsSync, mkdirSync, chmodSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { join, resolve } from 'node:path';
import { tmpdir } from 'node:os';
import { createConnection } from 'node:net';
import { log, run } from './run.ts';

/** Whether something already answers on 127.0.0.1:port. */
export function portInUse(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = createConnection({ host: '127.0.0.1', port });
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('error', () => resolve(false));
  });
}

/**
 * A private PostgreSQL cluster for this checkout: Debian's server binaries, a data folder under
 * `.data/`, listening on 127.0.0.1 only, on a port of its own, with trust auth (loopback only).
 * `initdb` and `postgres` refuse to run as root, so they run as the `postgres` system user.
 */
const BIN = '/usr/lib/postgresql/15/bin';

export type PostgresCluster = {
  dataDir: string;
  port: number;
  url(database: string): string;
  stop(): Promise<void>;
};

async function ensureServerInstalled(): Promise<void> {
  if (existsSync(join(BIN, 'postgres'))) return;
  log('PostgreSQL 15 server not found: installing Debian package postgresql-15 (needs root)…');
  await run('apt-get', ['update'], { quiet: true });
  await run('apt-get', ['install', '-y', '--no-install-recommends', 'postgresql-15'], {
    quiet: true,
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
}

const asPostgres = (command: string, args: string[], quiet = true) =>
  process.getuid?.() === 0 ? run('runuser', ['-u', 'postgres', '--', command, ...args], { quiet }) : run(command, args, { quiet });

/**
 * The data folder: under the project's `.data/` when the postgres user can reach it, else under
 * the system temp folder (a checkout inside a private home folder is not traversable).
 */
async function chooseDataDir(projectDir: string, name: string): Promise<string> {
  const preferred = resolve(projectDir, '.data', name);
  mkdirSync(preferred, { recursive: true });
  if (process.getuid?.() !== 0) return preferred;
  await run('chown', ['postgres:postgres', preferred], { quiet: true });
  chmodSync(preferred, 0o700);
  try {
    await asPostgres('test', ['-w', preferred]);
    return preferred;
  } catch {
    const hash = createHash('sha1').update(preferred).digest('hex').slice(0, 10);
    const fallback = join(tmpdir(), `etchwell-${hash}`, name);
    mkdirSync(fallback, { recursive: true });
    await run('chown', ['-R', 'postgres:postgres', join(tmpdir(), `etchwell-${hash}`)], { quiet: true });
    chmodSync(fallback, 0o700);
    log(`postgres cannot reach ${preferred}; using ${fallback}`);
    return fallback;
  }
}

export async function startPostgres(options: {
  projectDir: string;
  name: string;
  port: number;
  /** Test clusters trade durability for speed. */
  fast?: boolean;
}): Promise<PostgresCluster> {
  await ensureServerInstalled();
  const dataDir = await chooseDataDir(options.projectDir, options.name);
  const pgCtl = join(BIN, 'pg_ctl');
  if (!existsSync(join(dataDir, 'PG_VERSION'))) {
    log(`creating a PostgreSQL cluster in ${dataDir}`);
    await asPostgres(join(BIN, 'initdb'), ['-D', dataDir, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--no-locale']);
  }
  // A cluster left running by a killed earlier run is stopped first, so its settings are ours.
  try {
    await asPostgres(pgCtl, ['-D', dataDir, 'status']);
    log('stopping a PostgreSQL left running by an earlier run');
    await asPostgres(pgCtl, ['-D', dataDir, '-m', 'fast', '-w', 'stop']);
  } catch {
    /* not running: the usual case */
  }
  if (await portInUse(options.port)) {
    throw new Error(`port ${options.port} is already in use on 127.0.0.1 (is another checkout's stack running?). Stop it first.`);
  }
  const settings = [`-c listen_addresses=127.0.0.1`, `-p ${options.port}`, `-k ${dataDir}`];
  if (options.fast) settings.push('-c fsync=off', '-c synchronous_commit=off', '-c full_page_writes=off');
  await asPostgres(pgCtl, ['-D', dataDir, '-l', join(dataDir, 'server.log'), '-w', '-t', '30', '-o', settings.join(' '), 'start']);
  log(`PostgreSQL listening on 127.0.0.1:${options.port}`);
  return {
    dataDir,
    port: options.port,
    url: (database) => `postgres://postgres@127.0.0.1:${options.port}/${database}`,
    async stop() {
      await asPostgres(pgCtl, ['-D', dataDir, '-m', 'fast', '-w', '-t', '20', 'stop']);
    },
  };
}
