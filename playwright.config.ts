import { defineConfig } from '@playwright/test';

const port = Number(process.env.E2E_PORT ?? 3100);

/**
 * Browser tests drive Debian's Chromium (never a downloaded browser) against the built client and
 * a server on a fresh demo database. `npm run test:e2e` builds the client first.
 */
export default defineConfig({
  testDir: 'tests/e2e',
  testMatch: '**/*.spec.ts',
  // Generous: several suites share a two-core machine, and no test may depend on its speed.
  timeout: 180_000,
  expect: { timeout: 30_000 },
  fullyParallel: false,
  workers: 1,
  retries: 0,
  reporter: [['list']],
  outputDir: 'test-results',
  use: {
    baseURL: `http://localhost:${port}`,
    screenshot: 'only-on-failure',
    trace: 'off',
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
      args: [
        '--headless',
        '--no-sandbox',
        '--disable-gpu',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
        '--no-first-run',
      ],
    },
  },
  webServer: {
    command: 'tsx tests/e2e/support/server.ts',
    url: `http://localhost:${port}/api/health`,
    reuseExistingServer: false,
    timeout: 60_000,
    env: { E2E_PORT: String(port) },
    stdout: 'ignore',
    stderr: 'pipe',
  },
});
