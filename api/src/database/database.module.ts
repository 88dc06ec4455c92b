import { Global, Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AppConfig } from '../config/app-config';
import { dataSourceOptions } from './data-source-options';
import { SessionPool } from './session-pool';

@Global()
@Module({
  imports: [
    TypeOrmModule.forRootAsync({
      inject: [AppConfig],
      useFactory: (config: AppConfig) => ({
        ...dataSourceOptions(config.databaseUrl),
        // Boot even when PostgreSQL is still starting: try for about 30 s.
        retryAttempts: 10,
        retryDelay: 3_000,
      }),
    }),
  ],
  providers: [SessionPool],
  exports: [SessionPool],
})
export class DatabaseModule {}
