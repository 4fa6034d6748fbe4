import { defineConfig } from '@playwright/test';
import { CHROMIUM_ARGS } from './chromium-args.mjs';

// Debian's Chromium, never a downloaded browser. `npm test` starts the server and sets BASE_URL.
const chromiumArgs = ['--headless', ...CHROMIUM_ARGS];

export default defineConfig({
  testDir: 'e2e',
  outputDir: '../test-results',
  timeout: 60_000,
  expect: { timeout: 15_000 },
  workers: 2,
  // One retry: a busy two-core machine can push a long flow past its timeout; a real failure fails twice.
  retries: 1,
  reporter: [['list']],
  use: {
    baseURL: process.env.BASE_URL ?? 'http://127.0.0.1:8080',
    browserName: 'chromium',
    launchOptions: { executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', args: chromiumArgs },
    trace: 'off',
    // The offline worker would answer page loads from its cache; only the offline tests want it.
    serviceWorkers: 'block',
    screenshot: 'only-on-failure',
  },
  projects: [
    { name: 'phone', use: { viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true } },
    { name: 'wide', use: { viewport: { width: 1440, height: 900 } } },
  ],
});
