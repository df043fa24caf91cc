/**
 * The new CSV exports read back with the app's one CSV reader: the Hazard results carry the caution
 * and, on every value row, the source and provenance of the limit; the numbers are those of the
 * assessment. The reference beam is the one of tests/reference/safety-hazard.test.ts: 514.5 nm, 5 W,
 * 2.83 mm, 1.41 mrad, 0.25 s, whose limit is E = 18·t^0.75/t W/m² with t = 0.25 s (Directive
 * 2006/25/EC, Annex I, Table 2.2, row 400–700 nm, 10 µs … 10 s, read in the French labour code
 * reproduction) and whose far-field NOHD is (√(4P/(πE)) − d/√2)/(Θ/√2) (the formula the page states).
 */
import { describe, it, expect } from 'vitest';
import { readCsv } from '../../src/lib/io/csv';
import { hazardResultsCsv, linesCsv } from '../../src/lib/io/hazardCsv';
import { singleLensCsv } from '../../src/lib/io/matchCsv';
import { assessBeam, assessLines } from '../../src/lib/safety';
import { expectClose } from '../helpers';

function table(text: string) {
	const r = readCsv(text);
	if (!r.ok) throw new Error(r.message);
	const [head, ...rows] = r.records.map((x) => x.cells);
	return { head, rows, header: text.split('\r\n').filter((l) => l.startsWith('#')).join('\n') };
}

describe('Hazard results as CSV', () => {
	const P = 5, d = 2.83e-3, Th = 1.41e-3;
	const a = assessBeam({ standard: 'eu-2006-25', wavelength_m: 514.5e-9, power_W: P, diameter_m: d, fullDivergence_rad: Th, duration_s: 0.25 });
	const t = table(hazardResultsCsv(a, 'Demo lab', new Date('2026-01-02T03:04:05Z')));
	const value = (q: string) => Number(t.rows.find((r) => r[1] === q)![2]);

	it('carries the caution, the standard and the date in its header', () => {
		expect(t.header).toContain('First-pass estimate, not a hazard evaluation.');
		expect(t.header).toContain("The applicable standard, local regulations and the site's laser safety officer decide.");
		expect(t.header).toContain('Exported: 2026-01-02T03:04:05.000Z');
		expect(t.header).toContain(`Standard: ${a.standard}`);
		expect(t.head).toEqual(['section', 'quantity', 'value', 'unit', 'basis', 'limit_source', 'provenance']);
	});
	it('writes the limit and the formula distance of the reference beam', () => {
		const E = (18 * 0.25 ** 0.75) / 0.25;
		expectClose(value('limit as irradiance'), E, 1e-8);
		expectClose(value('NOHD, far-field formula'), (Math.sqrt((4 * P) / (Math.PI * E)) - d / Math.SQRT2) / (Th / Math.SQRT2), 1e-8);
		expect(value('optical density, rounded up')).toBe(4);
	});
	it('puts a limit source and provenance on every row', () => {
		for (const r of t.rows) {
			expect(r[5], r[1]).not.toBe('');
			expect(r[6], r[1]).toMatch(/^(read from the published text|recalled)/);
		}
		expect(t.rows.filter((r) => r[0] === 'skin').length).toBeGreaterThan(0);
	});
});

describe('further lines as CSV', () => {
	it('one row per line and per tissue, with the caution', () => {
		const r = assessLines({ standard: 'eu-2006-25', diameter_m: 2e-3, fullDivergence_rad: 1e-3 }, [
			{ wavelength_m: 532e-9, power_W: 2 },
			{ wavelength_m: 1064e-9, power_W: 0.05 }
		]);
		const t = table(linesCsv(r, 'Demo lab'));
		expect(t.header).toContain('First-pass estimate, not a hazard evaluation.');
		expect(t.rows.filter((x) => x[0] === 'line').map((x) => x[2])).toEqual(['532', '1064']);
		expect(t.rows.filter((x) => x[0] === 'combined').length).toBe(r.combined.length);
	});
});

describe('single lenses as CSV', () => {
	it('mm in the file, and a row saying none when an axis has no lens', () => {
		const t = table(singleLensCsv({ x: [{ f_m: 0.1, z_m: 0.25, onRail: true }], y: [] }, 'Demo lab', { from_m: 0.05, to_m: 0.85 }));
		expect(t.head).toEqual(['axis', 'f_mm', 'z_mm', 'on_rail']);
		expect(t.rows[0]).toEqual(['x', '100', '250', 'yes']);
		expect(t.rows[1][0]).toBe('y');
		expect(t.rows[1][3]).toMatch(/^none/);
	});
});
