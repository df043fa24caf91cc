import { test, expect } from './support/fixtures';
import { readFileSync } from 'node:fs';
import { readCsv, download, close4 } from './csv.helpers';
import { readSI } from './journeys.helpers';

/** "125.6 µm" / "1.163 m" / "37.27 mm" → metres. */
function metres(s: string): number {
	const m = s.trim().replace('−', '-').match(/^(-?[\d.]+)\s*(µm|mm|m|km|nm)$/);
	if (!m) throw new Error(`not a length: "${s}"`);
	return Number(m[1]) * { nm: 1e-9, µm: 1e-6, mm: 1e-3, m: 1, km: 1e3 }[m[2] as 'm'];
}
test.beforeEach(async ({ page }) => {
	// A fresh context per test: storage starts empty, so one load shows the demo setup.
	await page.goto('/');
	await expect(page.getByTestId('caustic-plot')).toBeVisible();
});

test('the beam along the train as CSV agrees with the read-out cursor', async ({ page }) => {
	await page.getByTestId('beam-step').fill('100');
	const csv = await readCsv(await download(page, 'beam-csv'));
	expect(csv.cols).toEqual(['z_mm', 'w_x_mm', 'w_y_mm', 'R_x_m', 'R_y_m', 'gouy_x_deg', 'gouy_y_deg']);
	expect(csv.header.join('\n')).toMatch(/Setup: Demo lab/);
	expect(csv.header.join('\n')).toMatch(/w_x_mm: x beam radius w \(1\/e²/);
	expect(csv.rows.map((r) => Number(r[0]))).toEqual([0, 100, 200, 300, 400, 500, 600, 700, 800, 900, 1000, 1100, 1200, 1300, 1400]);
	// Put the cursor at z = 700 mm by typing a bare number (read in mm) and compare with the file's row.
	await page.getByTestId('cursor-z').fill('700');
	const row = csv.rows.find((r) => r[0] === '700')!;
	const x = page.getByTestId('readout-x');
	const y = page.getByTestId('readout-y');
	await expect.poll(async () => Number(await page.getByTestId('cursor-knob').getAttribute('aria-valuenow'))).toBeCloseTo(0.7, 12);
	close4(metres(await x.locator('[data-col=w]').innerText()), Number(row[1]) / 1000);
	close4(metres(await y.locator('[data-col=w]').innerText()), Number(row[2]) / 1000);
	close4(metres(await x.locator('[data-col=d]').innerText()), (2 * Number(row[1])) / 1000);
	close4(metres(await x.locator('[data-col=R]').innerText()), Number(row[3]));
	close4(parseFloat((await x.locator('[data-col=gouy]').innerText()).replace('−', '-')), Number(row[5]));
});

test('waist and element tables export as CSV with the numbers shown', async ({ page }) => {
	const w = await readCsv(await download(page, 'waist-csv'));
	expect(w.cols).toEqual(['where', 'axis', 'z0_mm', 'w0_mm', 'd0_mm', 'zR_mm']);
	const shown = await page.getByTestId('waist-table').locator('tbody tr').evaluateAll((trs) => trs.map((tr) => [...tr.querySelectorAll('td')].map((td) => td.textContent ?? '')));
	expect(w.rows.length).toBe(shown.length);
	w.rows.forEach((r, i) => {
		expect(r[0]).toBe(shown[i][0]);
		close4(Number(r[2]) / 1000, metres(shown[i][2]));
		close4(Number(r[3]) / 1000, metres(shown[i][3]));
		close4(Number(r[4]) / 1000, metres(shown[i][4]));
		close4(Number(r[5]) / 1000, metres(shown[i][5]));
	});
	const e = await readCsv(await download(page, 'element-csv'));
	expect(e.cols[0]).toBe('element');
	const rows = await page.getByTestId('element-table').locator('tbody tr').evaluateAll((trs) => trs.map((tr) => [...tr.querySelectorAll('td')].map((td) => td.textContent ?? '')));
	expect(e.rows.map((r) => r[0])).toEqual(rows.map((r) => r[0]));
	e.rows.forEach((r, i) => {
		close4(Number(r[1]) / 1000, metres(rows[i][1]));
		close4(Number(r[2]) / 1000, metres(rows[i][2]));
		close4(Number(r[3]) / 1000, metres(rows[i][3]));
	});
});

test('the plot saves as SVG and PNG with its labels, the setup name and the date', async ({ page }) => {
	const svgFile = await download(page, 'bench-plot-svg');
	expect(svgFile.suggestedFilename()).toMatch(/\.beam-plot\.svg$/);
	const svg = readFileSync((await svgFile.path())!, 'utf8');
	expect(svg).toContain('Beam along the train — Demo lab, bench 2');
	expect(svg).toMatch(/exported \d{4}-\d\d-\d\d \d\d:\d\d UTC/);
	const waistLabel = (await page.getByTestId('waist-marker').first().locator('text').textContent())!.trim();
	expect(svg).toContain(waistLabel);
	for (const label of ['L1', 'L2', 'M1', 'M2', 'y: radius w (1/e²)', 'x: radius w (1/e²)']) expect(svg).toContain(label);
	expect(svg).not.toMatch(/var\(--/); // styles are resolved, the file stands alone
	const png = readFileSync((await (await download(page, 'bench-plot-png')).path())!);
	expect([...png.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
	const box = (await page.getByTestId('caustic-plot').locator('svg').first().boundingBox())!;
	expect(png.readUInt32BE(16)).toBe(2 * Math.ceil(box.width)); // IHDR width at 2 px per CSS px
});

test('the glyph moves with the arrow keys; the cursor follows a drag and a typed z', async ({ page }) => {
	const l2 = page.getByTestId('handle-L2');
	await l2.focus();
	for (let i = 0; i < 3; i++) await page.keyboard.press('ArrowRight');
	await page.keyboard.press('Shift+ArrowLeft');
	await expect(l2).toHaveAttribute('aria-valuenow', '0.293');
	await expect(page.getByTestId('element-L2')).toContainText('293 mm');
	// Drag the cursor knob to the right; the typed field follows.
	const before = await page.getByTestId('cursor-z').inputValue();
	const knob = (await page.getByTestId('cursor-knob').boundingBox())!;
	await page.mouse.move(knob.x + knob.width / 2, knob.y + knob.height / 2);
	await page.mouse.down();
	await page.mouse.move(knob.x - 120, knob.y + knob.height / 2, { steps: 4 });
	await page.mouse.up();
	await expect(page.getByTestId('cursor-z')).not.toHaveValue(before);
	expect(Number(await page.getByTestId('cursor-z').inputValue())).toBeLessThan(Number(before));
	// A typed z with its own unit is read in that unit.
	await page.getByTestId('cursor-z').fill('0.25 m');
	await expect.poll(async () => Number(await page.getByTestId('cursor-knob').getAttribute('aria-valuenow'))).toBeCloseTo(0.25, 12);
	await page.getByTestId('cursor-z').fill('12 parsecs');
	await expect(page.locator('#ro-z-err')).toContainText('Read-out z');
});

test('a round beam is drawn once, above the axis, and says x = y; close elements do not overlap', async ({ page }) => {
	await page.getByTestId('new').click();
	await page.getByTestId('new-bench').click();
	await page.getByTestId('add-element').click();
	await page.getByTestId('add-element').click();
	await expect(page.getByTestId('caustic-plot')).toContainText('x = y');
	await expect(page.getByTestId('curve-y')).toHaveCount(0);
	// Move L2 onto L1: their glyphs and labels must still not overlap.
	await page.getByTestId('el-L2-at').fill('101 mm');
	await expect(page.getByTestId('handle-L2')).toHaveAttribute('aria-valuenow', '0.101');
	const a = (await page.getByTestId('handle-L1').locator('text').first().boundingBox())!;
	const b = (await page.getByTestId('handle-L2').locator('text').first().boundingBox())!;
	expect(a.x + a.width <= b.x || b.x + b.width <= a.x).toBe(true);
});

test('after Add element the new element\'s first field has the focus', async ({ page }) => {
	await page.getByTestId('add-element').click();
	await expect(page.locator('li.el.selected input').first()).toBeFocused();
});

test('Measure: the fit report saves as CSV and JSON with the numbers, the wavelength and the plan check shown', async ({ page }) => {
	await page.goto('/measure/');
	await page.getByTestId('load-demo-widths').click();
	await page.getByTestId('m-wavelength').fill('1064 nm');
	await expect(page.getByTestId('fit-x-m2')).toHaveText(/±/);
	const csv = await readCsv(await download(page, 'fit-csv'));
	expect(csv.header.join('\n')).toContain('Wavelength (vacuum): 1064 nm');
	expect(csv.cols.slice(0, 11)).toEqual(['axis', 'd0_mm', 'u_d0_mm', 'z0_mm', 'u_z0_mm', 'full_divergence_mrad', 'u_full_divergence_mrad', 'zR_mm', 'u_zR_mm', 'M2', 'u_M2']);
	const col = (name: string) => csv.cols.indexOf(name);
	for (const axis of ['x', 'y']) {
		const row = csv.rows.find((r) => r[0] === axis)!;
		// The page shows "value ± u unit" with 4 significant digits on the value.
		const shown = (id: string) => page.getByTestId(`fit-${axis}-${id}`).innerText();
		const [d0v, , d0u] = (await shown('d0_m')).replace('−', '-').split(' ');
		close4(Number(row[col('d0_mm')]) / 1000, metres(`${d0v} ${(await shown('d0_m')).split(' ').pop()}`));
		expect(d0u).toBeDefined();
		const m2 = parseFloat(await shown('m2'));
		close4(Number(row[col('M2')]), m2);
		const plan = await page.getByTestId('plan-check').innerText();
		expect(plan).toContain(`${axis} axis: ${row[col('plan')] === 'meets the rule' ? '✓' : ''}`);
	}
	const jsonFile = await download(page, 'fit-json');
	const j = JSON.parse(readFileSync((await jsonFile.path())!, 'utf8'));
	expect(j.format).toBe('beamwright-fit-report');
	expect(j.wavelength_m).toBeCloseTo(1064e-9, 15);
	const xRow = csv.rows.find((r) => r[0] === 'x')!;
	close4(j.axes.x.d0_m * 1000, Number(xRow[col('d0_mm')]));
	close4(j.axes.x.m2, Number(xRow[col('M2')]));
	expect(typeof j.axes.x.plan.ok).toBe('boolean');
});

test('Match: focus lands on the results; the ranked solutions save as CSV with the numbers shown', async ({ page }) => {
	await page.goto('/match/');
	await page.getByTestId('target-waist').check();
	await page.getByTestId('target-at').fill('700 mm');
	await page.getByTestId('target-wx').fill('60 µm');
	await page.getByTestId('match-run').click();
	await expect(page.getByTestId('match-progress')).toContainText(/Done/, { timeout: 30_000 });
	await expect(page.getByTestId('match-results')).toBeFocused();
	const rows = page.getByTestId('match-row');
	const shown = await rows.evaluateAll((trs) => trs.map((tr) => [...tr.querySelectorAll('td')].map((td) => (td as HTMLElement).innerText)));
	const csv = await readCsv(await download(page, 'match-csv'));
	expect(csv.rows.length).toBe(shown.length);
	const col = (n: string) => csv.cols.indexOf(n);
	csv.rows.forEach((r, i) => {
		expect(r[0]).toBe(String(i + 1));
		// "Total" column: efficiency in percent as shown (4 significant digits or fewer).
		const total = parseFloat(shown[i][6]);
		expect(Math.abs(Number(r[col('efficiency_percent')]) - total)).toBeLessThanOrEqual(0.05 + 1e-3 * total);
		const firstLens = shown[i][1].split('\n')[0]; // "L1 <label>: f at z"
		const m = firstLens.match(/: (−?[\d.]+ m?m) at ([\d.]+ m?m)/)!;
		close4(Number(r[col('lens1_f_mm')]) / 1000, metres(m[1].replace('−', '-')));
		close4(Number(r[col('lens1_z_mm')]) / 1000, metres(m[2]));
	});
	// The exact single lenses save as CSV with the numbers of their table.
	const single = await readCsv(await download(page, 'single-lens-csv'));
	expect(single.cols).toEqual(['axis', 'f_mm', 'z_mm', 'on_rail']);
	const singleShown = await page.getByTestId('single-lens').locator('tbody tr').evaluateAll((trs) => trs.map((tr) => [...tr.querySelectorAll('td')].map((td) => (td as HTMLElement).innerText.trim())));
	expect(single.rows.length).toBe(singleShown.length);
	expect(single.rows.length).toBeGreaterThan(0);
	single.rows.forEach((r, i) => {
		const t = singleShown[i];
		expect(t[0]).toContain(r[0]);
		if (t.length === 2) return expect(r[3]).toMatch(/^none/);
		close4(Number(r[1]) / 1000, readSI(t[1]));
		expect(Math.abs(Number(r[2]) - Number(t[2].replace(/ mm$/, '')))).toBeLessThanOrEqual(0.005);
		expect(t[3].startsWith(r[3])).toBe(true);
	});
	// The rail sketch saves as SVG and PNG with its labels, the setup name, the date and the lens list.
	const sketch = page.getByTestId('rail-sketch');
	const sketchSvg = readFileSync((await (await download(page, 'rail-sketch-svg')).path())!, 'utf8');
	expect(sketchSvg).toContain('Rail sketch of solution 1 — Demo lab, bench 2');
	expect(sketchSvg).toMatch(/exported \d{4}-\d\d-\d\d \d\d:\d\d UTC/);
	for (const label of await sketch.locator('svg text').allTextContents()) expect(sketchSvg).toContain(label.trim());
	const firstLens = shown[0][1].split('\n')[0].match(/: (−?[\d.]+ m?m) at ([\d.]+ m?m)/)!;
	const inFile = /L1: f = (−?[\d.]+ m?m) at z = ([\d.]+ m?m)/.exec(sketchSvg)!;
	expect(inFile).not.toBeNull();
	close4(metres(inFile[1].replace('−', '-')), metres(firstLens[1].replace('−', '-')));
	expect(Math.abs(metres(inFile[2]) - metres(firstLens[2]))).toBeLessThanOrEqual(5e-6);
	expect(sketchSvg).toContain('converging lens');
	expect(sketchSvg).not.toMatch(/NaN|Infinity|undefined|var\(--/);
	const sketchPng = readFileSync((await (await download(page, 'rail-sketch-png')).path())!);
	expect([...sketchPng.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
	const sbox = (await sketch.locator('svg').first().boundingBox())!;
	expect(sketchPng.readUInt32BE(16)).toBe(2 * Math.ceil(sbox.width));
});

test('Match: an expander goes on the bench with its spacing, and the expander table saves as CSV', async ({ page }) => {
	await page.goto('/match/');
	await page.locator('nav[aria-label="On this page"]').getByRole('link', { name: 'Beam expanders' }).click();
	await expect(page).toHaveURL(/#exp-h$/);
	const first = page.getByTestId('expander-row').first();
	await expect(first).toBeVisible();
	const csv = await readCsv(await download(page, 'expanders-csv'));
	const row = csv.rows[0];
	const spacing_mm = Number(row[csv.cols.indexOf('spacing_mm')]);
	const at_mm = Number((await page.getByTestId('exp-at').inputValue()).replace(/\s*mm$/, ''));
	await first.getByTestId('expander-apply').click();
	await expect(page).toHaveURL(/\/$/);
	const table = page.getByTestId('element-table');
	await expect(table).toContainText('EX1');
	await expect(table).toContainText('EX2');
	const ex = await table.locator('tbody tr').evaluateAll((trs) => trs.map((tr) => [...tr.querySelectorAll('td')].map((td) => td.textContent ?? '')).filter((c) => c[0].startsWith('EX')));
	close4(metres(ex[0][1]), at_mm / 1000);
	close4(metres(ex[1][1]), (at_mm + spacing_mm) / 1000);
});

test('Hazard: the exposure plot saves as SVG with the caution and the limit source under it', async ({ page }) => {
	await page.goto('/hazard/');
	await expect(page.getByTestId('hz-nohd-beam')).toBeVisible();
	const nohd = (await page.getByTestId('hz-nohd-beam').innerText()).trim();
	const svgFile = await download(page, 'hazard-plot-svg');
	expect(svgFile.suggestedFilename()).toMatch(/\.exposure-plot\.svg$/);
	const svg = readFileSync((await svgFile.path())!, 'utf8');
	expect(svg).toContain('Exposure along the beam');
	// The caution travels with every safety output (src/lib/safety/cautions.ts), in the file too.
	expect(svg).toContain('First-pass estimate, not a hazard evaluation.');
	expect(svg).toContain('laser safety officer decide');
	expect(svg).not.toMatch(/NaN|Infinity|undefined|var\(--/);
	// The plot marks the NOHD that the page shows.
	const inPlot = /NOHD ([\d.]+) (m|km)/.exec(svg);
	expect(inPlot).not.toBeNull();
	close4(metres(`${inPlot![1]} ${inPlot![2]}`), metres(nohd.replace(/^beyond /, '')));

	// The result tables save as CSV: the caution in the header, every number as the page shows it, and
	// each value beside the source and provenance of the limit it rests on.
	const res = await readCsv(await download(page, 'hz-results-csv'));
	expect(res.cols).toEqual(['section', 'quantity', 'value', 'unit', 'basis', 'limit_source', 'provenance']);
	const head = res.header.join('\n');
	expect(head).toContain('First-pass estimate, not a hazard evaluation.');
	expect(head).toContain("The applicable standard, local regulations and the site's laser safety officer decide.");
	expect(head).toMatch(/value: the number, in the unit of the next column/);
	expect(res.text).not.toMatch(/NaN|Infinity|undefined/);
	const row = (q: string) => {
		const r = res.rows.find((r) => r[1] === q);
		expect(r, `row "${q}"`).toBeDefined();
		return r!;
	};
	const shown = async (id: string) => (await page.getByTestId(id).innerText()).trim();
	const limit = row('limit as irradiance');
	expect(limit[3]).toBe('W/m²');
	close4(Number(limit[2]), readSI((await shown('hz-mpe-E')).split(' (')[0], 'W/m²'));
	close4(Number(row('NOHD, far-field formula')[2]), readSI(await shown('hz-nohd-formula')));
	close4(Number(row('NOHD along the beam (aperture-averaged)')[2]), readSI(nohd.replace(/^beyond /, '')));
	close4(Number(row('hazard distance used (the larger)')[2]), readSI((await shown('hz-hazard-distance')).split(' — ')[0]));
	const od = /OD ([\d.]+) → at least OD (\d+)/.exec(await shown('hz-od'))!;
	expect(Math.abs(Number(row('optical density required')[2]) - Number(od[1]))).toBeLessThanOrEqual(0.005 * Number(od[1]));
	expect(row('optical density, rounded up')[2]).toBe(od[2]);
	close4(Number(row('nominal skin hazard distance')[2]), readSI(await shown('hz-nshd')));
	close4(Number(row('skin limit as irradiance')[2]), readSI((await shown('hz-skin-E')).split(' (')[0], 'W/m²'));
	// Eye rows carry the limit's table row and source as the page shows it; every row has one.
	expect(limit[5]).toBe(await shown('hz-limit-source'));
	expect(limit[6]).toMatch(/^read from the published text/);
	for (const r of res.rows) expect(r[5], `limit source of "${r[1]}"`).not.toBe('');
});
