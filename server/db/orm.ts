import { MikroORM } from '@mikro-orm/postgresql';
import config from '../../mikro-orm.config.ts';

export type Orm = MikroORM;

/** Opens the ORM on the given database (or the configured one). */
export function initOrm(clientUrl?: string): Promise<Orm> {
  return MikroORM.init({ ...config, ...(clientUrl ? { clientUrl } : {}) });
}

/** Brings the schema up to the newest migration. */
export async function migrate(orm: Orm): Promise<void> {
  await orm.getMigrator().up();
}
