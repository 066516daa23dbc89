import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

export default defineConfig({
  resolve: {
    alias: { '@': fileURLToPath(new URL('./', import.meta.url)) },
  },
  test: {
    include: ['tests/unit/**/*.test.ts', 'tests/integration/**/*.test.ts', 'lib/**/*.test.ts'],
    environment: 'node',
    setupFiles: ['tests/helpers/setup-env.ts'],
    // Integration files each open their own SQLite file and SMTP fake; two workers fit two cores.
    pool: 'forks',
    maxWorkers: 2,
    testTimeout: 20000,
    hookTimeout: 30000,
  },
});
