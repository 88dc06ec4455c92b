import { Injectable } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { type SignInLimitSettings, signInLimitSettings } from '../auth/sign-in-limits/sign-in-limit-settings';
import { fromRepoRoot } from './data-paths';
import type { Env } from './env.schema';

/** Typed, read-only view of the validated environment. The only way code reads settings. */
@Injectable()
export class AppConfig {
  constructor(private readonly config: ConfigService<Env, true>) {}

  private get<K extends keyof Env>(key: K): Env[K] {
    return this.config.get(key, { infer: true });
  }

  get nodeEnv(): Env['NODE_ENV'] {
    return this.get('NODE_ENV');
  }
  get isProduction(): boolean {
    return this.nodeEnv === 'production';
  }
  get isTest(): boolean {
    return this.nodeEnv === 'test';
  }
  get host(): string {
    return this.get('HOST');
  }
  get port(): number {
    return this.get('PORT');
  }
  get databaseUrl(): string {
    return this.get('DATABASE_URL');
  }
  get sessionSecret(): string {
    return this.get('SESSION_SECRET');
  }
  get sessionMaxAgeMs(): number {
    return this.get('SESSION_MAX_AGE_HOURS') * 3_600_000;
  }
  get bcryptCost(): number {
    return this.get('BCRYPT_COST');
  }
  /** Failed sign-ins allowed per client address in 15 minutes (LOGIN_RATE_LIMIT, 1–10000). */
  get loginRateLimit(): number {
    return this.get('LOGIN_RATE_LIMIT');
  }
  /** The sign-in limits: per address (loginRateLimit) and per account (growing lock). */
  get signInLimits(): SignInLimitSettings {
    return signInLimitSettings(this.loginRateLimit, this.get('LOGIN_ACCOUNT_FAILURES'));
  }
  /** DEMO_MODE (default: not in production): seeded accounts keep the demo password. */
  get demoMode(): boolean {
    return this.get('DEMO_MODE');
  }
  get smtp(): { host: string; port: number; secure: boolean; user?: string; pass?: string } {
    return {
      host: this.get('SMTP_HOST'),
      port: this.get('SMTP_PORT'),
      secure: this.get('SMTP_SECURE'),
      user: this.get('SMTP_USER'),
      pass: this.get('SMTP_PASS'),
    };
  }
  get mailFrom(): string {
    return this.get('MAIL_FROM');
  }
  /** Language-sample upload limits in bytes and files (SAMPLE_MAX_FILE_MB, SAMPLE_MAX_CLIENT_MB, SAMPLE_MAX_FILES). */
  get sampleLimits(): { maxFileBytes: number; maxClientBytes: number; maxFiles: number } {
    const mb = 1024 * 1024;
    return {
      maxFileBytes: this.get('SAMPLE_MAX_FILE_MB') * mb,
      maxClientBytes: this.get('SAMPLE_MAX_CLIENT_MB') * mb,
      maxFiles: this.get('SAMPLE_MAX_FILES'),
    };
  }
  /** No heartbeat for this long (TRAINING_STALE_SECONDS): a running training's worker is dead. */
  get trainingStaleMs(): number {
    return this.get('TRAINING_STALE_SECONDS') * 1000;
  }
  get appUrl(): string {
    return this.get('APP_URL');
  }
  /** Absolute folder of the built web app (WEB_APP_DIST); relative values are resolved from the repository root. */
  get webAppDist(): string {
    return fromRepoRoot(this.get('WEB_APP_DIST'));
  }
  /** EXPORT_SIGNING_KEY when set (else the export key is kept in the database). */
  get exportSigningKey(): string | undefined {
    return this.get('EXPORT_SIGNING_KEY');
  }
  get demoPassword(): string {
    return this.get('DEMO_PASSWORD');
  }
}
