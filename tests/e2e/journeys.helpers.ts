/**
 * Helpers for the journey tests: reading the numbers the pages show (SI prefixes as the app prints
 * them) and the independent closed forms the journeys check them against.
 */
import { expect, type Page } from '@playwright/test';

const prefix: Record<string, number> = { T: 1e12, G: 1e9, M: 1e6, k: 1e3, '': 1, m: 1e-3, 'µ': 1e-6, u: 1e-6, n: 1e-9, p: 1e-12, f: 1e-15 };

/**
 * Read a printed quantity in SI: "150 mm" → 0.15, "5.04 µm" → 5.04e-6, "−1.2×10^−5 m" → −1.2e-5.
 * `unit` is the bare unit the text must end with ('m', 'W', '' for a plain number).
 */
export function readSI(text: string, unit = 'm'): number {
	const t = text.trim().replace(/−/g, '-').replace(/\s+/g, ' ');
	const m = /^(-?[\d.]+)(?:×10\^(-?\d+))?\s*(\S*)/.exec(t);
	if (!m) throw new Error(`not a number: "${text}"`);
	const mant = Number(m[1]) * (m[2] ? 10 ** Number(m[2]) : 1);
	const u = m[3];
	if (unit === '') return mant;
	if (!u.endsWith(unit)) throw new Error(`"${text}" does not end with the unit ${unit}`);
	const p = u.slice(0, u.length - unit.length);
	if (!(p in prefix)) throw new Error(`unknown prefix in "${text}"`);
	return mant * prefix[p];
}

/** |actual − expected| ≤ rel·|expected|, with a message naming what was compared. */
export function expectNear(actual: number, expected: number, rel: number, what: string) {
	expect(Number.isFinite(actual), `${what}: ${actual} is not a number`).toBe(true);
	expect(Math.abs(actual - expected), `${what}: got ${actual}, expected ${expected} (±${rel * 100} %)`).toBeLessThanOrEqual(rel * Math.abs(expected));
}

export interface WaistRow {
	where: string;
	axis: string;
	z_m: number;
	w0_m: number;
	zR_m: number;
	text: string;
}

/** The bench's waist table, read as numbers. */
export async function waistRows(page: Page): Promise<WaistRow[]> {
	const rows = page.getByTestId('waist-table').locator('tbody tr');
	const out: WaistRow[] = [];
	for (const r of await rows.all()) {
		const cells = (await r.locator('td').allInnerTexts()).map((s) => s.trim());
		if (cells.length < 6) continue;
		out.push({ where: cells[0], axis: cells[1], z_m: readSI(cells[2]), w0_m: readSI(cells[3]), zR_m: readSI(cells[5]), text: cells.join(' | ') });
	}
	return out;
}

/** Poll until the waist table has an x row after `label` whose numbers match; returns that row. */
export async function expectWaistAfter(page: Page, label: string, z_m: number, w0_m: number, rel = 2e-3) {
	await expect
		.poll(
			async () => {
				const row = (await waistRows(page)).find((r) => r.where.includes(`after ${label}`) && r.axis.includes('x'));
				if (!row) return 'no row after ' + label;
				const ok = Math.abs(row.z_m - z_m) <= rel * Math.abs(z_m) && Math.abs(row.w0_m - w0_m) <= rel * w0_m;
				return ok ? 'ok' : `${row.text} (expected z ${z_m} m, w0 ${w0_m} m)`;
			},
			{ timeout: 10_000 }
		)
		.toBe('ok');
}

// ── Closed forms ────────────────────────────────────────────────────────────

/** Rayleigh range zR = π·w0²/(M²·λ) (A. E. Siegman, "Lasers", 1986, ch. 17, with the embedded-Gaussian M²; equation numbers from memory). */
export function rayleigh(w0_m: number, lambda_m: number, m2 = 1): number {
	return (Math.PI * w0_m * w0_m) / (m2 * lambda_m);
}

/** Beam radius w(z) = w0·√(1 + ((z − z0)/zR)²) (Siegman, "Lasers", 1986, ch. 17; from memory). */
export function radiusAt(w0_m: number, z0_m: number, zR_m: number, z_m: number): number {
	return w0_m * Math.sqrt(1 + ((z_m - z0_m) / zR_m) ** 2);
}

/**
 * Thin-lens waist transformation (S. A. Self, "Focusing of spherical Gaussian beams", Appl. Opt. 22,
 * 658, 1983, eqs. 9 and 10, numbers from memory): input waist w0 a distance s before a lens of focal length f →
 * output waist w0' = w0/√((1 − s/f)² + (zR/f)²) a distance s' = f·(1 + (s/f − 1)/((s/f − 1)² + (zR/f)²))
 * after the lens. Returns the new waist radius, distance after the lens and Rayleigh range.
 */
export function thinLens(w0_m: number, s_m: number, zR_m: number, f_m: number) {
	const a = s_m / f_m - 1;
	const b = zR_m / f_m;
	const den = a * a + b * b;
	const w = w0_m / Math.sqrt(den);
	return { w0_m: w, s_m: f_m * (1 + a / den), zR_m: zR_m / den };
}

/**
 * A fresh browser state holding exactly this setup document (written by the test, not by the app).
 * Written before the app's scripts run on the first load of this tab (a page being left would save
 * its own setup over it on the way out); later reloads keep whatever the app saved.
 */
export async function startWith(page: Page, doc: object, path = '/') {
	await page.addInitScript((text) => {
		if (sessionStorage.getItem('journey.seeded')) return;
		sessionStorage.setItem('journey.seeded', '1');
		localStorage.clear();
		localStorage.setItem('beamwright.setup.v1', text);
	}, JSON.stringify(doc));
	// Resolves once the app has taken the page over (the shared page's goto, support/ready.ts): until
	// then a prerendered page keeps its view hidden while the saved setup replaces the demo.
	await page.goto(path);
}

/** Navigate with the top bar, as a user does (client-side navigation, no reload). */
export async function openWorkspace(page: Page, name: 'Bench' | 'Match' | 'Measure' | 'Scan' | 'Hazard') {
	await page.getByRole('navigation', { name: 'Workspaces' }).getByRole('link', { name, exact: true }).click();
	const path = { Bench: /\/$/, Match: /\/match\/$/, Measure: /\/measure\/$/, Scan: /\/scan\/$/, Hazard: /\/hazard\/$/ }[name];
	await expect(page).toHaveURL(path);
}

const axis = (over: Record<string, unknown> = {}) => ({
	m2: '1',
	kind: 'waist',
	waist: '0.5 mm',
	waistAt: '0 mm',
	diameter: '1 mm',
	at: '0 mm',
	fullDivergence: '1.5 mrad',
	converging: false,
	d1: '1 mm',
	z1: '0 mm',
	d2: '1.5 mm',
	z2: '1 m',
	...over
});

/** A setup document as the test means it: a round beam and thin lenses at the given places. */
export function setupDoc(o: { name?: string; wavelength?: string; waist?: string; lenses?: Array<{ at: string; f: string }>; end?: string; extra?: object } = {}) {
	return {
		format: 'beamwright-setup',
		version: 1,
		name: o.name ?? 'Journey bench',
		notes: '',
		source: { label: 'Demo laser J', wavelength: o.wavelength ?? '632.8 nm', index: '1', astigmatic: false, x: axis({ waist: o.waist ?? '0.5 mm' }), y: axis({ waist: o.waist ?? '0.5 mm' }) },
		elements: (o.lenses ?? []).map((l, i) => ({ id: `j${i + 1}`, kind: 'thinLens', label: `L${i + 1}`, at: l.at, aperture: '', params: { f: l.f } })),
		view: { end: o.end ?? '1 m' },
		...(o.extra ?? {})
	};
}
