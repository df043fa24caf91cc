import { defineConfig } from '@playwright/test';
import { existsSync } from 'node:fs';

const debianChromium = '/usr/bin/chromium';

export default defineConfig({
	testDir: 'tests/e2e',
	timeout: 60_000,
	workers: 2,
	reporter: [['list']],
	webServer: {
		command: 'node scripts/serve.js --port 4317 --quiet',
		port: 4317,
		reuseExistingServer: !process.env.CI
	},
	use: {
		baseURL: 'http://localhost:4317',
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
