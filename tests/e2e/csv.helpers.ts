/**
 * Helpers for the export tests: trigger a download by its button and read the file back (CSV: the
 * commented header lines and the rows, first row = column names).
 */
import { expect, type Page, type Download } from '@playwright/test';
import { readFileSync } from 'node:fs';
import Papa from 'papaparse';

export async function readCsv(d: Download) {
	const text = readFileSync((await d.path())!, 'utf8');
	const header = text.split(/\r?\n/).filter((l) => l.startsWith('#'));
	const rows = Papa.parse<string[]>(text, { comments: '#', skipEmptyLines: true }).data;
	return { text, header, cols: rows[0], rows: rows.slice(1), col: (name: string) => rows[0].indexOf(name) };
}

export async function download(page: Page, testid: string) {
	const d = page.waitForEvent('download');
	await page.getByTestId(testid).click();
	return d;
}

export function readText(d: Download): Promise<string> {
	return d.path().then((p) => readFileSync(p!, 'utf8'));
}

/** Page values are shown to 4 significant digits: a file value agrees when within half a unit of the 4th digit. */
export const close4 = (a: number, b: number) => (b === 0 ? expect(a).toBe(0) : expect(Math.abs(a - b) / Math.abs(b)).toBeLessThan(6e-4));
