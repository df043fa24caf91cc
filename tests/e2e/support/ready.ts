import type { Page } from '@playwright/test';

/**
 * A prerendered page shows its controls before its scripts have taken it over (`<html data-ready>`,
 * set by the root layout); a test that clicks or picks a file before then acts on a page that does not
 * answer yet. After this, `page.goto(url)` and `page.reload()` resolve once the app has taken the page
 * over. A test that wants the page as loaded without waiting for that (its scripts blocked, or the
 * moment before the take-over) passes `waitUntil` itself. Returns a function that puts both back.
 */
export function gotoWaitsForApp(page: Page): () => void {
	const goto = page.goto;
	const reload = page.reload;
	const ready = () => page.waitForFunction(() => document.documentElement.hasAttribute('data-ready'), undefined, { polling: 50 });
	page.goto = (async (url: string, options?: Parameters<Page['goto']>[1]) => {
		const response = await goto.call(page, url, options);
		if (!options?.waitUntil) await ready();
		return response;
	}) as Page['goto'];
	page.reload = (async (options?: Parameters<Page['reload']>[0]) => {
		const response = await reload.call(page, options);
		if (!options?.waitUntil) await ready();
		return response;
	}) as Page['reload'];
	return () => {
		page.goto = goto;
		page.reload = reload;
	};
}
