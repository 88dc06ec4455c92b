import { defineConfig } from 'vitest/config';

// Engine tests live beside the code; the base-corpus tests live in ../corpora.
export default defineConfig({
  test: {
    include: ['src/**/*.test.ts', '../corpora/**/*.test.ts'],
    environment: 'node',
    testTimeout: 60_000,
  },
});
