/**
 * The `test` of most browser specs: one page per worker, put back to a fresh state before each test,
 * instead of a new browser context and page per test. Opening a page costs about 0.7 s of this 2-core
 * machine (a renderer process and its window) and most tests are shorter than that.
 *
 * "Fresh" means what a new context would give: the origin's storage (local and session storage,
 * IndexedDB, cookies) is empty, the viewport and emulated media are the defaults, and
 * nothing a previous test installed on the page (init scripts, event listeners, routes) is left. Each
 * test still loads the app itself, so no JavaScript state carries over.
 *
 * `page.goto` and `page.reload` resolve once the app has taken the page over (support/ready.ts).
 *
 * Specs that need a context of their own (several tabs, offline, service workers, camera permissions)
 * import `test` from '@playwright/test' and get Playwright's per-test context.
 */
import { test as base, type Page, type BrowserContext } from '@playwright/test';
import { gotoWaitsForApp } from './ready';

const VIEWPORT = { width: 1280, height: 720 };
const RESET_PATH = '/__test-reset';

type Listener = [string, (...args: unknown[]) => void];

export const test = base.extend<object, { workerPage: { context: BrowserContext | null; page: Page | null } }>({
	workerPage: [
		// eslint-disable-next-line no-empty-pattern
		async ({}, use) => {
			const holder: { context: BrowserContext | null; page: Page | null } = { context: null, page: null };
			await use(holder);
			await holder.context?.close();
		},
		{ scope: 'worker' }
	],
	page: async ({ browser, workerPage: holder }, use, testInfo) => {
		if (!holder.page || holder.page.isClosed()) {
			await holder.context?.close().catch(() => {});
			holder.context = await browser.newContext({ baseURL: testInfo.project.use.baseURL, serviceWorkers: 'block', viewport: VIEWPORT });
			holder.page = await holder.context.newPage();
		}
		const page = holder.page;
		// A blank page of the app's own origin empties that origin's storage, including this tab's session
		// storage, which a new context would not have either. (Leaving the previous test's page lets the
		// app save on its way out; the emptying comes after that.)
		const reset = new URL(RESET_PATH, testInfo.project.use.baseURL).href;
		await page.route(reset, (r) => r.fulfill({ contentType: 'text/html', body: '<!doctype html><title>reset</title><script>localStorage.clear(); sessionStorage.clear();</script>' }));
		await page.goto(reset);
		await page.unroute(reset);
		await holder.context!.setStorageState({ cookies: [], origins: [] });
		const left = await page.evaluate(() => localStorage.length + sessionStorage.length);
		if (left !== 0) throw new Error(`test page reset: ${left} storage entries survived`);
		await page.setViewportSize(VIEWPORT);
		await page.emulateMedia({ media: null, colorScheme: null, reducedMotion: null, forcedColors: null });

		// What a test installs on the page is recorded here and taken off afterwards.
		const disposables: { dispose(): Promise<void> }[] = [];
		const listeners: Listener[] = [];
		const addInitScript = page.addInitScript;
		type Subscribe = (event: string, fn: Listener[1]) => Page;
		const on = page.on;
		const once = page.once;
		const off = page.off as unknown as Subscribe;
		page.addInitScript = (async (...args: Parameters<Page['addInitScript']>) => {
			const d = await addInitScript.apply(page, args);
			disposables.push(d);
			return d;
		}) as Page['addInitScript'];
		page.on = ((event: string, fn: (...a: unknown[]) => void) => {
			listeners.push([event, fn]);
			return (on as unknown as Subscribe).call(page, event, fn);
		}) as Page['on'];
		page.once = ((event: string, fn: (...a: unknown[]) => void) => {
			listeners.push([event, fn]);
			return (once as unknown as Subscribe).call(page, event, fn);
		}) as Page['once'];
		const putBack = gotoWaitsForApp(page);
		try {
			await use(page);
		} finally {
			putBack();
			page.addInitScript = addInitScript;
			page.on = on;
			page.once = once;
			if (!page.isClosed()) {
				for (const [event, fn] of listeners) off.call(page, event, fn);
				for (const d of disposables) await d.dispose().catch(() => {});
				await page.unrouteAll({ behavior: 'ignoreErrors' });
			}
		}
	}
});

export { expect } from '@playwright/test';
