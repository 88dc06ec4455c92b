import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

// @keyloom/shared from its sources (as tsconfig.json's paths say), so no build is needed first.
const sharedSrc = fileURLToPath(new URL('../shared/src', import.meta.url));

export default defineConfig({
  resolve: {
    alias: [
      { find: /^@keyloom\/shared$/, replacement: `${sharedSrc}/index.ts` },
      { find: /^@keyloom\/shared\/src\//, replacement: `${sharedSrc}/` },
    ],
  },
  test: {
    include: ['src/**/*.test.ts'],
    environment: 'node',
    testTimeout: 60_000,
    // Hooks build models too (a profile trained once for a whole file): same headroom as a test on
    // a 2-core machine shared with other work.
    hookTimeout: 60_000,
  },
});
