import type { EntityManager } from 'typeorm';
import type { Env } from '../../config/env.schema';

export type SeedContext = {
  manager: EntityManager;
  env: Env;
  /** --reset-passwords: set the demo accounts' passwords back to DEMO_PASSWORD. */
  resetPasswords: boolean;
  log: (line: string) => void;
};

/** One idempotent part of the demo clinic: running it twice changes nothing the second time. */
export type SeedStep = { name: string; run: (context: SeedContext) => Promise<void> };
