import '@testing-library/jest-dom/vitest';
import { cleanup, configure } from '@testing-library/react';
import { afterEach } from 'vitest';
import { resetCsrfToken } from '@/lib/api-client';

// Pages are lazy chunks that vitest transforms on first import: allow for that.
configure({ asyncUtilTimeout: 4000 });

// jsdom lacks ResizeObserver, which Headless UI's anchored menus use to follow their button.
if (!('ResizeObserver' in globalThis)) {
  globalThis.ResizeObserver = class {
    observe() {}
    unobserve() {}
    disconnect() {}
  };
}

afterEach(() => {
  cleanup();
  // The token cache is module state: every test starts without one.
  resetCsrfToken();
});
