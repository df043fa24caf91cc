import { test, expect } from './support/fixtures';

// A plot that only draws (the Scan and Hazard plots) is taken over once its code has loaded, after the
// page answers input (src/lib/ui/island/lazyPart.ts): its code and the plotting library stay out of
// what the page loads before then. Each marker is a string only that code holds.
const pages = [
	{ path: '/scan/', markers: ['scan-transmitted', 'LayerCake'], plot: 'scan-transmitted' },
	{ path: '/hazard/', markers: ['hz-series-', 'LayerCake'], plot: 'hz-series-0' }
];

for (const p of pages) {
	test(`${p.path}: the drawing-only plot's code loads after the page answers input, and the plot is then taken over`, async ({ page }) => {
		await page.addInitScript(() => {
			const w = window as unknown as { __atReady: string[] };
			new MutationObserver((_, obs) => {
				if (!document.documentElement?.hasAttribute('data-ready')) return;
				obs.disconnect();
				w.__atReady = performance.getEntriesByType('resource').map((e) => e.name).filter((n) => n.endsWith('.js'));
			}).observe(document, { subtree: true, attributes: true, attributeFilter: ['data-ready'] });
		});
		await page.goto(p.path);
		const before = await page.evaluate(() => (window as unknown as { __atReady: string[] }).__atReady);
		expect(before.length).toBeGreaterThan(3);
		const texts = await page.evaluate((urls) => Promise.all(urls.map((u) => fetch(u).then((r) => r.text()))), before);
		for (const m of p.markers) expect(texts.filter((t) => t.includes(m)), `"${m}" loaded before the page answered input`).toEqual([]);
		// Then loaded, and the plot taken over (the mark the layout sets when the last island is).
		await expect.poll(() => page.evaluate(() => performance.getEntriesByName('beamwright:taken-over').length)).toBe(1);
		const all = await page.evaluate(() => performance.getEntriesByType('resource').map((e) => e.name).filter((n) => n.endsWith('.js')));
		const allTexts = await page.evaluate((urls) => Promise.all(urls.map((u) => fetch(u).then((r) => r.text()))), all);
		for (const m of p.markers) expect(allTexts.some((t) => t.includes(m))).toBe(true);
		await expect(page.getByTestId(p.plot)).toBeVisible();
	});
}

// Their styles cannot come with their code (it loads later): with scripts blocked the prerendered plots
// must still be laid out and drawn as the app draws them (src/lib/ui/plot/plots.css).
for (const p of [
	{ path: '/scan/', figure: 'scan-plot', curve: 'scan-transmitted' },
	{ path: '/hazard/', figure: 'hz-plot', curve: 'hz-series-0' }
]) {
	test(`${p.path}: with scripts blocked the prerendered plot is styled (size, layout, unfilled curve)`, async ({ page }) => {
		await page.route('**/*.js', (r) => r.abort());
		await page.goto(p.path, { waitUntil: 'load' });
		const style = await page.evaluate(({ figure, curve }) => {
			const fig = document.querySelector(`[data-testid="${figure}"]`)!;
			const svg = fig.querySelector('svg')!;
			const path = document.querySelector(`[data-testid="${curve}"]`)!;
			const tick = fig.querySelector('.bw-axis text')!;
			return { height: getComputedStyle(fig).height, svgPosition: getComputedStyle(svg).position, fill: getComputedStyle(path).fill, tickSize: getComputedStyle(tick).fontSize };
		}, p);
		expect(style).toEqual({ height: '340px', svgPosition: 'absolute', fill: 'none', tickSize: '12px' });
	});
}
