#!/usr/bin/env node
// Screenshots of the bench for the README: light, dark, greyscale and a 375 px phone.
// Usage: npx vite build && node scripts/serve.js --port 4317 & node scripts/screens.js [baseURL] [outDir]
import { chromium } from '@playwright/test';
import { existsSync, mkdirSync } from 'node:fs';

const base = process.argv[2] ?? 'http://localhost:4317';
const out = process.argv[3] ?? 'static/screens';
mkdirSync(out, { recursive: true });
const shots = [
	{ file: 'bench-light.png', width: 1280, theme: 'light' },
	{ file: 'bench-dark.png', width: 1280, theme: 'dark' },
	{ file: 'bench-greyscale.png', width: 1280, theme: 'light', grey: true },
	{ file: 'bench-phone-375.png', width: 375, theme: 'light' }
];
const browser = await chromium.launch({ executablePath: existsSync('/usr/bin/chromium') ? '/usr/bin/chromium' : undefined, args: ['--no-sandbox'] });
for (const s of shots) {
	const page = await browser.newPage({ viewport: { width: s.width, height: 900 }, deviceScaleFactor: 1 });
	await page.goto(base + '/');
	await page.evaluate((t) => {
		localStorage.clear();
		localStorage.setItem('beamwright.theme', t);
	}, s.theme);
	await page.goto(base + '/');
	await page.evaluate((t) => (document.documentElement.dataset.theme = t), s.theme);
	await page.getByTestId('caustic-plot').waitFor();
	if (s.grey) await page.addStyleTag({ content: 'html { filter: grayscale(1); }' });
	await page.waitForTimeout(300);
	const wide = await page.evaluate(() => {
		const w = window.innerWidth;
		return [...document.querySelectorAll('body *')].filter((e) => e.getBoundingClientRect().right > w + 1).slice(0, 5).map((e) => e.tagName + '.' + e.className);
	});
	if (wide.length) console.log(`${s.file}: wider than the viewport:`, wide.join(', '));
	await page.screenshot({ path: `${out}/${s.file}`, fullPage: s.width < 500 });
	await page.close();
	console.log(`${out}/${s.file}`);
}
await browser.close();
