import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { validateEnv } from '../config/env.schema';
import { dataSourceOptions } from '../database/data-source-options';

// `node api/dist/db/migrate.js`: runs pending migrations on DATABASE_URL, each in its own transaction.
async function main(): Promise<void> {
  const env = validateEnv(process.env);
  const dataSource = new DataSource({ ...dataSourceOptions(env.DATABASE_URL), logging: ['error'] });
  await dataSource.initialize();
  try {
    const ran = await dataSource.runMigrations({ transaction: 'each' });
    if (ran.length === 0) console.log('migrate: the database is up to date; nothing to run.');
    for (const migration of ran) console.log(`migrate: ran ${migration.name}`);
  } finally {
    await dataSource.destroy();
  }
}

main().catch((error: unknown) => {
  console.error(`migrate: failed: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
