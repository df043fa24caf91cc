import { defineConfig } from '@playwright/test';
import { existsSync } from 'node:fs';

const debianChromium = '/usr/bin/chromium';
// Port of the test server; set BW_E2E_PORT to run several checkouts side by side.
const port = Number(process.env.BW_E2E_PORT ?? 4317);

export default defineConfig({
	testDir: 'tests/e2e',
	timeout: 60_000,
	workers: 2,
	reporter: [['list']],
	webServer: {
		command: `node scripts/serve.js --port ${port} --quiet`,
		port,
		reuseExistingServer: !process.env.CI
	},
	use: {
		baseURL: `http://localhost:${port}`,
		launchOptions: {
			executablePath: existsSync(debianChromium) ? debianChromium : undefined,
			args: [
				'--no-sandbox',
				'--disable-gpu',
				'--disable-background-networking',
				'--disable-component-update',
				'--disable-sync',
				'--no-first-run'
			]
		}
	}
});
