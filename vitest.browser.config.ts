import { defineConfig } from 'vitest/config';

// The browser suite: the example page built by vite and opened in a headless Chromium. Slow, so it
// is kept out of `npm test`; `npm run test:browser` (and CI) run it.
export default defineConfig({
  test: {
    include: ['test/browser/**/*.test.ts'],
    testTimeout: 60_000,
    hookTimeout: 120_000,
  },
});
