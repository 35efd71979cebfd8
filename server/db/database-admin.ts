import pg from 'pg';

/** Database names are ours, never user input; still, refuse anything but a plain identifier. */
function quoteName(name: string): string {
  if (!/^[a-z_][a-z0-9_]{0,62}$/.test(name)) throw new Error(`Unsafe database name: ${name}`);
  return `"${name}"`;
}

async function withMaintenanceClient<T>(serverUrl: string, work: (client: pg.Client) => Promise<T>): Promise<T> {
  const url = new URL(serverUrl);
  url.pathname = '/postgres';
  const client = new pg.Client({ connectionString: url.toString() });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

/** The database name of a postgres:// URL. */
export function databaseNameOf(databaseUrl: string): string {
  return decodeURIComponent(new URL(databaseUrl).pathname.slice(1));
}

/** Replaces the database name of a postgres:// URL. */
export function withDatabaseName(databaseUrl: string, name: string): string {
  const url = new URL(databaseUrl);
  url.pathname = `/${name}`;
  return url.toString();
}

/** Creates the database of `databaseUrl` unless it exists; returns whether it was created. */
export async function ensureDatabase(databaseUrl: string, template?: string): Promise<boolean> {
  const name = databaseNameOf(databaseUrl);
  return withMaintenanceClient(databaseUrl, async (client) => {
    const found = await client.query('select 1 from pg_database where datname = $1', [name]);
    if (found.rowCount) return false;
    await client.query(`create database ${quoteName(name)}${template ? ` template ${quoteName(template)}` : ''}`);
    return true;
  });
}

/** Drops the database of `databaseUrl`, closing any sessions still on it. */
export async function dropDatabase(databaseUrl: string): Promise<void> {
  const name = databaseNameOf(databaseUrl);
  await withMaintenanceClient(databaseUrl, (client) => client.query(`drop database if exists ${quoteName(name)} with (force)`));
}
