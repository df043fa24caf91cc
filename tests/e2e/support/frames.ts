/**
 * What a field shows in every frame while the page is visible, from the page's first frame until the
 * app has taken it over (`<html data-ready>`): a prerendered page must never show its demo values in
 * place of a returning user's work, not even for one frame.
 */
import { expect, type Page } from '@playwright/test';

type Seen = { __seen: string[] };

/**
 * Start recording, for the next load of `page`, the value of the field with this test id (or, given
 * `attribute`, that attribute of the element with this test id, e.g. a plot curve's `d`).
 */
export async function recordFieldWhileShown(page: Page, testid: string, attribute?: string): Promise<void> {
	await page.addInitScript(([id, attr]) => {
		const seen: string[] = [];
		(window as unknown as Seen).__seen = seen;
		const look = () => {
			const field = document.querySelector<HTMLInputElement>(`[data-testid="${id}"]`);
			// Rendered and visible (not inside a hidden or content-visibility-hidden <main>).
			if (field && field.checkVisibility({ visibilityProperty: true })) seen.push(attr ? String(field.getAttribute(attr)) : field.value);
			if (!document.documentElement.hasAttribute('data-ready') || seen.length < 3) requestAnimationFrame(look);
		};
		requestAnimationFrame(look);
	}, [testid, attribute] as const);
}

/** The values recorded since the load (at least three visible frames). */
export async function fieldValuesShown(page: Page): Promise<string[]> {
	await expect.poll(() => page.evaluate(() => (window as unknown as Seen).__seen.length)).toBeGreaterThanOrEqual(3);
	return page.evaluate(() => (window as unknown as Seen).__seen);
}
