import { defineConfig } from '@playwright/test';

const executablePath = process.env.CHROMIUM_PATH ?? '/usr/lib/chromium/chromium';
/** The preview server's port; set FALL_LINE_E2E_PORT when another worktree's tests hold 4173. */
const port = Number(process.env.FALL_LINE_E2E_PORT ?? 4173);

export default defineConfig({
  testDir: 'e2e',
  timeout: 120_000,
  fullyParallel: false,
  workers: 1,
  reporter: [['list']],
  outputDir: 'test-results',
  use: {
    baseURL: `http://localhost:${port}`,
    browserName: 'chromium',
    viewport: { width: 1400, height: 900 },
    launchOptions: {
      executablePath,
      args: [
        '--no-sandbox',
        '--disable-gpu',
        '--disable-quic',
        '--no-first-run',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
        '--disable-dev-shm-usage',
      ],
    },
  },
  webServer: {
    command: `npx vite build && npx vite preview --port ${port} --strictPort`,
    url: `http://localhost:${port}`,
    timeout: 60_000,
    reuseExistingServer: false,
  },
});
