// polylinePath drops the points inside flat runs: the curve drawn must be the same. Checked geometrically,
// not against the function's own output: every sample (rounded to 0.1 px as drawn) lies on the written
// polyline, the written vertices are samples in order, and the first and last sample are kept (common
// practice for lossless polyline thinning: only points on the segment joining their neighbours go).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { polylinePath } from '../../src/lib/ui/plot/polyline';

const r1 = (v: number) => Math.round(v * 10) / 10;

function vertices(d: string): [number, number][] {
	expect(d).toMatch(/^M/);
	return d
		.slice(1)
		.split('L')
		.map((p) => p.split(',').map(Number) as [number, number]);
}

/** Distance from point p to the segment a–b. */
function toSegment(p: [number, number], a: [number, number], b: [number, number]): number {
	const [dx, dy] = [b[0] - a[0], b[1] - a[1]];
	const len2 = dx * dx + dy * dy;
	const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / len2));
	return Math.hypot(p[0] - (a[0] + t * dx), p[1] - (a[1] + t * dy));
}

function check(xs: number[], ys: number[]) {
	const d = polylinePath(xs.length, (i) => xs[i], (i) => ys[i]);
	const v = vertices(d);
	const samples = xs.map((x, i) => [r1(x), r1(ys[i])] as [number, number]);
	expect(v[0]).toEqual(samples[0]);
	expect(v[v.length - 1]).toEqual(samples[samples.length - 1]);
	// Every sample lies on the segment between the written vertices around it (x increasing).
	let k = 0;
	for (const s of samples) {
		while (k < v.length - 2 && v[k + 1][0] < s[0]) k++;
		const on = [k, k + 1].some((j) => j + 1 < v.length && toSegment(s, v[j], v[j + 1]) < 1e-9) || v.some((w) => w[0] === s[0] && w[1] === s[1]);
		expect(on, `sample ${s} off the drawn curve`).toBe(true);
	}
	return v.length;
}

describe('polylinePath: a sampled curve at 0.1 px without the points inside flat runs', () => {
	it('a cavity-scan-like trace (flat baseline, narrow lines) keeps its lines and loses most baseline points', () => {
		const n = 3001;
		const xs = Array.from({ length: n }, (_, i) => (i * 1300) / (n - 1));
		const line = (x: number, x0: number, w: number, a: number) => a / (1 + ((x - x0) / w) ** 2);
		const ys = xs.map((x) => 276 - line(x, 60, 1.5, 250) - line(x, 400, 1.5, 30) - line(x, 1240, 1.5, 250));
		const kept = check(xs, ys);
		expect(kept).toBeLessThan(n / 2);
		// The line tops are drawn at their full height: the lowest y of the samples is a vertex.
		const d = polylinePath(n, (i) => xs[i], (i) => ys[i]);
		const top = Math.min(...ys.map(r1));
		expect(vertices(d).some(([, y]) => y === top)).toBe(true);
	});
	it('any curve (random heights, flat runs, x increasing): every sample is on the drawn curve', () => {
		fc.assert(
			fc.property(fc.array(fc.oneof(fc.constant(100), fc.double({ min: 0, max: 300, noNaN: true })), { minLength: 1, maxLength: 300 }), (ys) => {
				const xs = ys.map((_, i) => i * 0.43);
				check(xs, ys);
			}),
			{ numRuns: 200 }
		);
	});
	it('one point, and an entirely flat curve: first and last point only', () => {
		expect(polylinePath(1, () => 3, () => 4)).toBe('M3,4');
		expect(polylinePath(5, (i) => i, () => 7)).toBe('M0,7L4,7');
	});
});
