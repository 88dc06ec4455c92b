// @keyloom/shared: the zod schemas and types both the client and the API use,
// and the model engine (plain TypeScript, no Node-only API).
export * from './schemas/roles';
export * from './schemas/auth.schema';
export * from './schemas/users.schema';
export * from './schemas/email';
export * from './schemas/common';
export * from './schemas/clients.schema';
export * from './schemas/consents.schema';
export * from './schemas/samples.schema';
export * from './schemas/audit.schema';
export * from './engine/index';
export * from './engine/search/index';
export * from './engine/evaluation/index';
export * from './engine/words/index';
export * from './engine/profile/index';
export * from './vocabulary/index';
export * from './samples/index';
export * from './schemas/profile-settings.schema';
export * from './schemas/profile-report.schema';
export * from './schemas/profile-versions.schema';
export * from './schemas/profile-exports.schema';
export * from './schemas/summaries.schema';
export * from './schemas/trials.schema';
export * from './keyboard/index';
export * from './trials/index';
export * from './workspace/workspace-root';
export * from './schemas/vocabulary.schema';
