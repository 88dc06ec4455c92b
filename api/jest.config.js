// Unit tests: *.spec.ts beside the code, no database.
// @keyloom/shared is mapped to its TypeScript source so tests do not need shared/dist.
module.exports = {
  rootDir: 'src',
  testRegex: '.*\\.spec\\.ts$',
  moduleFileExtensions: ['js', 'json', 'ts'],
  transform: { '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/../tsconfig.json' }] },
  moduleNameMapper: { '^@keyloom/shared$': '<rootDir>/../../shared/src/index.ts' },
  testEnvironment: 'node',
};
