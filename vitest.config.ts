import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    setupFiles: ['test/support/fast-check-seed.ts'],
    // The browser suite has its own config (vitest.browser.config.ts): it builds a page and starts Chromium.
    exclude: ['test/browser/**', '**/node_modules/**'],
    testTimeout: 60_000,
  },
});
