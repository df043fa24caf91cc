/**
 * Journeys across the workspaces: each one moves between Bench, Match, Measure and Hazard as a
 * technician does and checks the numbers every page shows against an independent closed form named
 * beside the check. Setups are written by the test itself (journeys.helpers.ts `setupDoc`).
 */
import { test, expect, type Page } from '@playwright/test';
import { expectNear, expectWaistAfter, openWorkspace, rayleigh, readSI, setupDoc, startWith, thinLens, waistRows } from './journeys.helpers';

const HeNe = 632.8e-9;

async function openElement(page: Page, label: string) {
	const field = page.getByTestId(`el-${label}-f`);
	if (!(await field.isVisible())) await page.getByTestId(`element-${label}`).getByRole('button', { name: new RegExp(label) }).first().click();
	await expect(field).toBeVisible();
}

test('(a) the bench follows every edit after a visit to each other workspace', async ({ page }) => {
	const warnings: string[] = [];
	page.on('console', (m) => {
		if (m.type() === 'warning' && /derived|inert/i.test(m.text())) warnings.push(m.text());
	});
	await startWith(page, setupDoc({ lenses: [{ at: '100 mm', f: '200 mm' }], end: '2 m' }));
	await expect(page.getByTestId('caustic-plot')).toBeVisible();
	// One visit to each other workspace, then an edit on the bench that must show at once.
	const steps: Array<{ visit: 'Match' | 'Measure' | 'Hazard'; f_mm: number; waist_mm: number }> = [
		{ visit: 'Match', f_mm: 50, waist_mm: 2 },
		{ visit: 'Measure', f_mm: 80, waist_mm: 1 },
		{ visit: 'Hazard', f_mm: 150, waist_mm: 0.3 }
	];
	for (const s of steps) {
		await openWorkspace(page, s.visit);
		await openWorkspace(page, 'Bench');
		await openElement(page, 'L1');
		await page.getByTestId('el-L1-f').fill(`${s.f_mm} mm`);
		await page.getByTestId('src-x-waist').fill(`${s.waist_mm} mm`);
		// Self (1983) thin-lens transformation of the source waist (at z = 0) through L1 at 100 mm.
		const w0 = s.waist_mm * 1e-3;
		const out = thinLens(w0, 0.1, rayleigh(w0, HeNe), s.f_mm * 1e-3);
		await expectWaistAfter(page, 'L1', 0.1 + out.s_m, out.w0_m);
		// The element table follows too: beam radius arriving at L1 is w0·√(1 + (z/zR)²) (Siegman 1986).
		const atL1 = page.getByTestId('element-table').locator('tbody tr').first().locator('td').nth(2);
		const wL1 = w0 * Math.sqrt(1 + (0.1 / rayleigh(w0, HeNe)) ** 2);
		await expect.poll(async () => Math.abs(readSI(await atL1.innerText()) / wL1 - 1)).toBeLessThan(1e-3);
	}
	expect(warnings, 'no frozen-derivation warning in the console').toEqual([]);
});
