/**
 * Nothing the user typed or saved is lost: two tabs, full storage, unreadable autosaves, the lab table
 * round trip. Storage keys are those of src/lib/document/persist.ts.
 */
import { test, expect, type Page } from '@playwright/test';
import { readFileSync, writeFileSync } from 'node:fs';
import { openUnderServiceWorker } from './support/sw';
import { gotoWaitsForApp } from './support/ready';

// Every page of the app in these tests: `goto` resolves once the app has taken the page over.
test.beforeEach(({ page, context }) => {
	gotoWaitsForApp(page);
	context.on('page', (p) => void gotoWaitsForApp(p));
});

const KEY = 'beamwright.setup.v1';

async function setName(page: Page, name: string) {
	const field = page.getByRole('textbox', { name: 'Setup name' });
	await field.fill(name);
}

test('two tabs: the second tab is told, never overwrites newer work, and can take the other version', async ({ context }) => {
	test.slow(); // two pages of the app at once
	const a = await context.newPage();
	await a.goto('/');
	await expect(a.getByTestId('caustic-plot')).toBeVisible();
	const b = await context.newPage();
	await b.goto('/');
	await expect(b.getByTestId('caustic-plot')).toBeVisible();
	// Each tab knows the other is open.
	await expect(b.getByTestId('other-tab')).toBeVisible();
	await setName(a, 'Saved in tab A');
	await expect(a.getByTestId('autosave-status')).toHaveText('Autosaved in this browser');
	// Tab B hears of it at once and offers the three choices.
	await expect(b.getByTestId('tab-conflict')).toBeVisible();
	await setName(b, 'Typed in tab B');
	// B tries to save at once (as when its tab is hidden or closed): it must not write over A's work.
	await b.evaluate(() => window.dispatchEvent(new Event('pagehide')));
	expect(await a.evaluate((k) => JSON.parse(localStorage.getItem(k)!).name, KEY)).toBe('Saved in tab A');
	await expect(b.getByTestId('autosave-status')).not.toHaveText('Autosaved in this browser');
	// Take the other tab's version.
	await b.getByTestId('conflict-take').click();
	await expect(b.getByRole('textbox', { name: 'Setup name' })).toHaveValue('Saved in tab A');
	await expect(b.getByTestId('tab-conflict')).toHaveCount(0);
});

test('two tabs: keeping this tab\'s work as a copy stores it beside the other tab\'s', async ({ context }) => {
	test.slow(); // two pages of the app at once
	const a = await context.newPage();
	await a.goto('/');
	const b = await context.newPage();
	await b.goto('/');
	await expect(b.getByTestId('caustic-plot')).toBeVisible();
	await setName(a, 'Work of tab A');
	await expect(b.getByTestId('tab-conflict')).toBeVisible();
	await setName(b, 'Work of tab B');
	await b.getByTestId('conflict-copy').click();
	await expect(b.getByTestId('saving-to-copy')).toBeVisible();
	// Tab A, reloaded, keeps its own work and lists tab B's copy.
	await a.reload();
	await expect(a.getByTestId('kept-copies')).toContainText('Copy kept from another tab');
	await expect(a.getByRole('textbox', { name: 'Setup name' })).toHaveValue('Work of tab A');
});

test('storage full: the failed autosave is shown, "Autosaved" is not, and Save file… saves the work', async ({ page }) => {
	await page.goto('/');
	await expect(page.getByTestId('caustic-plot')).toBeVisible();
	// Fill the origin's storage to the brim (as another app or a huge old setup would).
	await page.evaluate(() => {
		let i = 0;
		for (const size of [1 << 20, 1 << 17, 1 << 14, 1 << 11, 1 << 8, 16]) {
			const chunk = 'f'.repeat(size);
			for (;;) {
				try {
					localStorage.setItem('filler.' + i++, chunk);
				} catch {
					break;
				}
			}
		}
	});
	await setName(page, 'Work that does not fit');
	await expect(page.getByTestId('save-error')).toContainText('storage for this app is full');
	await expect(page.getByTestId('autosave-status')).not.toHaveText('Autosaved in this browser');
	const [file] = await Promise.all([page.waitForEvent('download'), page.getByTestId('save-error-file').click()]);
	const text = readFileSync((await file.path())!, 'utf8');
	expect(JSON.parse(text).name).toBe('Work that does not fit');
	await page.evaluate(() => localStorage.clear());
});

test('an unreadable autosave bigger than the free space: every page still starts, says so, and offers the download', async ({ page }) => {
	await page.goto('/measure/');
	await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
	// Put an unreadable autosave that takes most of the storage (its copy cannot fit beside it).
	const stored = await page.evaluate((k) => {
		localStorage.clear();
		for (const n of [4_900_000, 4_500_000, 4_000_000, 3_500_000, 3_000_000, 2_700_000]) {
			try {
				localStorage.setItem(k, '{"format":"beamwright-setup",' + 'x'.repeat(n));
				return n;
			} catch {
				/* try smaller */
			}
		}
		return 0;
	}, KEY);
	expect(stored).toBeGreaterThan(0);
	await page.reload();
	await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
	await expect(page.getByTestId('restore-problem')).toContainText('could not be read');
	await expect(page.getByTestId('kept-copies')).toContainText('Unreadable autosave');
	const [file] = await Promise.all([page.waitForEvent('download'), page.getByTestId('kept-download').first().click()]);
	const text = readFileSync((await file.path())!, 'utf8');
	expect(text.length).toBe('{"format":"beamwright-setup",'.length + stored);
	// Another page starts too and still lists it.
	await page.goto('/hazard/');
	await expect(page.getByTestId('kept-copies')).toContainText('Unreadable autosave');
	await page.evaluate(() => localStorage.clear());
});

test('the lab table export re-imports to the same lasers; a refused import leaves the list untouched', async ({ page }) => {
	await page.goto('/hazard/');
	await page.getByTestId('hz-lab-demo').click();
	const rows = page.getByTestId('hz-lab-table').locator('tbody tr');
	await expect(rows).toHaveCount(8);
	// The table without its "Line" column (the demo file has a comment line above its header).
	const lasers = async () => (await page.getByTestId('hz-lab-table').innerText()).split('\n').map((l) => l.split('\t').slice(1).join('\t'));
	const before = await lasers();
	const [file] = await Promise.all([page.waitForEvent('download'), page.getByTestId('hz-lab-export').click()]);
	const exported = readFileSync((await file.path())!, 'utf8');
	await page.getByTestId('hz-lab-import').setInputFiles({ name: 'lab-hazard-table.csv', mimeType: 'text/csv', buffer: Buffer.from(exported) });
	await expect(rows).toHaveCount(8);
	expect(await lasers()).toEqual(before);
	// A file with a broken quote is refused with its line; the 8 lasers stay.
	// Open a quote at the start of the second laser's line (whatever the demo names are).
	const lines = exported.split('\n');
	lines[2] = '"' + lines[2];
	const broken = lines.join('\n');
	await page.getByTestId('hz-lab-import').setInputFiles({ name: 'broken.csv', mimeType: 'text/csv', buffer: Buffer.from(broken) });
	await expect(page.getByTestId('hz-lab-refused')).toContainText('was not imported');
	await expect(page.getByTestId('hz-lab-refused')).toContainText('quote');
	await expect(rows).toHaveCount(8);
});

test.describe('with the service worker (blocked in the other specs)', () => {
	test.use({ serviceWorkers: 'allow' });

	test('a new build: the user is told a new version is ready and can reload onto it', async ({ page, context }) => {
		await openUnderServiceWorker(page);
		await expect(page.getByTestId('update-ready')).toHaveCount(0);
		// The next build: the served service worker changes (as after a deploy); restored afterwards.
		const swFile = 'build/service-worker.js';
		const original = readFileSync(swFile, 'utf8');
		try {
			writeFileSync(swFile, original + '\n// next build\n');
			await page.evaluate(async () => {
				const reg = await navigator.serviceWorker.getRegistration();
				await reg?.update();
			});
			await expect(page.getByTestId('update-ready')).toContainText('A new version of Beamwright is ready', { timeout: 20_000 });
			// The page is not switched under the user: they choose when to reload.
			// (Listening for the load before the click: a quick reload could otherwise finish first.)
			await Promise.all([page.waitForEvent('load'), page.getByTestId('update-reload').click()]);
			await expect(page.getByTestId('caustic-plot')).toBeVisible();
			await expect(page.getByTestId('update-ready')).toHaveCount(0);
		} finally {
			writeFileSync(swFile, original);
		}
	});
});

test('an image that declares 60000 × 60000 pixels is refused at once; the other images are analysed', async ({ page }) => {
	await page.goto('/measure/');
	// PNG signature and an IHDR chunk declaring 60000 × 60000, 16-bit greyscale (W3C PNG 2nd ed., §11.2.2).
	const head = Buffer.alloc(33);
	Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]).copy(head, 0);
	head.writeUInt32BE(13, 8);
	head.write('IHDR', 12, 'latin1');
	head.writeUInt32BE(60000, 16);
	head.writeUInt32BE(60000, 20);
	head[24] = 16;
	const rows: string[] = [];
	for (let y = 0; y < 64; y++) {
		const row: number[] = [];
		for (let x = 0; x < 64; x++) row.push(Math.round(1000 * Math.exp((-2 * ((x - 32) ** 2 + (y - 32) ** 2)) / 12 ** 2)));
		rows.push(row.join(','));
	}
	await page.getByTestId('image-files').setInputFiles([
		{ name: 'huge.png', mimeType: 'image/png', buffer: head },
		{ name: 'plane 10mm.csv', mimeType: 'text/csv', buffer: Buffer.from(rows.join('\n')) }
	]);
	const cards = page.getByTestId('image-card');
	await expect(cards.nth(0)).toContainText('declares 60000 × 60000');
	await expect(cards.nth(1).getByTestId('image-moments')).toBeVisible();
});
