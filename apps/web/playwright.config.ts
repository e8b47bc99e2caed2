import { defineConfig } from '@playwright/test';

// The app (API serving apps/web/dist) is started by the root `npm test` / `npm start`; no webServer here.
const baseURL = process.env.ROUNDBOOK_URL ?? 'http://127.0.0.1:8080';

export default defineConfig({
  testDir: './e2e',
  outputDir: './test-results',
  workers: 1,
  fullyParallel: false,
  retries: 0,
  timeout: 30_000,
  expect: { timeout: 10_000 },
  reporter: 'list',
  use: {
    baseURL,
    browserName: 'chromium',
    viewport: { width: 1280, height: 800 },
    trace: 'retain-on-failure',
    // page.route cannot see requests a service worker answers (Playwright's docs): specs that stand in for the
    // API run without the app's worker; the offline spec allows it (the board spec's sample mail failed so).
    serviceWorkers: 'block',
    launchOptions: {
      executablePath: '/usr/bin/chromium',
      args: [
        '--headless',
        '--no-sandbox',
        '--disable-gpu',
        '--disable-quic',
        '--no-first-run',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
      ],
    },
  },
});
