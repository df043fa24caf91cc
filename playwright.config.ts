import { defineConfig } from '@playwright/test';
import { chromiumLaunch } from './tests/e2e/support/chromium';

// Port of the test server; set BW_E2E_PORT to run several checkouts side by side.
const port = Number(process.env.BW_E2E_PORT ?? 4317);

export default defineConfig({
	testDir: 'tests/e2e',
	// Per test: each stays well under 20 s on an idle 2-core machine; the limit leaves room for a busy one.
	timeout: 60_000,
	// One worker: Chromium already runs several processes per page, so on 2 cores two workers gain
	// nothing (measured idle: 93 tests in 5.7 min with one worker and with two). BW_E2E_WORKERS overrides.
	workers: Number(process.env.BW_E2E_WORKERS ?? 1),
	reporter: [['list']],
	webServer: {
		command: `node scripts/serve.js --port ${port} --quiet`,
		port,
		reuseExistingServer: !process.env.CI
	},
	use: {
		// Each test is a fresh browser context; a service worker installing there would download and
		// cache the whole build every time. Only the specs about offline use and updates allow it.
		serviceWorkers: 'block',
		baseURL: `http://localhost:${port}`,
		launchOptions: chromiumLaunch()
	}
});
