import { expect, type Page } from '@playwright/test';

/**
 * Open the bench and wait until the service worker has cached the build and controls the page (the
 * worker is registered when the browser is idle after the first load; it takes over after a reload).
 * Only for specs that allow service workers (`test.use({ serviceWorkers: 'allow' })`).
 */
export async function openUnderServiceWorker(page: Page) {
	await page.goto('/');
	await expect(page.getByTestId('caustic-plot')).toBeVisible();
	await page.evaluate(async () => {
		await navigator.serviceWorker.ready;
	});
	await page.reload();
	await expect.poll(() => page.evaluate(() => navigator.serviceWorker.controller !== null)).toBe(true);
}
