import { type Page } from '@playwright/test';
import { test, expect } from './support/fixtures';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';

// axe-core (Deque, https://github.com/dequelabs/axe-core) checks WCAG 2.x rules in the page itself.
const axeSource = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

const pages = [
	{ path: '/', ready: 'caustic-plot' },
	{ path: '/match/', ready: null },
	{ path: '/measure/', ready: null },
	{ path: '/hazard/', ready: null },
	{ path: '/scan/', ready: null },
	{ path: '/hazard-report/', ready: null }
];

async function open(page: Page, path: string, theme: 'light' | 'dark', ready: string | null) {
	// Each test starts with empty storage (a fresh context); the theme is chosen before the page's own
	// scripts run, so one load is enough.
	await page.addInitScript((t) => localStorage.setItem('beamwright.theme', t), theme);
	await page.goto(path);
	await page.evaluate((t) => (document.documentElement.dataset.theme = t), theme);
	if (ready) await expect(page.getByTestId(ready)).toBeVisible();
	await expect(page.locator('main')).toBeVisible();
}

async function axeViolations(page: Page) {
	if (!(await page.evaluate(() => 'axe' in window))) await page.addScriptTag({ content: axeSource });
	return page.evaluate(async () => {
		// @ts-expect-error axe is injected above
		const r = await window.axe.run(document, { resultTypes: ['violations'] });
		return (r.violations as Array<{ id: string; help: string; nodes: Array<{ target: string[] }> }>).map((v) => `${v.id}: ${v.help} — ${v.nodes.map((n) => n.target.join(' ')).slice(0, 4).join(', ')}`);
	});
}

// Both themes on one page load: the page's own theme button switches it, as the user does.
for (const p of pages) {
	test(`no axe violations on ${p.path} (light and dark)`, async ({ page }) => {
		await open(page, p.path, 'light', p.ready);
		expect(await axeViolations(page), 'light').toEqual([]);
		await page.getByRole('button', { name: 'Switch to dark theme' }).click();
		await expect(page.locator('html')).toHaveAttribute('data-theme', 'dark');
		expect(await axeViolations(page), 'dark').toEqual([]);
	});
}

test('no axe violations on the bench with an element open, an error shown and the cursor moved', async ({ page }) => {
	await open(page, '/', 'light', 'caustic-plot');
	await page.getByTestId('element-L2').getByRole('button', { name: /L2/ }).first().click();
	await page.getByTestId('el-L2-f').fill('abc');
	await page.getByTestId('cursor-z').fill('500');
	expect(await axeViolations(page)).toEqual([]);
});

test('at 375 px wide no page scrolls sideways', async ({ page }) => {
	await page.setViewportSize({ width: 375, height: 800 });
	for (const p of pages) {
		await open(page, p.path, 'light', p.ready);
		const widths = await page.evaluate(() => ({ doc: document.documentElement.scrollWidth, body: document.body.scrollWidth, view: window.innerWidth }));
		expect(widths.doc, `${p.path} page width`).toBeLessThanOrEqual(widths.view);
		expect(widths.body, `${p.path} body width`).toBeLessThanOrEqual(widths.view);
		// Panels clip what overflows them, so also check that no table or plot is cut: each either fits
		// the viewport or sits in a region that scrolls sideways.
		const cut = await page.evaluate(() => {
			const w = window.innerWidth;
			return [...document.querySelectorAll('main table, main svg')]
				.filter((e) => {
					if (e.getBoundingClientRect().right <= w + 1) return false;
					for (let a = e.parentElement; a; a = a.parentElement) if (['auto', 'scroll'].includes(getComputedStyle(a).overflowX)) return false;
					return true;
				})
				.map((e) => (e.getAttribute('data-testid') ?? e.tagName) + ' ' + Math.round(e.getBoundingClientRect().right) + ' px');
		});
		expect(cut, `${p.path}: cut off at 375 px`).toEqual([]);
	}
});

test('at tablet width (768 px) no page scrolls sideways', async ({ page }) => {
	await page.setViewportSize({ width: 768, height: 1000 });
	for (const p of pages) {
		await open(page, p.path, 'dark', p.ready);
		expect(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth), p.path).toBe(true);
	}
});
