import { describe, expect, it } from 'vitest';
import { alignmentTolerance, axisCoupling, waistCoupling } from '../../src/lib/optics/overlap';
import { throughLens } from '../../src/lib/optics/solve/evaluate';
import { expectClose } from '../helpers';

const lam = 1064e-9;
const zr = (w: number) => (Math.PI * w * w) / lam;

describe('waistCoupling', () => {
	it('size mismatch at a common waist plane: η = (2·w1·w2/(w1² + w2²))² (Joyce & DeLoach, "Alignment of Gaussian beams", 1984, eq. 11)', () => {
		expectClose(waistCoupling(0.5e-3, 0.6e-3, 0, lam), (0.6 / 0.61) ** 2, 1e-12);
	});
	it('equal waists a distance d apart: η = 1/(1 + (d/2zR)²) (Joyce & DeLoach 1984, eq. 11 with w1 = w2; form from memory)', () => {
		const w = 0.3e-3;
		expectClose(waistCoupling(w, w, 0.2, lam), 1 / (1 + (0.2 / (2 * zr(w))) ** 2), 1e-12);
	});
	it('the issue’s CLI case agrees with the q-overlap: w1 0.5 mm, w2 0.6 mm, 10 cm apart', () => {
		const viaQ = axisCoupling({ q: { re: 0, im: zr(0.5e-3) } }, { q: { re: -0.1, im: zr(0.6e-3) } }, lam) ** 2;
		expectClose(waistCoupling(0.5e-3, 0.6e-3, 0.1, lam), viaQ, 1e-12);
	});
	it('perfectly matched beams reach 100 %', () => {
		expect(waistCoupling(1e-3, 1e-3, 0, lam)).toBe(1);
	});
});

describe('axisCoupling', () => {
	const b = (w: number, re = 0) => ({ q: { re, im: zr(w) } });
	it('lateral offset x0, equal waists: η = exp(−x0²/w²) (the offset axis alone carries the loss) (Joyce & DeLoach 1984, eq. 9)', () => {
		const w = 0.4e-3;
		expectClose(axisCoupling(b(w), b(w), lam, 0.1e-3), Math.exp(-((0.1e-3) ** 2) / (w * w)), 1e-12);
	});
	it('tilt θ, equal waists: η = exp(−(π·w·θ/λ)²) (Joyce & DeLoach 1984, eq. 9)', () => {
		const w = 0.4e-3;
		const t = 0.5e-3;
		expectClose(axisCoupling(b(w), b(w), lam, 0, t), Math.exp(-(((Math.PI * w * t) / lam) ** 2)), 1e-12);
	});
	it('different waists, offset: (2w1w2/(w1²+w2²))·exp(−2x0²/(w1²+w2²)) per axis (Joyce & DeLoach 1984, eq. 9)', () => {
		const [w1, w2, x0] = [0.3e-3, 0.5e-3, 0.2e-3];
		expectClose(axisCoupling(b(w1), b(w2), lam, x0), ((2 * w1 * w2) / (w1 * w1 + w2 * w2)) * Math.exp((-2 * x0 * x0) / (w1 * w1 + w2 * w2)), 1e-12);
	});
	it('is unchanged when both beams pass the same lens and distance (the ABCD map keeps the overlap; Siegman 1986, §20.1, from memory)', () => {
		const q1 = { re: -0.3, im: zr(0.5e-3) };
		const q2 = { re: 0.1, im: zr(0.2e-3) };
		const before = axisCoupling({ q: q1 }, { q: q2 }, lam);
		const after = axisCoupling({ q: throughLens(q1, 0.25, 0.1) }, { q: throughLens(q2, 0.25, 0.1) }, lam);
		expectClose(after, before, 1e-10);
	});
	it('alignment tolerance: the offset it returns costs exactly the allowed loss', () => {
		const t = alignmentTolerance(b(0.3e-3), b(0.35e-3, 0.05), lam, 0.01);
		const eta0 = axisCoupling(b(0.3e-3), b(0.35e-3, 0.05), lam);
		expectClose(axisCoupling(b(0.3e-3), b(0.35e-3, 0.05), lam, t.offset_m) / eta0, 0.99, 1e-9);
		expectClose(axisCoupling(b(0.3e-3), b(0.35e-3, 0.05), lam, 0, t.tilt_rad) / eta0, 0.99, 1e-9);
	});
	it('throws for a beam with no Rayleigh range', () => {
		expect(() => axisCoupling({ q: { re: 0, im: 0 } }, b(1e-3), lam)).toThrow(/Im q̂ of both beams must be > 0/);
	});
});
