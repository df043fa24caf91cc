import { type Page } from '@playwright/test';
import { test, expect } from './support/fixtures';
import { fieldValuesShown, recordFieldWhileShown } from './support/frames';
import { readCsv, download, close4 } from './csv.helpers';
import { readSI } from './journeys.helpers';

// The caution text as the engine writes it (src/lib/safety/cautions.ts); repeated here so the browser
// test checks the visible text, not a value it reads back from the app.
const cautions = [
	'First-pass estimate, not a hazard evaluation.',
	"The applicable standard, local regulations and the site's laser safety officer decide.",
	'Results depend on the inputs, which the user must verify.'
];

async function expectNoBrokenNumbers(page: Page) {
	const text = (await page.locator('main').innerText()).replace(/"[^"]*"/g, '');
	expect(text).not.toMatch(/\bNaN\b|\bundefined\b|Infinity/);
}

test.beforeEach(async ({ page }) => {
	// A fresh context per test: storage starts empty, so one load shows the demo setup.
	await page.goto('/hazard/');
	await expect(page.getByTestId('hz-results')).toBeVisible();
});

test('the workspace computes the reference beam and keeps the cautions in view', async ({ page }) => {
	// 514.5 nm, 5 W, 2.83 mm, 1.41 mrad, 0.25 s: E = 18·0.25^0.75/0.25 = 25.46 W/m² (Directive 2006/25/EC
	// Table 2.2, row 400–700 nm, read in the French labour code reproduction); formula NOHD
	// (√(4P/(πE)) − d/√2)/(Θ/√2); along the beam, where the 7 mm aperture-averaged irradiance
	// P(1 − exp(−2a²/w²))/(πa²) falls to E with w² = w0² + (θz)² (Siegman 1986, §17.1); OD 3.71 → 4.
	const P = 5, E = (18 * 0.25 ** 0.75) / 0.25, d = 2.83e-3, Th = 1.41e-3, a = 3.5e-3;
	const formula = (Math.sqrt((4 * P) / (Math.PI * E)) - d / Math.SQRT2) / (Th / Math.SQRT2);
	const wStar2 = (-2 * a * a) / Math.log(1 - (E * Math.PI * a * a) / P);
	const beam = Math.sqrt(wStar2 - (d / 2) ** 2) / (Th / 2);
	await expect(page.getByTestId('hz-mpe-E')).toContainText(`${E.toFixed(2)} W/m²`);
	await expect(page.getByTestId('hz-nohd-formula')).toHaveText(`${formula.toFixed(1)} m`);
	await expect(page.getByTestId('hz-nohd-beam')).toHaveText(`${beam.toFixed(1)} m`);
	await expect(page.getByTestId('hz-provenance')).toContainText('read from the published text');
	await expect(page.getByTestId('hz-od')).toContainText('at least OD 4');
	for (const c of cautions) await expect(page.getByTestId('cautions')).toContainText(c);
	await expect(page.getByTestId('cautions')).toBeVisible();
	await expect(page.getByTestId('hz-plot')).toBeVisible();
	await expect(page.getByTestId('hz-zone').first()).toBeVisible();
	await expectNoBrokenNumbers(page);
});

test('a first visit gets the demo estimate and every caution in the page itself, before any script runs', async ({ page }) => {
	// The Hazard page is prerendered: the numbers it shows before its scripts run must be the right
	// ones (the same closed form as above), and never without the cautions.
	const P = 5, E = (18 * 0.25 ** 0.75) / 0.25, d = 2.83e-3, Th = 1.41e-3;
	const formula = (Math.sqrt((4 * P) / (Math.PI * E)) - d / Math.SQRT2) / (Th / Math.SQRT2);
	await page.route('**/*.js', (r) => r.abort());
	await page.goto('/hazard/', { waitUntil: 'load' }); // the page as loaded: its scripts never take it over
	await expect(page.getByTestId('hz-plot')).toBeVisible();
	// The plot is drawn in the page itself, not only its frame.
	expect((await page.getByTestId('hz-plot').locator('path.series').first().getAttribute('d'))!.length).toBeGreaterThan(100);
	await expect(page.getByTestId('hz-nohd-formula')).toHaveText(`${formula.toFixed(1)} m`);
	for (const c of cautions) await expect(page.getByTestId('cautions')).toContainText(c);
	await expect(page.locator('main')).toHaveAttribute('aria-disabled', 'true');
});

test('a reload shows the saved laser and never the prerendered demo in its place', async ({ page }) => {
	await page.getByTestId('hz-power').fill('50 mW');
	await expect.poll(() => page.evaluate(() => Object.values(localStorage).join('\n'))).toContain('50 mW');
	// Every frame of the reloaded page: the power shown while the page is visible.
	await recordFieldWhileShown(page, 'hz-power');
	await page.reload();
	await expect(page.getByTestId('hz-power')).toHaveValue('50 mW');
	expect(new Set(await fieldValuesShown(page))).toEqual(new Set(['50 mW']));
});

test('a reload never shows the prerendered demo curve in place of the saved laser, though the plot is taken over last', async ({ page }) => {
	// The demo's curve as prerendered (the plot is an island that only draws: the page answers input
	// before it is taken over, but a returning user's page stays hidden until it is).
	const html = await (await page.request.get('/hazard/')).text();
	const demo = /<path d="([^"]+)"[^>]*data-testid="hz-series-0"/.exec(html)?.[1];
	expect(demo && demo.length).toBeGreaterThan(100);
	await page.getByTestId('hz-power').fill('50 mW');
	await expect.poll(() => page.evaluate(() => Object.values(localStorage).join('\n'))).toContain('50 mW');
	await recordFieldWhileShown(page, 'hz-series-0', 'd');
	await page.reload();
	await expect(page.getByTestId('hz-power')).toHaveValue('50 mW');
	const shown = await fieldValuesShown(page);
	expect(shown).not.toContain(demo);
	expect(shown.every((d) => d.length > 100)).toBe(true);
});

test('editing the power changes the distances; a bad wavelength is refused with the rule', async ({ page }) => {
	await page.getByTestId('hz-power').fill('50 mW');
	await expect(page.getByTestId('hz-nohd-formula')).not.toHaveText('499.6 m');
	await page.getByTestId('hz-wavelength').fill('150 nm');
	await expect(page.getByText('Wavelength must be ≥ 180 nm and ≤ 1 mm — got 150 nm')).toBeVisible();
	await expect(page.getByTestId('hz-no-result')).toBeVisible();
	await expect(page.getByTestId('cautions')).toContainText(cautions[0]);
});

test('pulsed emission shows each pulse rule and which limits; aided and diffuse read-outs appear', async ({ page }) => {
	await page.getByTestId('hz-pulsed').check();
	await page.getByTestId('hz-energy').fill('1 mJ');
	await page.getByTestId('hz-width').fill('10 ns');
	await page.getByTestId('hz-rate').fill('10 kHz');
	await expect(page.getByTestId('hz-pulse-rules')).toContainText('repetitive pulse (C_P) ◀ limits');
	await page.getByTestId('hz-optic-on').check();
	await expect(page.getByTestId('hz-aided')).toBeVisible();
	await page.getByTestId('hz-diffuse-on').check();
	await expect(page.getByTestId('hz-diffuse')).toContainText('m');
	await expectNoBrokenNumbers(page);
});

test('the whole-lab table imports the demo lab and exports CSV', async ({ page }) => {
	await page.getByTestId('hz-lab-demo').click();
	const rows = page.getByTestId('hz-lab-table').locator('tbody tr');
	await expect(rows).toHaveCount(8);
	await expect(page.getByTestId('hz-lab-table')).toContainText('Demo laser C (514.5 nm)');
	const download = page.waitForEvent('download');
	await page.getByTestId('hz-lab-export').click();
	const file = await download;
	expect(file.suggestedFilename()).toBe('lab-hazard-table.csv');
	const stream = await file.createReadStream();
	let text = '';
	for await (const chunk of stream) text += chunk;
	expect(text.split('\n')[0]).toMatch(/^line,name,room,wavelength_nm/);
	expect(text).toContain(cautions[0]);
});

test('the print view holds every caution and the review lines', async ({ page }) => {
	await page.getByTestId('hz-report-link').click();
	await expect(page.getByTestId('hz-report')).toBeVisible();
	await page.emulateMedia({ media: 'print' });
	for (const id of ['report-cautions', 'report-cautions-end']) {
		for (const c of cautions) await expect(page.getByTestId(id)).toContainText(c);
		await expect(page.getByTestId(id)).toBeVisible();
	}
	await expect(page.getByTestId('report-cautions')).toContainText('About the values of this edition');
	await expect(page.getByTestId('hz-review')).toContainText('Review by the laser safety officer');
	await expect(page.getByTestId('hz-nohd-formula')).toHaveText('499.6 m');
	await expect(page.getByRole('button', { name: 'Print' })).toBeHidden();
	await expect(page.locator('header.top')).toBeHidden();
});

test('the beam can come from the Bench: distances are measured along the propagated train', async ({ page }) => {
	await page.getByTestId('hz-beam-bench').check();
	await expect(page.getByTestId('hz-results')).toBeVisible();
	await expect(page.getByTestId('hz-nohd-beam')).toContainText('m');
	await expect(page.getByTestId('hz-plot')).toBeVisible();
	await expect(page.getByTestId('cautions')).toContainText(cautions[2]);
	await expectNoBrokenNumbers(page);
});

test('further lines are combined per tissue; skin and eyewear per rule are shown; a bad line is refused with the form', async ({ page }) => {
	await expect(page.getByTestId('hz-skin')).toContainText('Nominal skin hazard distance');
	await expect(page.getByTestId('hz-eyewear-rules')).toContainText('sets the OD');
	await page.getByTestId('hz-lines-input').fill('1064 nm: 50 mW, 10.6 um: 1 W');
	await expect(page.getByTestId('hz-lines')).toBeVisible();
	const combined = page.getByTestId('hz-lines-combined');
	await expect(combined).toContainText('retina');
	await expect(combined).toContainText('cornea and lens');
	await expect(combined).toContainText('skin');
	// The lines save as CSV: one row per line and one per tissue combined, as the tables show them.
	const lines = await readCsv(await download(page, 'hz-lines-csv'));
	expect(lines.header.join('\n')).toContain('First-pass estimate, not a hazard evaluation.');
	const cells = (id: string) => page.getByTestId(id).locator('tbody tr').evaluateAll((trs) => trs.map((tr) => [...tr.querySelectorAll('td')].map((td) => (td as HTMLElement).innerText.trim())));
	const lineRows = lines.rows.filter((r) => r[0] === 'line');
	const shownLines = await cells('hz-lines-table');
	expect(lineRows.length).toBe(shownLines.length);
	expect(lineRows.length).toBe(3);
	lineRows.forEach((r, i) => {
		const t = shownLines[i];
		close4(Number(r[lines.col('wavelength_nm')]) * 1e-9, readSI(t[0].replace(/^main: /, ''), 'nm') * 1e-9);
		close4(Number(r[lines.col('power_W')]), readSI(t[1], 'W'));
		expect(r[lines.col('tissue')]).toBe(t[2]);
		close4(Number(r[lines.col('limit_W_m2')]), readSI(t[3].split(' (')[0], 'W/m²'));
		close4(Number(r[lines.col('hazard_distance_m')]), readSI(t[4]));
		expect(t[5]).toBe(`${+Number(r[lines.col('od_required')]).toPrecision(3)} → ${r[lines.col('od_whole')]}`);
		if (t[6] === 'not evaluated') expect(r[lines.col('skin_hazard_distance_m')]).toBe('');
		else close4(Number(r[lines.col('skin_hazard_distance_m')]), readSI(t[6]));
		expect(r[lines.col('provenance')].startsWith(t[7] === 'read' ? 'read from' : 'recalled')).toBe(true);
		expect(r[lines.col('limit_source')]).not.toBe('');
	});
	const combinedRows = lines.rows.filter((r) => r[0] === 'combined');
	const shownCombined = await cells('hz-lines-combined');
	expect(combinedRows.map((r) => r[1])).toEqual(shownCombined.map((t) => t[0]));
	combinedRows.forEach((r, i) => close4(Number(r[lines.col('hazard_distance_m')]), readSI(shownCombined[i][3])));
	await page.getByTestId('hz-lines-input').fill('1064 nm 50 mW');
	await expect(page.getByTestId('hz-lines-error')).toContainText('Further lines, entry 1 "1064 nm 50 mW": not WAVELENGTH: POWER');
	await expect(page.getByTestId('hz-lines-input')).toHaveValue('1064 nm 50 mW');
	await expectNoBrokenNumbers(page);
});
