// The same rules as the shared package (plain TypeScript, no framework).
export { default } from '../shared/eslint.config.mjs';
