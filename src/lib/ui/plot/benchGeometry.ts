/**
 * Pure helpers for the bench plot: tick values, path strings built from typed arrays, spreading
 * element glyphs apart so close elements never overlap, and the glyph for each element kind.
 * No DOM, no Svelte: the plot component only calls these and draws.
 */
import type { ElementSpec } from '../../optics/elements';
import { formatSI } from '../../units/format';

/** "Nice" tick values 0, step, 2·step … ≤ max, step from {1, 2, 5}·10^k, about `count` of them. */
export function niceTicks(max: number, count = 4): number[] {
	if (!(max > 0) || !Number.isFinite(max)) return [0];
	const raw = max / count;
	const p = Math.pow(10, Math.floor(Math.log10(raw)));
	const m = raw / p;
	const step = (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * p;
	const out: number[] = [];
	for (let i = 0; i * step <= max * (1 + 1e-9); i++) out.push(+(i * step).toPrecision(12));
	return out;
}

/** Ticks over [from, to] (may start below zero). */
export function rangeTicks(from: number, to: number, count = 8): number[] {
	const span = to - from;
	if (!(span > 0) || !Number.isFinite(span)) return [from];
	const raw = span / count;
	const p = Math.pow(10, Math.floor(Math.log10(raw)));
	const m = raw / p;
	const step = (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * p;
	const out: number[] = [];
	for (let k = Math.ceil(from / step - 1e-9); k * step <= to + step * 1e-9; k++) out.push(k === 0 ? 0 : +(k * step).toPrecision(12));
	return out;
}

/**
 * Screen coordinates of a curve into a reusable Float32Array (x0, y0, x1, y1, …):
 * px = xa + xb·z, py = ya + yb·w. Returns the array (grown when needed).
 */
export function project(z: Float64Array, w: Float64Array, xa: number, xb: number, ya: number, yb: number, into?: Float32Array): Float32Array {
	const n = z.length;
	const out = into && into.length >= 2 * n ? into : new Float32Array(2 * n);
	for (let i = 0; i < n; i++) {
		out[2 * i] = xa + xb * z[i];
		out[2 * i + 1] = ya + yb * w[i];
	}
	return out;
}

const r1 = (v: number) => Math.round(v * 10) / 10;

/** "M x,y L x,y …" from the first n points of a coordinate array. */
export function linePath(xy: Float32Array, n: number): string {
	if (n === 0) return '';
	let s = 'M' + r1(xy[0]) + ',' + r1(xy[1]);
	for (let i = 1; i < n; i++) s += 'L' + r1(xy[2 * i]) + ',' + r1(xy[2 * i + 1]);
	return s;
}

/**
 * The curve px = (xa + xb·z, ya + yb·w) as a line path and as the closed area between it and the
 * horizontal line y = base, both built in one pass over the sampled arrays, at 0.1 px. A point that
 * rounds to the same place as the one before it is written once.
 */
export function curvePaths(z: Float64Array, w: Float64Array, xa: number, xb: number, ya: number, yb: number, base: number): { line: string; area: string } {
	const n = Math.min(z.length, w.length);
	if (n === 0) return { line: '', area: '' };
	let body = '';
	let px = NaN;
	let py = NaN;
	let first = '';
	for (let i = 0; i < n; i++) {
		const x = Math.round((xa + xb * z[i]) * 10) / 10;
		const y = Math.round((ya + yb * w[i]) * 10) / 10;
		if (x === px && y === py) continue;
		if (i === 0) first = x + ',' + y;
		else body += 'L' + x + ',' + y;
		px = x;
		py = y;
	}
	const b = r1(base);
	const x0 = first.slice(0, first.indexOf(','));
	return { line: 'M' + first + body, area: 'M' + x0 + ',' + b + 'L' + first + body + 'L' + px + ',' + b + 'Z' };
}

/** Closed area between a curve and the horizontal line y = base. */
export function areaPath(xy: Float32Array, n: number, base: number): string {
	if (n === 0) return '';
	const b = r1(base);
	return 'M' + r1(xy[0]) + ',' + b + linePath(xy, n).replace(/^M/, 'L') + 'L' + r1(xy[2 * (n - 1)]) + ',' + b + 'Z';
}

/**
 * Spread items along a line so that neighbours are at least (width_i + width_j)/2 + gap apart,
 * moving each as little as possible (clusters settle at the mean of their wishes), within [lo, hi].
 * `want` must be sorted ascending. Returns the placed centres.
 */
export function spread(want: number[], widths: number[], gap: number, lo: number, hi: number): number[] {
	const n = want.length;
	type Cluster = { start: number; end: number; pos: number; offsets: number[] };
	const clusters: Cluster[] = [];
	for (let i = 0; i < n; i++) {
		let c: Cluster = { start: i, end: i, pos: want[i], offsets: [0] };
		for (;;) {
			const prev = clusters[clusters.length - 1];
			if (!prev) break;
			const prevRight = prev.pos + prev.offsets[prev.offsets.length - 1];
			const need = (widths[prev.end] + widths[c.start]) / 2 + gap;
			if (c.pos - prevRight >= need) break;
			// Merge: offsets of c shift by the joined distance; the cluster centres at the mean wish.
			clusters.pop();
			const base = prev.offsets[prev.offsets.length - 1] + need;
			const offsets = prev.offsets.concat(c.offsets.map((o) => o + base));
			let sum = 0;
			for (let k = prev.start, j = 0; k <= c.end; k++, j++) sum += want[k] - offsets[j];
			c = { start: prev.start, end: c.end, pos: sum / offsets.length, offsets };
		}
		clusters.push(c);
	}
	const out = new Array<number>(n);
	for (const c of clusters) {
		const left = c.pos - widths[c.start] / 2;
		const right = c.pos + c.offsets[c.offsets.length - 1] + widths[c.end] / 2;
		let shift = 0;
		if (right > hi) shift = hi - right;
		if (left + shift < lo) shift = lo - left;
		for (let j = 0; j < c.offsets.length; j++) out[c.start + j] = c.pos + c.offsets[j] + shift;
	}
	// A cluster pushed back inside the bounds may now touch its neighbour: settle from both ends.
	for (let i = 0; i < n; i++) out[i] = Math.max(out[i], lo + widths[i] / 2, i ? out[i - 1] + (widths[i - 1] + widths[i]) / 2 + gap : -Infinity);
	for (let i = n - 1; i >= 0; i--) out[i] = Math.min(out[i], hi - widths[i] / 2, i < n - 1 ? out[i + 1] - (widths[i + 1] + widths[i]) / 2 - gap : Infinity);
	return out;
}

export type GlyphShape =
	| 'lens-pos'
	| 'lens-neg'
	| 'cyl-pos'
	| 'cyl-neg'
	| 'mirror-concave'
	| 'mirror-convex'
	| 'mirror-flat'
	| 'plate'
	| 'interface'
	| 'thermal'
	| 'block'
	| 'matrix';

export interface Glyph {
	shape: GlyphShape;
	/** Short description under the label, e.g. "f +100 mm" (sign always written). */
	caption: string;
	/** Words for screen readers and the tooltip, e.g. "converging lens". */
	words: string;
}

const signed = (v: number, unit = 'm') => (v > 0 ? '+' : '') + formatSI(v, unit, 3).replace('−', '−');

/** The glyph that shows an element's kind and the sign of its power. */
export function glyphFor(spec: ElementSpec): Glyph {
	switch (spec.kind) {
		case 'thinLens':
			return spec.f_m > 0
				? { shape: 'lens-pos', caption: `f ${signed(spec.f_m)}`, words: 'converging lens' }
				: { shape: 'lens-neg', caption: `f ${signed(spec.f_m)}`, words: 'diverging lens' };
		case 'thickLens': {
			// Lensmaker's equation, thick lens (Hecht, Optics, 5th ed. 2017, eq. 6.2), in air.
			const n = spec.index;
			const c1 = Number.isFinite(spec.r1_m) ? 1 / spec.r1_m : 0;
			const c2 = Number.isFinite(spec.r2_m) ? 1 / spec.r2_m : 0;
			const p = (n - 1) * (c1 - c2 + ((n - 1) * spec.thickness_m * c1 * c2) / n);
			if (p === 0) return { shape: 'plate', caption: 'no power', words: 'thick lens without power' };
			return p > 0 ? { shape: 'lens-pos', caption: `f ${signed(1 / p)}`, words: 'converging thick lens' } : { shape: 'lens-neg', caption: `f ${signed(1 / p)}`, words: 'diverging thick lens' };
		}
		case 'cylLens':
			return spec.f_m > 0
				? { shape: 'cyl-pos', caption: `f${spec.axis} ${signed(spec.f_m)}`, words: `converging cylindrical lens, ${spec.axis} only` }
				: { shape: 'cyl-neg', caption: `f${spec.axis} ${signed(spec.f_m)}`, words: `diverging cylindrical lens, ${spec.axis} only` };
		case 'mirror':
			if (!Number.isFinite(spec.r_m)) return { shape: 'mirror-flat', caption: 'flat', words: 'flat mirror' };
			return spec.r_m > 0
				? { shape: 'mirror-concave', caption: `R ${signed(spec.r_m)}`, words: 'concave (focusing) mirror' }
				: { shape: 'mirror-convex', caption: `R ${signed(spec.r_m)}`, words: 'convex (diverging) mirror' };
		case 'foldMirror':
			return { shape: 'mirror-flat', caption: `fold ${formatSI((spec.angle_rad * 180) / Math.PI, '°', 3)}`, words: 'flat fold mirror' };
		case 'plate':
			return { shape: 'plate', caption: `${formatSI(spec.thickness_m, 'm', 3)} plate`, words: 'tilted plate' };
		case 'interface':
			return { shape: 'interface', caption: `n → ${+spec.indexAfter.toPrecision(4)}`, words: 'interface into a new medium' };
		case 'thermalLens':
			return { shape: 'thermal', caption: `f ${signed(spec.fx_m)}`, words: 'thermal lens' };
		case 'medium':
			return { shape: 'block', caption: `n ${+spec.index.toPrecision(4)}`, words: 'medium block' };
		case 'abcd':
			return { shape: 'matrix', caption: 'ABCD', words: 'ray-matrix element' };
	}
}
