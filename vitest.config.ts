import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['tests/{core,server,client,lint}/**/*.test.ts', 'tests/{core,server,client}/**/*.test.tsx'],
    environment: 'node',
    // Server tests build a fresh SQLite file per test file; keep files isolated.
    pool: 'forks',
    testTimeout: 20_000,
    hookTimeout: 20_000,
  },
});
