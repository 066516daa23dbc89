import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

// Browser journeys: one production build served by `next start`, driven by Debian's chromium.
export default defineConfig({
  resolve: {
    alias: { '@': fileURLToPath(new URL('./', import.meta.url)) },
  },
  test: {
    include: ['tests/e2e/**/*.e2e.ts'],
    environment: 'node',
    globalSetup: ['tests/e2e/global-setup.ts'],
    // One server and one browser at a time fit two cores; files share the seeded database.
    fileParallelism: false,
    testTimeout: 60_000,
    hookTimeout: 60_000,
    // What the browser waits for arrives when the server gets to it: on a busy machine that can take
    // seconds, so polls wait up to 20 s (they return as soon as the condition holds).
    expect: { poll: { timeout: 20_000, interval: 100 } },
  },
});
