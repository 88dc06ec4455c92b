/// <reference types="node" />
import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vitest/config';

// The shared package is consumed from its TypeScript sources (no build step for the client).
const sharedSrc = fileURLToPath(new URL('../shared/src/index.ts', import.meta.url));
const clientSrc = fileURLToPath(new URL('./src', import.meta.url));
const apiPort = process.env.API_PORT ?? '3000';

export default defineConfig({
  plugins: [react()],
  resolve: {
    alias: {
      '@keyloom/shared': sharedSrc,
      '@': clientSrc,
    },
  },
  server: {
    host: '127.0.0.1',
    port: 5173,
    strictPort: true,
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
  },
  preview: { host: '127.0.0.1', port: 4173, strictPort: true },
  build: { sourcemap: true },
  test: {
    environment: 'jsdom',
    setupFiles: ['./src/testing/setup-tests.ts'],
    include: ['src/**/*.test.{ts,tsx}'],
    restoreMocks: true,
    unstubGlobals: true,
  },
});
