// server/dev/db-cli.ts migrate | prepare | reset
//   migrate: apply committed migrations.
//   prepare: migrate, then load the demo data if the database has no club yet (first run).
//   reset:   drop everything, migrate, load the demo data.
import { sql } from 'drizzle-orm';
import { connect, runMigrations } from '@/db/client';
import { clubs } from '@/db/schema';
import { seedDemo } from './seed/demo';

async function main(command: string | undefined) {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set.');
  const handle = connect(url, 2);
  try {
    if (command === 'reset') {
      await handle.db.execute(sql`drop schema if exists public cascade`);
      await handle.db.execute(sql`drop schema if exists drizzle cascade`);
      await handle.db.execute(sql`drop schema if exists pgboss cascade`);
      await handle.db.execute(sql`create schema public`);
    }
    await runMigrations(handle.db);
    if (command === 'prepare' || command === 'reset') {
      const [any] = await handle.db.select({ id: clubs.id }).from(clubs).limit(1);
      if (!any) {
        await seedDemo(handle.db);
        process.stdout.write('[squadline] Demo data loaded.\n');
      }
    } else if (command !== 'migrate') {
      throw new Error(`Unknown command "${command}": use migrate, prepare or reset.`);
    }
  } finally {
    await handle.close();
  }
}

main(process.argv[2]).catch((error: unknown) => {
  process.stderr.write(`${error instanceof Error ? error.message : String(error)}\n`);
  process.exit(1);
});
