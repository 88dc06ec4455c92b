import { defineConfig } from 'vitest/config';

// Engine tests live beside the code; those that need the Brown corpus, the base model or the demo
// samples live in the corpora workspace (@keyloom/corpora), which depends on this package.
export default defineConfig({
  test: {
    include: ['src/**/*.test.ts'],
    environment: 'node',
    testTimeout: 60_000,
    // Hooks build models too (a profile trained once for a whole file): same headroom as a test on
    // a 2-core machine shared with other work.
    hookTimeout: 60_000,
  },
});
