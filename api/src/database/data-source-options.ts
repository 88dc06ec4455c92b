import type { DataSourceOptions } from 'typeorm';
import { AuditEvent } from '../audit/audit-event.entity';
import { ClientAssignment } from '../clients/client-assignment.entity';
import { Client } from '../clients/client.entity';
import { Consent } from '../consents/consent.entity';
import { FamilyContact } from '../contacts/family-contact.entity';
import { IdempotencyKey } from '../idempotency/idempotency-key.entity';
import { CreateUsersAndSessions1764633600000 } from '../migrations/1764633600000-create-users-and-sessions';
import { CreateAuditEvents1764633600001 } from '../migrations/1764633600001-create-audit-events';
import { CreateClientsAndConsents1764720000000 } from '../migrations/1764720000000-create-clients-and-consents';
import { CreateLanguageSamples1764720500000 } from '../migrations/1764720500000-create-language-samples';
import { CreateProfileVersions1764721000000 } from '../migrations/1764721000000-create-profile-versions';
import { CreateSummaries1764722000000 } from '../migrations/1764722000000-create-summaries';
import { CreateTrials1764800000000 } from '../migrations/1764800000000-create-trials';
import { ScrubClientTextFromAudit1764910000001 } from '../migrations/1764910000001-scrub-client-text-from-audit';
import { AddProfileVersionWords1764920000001 } from '../migrations/1764920000001-add-profile-version-words';
import { CreateIdempotencyKeys1764930000001 } from '../migrations/1764930000001-create-idempotency-keys';
import { CreateAppSettings1764930000002 } from '../migrations/1764930000002-create-app-settings';
import { AddSignInLimitsAndPasswordChange1764940000001 } from '../migrations/1764940000001-add-sign-in-limits-and-password-change';
import { RenameBlendWeightToBaseWeight1764950000001 } from '../migrations/1764950000001-rename-blend-weight-to-base-weight';
import { OneNamePerIdea1764950000002 } from '../migrations/1764950000002-one-name-per-idea';
import { CreateClientVocabularies1764960000001 } from '../migrations/1764960000001-create-client-vocabularies';
import { ConsentVoid1764980000001 } from '../migrations/1764980000001-consent-void';
import { ContactAddresses1764980000002 } from '../migrations/1764980000002-contact-addresses';
import { SampleCorrections1764990000001 } from '../migrations/1764990000001-sample-corrections';
import { VersionRetire1764991000001 } from '../migrations/1764991000001-version-retire';
import { BaseOnlyVersions1765000000001 } from '../migrations/1765000000001-base-only-versions';
import { SummaryDrafts1765000000002 } from '../migrations/1765000000002-summary-drafts';
import { CreateClinicSettings1765010000001 } from '../migrations/1765010000001-create-clinic-settings';
import { ClientPreferredName1765010000002 } from '../migrations/1765010000002-client-preferred-name';
import { ClinicSettingsRow } from '../clinic/clinic-settings.entity';
import { SummaryStop } from '../contacts/summary-stop.entity';
import { SignInLimit } from '../auth/sign-in-limits/sign-in-limit.entity';
import { ProfileVersion } from '../profile-versions/profile-version.entity';
import { SampleFlag } from '../samples/sample-flag.entity';
import { AppSetting } from '../settings/app-setting.entity';
import { Sample } from '../samples/sample.entity';
import { SummaryRecipient } from '../summaries/summary-recipient.entity';
import { Summary } from '../summaries/summary.entity';
import { PracticePhraseRow } from '../trials/practice-phrase.entity';
import { Trial } from '../trials/trial.entity';
import { User } from '../users/user.entity';
import { ClientVocabularyRow } from '../vocabulary/client-vocabulary.entity';

// Listed as classes (not globs) so the same list works under ts-jest, in dist and for the typeorm CLI.
// Later issues append their entities and migrations here.
export const entities = [
  User,
  AuditEvent,
  Client,
  ClientAssignment,
  Consent,
  FamilyContact,
  Sample,
  SampleFlag,
  ProfileVersion,
  Summary,
  SummaryRecipient,
  Trial,
  PracticePhraseRow,
  IdempotencyKey,
  AppSetting,
  SignInLimit,
  ClientVocabularyRow,
  SummaryStop,
  ClinicSettingsRow,
];
export const migrations = [
  CreateUsersAndSessions1764633600000,
  CreateAuditEvents1764633600001,
  CreateClientsAndConsents1764720000000,
  CreateLanguageSamples1764720500000,
  CreateProfileVersions1764721000000,
  CreateSummaries1764722000000,
  CreateTrials1764800000000,
  ScrubClientTextFromAudit1764910000001,
  AddProfileVersionWords1764920000001,
  CreateIdempotencyKeys1764930000001,
  CreateAppSettings1764930000002,
  AddSignInLimitsAndPasswordChange1764940000001,
  RenameBlendWeightToBaseWeight1764950000001,
  OneNamePerIdea1764950000002,
  CreateClientVocabularies1764960000001,
  ConsentVoid1764980000001,
  ContactAddresses1764980000002,
  SampleCorrections1764990000001,
  VersionRetire1764991000001,
  BaseOnlyVersions1765000000001,
  SummaryDrafts1765000000002,
  CreateClinicSettings1765010000001,
  ClientPreferredName1765010000002,
];

/** TypeORM options for the app, the CLI, migrate.js, seed.js and the HTTP tests. Never synchronize. */
export function dataSourceOptions(databaseUrl: string): DataSourceOptions {
  return {
    type: 'postgres',
    url: databaseUrl,
    entities,
    migrations,
    migrationsTableName: 'typeorm_migrations',
    migrationsTransactionMode: 'each',
    synchronize: false,
    // gen_random_uuid() is built into PostgreSQL 13+, so no extension has to be created.
    uuidExtension: 'pgcrypto',
    installExtensions: false,
    // Not 'error': TypeORM would log failed queries with their parameters (e.g. a password hash on a
    // duplicate e-mail). Unexpected failures are logged by ApiExceptionFilter instead.
    logging: ['warn', 'migration'],
    extra: {
      max: 10,
      // Fail fast when the server is down instead of queueing requests for ever.
      connectionTimeoutMillis: 5_000,
      application_name: 'keyloom-api',
    },
  };
}
