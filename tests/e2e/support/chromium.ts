/**
 * How the browser tests start Chromium: Debian's build where it is installed (Playwright cannot download
 * its own here), Playwright's otherwise; no sandbox (containers), no GPU, no background traffic.
 * Used by playwright.config.ts and by specs that add flags of their own (the fake camera).
 */
import { existsSync } from 'node:fs';

const debianChromium = '/usr/bin/chromium';

export function chromiumLaunch(extraArgs: string[] = []) {
	return {
		executablePath: existsSync(debianChromium) ? debianChromium : undefined,
		args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', ...extraArgs]
	};
}
