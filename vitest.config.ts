import { defineConfig } from 'vitest/config';

// Node-side tests: the engine and CLI, the server against the test MariaDB, cross-package flows.
// The console's unit tests run under `ng test` (console/**/*.spec.ts).
export default defineConfig({
  test: {
    include: ['cli/**/*.test.ts', 'server/**/*.test.ts', 'test/**/*.test.ts'],
    environment: 'node',
    pool: 'forks',
    testTimeout: 30_000,
    hookTimeout: 120_000,
    maxWorkers: 2,
  },
});
