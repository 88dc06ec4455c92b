import { defineConfig } from 'vitest/config';

// Engine tests live beside the code; the base-corpus tests live in ../corpora.
export default defineConfig({
  test: {
    include: ['src/**/*.test.ts', '../corpora/**/*.test.ts'],
    environment: 'node',
    testTimeout: 60_000,
    // Hooks build models too (a profile trained once for a whole file): same headroom as a test on
    // a 2-core machine shared with other work.
    hookTimeout: 60_000,
  },
});
