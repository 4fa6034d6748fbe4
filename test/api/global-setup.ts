import { Client } from 'pg';
import { connect, runMigrations } from '@/db/client';
import { adminUrl, databaseUrlFor, TEMPLATE_DB } from '../fixtures/test-db';

/** Migrates one template database; every test file then clones it (fast, isolated). */
export default async function setup() {
  // Pure unit tests run without a database; API tests then fail with a message saying how to run them.
  if (!process.env.TEST_DATABASE_ADMIN_URL) return;
  const admin = new Client({ connectionString: adminUrl() });
  await admin.connect();
  await admin.query(`DROP DATABASE IF EXISTS ${TEMPLATE_DB} WITH (FORCE)`);
  await admin.query(`CREATE DATABASE ${TEMPLATE_DB}`);
  await admin.end();
  const handle = connect(databaseUrlFor(TEMPLATE_DB), 1);
  await runMigrations(handle.db);
  await handle.close();
}
