import { defineConfig, devices } from '@playwright/test';

const port = Number(process.env.E2E_PORT ?? 8091);

/** Browser tests run in Debian's chromium (never a downloaded browser) against a server on loopback. */
export default defineConfig({
  testDir: 'tests/e2e',
  outputDir: process.env.TEST_SLOT ? `.data/test-results-${process.env.TEST_SLOT}` : '.data/test-results',
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  use: {
    baseURL: `http://127.0.0.1:${port}`,
    trace: 'retain-on-failure',
    screenshot: 'only-on-failure',
    launchOptions: {
      executablePath: '/usr/bin/chromium',
      args: [
        '--no-sandbox',
        '--disable-gpu',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
      ],
    },
  },
  projects: [{ name: 'chromium', use: { ...devices['Desktop Chrome'] } }],
  webServer: {
    command: 'node_modules/.bin/tsx tests/e2e/server.ts',
    url: `http://127.0.0.1:${port}/api/health`,
    reuseExistingServer: false,
    timeout: 120_000,
    stdout: 'ignore',
    stderr: 'pipe',
    env: { E2E_PORT: String(port), E2E_MAIL_PORT: process.env.E2E_MAIL_PORT ?? '1027' },
  },
});
