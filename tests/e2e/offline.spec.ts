import { test, expect } from '@playwright/test';

test('after one visit the app opens and computes with no network', async ({ page, context }) => {
	await page.goto('/');
	await expect(page.getByTestId('caustic-plot')).toBeVisible();
	// Wait until the service worker has cached the build and controls the page.
	await page.evaluate(async () => {
		await navigator.serviceWorker.ready;
	});
	await page.reload();
	await expect.poll(() => page.evaluate(() => navigator.serviceWorker.controller !== null)).toBe(true);
	await context.setOffline(true);
	await page.reload();
	await expect(page.getByTestId('caustic-plot')).toBeVisible();
	await page.getByTestId('src-x-waist').fill('0.6 mm');
	await expect(page.getByTestId('waist-table')).toContainText('after M2');
	// Another workspace that was never opened online is served from the cache too.
	await page.goto('/hazard/');
	await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
	await context.setOffline(false);
});
