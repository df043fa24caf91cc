import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import Papa from 'papaparse';
import { spread, niceTicks, rangeTicks, glyphFor, project, linePath, curvePaths } from '../../src/lib/ui/plot/benchGeometry';
import { csvCell, toCsv } from '../../src/lib/io/csvOut';
import { beamAlongTrainCsv, stepGrid } from '../../src/lib/io/benchCsv';
import { propagate } from '../../src/lib/optics/train';
import { clippedTransmission } from '../../src/lib/optics/aperture';
import { expectClose } from '../helpers';

describe('glyph spreading keeps close elements apart', () => {
	it('neighbours end at least their half-widths plus the gap apart, in order, inside the bounds', () => {
		fc.assert(
			fc.property(fc.array(fc.double({ min: 0, max: 800, noNaN: true }), { minLength: 1, maxLength: 12 }), fc.array(fc.double({ min: 20, max: 70, noNaN: true }), { minLength: 12, maxLength: 12 }), (zs, ws) => {
				const want = [...zs].sort((a, b) => a - b);
				const widths = want.map((_, i) => ws[i]);
				const total = widths.reduce((a, b) => a + b, 0) + 6 * want.length;
				const hi = Math.max(800, total);
				const got = spread(want, widths, 6, 0, hi);
				for (let i = 1; i < got.length; i++) expect(got[i] - got[i - 1]).toBeGreaterThanOrEqual((widths[i] + widths[i - 1]) / 2 + 6 - 1e-6);
				expect(got[0] - widths[0] / 2).toBeGreaterThanOrEqual(-1e-6);
				expect(got[got.length - 1] + widths[widths.length - 1] / 2).toBeLessThanOrEqual(hi + 1e-6);
			})
		);
	});
	it('items with room stay exactly where they are', () => {
		expect(spread([10, 100, 300], [20, 20, 20], 4, 0, 400)).toEqual([10, 100, 300]);
	});
	it('two items wanting one place straddle it symmetrically', () => {
		const [a, b] = spread([200, 200], [30, 30], 6, 0, 400);
		expect(a).toBeCloseTo(182, 9);
		expect(b).toBeCloseTo(218, 9);
	});
});

describe('ticks', () => {
	it('steps of 1, 2 or 5 × 10^k', () => {
		expect(niceTicks(1.2e-3, 3)).toEqual([0, 0.0005, 0.001]);
		expect(rangeTicks(0, 1.4, 7)).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1, 1.2, 1.4]);
		expect(rangeTicks(-0.05, 0.3, 4)).toEqual([0, 0.1, 0.2, 0.3]);
	});
});

describe('paths from typed arrays', () => {
	it('projects with px = a + b·v and rounds to 0.1 px', () => {
		const xy = project(new Float64Array([0, 1]), new Float64Array([0.5, 0.25]), 10, 100, 200, -100);
		expect(linePath(xy, 2)).toBe('M10,150L110,175');
	});
	it('line and area in one pass: the same points, a repeated point written once, the area closed on the base line', () => {
		// px = 10 + 100·z, py = 200 − 100·w (hand-computed): (10,150), (60,180) twice, (110,175).
		const got = curvePaths(new Float64Array([0, 0.5, 0.5004, 1]), new Float64Array([0.5, 0.2, 0.2, 0.25]), 10, 100, 200, -100, 200);
		expect(got.line).toBe('M10,150L60,180L110,175');
		expect(got.area).toBe('M10,200L10,150L60,180L110,175L110,200Z');
		expect(curvePaths(new Float64Array(0), new Float64Array(0), 0, 1, 0, 1, 0)).toEqual({ line: '', area: '' });
	});
});

describe('glyphs show the kind and the sign of the power', () => {
	it('thin lenses and mirrors', () => {
		expect(glyphFor({ kind: 'thinLens', f_m: 0.1 }).shape).toBe('lens-pos');
		expect(glyphFor({ kind: 'thinLens', f_m: -0.05 }).shape).toBe('lens-neg');
		expect(glyphFor({ kind: 'thinLens', f_m: -0.05 }).caption).toBe('f −50 mm');
		expect(glyphFor({ kind: 'mirror', r_m: 0.5, angle_rad: 0, plane: 'x' }).shape).toBe('mirror-concave');
		expect(glyphFor({ kind: 'mirror', r_m: -0.5, angle_rad: 0, plane: 'x' }).shape).toBe('mirror-convex');
	});
	it('thick lens focal length from the lensmaker equation', () => {
		// Hecht, "Optics", 5th ed. (2017), eq. 6.2: 1/f = (n − 1)[1/R1 − 1/R2 + (n − 1)d/(n R1 R2)].
		const n = 1.507, r1 = 0.0515, r2 = -0.0515, d = 0.005;
		const f = 1 / ((n - 1) * (1 / r1 - 1 / r2 + ((n - 1) * d) / (n * r1 * r2)));
		const g = glyphFor({ kind: 'thickLens', r1_m: r1, r2_m: r2, thickness_m: d, index: n });
		expect(g.shape).toBe('lens-pos');
		expect(g.caption).toBe(`f +${+(f * 1000).toPrecision(3)} mm`);
	});
});

describe('CSV files', () => {
	it('guards text cells against formula injection and quotes separators', () => {
		// OWASP, "CSV Injection" (common practice): cells starting with = + - @ get a leading apostrophe.
		expect(csvCell('=1+2')).toBe("'=1+2");
		expect(csvCell('+x')).toBe("'+x");
		expect(csvCell('-cmd')).toBe("'-cmd");
		expect(csvCell('@SUM(A1)')).toBe("'@SUM(A1)");
		expect(csvCell('a, "b"')).toBe('"a, ""b"""');
		expect(csvCell('L1')).toBe('L1');
	});
	it('header documents every column; numbers read back as written', () => {
		const text = toCsv({ title: 'T', setup: '=evil', columns: [{ name: 'z_mm', about: 'position, mm' }, { name: 'label', about: 'name' }], rows: [[-1.5, '-L'], [Infinity, 'x']] });
		expect(text).toContain('# Setup: =evil'); // header lines are comments, never cells
		expect(text).toContain('#   z_mm: position, mm');
		const parsed = Papa.parse<string[]>(text, { comments: '#', skipEmptyLines: true });
		expect(parsed.data).toEqual([
			['z_mm', 'label'],
			['-1.5', "'-L"],
			['', 'x']
		]);
	});
	it('the beam along the train matches the Gaussian-beam law in free space', () => {
		// Siegman, "Lasers" (1986), eq. 17.5: w(z) = w0·sqrt(1 + (z/zR)²), zR = π w0²/(M² λ) (embedded Gaussian).
		const lam = 633e-9, w0 = 0.5e-3;
		const p = propagate({ source: { wavelength_m: lam, index: 1, x: { m2: 1, spec: { kind: 'waist', w0_m: w0, z0_m: 0 } }, y: { m2: 1, spec: { kind: 'waist', w0_m: w0, z0_m: 0 } } }, elements: [], end_m: 1 });
		const rows = Papa.parse<string[]>(beamAlongTrainCsv(p, 0.25, 'free'), { comments: '#', skipEmptyLines: true }).data;
		expect(rows[0]).toEqual(['z_mm', 'w_x_mm', 'w_y_mm', 'R_x_m', 'R_y_m', 'gouy_x_deg', 'gouy_y_deg']);
		expect(rows.length).toBe(6);
		const zR = (Math.PI * w0 * w0) / lam;
		for (const r of rows.slice(1)) {
			const z = Number(r[0]) / 1000;
			expectClose(Number(r[1]) / 1000, w0 * Math.sqrt(1 + (z / zR) ** 2), 1e-7, `w at ${z}`);
			if (z > 0) expectClose(Number(r[3]), z + (zR * zR) / z, 1e-7, `R at ${z}`); // Siegman eq. 17.5, R = z + zR²/z
			expectClose(Number(r[5]) + 1, (Math.atan(z / zR) * 180) / Math.PI + 1, 1e-7, `Gouy at ${z}`); // Siegman eq. 17.6, Gouy = atan(z/zR); +1 so z = 0 compares relatively
		}
	});
	it('refuses a step that would give too many rows, naming the field', () => {
		expect(() => stepGrid(0, 1, 1e-9)).toThrow(/^Step must give at most/);
		expect(stepGrid(0, 1, 0.3)).toEqual([0, 0.3, 0.6, 0.8999999999999999, 1]);
	});
});

describe('clipping shortcut', () => {
	it('past a = 3w the skipped integral would have differed from 1 by less than 2e-8', () => {
		// Siegman 1986, eq. 17.9: the power outside radius a of a round beam is exp(−2a²/w²); exp(−18) ≈ 1.5e-8.
		for (const [wx, wy] of [[1e-3, 1e-3], [1e-3, 0.4e-3], [0.2e-3, 1e-3]]) {
			expect(1 - clippedTransmission(3.0001 * Math.max(wx, wy), wx, wy)).toBeLessThan(2e-8);
		}
	});
});
