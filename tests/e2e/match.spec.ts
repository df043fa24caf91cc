import { type Page } from '@playwright/test';
import { test, expect } from './support/fixtures';

async function expectNoBrokenNumbers(page: Page) {
	// Messages may quote what the user typed; everything else must be a real number.
	const text = (await page.locator('main').innerText()).replace(/"[^"]*"/g, '');
	expect(text).not.toMatch(/\bNaN\b|\bundefined\b|Infinity/);
}

test.beforeEach(async ({ page }) => {
	// A fresh context per test: storage starts empty, so one load shows the demo setup.
	await page.goto('/match/');
	await expect(page.getByRole('heading', { name: '2 · Target' })).toBeVisible();
});

test('pick a target, run the search with progress, put a solution on the bench', async ({ page }) => {
	// A free waist target, 60 µm at 700 mm.
	await page.getByTestId('target-waist').check();
	await page.getByTestId('target-at').fill('700 mm');
	await page.getByTestId('target-wx').fill('60 µm');
	await expect(page.getByTestId('target-readout')).toContainText('60 µm');
	await expect(page.getByTestId('single-lens')).toContainText('○ x');

	await page.getByTestId('match-run').click();
	const progress = page.getByTestId('match-progress');
	await expect(progress).toBeVisible();
	await expect(progress.locator('progress')).toBeVisible();
	await expect(progress).toContainText(/Done: (\d+) of \1 lens combinations/, { timeout: 30_000 });
	const rows = page.getByTestId('match-row');
	await expect(rows.first()).toBeVisible();
	expect(await rows.count()).toBeGreaterThan(1);
	await expect(page.getByTestId('rail-sketch')).toBeVisible();
	await expectNoBrokenNumbers(page);
	// The fundamental-mode figure beside the efficiency, the target's 1 % tolerances, positions to 10 µm.
	await expect(page.getByTestId('match-fundamental').first()).toContainText('%');
	await expect(page.getByTestId('match-target-tolerance')).toContainText('Rayleigh range');
	await expect(rows.first().locator('td').nth(1)).toContainText(/at \d+\.\d\d mm/);

	// The first solution's lenses, as the table shows them.
	const lensText = await rows.first().locator('td').nth(1).innerText();
	const n = lensText.trim().split('\n').length;
	await rows.first().getByTestId('match-apply').click();
	await expect(page).toHaveURL(/\/$/);
	const table = page.getByTestId('element-table');
	await expect(table).toContainText('ML1');
	if (n > 1) await expect(table).toContainText('ML2');

	// Applying again replaces the earlier lenses instead of piling them up.
	await page.goto('/match/');
	await page.getByTestId('match-run').click();
	await expect(page.getByTestId('match-progress')).toContainText(/Done/, { timeout: 30_000 });
	await page.getByTestId('match-row').first().getByTestId('match-apply').click();
	await expect(page).toHaveURL(/\/$/);
	await expect(page.getByTestId('element-table').locator('tbody tr', { hasText: 'ML1' })).toHaveCount(1);
});

test('a cavity target shows its stability; an unstable one is reported and blocks the search', async ({ page }) => {
	await page.getByTestId('target-cavity').check();
	await expect(page.getByTestId('cavity-readout')).toContainText('Stable');
	await expect(page.getByTestId('cavity-g1g2')).toHaveText('0.5');
	await expect(page.getByTestId('cavity-halftrace')).toHaveText('0');
	await page.getByTestId('target-length').fill('600 mm');
	await expect(page.getByTestId('cavity-readout')).toContainText('Unstable');
	await expect(page.getByTestId('match-run')).toBeDisabled();
	await expect(page.getByTestId('match-blocked')).toContainText('no stable mode');
	await expectNoBrokenNumbers(page);
});

test('bad numbers name the field and the range, keep the text, and survive a reload', async ({ page }) => {
	for (const [value, re] of [
		['', /Rail end is empty/],
		['0', /Rail end must be after the rail start/],
		['-5 mm', /Rail end must be after the rail start/],
		['NaN', /Rail end/],
		['3 kg', /wrong unit/],
		['1e9 m', /Rail end must be ≥ −100 m and ≤ 100 m/]
	] as const) {
		await page.getByTestId('rail-to').fill(value);
		await expect(page.getByText(re).first()).toBeVisible();
		await expect(page.getByTestId('rail-to')).toHaveValue(value);
		await expectNoBrokenNumbers(page);
	}
	await expect(page.getByTestId('match-run')).toBeDisabled();
	await page.getByTestId('inv-focal-0').fill('0 mm');
	await expect(page.getByText(/focal length must be at least 1 mm/).first()).toBeVisible();
	// Wait for the autosave to hold both edits (no fixed sleep).
	await expect.poll(() => page.evaluate(() => Object.values(localStorage).join('\n'))).toContain('0 mm');
	await expect.poll(() => page.evaluate(() => Object.values(localStorage).join('\n'))).toContain('1e9 m');
	await page.reload();
	await expect(page.getByTestId('rail-to')).toHaveValue('1e9 m');
	await expect(page.getByTestId('inv-focal-0')).toHaveValue('0 mm');
});

test('CSV import names each bad line; the demo shelf loads', async ({ page }) => {
	await page.getByText('Import a lens list (CSV)').click();
	await page.getByTestId('inv-csv').fill('lens,f_mm,dia_mm,qty\nA,100,25.4,1\nB,zero,25.4,1\nC,50,25.4,-2\n');
	await page.getByTestId('inv-import').click();
	await expect(page.getByTestId('csv-errors')).toContainText('line 3: f_mm');
	await expect(page.getByTestId('csv-errors')).toContainText('line 4: qty');
	await page.getByTestId('inv-csv').fill('lens,f_mm,dia_mm,qty\nA,100,25.4,1\nB,-40,,2\n');
	await page.getByTestId('inv-import').click();
	await expect(page.getByTestId('inventory-table').locator('tbody tr')).toHaveCount(2);
	await page.getByTestId('inv-demo').click();
	await expect(page.getByTestId('inventory-table').locator('tbody tr')).toHaveCount(16);
});

test('Cancel stops a slow three-lens search; the page says so and stays usable', async ({ page }) => {
	// 120 invented lens types, three lenses per solution: a search of a second or more, far longer than a click needs.
	const rows = ['lens,f_mm,dia_mm,qty'];
	for (let i = 0; i < 120; i++) rows.push(`slow shelf ${i + 1},${(i % 5 === 0 ? -1 : 1) * (40 + 5 * i)},25.4,2`);
	await page.getByText('Import a lens list (CSV)').click();
	await page.getByTestId('inv-csv').fill(rows.join('\n'));
	await page.getByTestId('inv-import').click();
	await expect(page.getByTestId('inventory-table').locator('tbody tr')).toHaveCount(120);
	await page.getByTestId('count-3').check();

	await page.getByTestId('match-run').click();
	const progress = page.getByTestId('match-progress');
	await expect(progress).toContainText('Searching:');
	await expect(page.getByTestId('match-cancel')).toBeEnabled();
	await page.getByTestId('match-cancel').click();
	await expect(progress).toContainText(/Cancelled after \d+ of \d+ combinations/, { timeout: 10_000 });
	await expect(page.getByTestId('match-cancel')).toBeDisabled();
	await expect(page.getByTestId('match-run')).toBeEnabled();
	await expectNoBrokenNumbers(page);

	// Still usable: a smaller search runs to the end.
	await page.getByTestId('count-3').uncheck();
	await page.getByTestId('count-2').uncheck();
	await page.getByTestId('match-run').click();
	await expect(progress).toContainText(/Done: (\d+) of \1 lens combinations/, { timeout: 30_000 });
	await expectNoBrokenNumbers(page);
});

test('a ring cavity target computes per axis; an unstable ring is reported and blocks the search', async ({ page }) => {
	await page.getByTestId('target-ring').check();
	await expect(page.getByTestId('ring-mirrors').locator('tbody tr')).toHaveCount(4);
	await expect(page.getByTestId('ring-verdict')).toContainText('Stable on both axes');
	await expect(page.getByTestId('ring-axis-x')).toContainText('✓ stable');
	await expect(page.getByTestId('ring-axis-y')).toContainText('✓ stable');
	await expect(page.getByTestId('ring-axis-x')).toContainText(/µm at .* after M3/);
	await expect(page.getByTestId('target-readout')).toBeVisible();
	await page.getByTestId('match-run').click();
	await expect(page.getByTestId('match-progress')).toContainText(/Done/, { timeout: 30_000 });
	await expect(page.getByTestId('match-row').first()).toBeVisible();
	await expectNoBrokenNumbers(page);

	// 15° on every mirror and a 100 mm short arm: between R·cosθ and R/cosθ only x (tangential) is stable.
	for (let i = 0; i < 4; i++) await page.getByTestId(`ring-angle-${i}`).fill('15°');
	await page.getByTestId('ring-arm-2').fill('100 mm');
	await expect(page.getByTestId('ring-verdict')).toContainText('Unstable');
	await expect(page.getByTestId('ring-verdict')).toContainText('y (sagittal)');
	await expect(page.getByTestId('ring-axis-x')).toContainText('✓ stable');
	await expect(page.getByTestId('ring-axis-y')).toContainText('✗ unstable');
	await expect(page.getByTestId('match-run')).toBeDisabled();
	await expect(page.getByTestId('match-blocked')).toContainText('no stable mode');
	await expect(page.getByTestId('match-stale')).toBeVisible();
	await expectNoBrokenNumbers(page);

	// A typing slip names the mirror.
	await page.getByTestId('ring-angle-1').fill('95°');
	await expect(page.getByText(/Mirror 2 angle of incidence must be ≥ 0° and < 80°/).first()).toBeVisible();
});

test('two-mirror cavity with a lens inside; expander read-outs for both axes of an astigmatic beam', async ({ page }) => {
	await page.getByTestId('target-cavity').check();
	await page.getByTestId('target-lens-f').fill('1 m');
	await page.getByTestId('target-lens-at').fill('100 mm');
	// Flat / 500 mm, L = 250 mm, f = 1 m at 100 mm: equivalent g1·g2 = 0.85 × 0.43 (Kogelnik 1965, from memory).
	await expect(page.getByTestId('cavity-readout')).toContainText('Stable');
	await expect(page.getByTestId('cavity-g1g2')).toHaveText('0.3655');
	await page.getByTestId('target-lens-f').fill('50 mm');
	await expect(page.getByTestId('cavity-readout')).toContainText('Unstable');
	await expect(page.getByTestId('match-run')).toBeDisabled();
	await expectNoBrokenNumbers(page);

	// The example source is astigmatic (x and y waists differ): every expander row gives ○ x and □ y.
	const row = page.getByTestId('expander-row').first();
	await expect(row).toContainText('○');
	await expect(row.getByTestId('expander-y').first()).toContainText(/□ \d/);
});

test('a read-out that cannot compute says why instead of showing nothing', async ({ page }) => {
	await page.getByTestId('exp-min').fill('abc');
	await expect(page.getByTestId('expanders-why')).toContainText('Fix the expander fields');
	await page.getByTestId('exp-min').fill('2');
	await expect(page.getByTestId('expanders')).toBeVisible();
	await page.getByTestId('target-at').fill('5 kg');
	await expect(page.getByTestId('single-lens-why')).toContainText('not valid yet');
});

test('cavities on the stability boundary show the limit and why; the input mirror substrate moves the target outside', async ({ page }) => {
	await page.getByTestId('target-cavity').check();
	// Hemispherical: flat mirror 1, R2 = L = 500 mm: g1·g2 = 0 (Kogelnik & Li 1966, §V).
	await page.getByTestId('target-length').fill('500 mm');
	await expect(page.getByTestId('cavity-boundary')).toContainText('On the stability boundary');
	await expect(page.getByTestId('cavity-readout')).toContainText('hemispherical');
	await expect(page.getByTestId('cavity-limit')).toContainText('grows without bound');
	await expect(page.getByTestId('match-run')).toBeDisabled();
	await expectNoBrokenNumbers(page);
	// Confocal: R1 = R2 = L: on the boundary, with the symmetric limit mode, which can be matched.
	await page.getByTestId('target-r1').fill('500 mm');
	await expect(page.getByTestId('cavity-boundary')).toContainText('On the stability boundary');
	await expect(page.getByTestId('cavity-readout')).toContainText('confocal');
	await expect(page.getByTestId('cavity-limit')).toContainText('µm');
	await expect(page.getByTestId('match-run')).toBeEnabled();
	// Back to a stable cavity with a curved input mirror, then give its substrate.
	await page.getByTestId('target-r1').fill('1 m');
	await page.getByTestId('target-length').fill('250 mm');
	await expect(page.getByTestId('cavity-readout')).toContainText('Stable');
	await expect(page.getByTestId('cavity-readout')).toContainText('substrate');
	await page.getByTestId('target-sub-t').fill('6.35 mm');
	await expect(page.getByTestId('substrate-note')).toContainText('back face');
	await page.getByTestId('target-sub-n').fill('0.5');
	await expect(page.getByText(/Substrate index/).first()).toBeVisible();
	await expect(page.getByTestId('target-sub-n')).toHaveValue('0.5');
	await expectNoBrokenNumbers(page);
});

test('the parts below the first screen are built just after the take-over; a link to one of their headings lands on it', async ({ page }) => {
	// Not in the prerendered page (its take-over stays one short task), there once the app has it.
	const html = await (await page.request.get('/match/')).text();
	expect(html).toContain('<div id="res-h"></div>'); // the heading's place, so that links to it stay valid
	expect(html).not.toContain('<h2 id="res-h"');
	await expect(page.getByRole('heading', { name: '5 · Search and results' })).toBeVisible();
	await expect(page.getByRole('heading', { name: '4 · Where the lenses may go' })).toBeVisible();
	// A link to the search heading, opened fresh: the heading is scrolled into view once it is built.
	await page.goto('/match/#res-h');
	await expect(page.getByRole('heading', { name: '5 · Search and results' })).toBeInViewport();
});
