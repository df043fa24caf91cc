import type { Scale } from 'layercake';

/**
 * The map of a linear scale (LayerCake's default, d3's scaleLinear without clamping or nice), written out
 * from its domain and range once, for drawing layers that map thousands of points: calling the scale
 * per point cost a few milliseconds of a page's take-over. Same arithmetic as the scale's, so the same
 * pixel coordinates (checked against the scale in tests/unit/linear-map.test.ts).
 */
export function linearMap(scale: Scale | { domain(): number[]; range(): number[] }): (v: number) => number {
	const [d0, d1] = scale.domain() as number[];
	const [r0, r1] = scale.range() as number[];
	// A domain of one value maps everything to the middle of the range, as the scale does.
	if (d1 === d0) return () => (r0 + r1) / 2;
	const slope = (r1 - r0) / (d1 - d0);
	return (v) => r0 + (v - d0) * slope;
}
