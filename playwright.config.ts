import { defineConfig, devices } from '@playwright/test';
import { chromiumArgs, chromiumPath } from './tests/support/chromium';

const PORT = Number(process.env.E2E_PORT ?? 4317);
// One data folder per port, so two runs on one machine never share a database. Workers inherit it.
process.env.E2E_DATA_DIR = `.tmp/e2e-${PORT}`;

export default defineConfig({
  testDir: 'tests/e2e',
  testMatch: '**/*.spec.ts',
  // One server and one database for the run: tests that share a target must not race each other.
  workers: 1,
  fullyParallel: false,
  forbidOnly: !!process.env.CI,
  retries: 0,
  timeout: 60_000,
  reporter: [['list']],
  outputDir: '.tmp/test-results',
  use: {
    baseURL: `http://127.0.0.1:${PORT}`,
    ...devices['Pixel 7'],
    // The Pixel preset would pick Playwright's own browser; ours is Debian's.
    browserName: 'chromium',
    launchOptions: { executablePath: chromiumPath(), args: chromiumArgs },
    serviceWorkers: 'allow',
    screenshot: 'only-on-failure',
    trace: 'off',
  },
  webServer: {
    command: 'node_modules/.bin/tsx tests/e2e/support/startTestServer.ts',
    url: `http://127.0.0.1:${PORT}/api/health`,
    reuseExistingServer: false,
    timeout: 60_000,
    env: {
      PORT: String(PORT),
      HOST: '127.0.0.1',
      DATA_DIR: process.env.E2E_DATA_DIR,
      MAIL_CATCHER_PORT: '0',
    },
    stdout: 'ignore',
    stderr: 'pipe',
  },
});
