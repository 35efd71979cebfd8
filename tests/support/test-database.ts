import { randomBytes } from 'node:crypto';
import { dropDatabase, ensureDatabase, withDatabaseName } from '#server/db/database-admin.ts';
import { databaseNameOf } from '#server/db/database-admin.ts';

/**
 * Each test file gets a database of its own, copied from the migrated template that `npm test`
 * prepares (CREATE DATABASE … TEMPLATE is a file copy: fast, and files never see each other's rows).
 */
export async function createTestDatabase(): Promise<{ url: string; drop(): Promise<void> }> {
  const templateUrl = process.env.TEST_DATABASE_TEMPLATE_URL;
  if (!templateUrl) throw new Error('TEST_DATABASE_TEMPLATE_URL is not set: run the tests with `npm test`.');
  const url = withDatabaseName(templateUrl, `etchwell_test_${randomBytes(5).toString('hex')}`);
  await ensureDatabase(url, databaseNameOf(templateUrl));
  return { url, drop: () => dropDatabase(url) };
}
