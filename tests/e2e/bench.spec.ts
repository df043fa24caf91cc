import { type Page } from '@playwright/test';
import { test, expect } from './support/fixtures';
import { fieldValuesShown, recordFieldWhileShown } from './support/frames';

/** Text of the waist table body, to see it change. */
async function waistTable(page: Page) {
	return (await page.getByTestId('waist-table').locator('tbody').innerText()).trim();
}

async function expectNoBrokenNumbers(page: Page) {
	// Messages may quote what the user typed ("NaN"); everything else must be a real number.
	const text = (await page.locator('main').innerText()).replace(/"[^"]*"/g, '');
	expect(text).not.toMatch(/\bNaN\b|\bundefined\b|Infinity/);
}

/** Wait until the autosaved setup in this browser contains `text` (no fixed sleep). */
async function autosaved(page: Page, text: string) {
	await expect.poll(() => page.evaluate(() => Object.values(localStorage).join('\n'))).toContain(text);
}

// Each test starts with empty storage (the shared page is reset before it, see support/fixtures.ts): one page load.
test.beforeEach(async ({ page }) => {
	expect(await page.context().storageState()).toEqual({ cookies: [], origins: [] });
	await page.goto('/');
	await expect(page.getByTestId('caustic-plot')).toBeVisible();
});

test('loads the demo setup and shows waists and the beam at each element', async ({ page }) => {
	await expect(page.getByRole('heading', { name: 'Source' })).toBeVisible();
	await expect(page.getByTestId('waist-table')).toContainText('after M2');
	await expect(page.getByTestId('element-table')).toContainText('L1');
	await expect(page.getByTestId('waist-marker').first()).toBeVisible();
	await expectNoBrokenNumbers(page);
});

test('editing the source changes the waists', async ({ page }) => {
	const before = await waistTable(page);
	const field = page.getByTestId('src-x-waist');
	await field.fill('0.6 mm');
	await expect.poll(() => waistTable(page)).not.toBe(before);
	await expectNoBrokenNumbers(page);
});

test('add a lens, drag it along the axis, and the waist table follows', async ({ page }) => {
	await page.getByTestId('add-kind').selectOption('thinLens');
	await page.getByTestId('add-element').click();
	// The new lens is L3, placed past the last element; give it a position and focal length.
	await page.getByTestId('el-L3-at').fill('1000 mm');
	await page.getByTestId('el-L3-f').fill('150 mm');
	await expect(page.getByTestId('element-table')).toContainText('L3');
	const before = await waistTable(page);
	const handle = page.getByTestId('handle-L3');
	await handle.scrollIntoViewIfNeeded();
	const box = (await handle.boundingBox())!;
	await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
	await page.mouse.down();
	for (let i = 1; i <= 10; i++) await page.mouse.move(box.x + box.width / 2 + i * 6, box.y + box.height / 2);
	await page.mouse.up();
	await expect.poll(() => waistTable(page)).not.toBe(before);
	const at = await page.getByTestId('el-L3-at').inputValue();
	expect(parseFloat(at)).toBeGreaterThan(1000);
	await expectNoBrokenNumbers(page);
});

const badInputs = ['', '0', '-3 mm', 'NaN', '5 kg', '1e400 m', 'abc'];

// Units, blanks and non-numbers are refused in every source field by the per-form tests below; this one
// checks the range rules (zero and negative values) and the "Plot to" field, on one page load.
test('out-of-range source values and bad "Plot to" values show a message, keep the text, and nothing breaks', async ({ page }) => {
	const cases: Array<[string, string[]]> = [
		...['src-wavelength', 'src-index', 'src-x-m2', 'src-x-waist', 'src-x-waistAt', 'src-y-m2', 'src-y-waist', 'src-y-waistAt'].map((id): [string, string[]] => [id, ['0', '-3 mm']]),
		['view-end', badInputs]
	];
	for (const [id, values] of cases) {
		const input = page.getByTestId(id);
		const original = await input.inputValue();
		for (const bad of values) {
			await input.fill(bad);
			const invalid = await input.getAttribute('aria-invalid');
			if (invalid === 'true') {
				const describedBy = await input.getAttribute('aria-describedby');
				await expect(page.locator(`#${describedBy}`)).toBeVisible();
				await expect(page.getByTestId('setup-error')).toBeVisible();
			} else {
				// Accepted: only a waist location may be 0 or negative, and "Plot to" empty (automatic: past the last waist).
				expect(`${id}=${bad}`).toMatch(/waistAt=(0|-3 mm)$|^view-end=$/);
			}
			await expect(page.getByTestId('caustic-plot')).toBeVisible();
			await expectNoBrokenNumbers(page);
			// What the user typed is kept.
			await expect(input).toHaveValue(bad);
		}
		await input.fill(original);
		await expect(page.getByTestId('setup-error')).toHaveCount(0);
	}
	// "Plot to" keeps its unit picker when emptied: a bare number is read in the unit shown, and picking
	// another unit rewrites the number shown (500 mm = 0.5 m) — common practice for unit pickers.
	const end = page.getByTestId('view-end');
	const endUnit = page.getByTestId('view-end-unit');
	const endText = await end.inputValue();
	await end.fill('');
	await endUnit.selectOption('mm');
	await end.fill('500');
	await expect(end).toHaveAttribute('aria-invalid', 'false');
	await endUnit.selectOption('m');
	await expect(end).toHaveValue('0.5');
	await end.fill(endText);
	await expect(page.getByTestId('setup-error')).toHaveCount(0);
});

test('bad input in the fields of lens L2 (focal length, position, aperture) is refused and nothing breaks', async ({ page }) => {
	await page.getByTestId('element-L2').getByRole('button', { name: /L2/ }).first().click();
	for (const id of ['el-L2-f', 'el-L2-at', 'el-L2-aperture']) {
		const input = page.getByTestId(id);
		const original = await input.inputValue();
		for (const bad of badInputs) {
			await input.fill(bad);
			const acceptable = (id === 'el-L2-aperture' && bad === '') || (id === 'el-L2-at' && (bad === '0' || bad === '-3 mm')) || (id === 'el-L2-f' && bad === '-3 mm');
			if (!acceptable) await expect(input, `${id} = "${bad}"`).toHaveAttribute('aria-invalid', 'true');
			await expectNoBrokenNumbers(page);
			await expect(page.getByTestId('caustic-plot')).toBeVisible();
		}
		await input.fill(original);
	}
	await expect(page.getByTestId('setup-error')).toHaveCount(0);
});

test('a reload restores the setup', async ({ page }) => {
	await page.getByTestId('src-wavelength').fill('532 nm');
	await page.getByTestId('add-element').click();
	await autosaved(page, '"L3"');
	await autosaved(page, '532 nm');
	await page.reload();
	await expect(page.getByTestId('src-wavelength')).toHaveValue('532 nm');
	await expect(page.getByTestId('element-L3')).toBeVisible();
});

test('a reload shows the saved setup and never the prerendered demo in its place', async ({ page }) => {
	await page.getByTestId('src-wavelength').fill('532 nm');
	await autosaved(page, '532 nm');
	// Every frame of the reloaded page: what the wavelength field shows while the page is visible.
	await recordFieldWhileShown(page, 'src-wavelength');
	await page.reload();
	await expect(page.getByTestId('src-wavelength')).toHaveValue('532 nm');
	expect(new Set(await fieldValuesShown(page))).toEqual(new Set(['532 nm']));
});

test('the plot, taken over after the rest of the page, keeps its prerendered drawing and follows the setup, a reloaded one included', async ({ page }) => {
	// From the start of the next load: every curve element the page removes (a rebuilt plot removes its prerendered one).
	await page.addInitScript(() => {
		const w = window as unknown as { __curvesRemoved: number };
		w.__curvesRemoved = 0;
		new MutationObserver((records) => {
			for (const r of records) for (const n of r.removedNodes) if (n instanceof Element && (n.matches('[data-testid="curve-x"]') || n.querySelector('[data-testid="curve-x"]'))) w.__curvesRemoved++;
		}).observe(document, { subtree: true, childList: true });
	});
	await page.reload(); // waits for <html data-ready>: the plot has been taken over by then (src/lib/ui/island)
	const curve = page.getByTestId('curve-x');
	const demo = await curve.getAttribute('d');
	expect(await page.evaluate(() => (window as unknown as { __curvesRemoved: number }).__curvesRemoved)).toBe(0);
	// Taken over, not just drawn: the same element follows an edit.
	await page.getByTestId('src-wavelength').fill('532 nm');
	await expect(curve).not.toHaveAttribute('d', demo!);
	const edited = await curve.getAttribute('d');
	await autosaved(page, '532 nm');
	// A returning user: the page is taken over with the demo and the plot with their own setup.
	await page.reload();
	await expect(curve).toHaveAttribute('d', edited!);
	expect(await page.evaluate(() => (window as unknown as { __curvesRemoved: number }).__curvesRemoved)).toBe(0);
});

test('a first visit gets the demo beam drawn in the page itself, before any script runs', async ({ page }) => {
	await page.route('**/*.js', (r) => r.abort());
	await page.goto('/', { waitUntil: 'load' }); // the page as loaded: its scripts never take it over
	const curve = page.getByTestId('curve-x');
	await expect(curve).toBeVisible();
	expect((await curve.getAttribute('d'))!.length).toBeGreaterThan(100);
	await expect(page.getByTestId('src-wavelength')).toHaveValue('1064 nm');
	// Nothing in the demo needs fixing: no field says it does (the read-out z once said "empty" here).
	await expect(page.locator('.field-error')).toHaveCount(0);
	await expect(page.getByTestId('cursor-z')).not.toHaveValue('');
	// Until the scripts take over, the page says it does not answer input yet.
	await expect(page.locator('main')).toHaveAttribute('aria-disabled', 'true');
});

test('a rejected import leaves the current work untouched and says why', async ({ page }) => {
	await page.getByTestId('src-wavelength').fill('780 nm');
	await page.getByTestId('import-input').setInputFiles({ name: 'broken.json', mimeType: 'application/json', buffer: Buffer.from('{"format":"beamwright-setup","version":1,"name":3}') });
	await expect(page.getByTestId('import-message')).toContainText('not loaded');
	await expect(page.getByTestId('import-message')).toContainText('unchanged');
	await expect(page.getByTestId('src-wavelength')).toHaveValue('780 nm');
});

test('the setup bar stays put when the autosave status appears (a click meant for New… lands on New…)', async ({ page }) => {
	const before = await page.getByTestId('new').boundingBox();
	await expect(page.getByTestId('autosave-status')).toHaveText('');
	await page.getByTestId('src-wavelength').fill('633 nm');
	await expect(page.getByTestId('autosave-status')).toHaveText('Autosaved in this browser');
	expect(await page.getByTestId('new').boundingBox()).toEqual(before);
});

test('export then import round-trips the setup', async ({ page }) => {
	await page.getByTestId('src-wavelength').fill('633 nm');
	const download = page.waitForEvent('download');
	await page.getByTestId('export').click();
	const file = await (await download).path();
	await page.getByTestId('new').click();
	await page.getByTestId('new-all').click();
	await expect(page.getByTestId('src-wavelength')).toHaveValue('632.8 nm');
	await page.getByTestId('import-input').setInputFiles(file);
	await expect(page.getByTestId('src-wavelength')).toHaveValue('633 nm');
});

test('a copied link carries the setup to another browser, which opens it only when asked', async ({ page, browser }) => {
	await page.getByTestId('src-wavelength').fill('780 nm');
	await page.getByTestId('share').click();
	const link = await page.getByTestId('share-link').inputValue();
	expect(link).toContain('#setup=');

	const other = await browser.newPage();
	await other.goto(link);
	await expect(other.getByTestId('shared-offer')).toContainText('Demo lab');
	// Not applied until the user says so.
	await expect(other.getByTestId('src-wavelength')).toHaveValue('1064 nm');
	await other.getByTestId('shared-open').click();
	await expect(other.getByTestId('src-wavelength')).toHaveValue('780 nm');
	expect(new URL(other.url()).hash).toBe('');
	await other.close();
});

test('a damaged link is refused and the current setup stays', async ({ page }) => {
	await page.getByTestId('src-wavelength').fill('633 nm');
	await autosaved(page, '633 nm');
	await page.goto('/#setup=AAAA-broken');
	await expect(page.getByTestId('shared-offer')).toContainText('cannot be opened');
	await expect(page.getByTestId('src-wavelength')).toHaveValue('633 nm');
});

/**
 * Every text field whose test id starts with `prefix` is wired to its rule: it refuses bad text with a
 * message beside it and keeps the text. The first field gets every kind of bad value, the others one
 * (a wrong unit); tests/unit/element-fields.test.ts checks every field against every bad value.
 */
async function refusesBadInput(page: Page, prefix: string) {
	const bad = ['', 'abc', '5 kg', '1e400 m', 'NaN'];
	// The text fields, by test id (not by position: a field that came or went would shift the rest).
	const ids = await page
		.locator(`input[data-testid^="${prefix}"]`)
		.evaluateAll((els) => els.filter((el) => (el as HTMLInputElement).type === 'text').map((el) => el.getAttribute('data-testid') ?? ''));
	expect(ids.length, `fields for ${prefix}`).toBeGreaterThan(0);
	expect(new Set(ids).size, `test ids of the fields for ${prefix} are unique`).toBe(ids.length);
	for (const [k, id] of ids.entries()) {
		const input = page.getByTestId(id);
		const original = await input.inputValue();
		for (const b of k === 0 ? bad : ['5 kg']) {
			// A blank clear aperture means "no aperture": the one blank that is valid.
			if (b === '' && id?.endsWith('-aperture')) continue;
			await input.fill(b);
			await expect(input, `${id} = "${b}"`).toHaveAttribute('aria-invalid', 'true');
			const msgId = await input.getAttribute('aria-describedby');
			await expect(page.locator(`#${msgId}`)).toContainText(/\w/);
			await expect(input).toHaveValue(b);
		}
		await input.fill(original);
		await expect(input).toHaveAttribute('aria-invalid', 'false');
	}
	await expect(page.getByTestId('setup-error')).toHaveCount(0);
	const text = (await page.locator('main').innerText()).replace(/"[^"]*"/g, '');
	expect(text).not.toMatch(/\bNaN\b|\bundefined\b|Infinity/);
}

// One test per source form and per element kind (each stays short on a busy machine).
for (const form of ['waist', 'divergence', 'twoDiameters']) {
	test(`every numeric field of the source (${form} form) refuses bad input with a message`, async ({ page }) => {
		await page.getByTestId('new').click();
		await page.getByTestId('new-all').click();
		await page.getByTestId('src-x-kind').selectOption(form);
		await refusesBadInput(page, 'src-');
	});
}

/** Every element kind of the Add menu (the next test fails when one is added without being listed here). */
const elementKinds = ['thinLens', 'thickLens', 'mirror', 'foldMirror', 'cylLens', 'interface', 'plate', 'thermalLens', 'medium', 'abcd'];

test('the element kinds are the ones tested below', async ({ page }) => {
	const kinds = await page.getByTestId('add-kind').locator('option').evaluateAll((os) => os.map((o) => (o as HTMLOptionElement).value));
	expect(kinds.sort()).toEqual([...elementKinds].sort());
});

for (const kind of elementKinds) {
	test(`every numeric field of a new ${kind} element refuses bad input with a message`, async ({ page }) => {
		await page.getByTestId('new').click();
		await page.getByTestId('new-all').click();
		await page.getByTestId('add-kind').selectOption(kind);
		await page.getByTestId('add-element').click();
		const label = (await page.locator('li.el.selected strong').innerText()).trim();
		await refusesBadInput(page, `el-${label}-`);
	});
}

test('input aimed at the page the moment it says it answers is not lost: a part not yet taken over takes itself over inside the event', async ({ page }) => {
	// The first moment <html data-ready> is there (a mutation observer runs before the next task, so before
	// any part's own take-over task): a click on "Add element" (the workspace) and the End key on the plot's
	// read-out cursor (the plot, an island inside the workspace's).
	await page.addInitScript(() => {
		const w = window as unknown as { __early: Record<string, unknown> };
		new MutationObserver((_, obs) => {
			if (!document.documentElement?.hasAttribute('data-ready')) return;
			obs.disconnect();
			const add = document.querySelector('[data-testid="add-element"]') as HTMLButtonElement & { __click?: unknown };
			const knob = document.querySelector('[data-testid="cursor-knob"]') as SVGGElement & { __keydown?: unknown };
			// Svelte keeps a delegated handler on the element itself: none yet means not taken over yet.
			const cursorBefore = (document.querySelector('[data-testid="cursor-z"]') as HTMLInputElement).value;
			w.__early = { elements: document.querySelectorAll('li.el').length, addHandled: typeof add.__click, knobHandled: typeof knob.__keydown, cursorBefore };
			add.click();
			knob.focus();
			knob.dispatchEvent(new KeyboardEvent('keydown', { key: 'End', bubbles: true, cancelable: true }));
		}).observe(document, { subtree: true, attributes: true, attributeFilter: ['data-ready'] });
	});
	await page.reload();
	const early = await page.evaluate(() => (window as unknown as { __early: { elements: number; addHandled: string; knobHandled: string; cursorBefore: string } }).__early);
	expect(early).toMatchObject({ addHandled: 'undefined', knobHandled: 'undefined' });
	expect(early.elements).toBeGreaterThan(0);
	// The click added an element, and the key moved the cursor to the end of the plot, as the same key does now.
	await expect(page.locator('li.el')).toHaveCount(early.elements + 1);
	const cursor = page.getByTestId('cursor-z');
	await expect(cursor).not.toHaveValue(early.cursorBefore);
	const atEnd = await cursor.inputValue();
	await page.getByTestId('cursor-knob').press('Home');
	await expect(cursor).not.toHaveValue(atEnd);
	await page.getByTestId('cursor-knob').press('End');
	await expect(cursor).toHaveValue(atEnd);
});
