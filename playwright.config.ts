import { defineConfig } from '@playwright/test'

const PORT = 3100

export default defineConfig({
  testDir: 'tests/e2e',
  timeout: 60_000,
  workers: 1,
  reporter: [['list']],
  use: {
    baseURL: `http://localhost:${PORT}`,
    screenshot: 'only-on-failure',
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium',
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    },
  },
  webServer: {
    // A fresh database and mail folder for every run; the app must already be built (scripts/test.sh does it).
    command: 'rm -rf data/e2e && node --import tsx scripts/demo.ts',
    url: `http://localhost:${PORT}/sign-in`,
    reuseExistingServer: false,
    timeout: 300_000,
    env: {
      PORT: String(PORT),
      SKIP_BUILD: '1',
      DATABASE_URL: 'file:./data/e2e/e2e.db',
      MAIL_FAKE_DIR: 'data/e2e/mail',
      SMTP_PORT: '2626',
      APP_URL: `http://localhost:${PORT}`,
    },
  },
})
