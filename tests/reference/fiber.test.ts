import { describe, expect, it } from 'vitest';
import { fiberMode, vNumber } from '../../src/lib/optics/fiber';
import { expectClose } from '../helpers';

describe('vNumber', () => {
	it('V = 2π·a·NA/λ (Marcuse, "Loss analysis of single-mode fiber splices", 1977, definition of V)', () => {
		expectClose(vNumber(4.1e-6, 0.14, 1550e-9), (2 * Math.PI * 4.1e-6 * 0.14) / 1550e-9, 1e-15);
		expectClose(vNumber(4e-6, 0.1, 1e-6), 2.5132741228718345, 1e-12);
	});
	it('throws for an NA outside (0, 1)', () => {
		expect(() => vNumber(4e-6, 1.2, 1e-6)).toThrow(/numerical aperture must be > 0 and < 1/);
	});
});

describe('fiberMode', () => {
	it('w/a = 0.65 + 1.619·V^−1.5 + 2.879·V^−6: at V = 2, w/a = 1.267387 (Marcuse 1977, eq. 1, evaluated by hand)', () => {
		const na = 2 / (2 * Math.PI * 4); // a = 4 µm, λ = 1 µm → V = 2
		const m = fiberMode(4e-6, na, 1e-6);
		expectClose(m.V, 2, 1e-12);
		expectClose(m.mfd_m / 2 / 4e-6, 1.267387, 1e-6);
		expect(m.singleMode).toBe(true);
	});
	it('a = 4.1 µm, NA = 0.14, λ = 1550 nm: V = 2.3268, MFD = 9.219 µm (Marcuse 1977, eq. 1, by hand)', () => {
		const m = fiberMode(4.1e-6, 0.14, 1550e-9);
		expectClose(m.V, 2.32681, 1e-5);
		expectClose(m.mfd_m, 9.2192e-6, 1e-4);
	});
	it('flags more than one guided mode above V = 2.405 (common practice: LP11 cut-off)', () => {
		const m = fiberMode(4.1e-6, 0.14, 1064e-9);
		expect(m.singleMode).toBe(false);
		expect(m.note).toMatch(/more than one mode/);
	});
	it('refuses V below the fit range', () => {
		expect(() => fiberMode(1e-6, 0.05, 1550e-9)).toThrow(/V number must be ≥ 0.8/);
	});
});
