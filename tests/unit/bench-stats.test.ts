import { describe, it, expect } from 'vitest';
import { medianRatioInterval, ratioRow, spread, verdictText } from '../../bench/stats';

/** A seeded uniform generator for the test's own samples (not the one under test). */
function lcg(seed: number) {
	let s = seed >>> 0;
	return () => {
		s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
		return (s + 0.5) / 4294967296;
	};
}

describe('bootstrap interval of a ratio of medians (bench verdicts)', () => {
	it('samples without spread give the ratio itself', () => {
		const iv = medianRatioInterval([120, 120, 120], [60, 60, 60, 60]);
		expect(iv.lo).toBe(2);
		expect(iv.hi).toBe(2);
	});

	it('is the same for the same samples (fixed seed) and brackets the point ratio', () => {
		const xs = [96, 124, 177, 110, 131, 99, 140, 121, 118, 150];
		const ref = [36, 56, 100, 52, 48, 60, 64, 44, 56, 52, 58, 40];
		const a = medianRatioInterval(xs, ref);
		expect(medianRatioInterval(xs, ref)).toEqual(a);
		const point = spread(xs).med / spread(ref).med;
		expect(a.lo).toBeLessThanOrEqual(point);
		expect(a.hi).toBeGreaterThanOrEqual(point);
		expect(a.hi).toBeGreaterThan(a.lo);
	});

	it('covers the true ratio of medians about as often as its level says (exponential samples)', () => {
		// Exponential with mean m has median m·ln 2 (any statistics text, e.g. Rice, Mathematical Statistics
		// and Data Analysis, 3rd ed. 2007, §2.2.1); the true ratio of medians of means 2 and 1 is 2. The
		// percentile bootstrap of a median is known to under-cover a little with 10 values (Efron and
		// Tibshirani 1993, ch. 13), so a nominal 90 % interval is asked to cover at least 75 % of 120 trials.
		const u = lcg(7);
		const exp = (mean: number, n: number) => Array.from({ length: n }, () => -mean * Math.log(u()));
		let covered = 0;
		const trials = 120;
		for (let t = 0; t < trials; t++) {
			const iv = medianRatioInterval(exp(2, 10), exp(1, 70), 0.9, 600);
			if (iv.lo <= 2 && 2 <= iv.hi) covered++;
		}
		expect(covered / trials).toBeGreaterThanOrEqual(0.75);
		expect(covered / trials).toBeLessThanOrEqual(0.99);
	});

	it('the verdict says when the goal lies within the interval, and never changes meets / misses', () => {
		const ref = { min: 50, med: 50, max: 50 };
		const close = ratioRow('x', 'ms', { min: 90, med: 101, max: 120 }, 'blank FP', ref, 2, false, '', { lo: 1.8, hi: 2.3, level: 0.9 });
		expect(close.ok).toBe(false);
		expect(verdictText(close)).toBe("  [MISSES goal, within this run's noise: 90 % interval 1.80–2.30×]");
		const firm = ratioRow('x', 'ms', { min: 60, med: 80, max: 90 }, 'blank FP', ref, 2, false, '', { lo: 1.4, hi: 1.8, level: 0.9 });
		expect(firm.ok).toBe(true);
		expect(verdictText(firm)).toBe('  [meets goal; 90 % interval 1.40–1.80×]');
		expect(verdictText(ratioRow('x', 'ms', { min: 1, med: 1, max: 1 }, 'r', ref, null))).toBe('');
		expect(verdictText(ratioRow('x', 'ms', { min: 1, med: 60, max: 1 }, 'r', ref, 1.25))).toBe('  [meets goal]');
	});
});
