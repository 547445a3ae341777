import os from 'node:os';
import path from 'node:path';

import { defineConfig, devices } from '@playwright/test';

import { envVar } from './server/config.ts';

/**
 * E2E against the real product: `npm start`'s own script on a free port with a throwaway data
 * folder (PostgreSQL, SMTP and S3 fakes included), in Debian's Chromium with software WebGL.
 * The web app is built beforehand by `npm test` (server/scripts/test-all.ts) or `npm run build:web`.
 */
// Chosen once in the runner process; its test workers inherit it through the environment.
process.env.E2E_PORT ??= String(20000 + Math.floor(Math.random() * 20000));
const port = Number(process.env.E2E_PORT);
const dataDir = envVar('E2E_DATA_DIR') ?? path.join(os.tmpdir(), `hn-e2e-${port}`);
process.env.E2E_DATA_DIR = dataDir;

// Headless Chromium without a GPU: WebGL 2 through SwiftShader; no background network calls.
export const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--use-angle=swiftshader',
  '--enable-unsafe-swiftshader',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export default defineConfig({
  testDir: './e2e',
  testMatch: '**/*.spec.ts',
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  // Per run, so concurrent runs do not delete each other's artifacts.
  outputDir: `test-results/e2e/${port}`,
  reporter: [['list'], ['json', { outputFile: 'test-results/e2e-report.json' }]],
  use: {
    baseURL: `http://127.0.0.1:${port}`,
    trace: 'retain-on-failure',
    screenshot: 'only-on-failure',
    launchOptions: { executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS },
  },
  projects: [{ name: 'chromium', use: { ...devices['Desktop Chrome'], launchOptions: { executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS } } }],
  webServer: {
    command: 'node --import tsx server/scripts/start.ts',
    gracefulShutdown: { signal: 'SIGTERM', timeout: 10_000 },
    url: `http://127.0.0.1:${port}/healthz`,
    reuseExistingServer: false,
    timeout: 180_000,
    stdout: 'pipe',
    env: {
      PORT: String(port),
      HOLONAUT_DATA_DIR: dataDir,
      HOLONAUT_THROWAWAY: '1',
      SKIP_WEB_BUILD: '1',
      PUBLIC_URL: `http://127.0.0.1:${port}`,
      LOG_LEVEL: 'warn',
      // Many sign-ins from one address during the suite.
      SIGNIN_RATE_LIMIT: '500',
      // Every saved version queues a robustness run; smaller runs keep the suite's worker from crowding the 2 cores.
      ROBUSTNESS_SAMPLES: '200',
    },
  },
});
