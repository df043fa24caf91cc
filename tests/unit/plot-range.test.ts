/**
 * The bench plot's automatic end and the waists kept beyond a typed end (src/lib/document/plotRange.ts).
 * Expected positions come from closed forms, not from the code under test.
 */
import { describe, it, expect } from 'vitest';
import { compileSetup, emptySetup, makeElement } from '../../src/lib/document';
import { autoPlotEnd, waistsBeyondPlot } from '../../src/lib/document/plotRange';
import { propagate } from '../../src/lib/optics/train';
import { expectClose } from '../helpers';

const lam = 632.8e-9;
/** zR = π·w0²/λ (A. E. Siegman, "Lasers", 1986, ch. 17; from memory). */
const zR = (w0: number) => (Math.PI * w0 * w0) / lam;
/** Waist distance after a thin lens, s' = f·(1 + (s/f − 1)/((s/f − 1)² + (zR/f)²)) (S. A. Self, Appl. Opt. 22, 658, 1983; from memory). */
function waistAfter(s: number, zr: number, f: number) {
	const a = s / f - 1;
	const b = zr / f;
	return f * (1 + a / (a * a + b * b));
}

describe('automatic plot end ("Plot to" empty)', () => {
	it('a bare source that diverges: three Rayleigh ranges past the start', () => {
		const c = compileSetup(emptySetup());
		expect(c.ok).toBe(true);
		if (c.ok) {
			expect(c.autoEnd).toBe(true);
			expectClose(c.input.end_m, 3 * zR(0.5e-3), 1e-9);
		}
	});

	it('a focusing lens: past the focus it makes', () => {
		const d = emptySetup();
		d.elements.push(makeElement('thinLens', 'a', 'L1', '100 mm', { f: '200 mm' }));
		const c = compileSetup(d);
		if (!c.ok) throw new Error('compile failed');
		const focus = 0.1 + waistAfter(0.1, zR(0.5e-3), 0.2);
		expect(c.input.end_m).toBeGreaterThan(focus);
		expect(c.input.end_m).toBeLessThan(focus + 0.5 * (focus - 0.1));
		expect(autoPlotEnd(c.input)).toBe(c.input.end_m);
	});

	it('a diverging lens last: three Rayleigh ranges of the beam it leaves, past the lens', () => {
		const d = emptySetup();
		d.elements.push(makeElement('thinLens', 'a', 'L1', '100 mm', { f: '-100 mm' }));
		const c = compileSetup(d);
		if (!c.ok) throw new Error('compile failed');
		// Self (1983): the new Rayleigh range is zR/((s/f − 1)² + (zR/f)²).
		const z = zR(0.5e-3);
		const a = 0.1 / -0.1 - 1;
		const b = z / -0.1;
		expectClose(c.input.end_m, 0.1 + (3 * z) / (a * a + b * b), 1e-9);
	});

	it('a typed end is kept, and a waist past it is listed as beyond the plot', () => {
		const d = emptySetup();
		d.view.end = '1 m';
		d.elements.push(makeElement('thinLens', 'a', 'L1', '100 mm', { f: '-100 mm' }), makeElement('thinLens', 'b', 'L2', '300 mm', { f: '215 mm' }));
		const c = compileSetup(d);
		if (!c.ok) throw new Error('compile failed');
		expect(c.autoEnd).toBeFalsy();
		expect(c.input.end_m).toBe(1);
		const beyond = waistsBeyondPlot(propagate(c.input));
		expect(beyond.map((w) => w.axis).sort()).toEqual(['x', 'y']);
		// Self (1983) twice: −100 mm at 100 mm, then 215 mm at 300 mm.
		const s1 = waistAfter(0.1, zR(0.5e-3), -0.1); // negative: a virtual waist before L1
		const a = 0.1 / -0.1 - 1;
		const b = zR(0.5e-3) / -0.1;
		const zr1 = zR(0.5e-3) / (a * a + b * b);
		const focus = 0.3 + waistAfter(0.3 - (0.1 + s1), zr1, 0.215);
		expect(focus).toBeGreaterThan(1);
		expectClose(beyond[0].z_m, focus, 1e-9);
	});
});
