/**
 * Measure workspace in the browser: paste widths, see the fit, the flagged line and the plan check,
 * send the fitted beam to the bench; load a beam image and add its widths.
 * Widths come from the ISO 11146-1 caustic d(z)² = d0² + Θ²(z − z0)², Θ = 4·M²·λ/(π·d0)
 * (ISO 11146-1:2005, clauses 3 and 9; from memory), so the fit must return d0, z0 and M².
 */
import { type Page } from '@playwright/test';
import { test, expect } from './support/fixtures';
import { readCsv, download } from './csv.helpers';
import { readSI } from './journeys.helpers';

const lam = 1064e-9;
function caustic(d0: number, z0: number, m2: number, z: number) {
	const theta = (4 * m2 * lam) / (Math.PI * d0);
	return Math.sqrt(d0 * d0 + theta * theta * (z - z0) ** 2);
}

/** Ten planes laid out for x (half within zR, half beyond 2zR), z in mm, diameters in µm. */
function widthsText(extra: string[] = []): string {
	const zR = (Math.PI * 0.42e-3 ** 2) / (4 * 1.2 * lam);
	const lines = ['z,dx,dy'];
	for (const k of [-0.9, -0.5, -0.1, 0.3, 0.8, -3, -2.4, 2.3, 2.9, 3.6]) {
		const z = 0.3 + k * zR;
		lines.push(`${(z * 1e3).toFixed(4)},${(caustic(0.42e-3, 0.3, 1.2, z) * 1e6).toFixed(4)},${(caustic(0.38e-3, 0.29, 1.5, z) * 1e6).toFixed(4)}`);
	}
	return [...lines.slice(0, 3), ...extra, ...lines.slice(3)].join('\n');
}

async function expectNoBrokenNumbers(page: Page) {
	const text = (await page.locator('main').innerText()).replace(/"[^"]*"/g, '');
	expect(text).not.toMatch(/\bNaN\b|\bundefined\b|Infinity/);
}

test.beforeEach(async ({ page }) => {
	// A fresh context per test: storage starts empty, so one load shows the demo setup.
	await page.goto('/measure/');
	await expect(page.getByTestId('widths-input')).toBeVisible();
});

test('paste widths, see the fit with uncertainties and the flagged line, send the beam to the bench', async ({ page }) => {
	await page.getByTestId('m-wavelength').fill('1064 nm');
	await page.getByTestId('widths-input').fill(widthsText(['812.5,abc,400']));
	await expect(page.getByTestId('flagged-rows')).toContainText('line 4');
	await expect(page.getByTestId('flagged-rows')).toContainText('dx "abc" is not a number');
	// Value ± uncertainty in one unit; the value before "±" is the caustic's (exact data, so tight).
	const before = async (id: string) => Number((await page.getByTestId(id).innerText()).split('±')[0].trim());
	await expect(page.getByTestId('fit-x-m2')).toHaveText(/^[\d.]+ ± <?[\d.×^−]+$/);
	expect(Math.abs((await before('fit-x-m2')) - 1.2)).toBeLessThan(1e-3);
	expect(Math.abs((await before('fit-y-m2')) - 1.5)).toBeLessThan(1e-3);
	await expect(page.getByTestId('fit-x-d0_m')).toHaveText(/^[\d.]+ ± <?[\d.×^−]+ µm$/);
	expect(Math.abs((await before('fit-x-d0_m')) - 420)).toBeLessThan(0.05);
	await expect(page.getByTestId('fit-x-z0_m')).toHaveText(/^[\d.]+ ± <?[\d.×^−]+ mm$/);
	expect(Math.abs((await before('fit-x-z0_m')) - 300)).toBeLessThan(0.05);
	await expect(page.getByTestId('measure-plot')).toBeVisible();
	await expect(page.getByTestId('point-x')).toHaveCount(10);
	await expect(page.getByTestId('point-y')).toHaveCount(10);
	await expect(page.getByTestId('plan-check')).toContainText('x axis: ✓ plan meets the rule');
	await expect(page.getByTestId('source-preview')).toContainText('x: waist radius 210 µm at 300 mm, M² 1.2');
	await expectNoBrokenNumbers(page);

	await page.getByTestId('send-to-bench').click();
	await expect(page).toHaveURL(/\/$/);
	await expect(page.getByTestId('src-x-m2')).toHaveValue('1.2');
	await expect(page.getByTestId('src-y-m2')).toHaveValue('1.5');
	await expect(page.getByTestId('src-x-waist')).toHaveValue('210 µm');
	await expect(page.getByTestId('src-y-waistAt')).toHaveValue('290 mm');
	await expect(page.getByTestId('src-wavelength')).toHaveValue('1064 nm');
	await expect(page.getByTestId('caustic-plot')).toBeVisible();
});

test('too few planes: the plan check says where to add planes', async ({ page }) => {
	const lines = widthsText().split('\n');
	await page.getByTestId('widths-input').fill([lines[0], lines[1], lines[3], lines[4], lines[8], lines[9]].join('\n'));
	await expect(page.getByTestId('plan-check')).toContainText('only 5 planes; the standard asks for at least 10');
	await expect(page.getByTestId('plan-add-x')).toContainText(/Add \d planes? within one z_R, between [\d.]+ and [\d.]+ mm — e\.g\. at/);
	await expectNoBrokenNumbers(page);
});

test('a beam image (CSV matrix) is analysed in the page and its widths join the table', async ({ page }) => {
	// A round Gaussian, 1/e² radius 12 pixels, on a 96 × 96 frame with a 100-count background:
	// D4σ = 2w = 24 pixels (Siegman, "Lasers" 1986, §17.1) = 132 µm at a 5.5 µm pitch.
	const rows: string[] = [];
	for (let r = 0; r < 96; r++) {
		const row: number[] = [];
		for (let c = 0; c < 96; c++) row.push(Math.round(100 + 20000 * Math.exp((-2 * ((c - 48) ** 2 + (r - 46) ** 2)) / 144)));
		rows.push(row.join(','));
	}
	await page.getByTestId('image-files').setInputFiles({ name: 'plane 250mm.csv', mimeType: 'text/csv', buffer: Buffer.from(rows.join('\n')) });
	const card = page.getByTestId('image-card');
	await expect(card.getByTestId('image-moments')).toContainText('132 µm, 132 µm');
	await expect(card.getByTestId('image-z')).toHaveValue('250 mm');
	await page.getByTestId('add-image-planes').click();
	await expect(page.getByTestId('widths-input')).toHaveValue(/^z,dx,dy\n250,13[12][.\d]*,13[12][.\d]*\n$/);
	await expect(page.getByTestId('table-summary')).toContainText('1 plane read');
	await expectNoBrokenNumbers(page);
});

test('a fit with M² below 1 is flagged as not a real beam with the likely causes (ISO 11146-1, clause 3: M² ≥ 1)', async ({ page }) => {
	const zR = (Math.PI * 0.42e-3 ** 2) / (4 * 0.8 * lam);
	const lines = ['z,d'];
	for (const k of [-0.9, -0.5, -0.1, 0.3, 0.8, -3, -2.4, 2.3, 2.9, 3.6]) {
		const z = 0.3 + k * zR;
		lines.push(`${(z * 1e3).toFixed(4)},${(caustic(0.42e-3, 0.3, 0.8, z) * 1e6).toFixed(4)}`);
	}
	await page.getByTestId('m-wavelength').fill('1064 nm');
	await page.getByTestId('widths-input').fill(lines.join('\n'));
	const alert = page.getByTestId('fit-d-unphysical');
	await expect(alert).toContainText('M² below 1');
	await expect(alert).toContainText('wavelength');
	await expect(alert).toContainText('second-moment');
	await expect(page.getByTestId('fit-d-m2')).toContainText('0.8');
	await expectNoBrokenNumbers(page);
});

test('knife-edge scans: the fitted radius is shown and the widths join the table as a plane', async ({ page }) => {
	// erf by Abramowitz & Stegun 1964, eq. 7.1.26 (|error| < 1.5e-7; from memory) — independent of the engine.
	const erf = (x: number) => {
		const t = 1 / (1 + 0.3275911 * Math.abs(x));
		const y = 1 - ((((1.061405429 * t - 1.453152027) * t + 1.421413741) * t - 0.284496736) * t + 0.254829592) * t * Math.exp(-x * x);
		return x < 0 ? -y : y;
	};
	// Power behind a blade at x for a Gaussian of 1/e² radius w: ½[1 + erf(√2 (x − c)/w)] (x in mm, P in mW).
	const scan = (w: number, c: number) =>
		['x (mm),P (mW)', ...Array.from({ length: 61 }, (_, i) => {
			const x = -3 + (6 * i) / 60;
			return `${x.toFixed(3)},${(0.05 + 4 * 0.5 * (1 + erf((Math.SQRT2 * (x - c)) / w))).toFixed(5)}`;
		})].join('\n');
	await page.getByTestId('knife-add').click();
	await page.getByTestId('knife-add').click();
	const cards = page.getByTestId('knife-card');
	await cards.nth(0).getByTestId('knife-z').fill('100 mm');
	await cards.nth(0).getByTestId('knife-text').fill(scan(0.8, 0.2));
	await cards.nth(1).getByTestId('knife-axis').selectOption('y');
	// An empty z field shows its unit, and a bare number is read in it.
	await expect(cards.nth(1).getByTestId('knife-z-unit')).toHaveValue('mm');
	await cards.nth(1).getByTestId('knife-z').fill('100');
	await cards.nth(1).getByTestId('knife-text').fill(scan(0.6, -0.1));
	// w = 0.8 mm → "800.0 ± … µm"; D4σ = 2w = 1.6 mm.
	const lead = async (el: ReturnType<typeof page.getByTestId>) => Number((await el.innerText()).split('±')[0].trim());
	await expect(cards.nth(0).getByTestId('knife-w')).toContainText('µm');
	expect(Math.abs((await lead(cards.nth(0).getByTestId('knife-w'))) - 800)).toBeLessThan(1);
	expect(Math.abs((await lead(cards.nth(0).getByTestId('knife-d'))) - 1.6)).toBeLessThan(0.005);
	// The scan fits save as CSV with the numbers shown (mm in the file; µm / mm on the page).
	await expect(cards.nth(1).getByTestId('knife-w')).toContainText('µm');
	const fits = await readCsv(await download(page, 'knife-csv'));
	expect(fits.rows.map((r) => [r[0], r[1], r[fits.col('z_mm')]])).toEqual([['1', 'x', '100'], ['2', 'y', '100']]);
	// "800.0 ± 0.6 µm": the file's value must round to the digits shown.
	const agrees = (file_mm: number, shown: string) => {
		const m = /^(−?[\d.]+) ± <?([\d.×^−]+) (\S+)$/.exec(shown.trim())!;
		expect(m, shown).not.toBeNull();
		const half = 0.5 * 10 ** -(m[1].split('.')[1] ?? '').length;
		expect(Math.abs(file_mm * 1e-3 - readSI(`${m[1]} ${m[3]}`))).toBeLessThanOrEqual(half * readSI(`1 ${m[3]}`) * 1.001);
	};
	for (const i of [0, 1]) {
		agrees(Number(fits.rows[i][fits.col('w_mm')]), await cards.nth(i).getByTestId('knife-w').innerText());
		agrees(Number(fits.rows[i][fits.col('d_mm')]), await cards.nth(i).getByTestId('knife-d').innerText());
	}
	await page.getByTestId('knife-to-table').click();
	await expect(page.getByTestId('knife-message')).toContainText('Added 2 scan widths');
	const table = await page.getByTestId('widths-input').inputValue();
	const row = table.trim().split('\n').pop()!.split(',').map(Number);
	expect(row[0]).toBeCloseTo(100, 6);
	expect(Math.abs(row[1] - 1600)).toBeLessThan(5); // dx = 2·0.8 mm in µm
	expect(Math.abs(row[2] - 1200)).toBeLessThan(5); // dy = 2·0.6 mm in µm
	// Reload: the typed scans are kept in the setup (wait for the autosave, no fixed sleep).
	await expect.poll(() => page.evaluate(() => Object.values(localStorage).join('\n'))).toContain('"knife"');
	await page.reload();
	await expect(page.getByTestId('knife-card')).toHaveCount(2);
});
