import { Module } from '@nestjs/common';
import { APP_FILTER, APP_GUARD, Reflector } from '@nestjs/core';
import { ThrottlerGuard, ThrottlerModule } from '@nestjs/throttler';
import { AuditModule } from './audit/audit.module';
import { AuthModule } from './auth/auth.module';
import { ClientsModule } from './clients/clients.module';
import { ClinicModule } from './clinic/clinic.module';
import { ConsentsModule } from './consents/consents.module';
import { ContactsModule } from './contacts/contacts.module';
import { SamplesModule } from './samples/samples.module';
import { ProfileVersionsModule } from './profile-versions/profile-versions.module';
import { ReportsModule } from './reports/reports.module';
import { SummariesModule } from './summaries/summaries.module';
import { TrialsModule } from './trials/trials.module';
import { VocabularyModule } from './vocabulary/vocabulary.module';
import { CsrfGuard } from './auth/guards/csrf.guard';
import { RolesGuard } from './auth/guards/roles.guard';
import { PasswordChangeGuard } from './auth/guards/password-change.guard';
import { SessionGuard } from './auth/guards/session.guard';
import { ApiExceptionFilter } from './common/filters/api-exception.filter';
import { AppConfigModule } from './config/app-config.module';
import { DatabaseModule } from './database/database.module';
import { HealthModule } from './health/health.module';
import { UsersModule } from './users/users.module';

const MINUTE_MS = 60_000;
// Ceiling for all API calls per client address; far above what one person's browser does
// (common practice, no source). Failed sign-ins have their own limits (auth/sign-in-limits).
const API_REQUESTS_PER_MINUTE = 1_000;

@Module({
  imports: [
    AppConfigModule,
    DatabaseModule,
    ThrottlerModule.forRoot({
      throttlers: [{ name: 'default', ttl: MINUTE_MS, limit: API_REQUESTS_PER_MINUTE }],
      errorMessage: 'Too many requests. Wait a minute and try again.',
    }),
    AuditModule,
    UsersModule,
    AuthModule,
    HealthModule,
    ClinicModule,
    ClientsModule,
    ConsentsModule,
    ContactsModule,
    SamplesModule,
    ProfileVersionsModule,
    ReportsModule,
    SummariesModule,
    TrialsModule,
    VocabularyModule,
  ],
  providers: [
    Reflector,
    // Global guards run in this order: rate limit, session, pending password change, role, CSRF token.
    { provide: APP_GUARD, useClass: ThrottlerGuard },
    { provide: APP_GUARD, useClass: SessionGuard },
    { provide: APP_GUARD, useClass: PasswordChangeGuard },
    { provide: APP_GUARD, useClass: RolesGuard },
    { provide: APP_GUARD, useClass: CsrfGuard },
    { provide: APP_FILTER, useClass: ApiExceptionFilter },
  ],
})
export class AppModule {}
