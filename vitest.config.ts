import { fileURLToPath } from 'node:url'
import { defineConfig } from 'vitest/config'

// `#shared` as in Nuxt, so tests import shared code the way the app and the server do.
const alias = { '#shared': fileURLToPath(new URL('./shared', import.meta.url)) }

// Two projects: pure unit tests, and API tests against one built server + real PostgreSQL
// (started once by tests/api/global-setup.ts, so the app is built once per run, not per file).
export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.spec.ts'],
          environment: 'node',
        },
      },
      {
        resolve: { alias },
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
