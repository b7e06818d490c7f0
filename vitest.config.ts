import { defineConfig } from 'vitest/config'

// Two projects: pure unit tests, and API tests against one built server + real PostgreSQL
// (started once by tests/api/global-setup.ts, so the app is built once per run, not per file).
export default defineConfig({
  test: {
    projects: [
      {
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.spec.ts'],
          environment: 'node',
        },
      },
      {
        test: {
          name: 'api',
          include: ['tests/api/**/*.spec.ts'],
          environment: 'node',
          globalSetup: ['tests/api/global-setup.ts'],
          testTimeout: 30_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
})
