/**
 * Journeys across the workspaces: each one moves between Bench, Match, Measure and Hazard as a
 * technician does and checks the numbers every page shows against an independent closed form named
 * beside the check. Setups are written by the test itself (journeys.helpers.ts `setupDoc`).
 */
import { type Page } from '@playwright/test';
import { test, expect } from './support/fixtures';
import { expectNear, expectWaistAfter, openWorkspace, rayleigh, readSI, setupDoc, startWith, thinLens, waistRows } from './journeys.helpers';

const HeNe = 632.8e-9;

async function openElement(page: Page, label: string) {
	const field = page.getByTestId(`el-${label}-f`);
	if (!(await field.isVisible())) await page.getByTestId(`element-${label}`).getByRole('button', { name: new RegExp(label) }).first().click();
	await expect(field).toBeVisible();
}

// One visit to each other workspace (one test each), then an edit on the bench that must show at once.
const visits: Array<{ visit: 'Match' | 'Measure' | 'Scan' | 'Hazard'; f_mm: number; waist_mm: number }> = [
	{ visit: 'Match', f_mm: 50, waist_mm: 2 },
	{ visit: 'Measure', f_mm: 80, waist_mm: 1 },
	{ visit: 'Scan', f_mm: 120, waist_mm: 0.7 },
	{ visit: 'Hazard', f_mm: 150, waist_mm: 0.3 }
];
for (const s of visits) {
	test(`(a) the bench follows every edit after a visit to ${s.visit}`, async ({ page }) => {
		const warnings: string[] = [];
		page.on('console', (m) => {
			if (m.type() === 'warning' && /derived|inert/i.test(m.text())) warnings.push(m.text());
		});
		await startWith(page, setupDoc({ lenses: [{ at: '100 mm', f: '200 mm' }], end: '2 m' }));
		await expect(page.getByTestId('element-table')).toContainText('L1');
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
		await expect.poll(async () => Math.abs(readSI(await atL1.innerText()) / wL1 - 1), { timeout: 15_000 }).toBeLessThan(1e-3);
		expect(warnings, 'no frozen-derivation warning in the console').toEqual([]);
	});
}

/** The setup document the app has saved in this browser (waits for the autosave). */
/**
 * The autosaved document once it has `count` elements. The page seeded a document at the start, and
 * autosave waits a moment after an edit, so the wait is for the edit itself, not only for a saved key.
 */
async function savedDoc(page: Page, count: number) {
	const read = () => page.evaluate(() => JSON.parse(localStorage.getItem('beamwright.setup.v1') ?? '{"elements":[]}'));
	await expect.poll(async () => (await read()).elements?.length ?? 0, { timeout: 15_000 }).toBe(count);
	return read();
}
const mm = (text: string) => readSI(text);

/** Waist after a train of thin lenses, by repeated use of Self's (1983) transformation. */
function throughLenses(w0_m: number, z0_m: number, lambda_m: number, lenses: Array<{ z_m: number; f_m: number }>) {
	let w = w0_m;
	let z = z0_m;
	for (const l of [...lenses].sort((a, b) => a.z_m - b.z_m)) {
		const out = thinLens(w, l.z_m - z, rayleigh(w, lambda_m), l.f_m);
		w = out.w0_m;
		z = l.z_m + out.s_m;
	}
	return { w0_m: w, z_m: z };
}

/** A match section written by the test: a free waist target and a small shelf, two lenses. */
const matchSection = {
	input: { from: 'source' },
	target: { kind: 'waist', at: '700 mm', wx: '60 µm', wy: '', r1: '', r2: '', length: '', lensF: '', lensAt: '', fiberBy: 'mfd', mfd: '', coreRadius: '', na: '' },
	inventory: [
		{ label: 'Shelf lens 1', focal: '-50 mm', diameter: '25.4 mm', count: '1' },
		{ label: 'Shelf lens 2', focal: '100 mm', diameter: '25.4 mm', count: '1' },
		{ label: 'Shelf lens 3', focal: '150 mm', diameter: '25.4 mm', count: '1' },
		{ label: 'Shelf lens 4', focal: '200 mm', diameter: '25.4 mm', count: '1' }
	],
	rail: { from: '50 mm', to: '650 mm' },
	slots: [],
	keepOut: [],
	minSpacing: '20 mm',
	lensCounts: [2],
	rankBy: 'efficiency'
};

test('(b) Match → Put on the bench: the bench shows the solution and its waist is the target', async ({ page }) => {
	await startWith(page, setupDoc({ name: 'Journey b', extra: { match: matchSection } }), '/match/');
	await expect(page.getByTestId('search-constraints')).toContainText('Keep-out zones: none');
	await expect(page.getByTestId('constraint-rail')).toContainText('"50 mm" to "650 mm"');
	await page.getByTestId('match-run').click();
	await expect(page.getByTestId('match-progress')).toContainText(/Done/, { timeout: 30_000 });
	await page.getByTestId('match-row').first().getByTestId('match-apply').click();
	await expect(page).toHaveURL(/\/$/);
	await expect(page.getByTestId('element-table')).toContainText('ML2');
	// The lenses as placed (the document's text), pushed through Self's (1983) thin-lens formula from
	// the source waist (0.5 mm at z = 0, 632.8 nm): the result must be the target, 60 µm at 700 mm.
	const doc = await savedDoc(page, 2);
	const lenses = doc.elements.map((e: { at: string; params: { f: string } }) => ({ z_m: mm(e.at), f_m: mm(e.params.f) }));
	expect(lenses.length).toBe(2);
	const closed = throughLenses(0.5e-3, 0, HeNe, lenses);
	expectNear(closed.z_m, 0.7, 5e-3, 'closed-form waist position of the applied solution vs the target');
	expectNear(closed.w0_m, 60e-6, 5e-3, 'closed-form waist radius of the applied solution vs the target');
	// The bench shows that waist.
	await expectWaistAfter(page, 'ML2', closed.z_m, closed.w0_m, 2e-3);
});

/**
 * Widths of a beam along z from the ISO 11146-1 hyperbolic caustic d(z)² = d0² + Θ²(z − z0)² with
 * Θ = 4·M²·λ/(π·d0) (ISO 11146-1:2005, clause 3; from memory): z in mm, d in µm, ten planes.
 */
function widths(d0_m: number, z0_m: number, m2: number, lambda_m: number): string {
	const theta = (4 * m2 * lambda_m) / (Math.PI * d0_m);
	const zR = d0_m / theta;
	const lines = ['z,d'];
	for (const k of [-3, -2.4, -0.9, -0.5, -0.1, 0.3, 0.8, 2.3, 2.9, 3.6]) {
		const z = z0_m + k * zR;
		lines.push(`${(z * 1e3).toFixed(5)},${(Math.sqrt(d0_m ** 2 + theta ** 2 * (z - z0_m) ** 2) * 1e6).toFixed(5)}`);
	}
	return lines.join('\n');
}
const leading = async (page: Page, id: string) => Number((await page.getByTestId(id).innerText()).trim().split(/\s/)[0]);

test('(c) Measure → fit → Make this the source: the bench source is the fit, and a wavelength change is asked first', async ({ page }) => {
	await startWith(page, setupDoc({ name: 'Journey c' }), '/measure/');
	// Following the bench laser: 632.8 nm.
	await expect(page.getByTestId('m-wavelength')).toHaveValue('632.8 nm');
	await page.getByTestId('widths-input').fill(widths(0.6e-3, 0.2, 2.27, HeNe));
	await expect(page.getByTestId('fit-wavelength')).toContainText('632.8 nm');
	await expect.poll(() => leading(page, 'fit-d-m2'), { timeout: 15_000 }).toBeCloseTo(2.27, 3);
	await page.getByTestId('send-to-bench').click();
	await expect(page).toHaveURL(/\/$/);
	await expect(page.getByTestId('src-wavelength')).toHaveValue('632.8 nm');
	expectNear(readSI(await page.getByTestId('src-x-waist').inputValue()), 0.3e-3, 1e-4, 'bench source waist radius = d0/2 of the caustic');
	expectNear(readSI(await page.getByTestId('src-x-waistAt').inputValue()), 0.2, 1e-4, 'bench source waist position = z0 of the caustic');
	expectNear(Number(await page.getByTestId('src-x-m2').inputValue()), 2.27, 1e-3, 'bench source M²');
	// The bench propagates it: its first waist is the fitted one, with zR = π·w0²/(M²·λ) (Siegman 1986).
	const first = (await waistRows(page))[0];
	expectNear(first.z_m, 0.2, 1e-3, 'bench waist z');
	expectNear(first.zR_m, rayleigh(0.3e-3, HeNe, 2.27), 2e-3, 'bench Rayleigh range');

	// Type another wavelength on Measure: the note says it differs; M² scales as 1/λ (M² = π·d0·Θ/(4λ), ISO 11146-1).
	await openWorkspace(page, 'Measure');
	await page.getByTestId('m-wavelength').fill('1064 nm');
	await expect(page.getByTestId('m-wavelength-differs')).toContainText('differs from the bench laser (632.8 nm)');
	await expect.poll(() => leading(page, 'fit-d-m2'), { timeout: 15_000 }).toBeCloseTo((2.27 * 632.8) / 1064, 3);
	// "Make this the bench's source" asks before it changes the bench wavelength; Cancel changes nothing.
	await page.getByTestId('send-to-bench').click();
	await expect(page.getByTestId('confirm-wavelength')).toContainText('1064 nm');
	await page.getByTestId('confirm-wavelength-no').click();
	await openWorkspace(page, 'Bench');
	await expect(page.getByTestId('src-wavelength')).toHaveValue('632.8 nm');
	await openWorkspace(page, 'Measure');
	await page.getByTestId('send-to-bench').click();
	await page.getByTestId('confirm-wavelength-yes').click();
	await expect(page).toHaveURL(/\/$/);
	await expect(page.getByTestId('src-wavelength')).toHaveValue('1064 nm');
	expectNear(Number(await page.getByTestId('src-x-m2').inputValue()), (2.27 * 632.8) / 1064, 1e-3, 'bench M² at 1064 nm');
});

test('(d) a bench wavelength change: Measure and Hazard follow', async ({ page }) => {
	const measure = { widths: widths(0.6e-3, 0.2, 1.35, HeNe), zUnit: 'mm', dUnit: 'um', wavelength: '', wavelengthFrom: 'bench', weighting: 'relative', zOffset: '0 mm', pixel: '5.5 um' };
	const safety = { beamFrom: 'bench', label: 'Demo laser J', power: '5 mW', duration: '' };
	await startWith(page, setupDoc({ name: 'Journey d', extra: { measure, safety } }), '/measure/');
	await expect.poll(() => leading(page, 'fit-d-m2'), { timeout: 15_000 }).toBeCloseTo(1.35, 3);
	await openWorkspace(page, 'Hazard');
	await expect(page.getByTestId('hz-bench-beam')).toContainText('632.8 nm');
	await openWorkspace(page, 'Bench');
	await page.getByTestId('src-wavelength').fill('532 nm');
	await openWorkspace(page, 'Measure');
	await expect(page.getByTestId('m-wavelength')).toHaveValue('532 nm');
	await expect(page.getByTestId('m-wavelength-differs')).toHaveCount(0);
	// Same widths, shorter wavelength: M² = π·d0·Θ/(4λ) grows as 1/λ (ISO 11146-1:2005; from memory).
	await expect.poll(() => leading(page, 'fit-d-m2'), { timeout: 15_000 }).toBeCloseTo((1.35 * 632.8) / 532, 3);
	await openWorkspace(page, 'Hazard');
	await expect(page.getByTestId('hz-bench-beam')).toContainText('532 nm');
	await expect(page.getByTestId('hz-bench-beam')).toContainText('Journey d');
});

/**
 * Far-field formula NOHD = (√(4P/(π·E)) − a)/φ with a and φ the 1/e beam diameter and full divergence
 * (IEC 60825-1 and ANSI Z136.1 hazard-distance formula; from memory); a Gaussian's 1/e diameter and
 * divergence are its 1/e² values divided by √2 (common practice).
 */
function nohdFormula(power_W: number, mpe_W_m2: number, d_m: number, theta_rad: number) {
	return (Math.sqrt((4 * power_W) / (Math.PI * mpe_W_m2)) - d_m / Math.SQRT2) / (theta_rad / Math.SQRT2);
}
/** Visible (400–700 nm), 0.25 s accidental exposure: H = 18·t^0.75 J/m², E = H/t = 25.46 W/m² (Directive 2006/25/EC, Annex II Table 2.2; from memory). */
const mpeVisible = (18 * 0.25 ** 0.75) / 0.25;

test('(e) Hazard from the bench beam follows bench edits, and its summary prints the same numbers', async ({ page }) => {
	const safety = { beamFrom: 'bench', label: 'Demo laser J', power: '5 mW', duration: '' };
	await startWith(page, setupDoc({ name: 'Journey e', wavelength: '532 nm', waist: '1 mm', extra: { safety } }), '/hazard/');
	// No elements: exit at the source waist, d = 2w0, φ = 2λ/(π·w0) (Siegman 1986, far field).
	const before = nohdFormula(5e-3, mpeVisible, 2e-3, (2 * 532e-9) / (Math.PI * 1e-3));
	await expect.poll(async () => readSI(await page.getByTestId('hz-nohd-formula').innerText()) / before, { timeout: 15_000 }).toBeCloseTo(1, 3);
	await expect(page.getByTestId('hz-bench-beam')).toContainText('Journey e');
	await expect(page.getByTestId('hz-bench-beam')).toContainText('532 nm');

	// On the bench: 632.8 nm and a 100 mm lens at 100 mm.
	await openWorkspace(page, 'Bench');
	await page.getByTestId('src-wavelength').fill('632.8 nm');
	await page.getByTestId('add-kind').selectOption('thinLens');
	await page.getByTestId('add-element').click();
	await page.getByTestId('el-L1-at').fill('100 mm');
	await page.getByTestId('el-L1-f').fill('100 mm');
	await openWorkspace(page, 'Hazard');
	// Exit at the lens (z = 0.1 m, where the distance starts): d = 2·w(0.1 m) of the source beam; after
	// it Self's (1983) waist w0', φ = 2λ/(π·w0').
	const zR = rayleigh(1e-3, HeNe);
	const out = thinLens(1e-3, 0.1, zR, 0.1);
	const after = 0.1 + nohdFormula(5e-3, mpeVisible, 2 * 1e-3 * Math.sqrt(1 + (0.1 / zR) ** 2), (2 * HeNe) / (Math.PI * out.w0_m));
	await expect.poll(async () => readSI(await page.getByTestId('hz-nohd-formula').innerText()) / after, { timeout: 15_000 }).toBeCloseTo(1, 3);
	await expect(page.getByTestId('hz-bench-beam')).toContainText('632.8 nm');
	const shown = await page.getByTestId('hz-nohd-formula').innerText();

	// The printed summary names the bench setup and its wavelength and carries the same numbers.
	await page.getByTestId('hz-report-link').click();
	await expect(page.getByTestId('report-bench-beam')).toContainText('Journey e');
	await expect(page.getByTestId('report-bench-beam')).toContainText('632.8 nm');
	await expect(page.getByTestId('hz-nohd-formula')).toHaveText(shown);
	expect(readSI(shown) / after).toBeCloseTo(1, 3);
});

test('(f) New whole setup: every workspace is empty; New bench only keeps the others', async ({ page }) => {
	await page.goto('/'); // fresh context, empty storage: the demo setup, with its shelf, keep-out zone, laser name and widths
	await page.getByTestId('new').click();
	await page.getByTestId('new-bench').click();
	await expect(page.getByTestId('element-table')).toContainText('No elements.');
	await openWorkspace(page, 'Match');
	await expect(page.getByTestId('constraint-keepout')).not.toContainText('none'); // the example's zone is kept
	await openWorkspace(page, 'Bench');
	await page.getByTestId('new').click();
	await page.getByTestId('new-all').click();
	await expect(page.getByTestId('element-table')).toContainText('No elements.');
	// The automatic plot end of a bare source: 3 Rayleigh ranges, zR = π·w0²/λ = 1.241 m (Siegman 1986).
	const zR = rayleigh(0.5e-3, HeNe);
	expectNear((await waistRows(page))[0].zR_m, zR, 1e-3, 'source Rayleigh range');
	await expect(page.getByTestId('view-end')).toHaveValue('');
	const hint = await page.locator('#' + (await page.getByTestId('view-end').getAttribute('aria-describedby'))).innerText();
	expectNear(readSI(hint.replace(/^.*to /, '')), 3 * zR, 1e-3, 'automatic plot end (3 zR past the last element)');

	await openWorkspace(page, 'Match');
	await expect(page.getByTestId('constraint-shelf')).toContainText('empty');
	await expect(page.getByTestId('constraint-keepout')).toContainText('none');
	await expect(page.getByTestId('constraint-ranges')).toContainText('none');
	await openWorkspace(page, 'Measure');
	await expect(page.getByTestId('widths-input')).toHaveValue('');
	await expect(page.getByTestId('m-wavelength')).toHaveValue('632.8 nm');
	await openWorkspace(page, 'Hazard');
	await expect(page.getByTestId('hz-label')).toHaveValue('');
	// Pulsed works at once: no leftover explicit duration blocks it.
	await page.getByTestId('hz-pulsed').check();
	await expect(page.getByTestId('hz-results')).toBeVisible();
	await expect(page.getByTestId('hz-no-result')).toHaveCount(0);
});

test('(g) a reload in the middle of editing loses nothing', async ({ page }) => {
	await startWith(page, setupDoc({ name: 'Journey g', lenses: [{ at: '100 mm', f: '200 mm' }], end: '2 m' }));
	await openWorkspace(page, 'Hazard');
	await page.getByTestId('hz-label').fill('Demo laser G');
	await openWorkspace(page, 'Measure');
	await page.getByTestId('m-wavelength').fill('600 nm');
	await openWorkspace(page, 'Bench');
	await openElement(page, 'L1');
	// A bare number is read in the unit shown beside the field (mm, the unit of "200 mm").
	const f = page.getByTestId('el-L1-f');
	const fUnit = page.getByTestId('el-L1-f-unit');
	await expect(fUnit).toHaveValue('mm');
	await f.fill('120');
	// Another unit rewrites the number shown; the setup keeps 120 mm.
	await fUnit.selectOption('µm');
	await expect(f).toHaveValue('120000');
	await fUnit.focus(); // keyboard reachable
	await page.reload(); // at once, inside the autosave delay
	await expect(page.getByTestId('caustic-plot')).toBeVisible();
	const out = thinLens(0.5e-3, 0.1, rayleigh(0.5e-3, HeNe), 0.12);
	await expectWaistAfter(page, 'L1', 0.1 + out.s_m, out.w0_m);
	await openElement(page, 'L1');
	await expect(f).toHaveValue('120 mm');
	await expect(fUnit).toHaveValue('mm');
	await openWorkspace(page, 'Measure');
	await expect(page.getByTestId('m-wavelength')).toHaveValue('600 nm');
	await expect(page.getByTestId('m-wavelength-differs')).toContainText('632.8 nm');
	await openWorkspace(page, 'Hazard');
	await expect(page.getByTestId('hz-label')).toHaveValue('Demo laser G');
});

test('(h) undo across a page change brings the bench back, and every page follows', async ({ page }) => {
	await startWith(page, setupDoc({ name: 'Journey h', lenses: [{ at: '100 mm', f: '200 mm' }], end: '2 m' }));
	await openElement(page, 'L1');
	await page.getByTestId('el-L1-f').fill('50 mm');
	const f50 = thinLens(0.5e-3, 0.1, rayleigh(0.5e-3, HeNe), 0.05);
	await expectWaistAfter(page, 'L1', 0.1 + f50.s_m, f50.w0_m);
	await openWorkspace(page, 'Match');
	await page.locator('h1').click();
	await page.keyboard.press('Control+z');
	await openWorkspace(page, 'Bench');
	await openElement(page, 'L1');
	await expect(page.getByTestId('el-L1-f')).toHaveValue('200 mm');
	const f200 = thinLens(0.5e-3, 0.1, rayleigh(0.5e-3, HeNe), 0.2);
	await expectWaistAfter(page, 'L1', 0.1 + f200.s_m, f200.w0_m);
	// Redo on the Hazard page: the bench beam there is the 50 mm one again (its formula NOHD is
	// checked in (e); here the wavelength line and the bench page show the redo).
	await openWorkspace(page, 'Hazard');
	await page.locator('h1').click();
	await page.keyboard.press('Control+Shift+z');
	await openWorkspace(page, 'Bench');
	await expectWaistAfter(page, 'L1', 0.1 + f50.s_m, f50.w0_m);
});

/** A setup file as another session saved it (written by the test). */
const savedFile = setupDoc({
	name: 'Journey file',
	wavelength: '780 nm',
	waist: '0.8 mm',
	lenses: [{ at: '150 mm', f: '250 mm' }],
	end: '2 m',
	extra: {
		match: { ...matchSection, target: { ...matchSection.target, at: '500 mm', wx: '80 µm' } },
		safety: { beamFrom: 'bench', label: 'Demo laser F', power: '2 mW', duration: '' }
	}
});

async function expectEveryPageShowsFile(page: Page) {
	await openWorkspace(page, 'Match');
	await expect(page.getByTestId('target-at')).toHaveValue('500 mm');
	await openWorkspace(page, 'Measure');
	await expect(page.getByTestId('m-wavelength')).toHaveValue('780 nm');
	await openWorkspace(page, 'Hazard');
	await expect(page.getByTestId('hz-bench-beam')).toContainText('Journey file');
	await expect(page.getByTestId('hz-bench-beam')).toContainText('780 nm');
	await openWorkspace(page, 'Bench');
	await expect(page.getByTestId('src-wavelength')).toHaveValue('780 nm');
	// Self (1983): 0.8 mm at 0, 780 nm, through f = 250 mm at 150 mm.
	const out = thinLens(0.8e-3, 0.15, rayleigh(0.8e-3, 780e-9), 0.25);
	await expectWaistAfter(page, 'L1', 0.15 + out.s_m, out.w0_m);
}

test('(i) a saved file opened while on Match: every page shows the opened setup', async ({ page }) => {
	await startWith(page, setupDoc({ name: 'Journey i', lenses: [{ at: '100 mm', f: '200 mm' }] }));
	await openWorkspace(page, 'Match');
	await page.getByTestId('open-file-input').setInputFiles({ name: 'journey.beamwright.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(savedFile)) });
	await expect(page.getByTestId('open-file-message')).toContainText('Journey file');
	await expect(page.getByTestId('target-at')).toHaveValue('500 mm');
	await expectEveryPageShowsFile(page);
});

test('(j) a share link opened and accepted: every page follows', async ({ page, browser }) => {
	await startWith(page, savedFile);
	await page.getByTestId('share').click();
	const link = await page.getByTestId('share-link').inputValue();
	const context = await browser.newContext();
	const other = await context.newPage();
	await other.goto(link); // a browser with no setup of its own: the demo is shown and the link's setup offered
	await expect(other.getByTestId('shared-offer')).toContainText('Journey file', { timeout: 15_000 });
	await expect(other.getByTestId('src-wavelength')).toHaveValue('1064 nm'); // not applied before the user says so
	await other.getByTestId('shared-open').click();
	await expectEveryPageShowsFile(other);
	await context.close();
});

test('(k) a focus just past "Plot to" stays in the waist table, marked, with an offer to extend', async ({ page }) => {
	// −100 mm at 100 mm, then 215 mm at 300 mm: Self (1983) twice puts the focus just past 1 m.
	const lenses = [{ at: '100 mm', f: '-100 mm' }, { at: '300 mm', f: '215 mm' }];
	const focus = throughLenses(0.5e-3, 0, HeNe, lenses.map((l) => ({ z_m: mm(l.at), f_m: mm(l.f) })));
	expect(focus.z_m).toBeGreaterThan(1);
	await startWith(page, setupDoc({ name: 'Journey k', lenses, end: '1 m' }));
	const beyond = page.getByTestId('waist-beyond');
	await expect(beyond.first()).toContainText('beyond the plot');
	await expectWaistAfter(page, 'L2', focus.z_m, focus.w0_m);
	await page.getByTestId('extend-plot').click();
	expect(readSI(await page.getByTestId('view-end').inputValue())).toBeGreaterThan(focus.z_m);
	await expect(beyond).toHaveCount(0);
	await expectWaistAfter(page, 'L2', focus.z_m, focus.w0_m);
	// Empty "Plot to" (the default of a new setup): the plot runs past that waist on its own.
	await page.getByTestId('view-end').fill('');
	await expect(beyond).toHaveCount(0);
	await expectWaistAfter(page, 'L2', focus.z_m, focus.w0_m);
});
