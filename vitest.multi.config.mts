import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

// Several processes: nginx + two `npm start` + PostgreSQL + the S3 fake (tests/helpers/stack.ts),
// on a production build (built first when .next has none).
export default defineConfig({
  resolve: {
    alias: { '@': fileURLToPath(new URL('./', import.meta.url)) },
  },
  test: {
    include: ['tests/multi/**/*.test.ts'],
    environment: 'node',
    fileParallelism: false,
    testTimeout: 60_000,
    hookTimeout: 600_000,
  },
});
