import { test, expect } from '@playwright/test';
import { openUnderServiceWorker } from './support/sw';
import { gotoWaitsForApp } from './support/ready';

// Every page of the app in these tests: `goto` resolves once the app has taken the page over.
test.beforeEach(({ page, context }) => {
	gotoWaitsForApp(page);
	context.on('page', (p) => void gotoWaitsForApp(p));
});

// The service worker is what this file tests (the other specs block it).
test.use({ serviceWorkers: 'allow' });

test('after one visit the app opens and computes with no network', async ({ page, context }) => {
	await openUnderServiceWorker(page);
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
