import { defineConfig } from '@playwright/test'

// Debian's chromium (never a downloaded browser); the server is the built app on its own fresh
// database, started by tests/support/serve-e2e.ts. Run through `npm test -- e2e`.
const port = Number(process.env.E2E_PORT || 3999)

export default defineConfig({
  testDir: 'tests/e2e',
  outputDir: `test-results${process.env.EDDY_BUILD_SLOT ? `-${process.env.EDDY_BUILD_SLOT}` : ''}`,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  fullyParallel: false,
  workers: 1,
  retries: process.env.CI ? 1 : 0,
  reporter: [['list']],
  use: {
    baseURL: `http://127.0.0.1:${port}`,
    viewport: { width: 1280, height: 860 },
    screenshot: 'only-on-failure',
    trace: 'off',
    launchOptions: {
      executablePath: '/usr/bin/chromium',
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
        '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    },
  },
  webServer: {
    command: `npx tsx tests/support/serve-e2e.ts ${port}`,
    url: `http://127.0.0.1:${port}/login`,
    timeout: 120_000,
    reuseExistingServer: false,
    stdout: 'ignore',
    stderr: 'pipe',
  },
})
