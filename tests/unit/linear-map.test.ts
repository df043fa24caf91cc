// The drawing layers map thousands of points with linearMap instead of calling the scale: it must give
// the scale's own pixel coordinates. Reference: d3-scale's scaleLinear (the registry's general-purpose
// scale library, which LayerCake uses for its default scales).
import { describe, expect, it } from 'vitest';
import { scaleLinear } from 'd3-scale';
import { linearMap } from '../../src/lib/ui/plot/linearMap';

describe('linearMap: the map of a linear scale, written out once', () => {
	const cases: [number[], number[]][] = [
		[[-3.2e7, 6.3e8], [0, 1140]], // detuning in Hz across a plot
		[[0, 44.1], [276, 0]], // percent, y downwards
		[[-1, 4], [276, 0]], // decades of exposure ÷ limit
		[[0.5, 0.5], [0, 100]] // a degenerate domain
	];
	it.each(cases)('domain %j, range %j: the same pixel as d3 scaleLinear (to 1e-9 px)', (domain, range) => {
		const s = scaleLinear().domain(domain).range(range);
		const f = linearMap(s);
		const [d0, d1] = domain;
		for (let i = 0; i <= 200; i++) {
			const v = d0 + ((d1 - d0 || 1) * (i - 20)) / 160; // inside and a little outside the domain
			expect(Math.abs(f(v) - s(v))).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(s(v))));
		}
	});
});
