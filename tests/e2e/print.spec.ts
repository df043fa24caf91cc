import { type Page } from '@playwright/test';
import { test, expect } from './support/fixtures';

// 170 mm at 96 px per inch: the printable width the summary is laid out for (A4 and Letter less margins).
const PRINT_WIDTH_PX = Math.floor((170 / 25.4) * 96);

async function layoutProblems(page: Page, rootSel: string) {
	return page.evaluate((sel) => {
		const root = document.querySelector(sel)!;
		const box = root.getBoundingClientRect();
		const out: string[] = [];
		// Nothing wider than the summary (cut on paper).
		for (const e of root.querySelectorAll('table, svg, figure, section, header, dl')) {
			const r = e.getBoundingClientRect();
			if (r.width > 0 && r.right > box.right + 1) out.push(`${e.tagName} ${e.getAttribute('data-testid') ?? ''} ends at ${Math.round(r.right)} > ${Math.round(box.right)}`);
		}
		// Blocks follow one another without overlapping.
		const blocks = [...root.children].map((c) => c.getBoundingClientRect()).filter((r) => r.height > 0);
		for (let i = 1; i < blocks.length; i++) if (blocks[i].top < blocks[i - 1].bottom - 1) out.push(`block ${i} overlaps block ${i - 1}`);
		return out;
	}, rootSel);
}

function pdfPages(pdf: Buffer): number {
	return (pdf.toString('latin1').match(/\/Type\s*\/Page[^s]/g) ?? []).length;
}

test.beforeEach(async ({ page }) => {
	await page.goto('/hazard/');
	await page.evaluate(() => localStorage.clear());
});

test('the printable summary fits A4 and Letter: inputs included, nothing cut or overlapping, review on its own page', async ({ page }) => {
	await page.setViewportSize({ width: PRINT_WIDTH_PX + 40, height: 1000 });
	await page.goto('/hazard-report/');
	await expect(page.getByTestId('hz-plot')).toBeVisible();
	await page.emulateMedia({ media: 'print' });
	await expect(page.getByText('Inputs as entered')).toBeVisible();
	expect(await layoutProblems(page, '[data-testid="hz-report"]')).toEqual([]);
	expect(await page.getByTestId('hz-review').evaluate((e) => getComputedStyle(e).breakBefore)).toBe('page');
	for (const format of ['A4', 'Letter'] as const) {
		const pdf = await page.pdf({ format, preferCSSPageSize: false });
		expect(pdfPages(pdf), format).toBeGreaterThanOrEqual(2);
	}
});

test('printing the Hazard page prints the same summary', async ({ page }) => {
	await page.goto('/hazard-report/');
	const reportInputs = await page.locator('[data-testid="hz-report"] table.kv').first().innerText();
	await page.goto('/hazard/');
	await expect(page.getByTestId('hz-print-summary')).toHaveCount(0);
	await page.emulateMedia({ media: 'print' });
	await page.evaluate(() => window.dispatchEvent(new Event('beforeprint')));
	const summary = page.getByTestId('hz-print-summary');
	await expect(summary).toBeVisible();
	await expect(summary.getByText('Review by the laser safety officer')).toBeVisible();
	expect(await summary.locator('table.kv').first().innerText()).toBe(reportInputs);
	await expect(page.locator('.workspace')).toBeHidden();
	expect(await layoutProblems(page, '[data-testid="hz-print-summary"] [data-testid="hz-report"]')).toEqual([]);
	await page.evaluate(() => window.dispatchEvent(new Event('afterprint')));
	await expect(summary).toHaveCount(0);
	await expect(page).toHaveTitle('Hazard · Beamwright');
});
