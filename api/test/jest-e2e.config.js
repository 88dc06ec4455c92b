// HTTP tests: test/*.e2e-spec.ts against a real PostgreSQL given by DATABASE_URL
// (the tests drop and re-migrate that database). Run with --runInBand.
module.exports = {
  rootDir: '..',
  testRegex: 'test/.*\\.e2e-spec\\.ts$',
  moduleFileExtensions: ['js', 'json', 'ts'],
  transform: { '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.json' }] },
  moduleNameMapper: { '^@keyloom/shared$': '<rootDir>/../shared/src/index.ts' },
  testEnvironment: 'node',
  testTimeout: 30000,
};
