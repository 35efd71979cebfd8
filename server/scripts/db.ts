import { initOrm, migrate } from '../db/orm.ts';
import { ensureDatabase } from '../db/database-admin.ts';
import { seedDemo } from '../db/seed.ts';
import { loadEnv } from '../env.ts';

/**
 * `npm run db:migrate` and `npm run db:seed` against DATABASE_URL (the database server must be
 * running: `npm start` or `npm run dev` start the embedded one).
 */
const command = process.argv[2];
const env = loadEnv();
await ensureDatabase(env.DATABASE_URL);
const orm = await initOrm(env.DATABASE_URL);
try {
  if (command === 'migrate') {
    await migrate(orm);
    console.log('migrations: up to date');
  } else if (command === 'seed') {
    const added = await seedDemo(orm.em.fork());
    console.log(`seed: ${added} row(s) added`);
  } else {
    throw new Error(`unknown command ${command}; use migrate or seed`);
  }
} finally {
  await orm.close();
}
