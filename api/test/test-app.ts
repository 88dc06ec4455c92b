import type { INestApplication } from '@nestjs/common';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { Test } from '@nestjs/testing';
import type { Server } from 'node:http';
import type { Pool } from 'pg';
import { DataSource } from 'typeorm';
import { AppModule } from '../src/app.module';
import type { SignInLimitSettings } from '../src/auth/sign-in-limits/sign-in-limit-settings';
import { AppConfig } from '../src/config/app-config';
import { configureApp } from '../src/configure-app';
import { dataSourceOptions } from '../src/database/data-source-options';

export type TestApp = { app: INestApplication; http: Server; dataSource: DataSource; sessionPool: Pool };

/** DATABASE_URL of the throwaway test database; refuses anything whose name lacks "test". */
export function testDatabaseUrl(): string {
  const url = process.env.DATABASE_URL;
  if (!url)
    throw new Error('Set DATABASE_URL to a throwaway PostgreSQL database (it is dropped by the tests).');
  const name = new URL(url).pathname.slice(1);
  if (!name.includes('test'))
    throw new Error(`Refusing to drop "${name}": the test database name must contain "test".`);
  return url;
}

/** Empties the test database (tables, views, types) and runs every migration, as a fresh install would. */
export async function resetDatabase(): Promise<void> {
  const dataSource = new DataSource({ ...dataSourceOptions(testDatabaseUrl()), logging: ['error'] });
  await dataSource.initialize();
  try {
    await dataSource.dropDatabase();
    await dataSource.runMigrations({ transaction: 'each' });
  } finally {
    await dataSource.destroy();
  }
}

/**
 * The real AppModule wired by the same configureApp() as main.ts. The per-address sign-in limit is
 * raised by default because every test signs in from 127.0.0.1; the limit tests pass small ones.
 * `nodeEnv: 'production'` builds the app as production mode would (Secure cookie, HSTS, docs). The
 * worker-process test shortens the time after which a silent training counts as dead.
 */
export async function createTestApp({
  loginRateLimit = 1_000,
  signInLimits = {},
  nodeEnv,
  trainingStaleSeconds,
}: {
  loginRateLimit?: number;
  signInLimits?: Partial<SignInLimitSettings>;
  nodeEnv?: 'production';
  trainingStaleSeconds?: number;
} = {}): Promise<TestApp> {
  class TestConfig extends AppConfig {
    override get loginRateLimit(): number {
      return loginRateLimit;
    }
    override get signInLimits(): SignInLimitSettings {
      return { ...super.signInLimits, ...signInLimits };
    }
    override get nodeEnv(): 'development' | 'test' | 'production' {
      return nodeEnv ?? super.nodeEnv;
    }
    override get trainingStaleMs(): number {
      return trainingStaleSeconds === undefined ? super.trainingStaleMs : trainingStaleSeconds * 1000;
    }
  }
  const moduleRef = await Test.createTestingModule({ imports: [AppModule] })
    .overrideProvider(AppConfig)
    .useClass(TestConfig)
    .compile();
  const app = moduleRef.createNestApplication<NestExpressApplication>({ logger: ['error'] });
  const sessionPool = configureApp(app);
  await app.init();
  return { app, http: app.getHttpServer(), dataSource: app.get(DataSource), sessionPool };
}
