import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { validateEnv } from '../config/env.schema';
import { dataSourceOptions } from '../database/data-source-options';
import { seedSteps } from './seed-steps';

// `node api/dist/db/seed.js [--reset-passwords]`: seeds the demo clinic, idempotently, in one
// transaction. Existing accounts keep their passwords unless --reset-passwords is given.
async function main(): Promise<void> {
  const args = process.argv.slice(2);
  const unknown = args.filter((arg) => arg !== '--reset-passwords');
  if (unknown.length > 0) throw new Error(`unknown option ${unknown.join(' ')} (known: --reset-passwords)`);
  const env = validateEnv(process.env);
  const dataSource = new DataSource({ ...dataSourceOptions(env.DATABASE_URL), logging: ['error'] });
  await dataSource.initialize();
  try {
    await dataSource.transaction(async (manager) => {
      for (const step of seedSteps) {
        await step.run({
          manager,
          env,
          resetPasswords: args.includes('--reset-passwords'),
          log: (line) => console.log(`seed: ${step.name}: ${line}`),
        });
      }
    });
  } finally {
    await dataSource.destroy();
  }
}

main().catch((error: unknown) => {
  console.error(`seed: failed: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
