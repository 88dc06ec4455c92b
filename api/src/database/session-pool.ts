import { Injectable, Logger, type OnApplicationShutdown } from '@nestjs/common';
import { Pool } from 'pg';
import { AppConfig } from '../config/app-config';

/** The small pg pool behind the session store (connect-pg-simple), closed with the app. */
@Injectable()
export class SessionPool implements OnApplicationShutdown {
  readonly pool: Pool;
  private readonly logger = new Logger(SessionPool.name);

  constructor(config: AppConfig) {
    this.pool = new Pool({
      connectionString: config.databaseUrl,
      max: 5,
      connectionTimeoutMillis: 5_000,
      application_name: 'keyloom-sessions',
    });
    // An idle connection dropped by a server restart emits 'error'; unhandled, it would end the process.
    this.pool.on('error', (error) => this.logger.warn(`Session store connection lost: ${error.message}`));
  }

  async onApplicationShutdown(): Promise<void> {
    if (!this.pool.ended) await this.pool.end();
  }
}
