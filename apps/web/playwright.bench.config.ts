import { defineConfig } from '@playwright/test';
import base from './playwright.config';

// `npm run bench`'s browser step (infra/bench.mjs starts the app first): e2e/bench/*.bench.ts in Debian's
// Chromium. Frames are not held to the display's 60 Hz (--disable-frame-rate-limit, --disable-gpu-vsync), so
// a frame takes as long as its work and the figures measure the drawing, not the wait for the next vsync.
export default defineConfig({
  ...base,
  testDir: './e2e/bench',
  testMatch: '*.bench.ts',
  outputDir: './test-results/bench',
  timeout: 180_000,
  use: {
    ...base.use,
    launchOptions: {
      ...base.use?.launchOptions,
      args: [...(base.use?.launchOptions?.args ?? []), '--disable-frame-rate-limit', '--disable-gpu-vsync'],
    },
  },
});
