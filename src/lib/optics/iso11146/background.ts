/**
 * Background of a beam image: a plane b(x, y) = offset + slopeX·(x − xc) + slopeY·(y − yc) fitted by
 * least squares to pixels the beam does not reach, and the rms noise about that plane.
 *
 * Two regions: a frame along the image border (before the beam is located), and then every pixel
 * outside the integration rectangle (three times the beam widths, where a Gaussian has fallen below
 * e⁻¹⁸ of its peak). The second uses far more pixels, which matters: an offset error δ left in the
 * rectangle biases σ² by about 275·δ/peak (round beam, 3× area), so 1 % in width needs δ below
 * ~7·10⁻⁵ of the peak. A plane rather than a constant copes with a background that tilts across the
 * sensor (stray light, a warm corner). The first level comes from the median and MAD of the
 * region, and pixels more than 3σ from the current plane (hot pixels, a stray reflection, a beam wing
 * in the border) are left out of each fit.
 *
 * Approach after ISO/TR 11146-3:2004, clause 3 (background from the unilluminated part of the frame,
 * subtracted before the moments; from memory); the plane, the two regions and the robust
 * clipping are ours.
 */
import { invert3 } from './lsq';
import type { GreyImage } from './image';

export interface Background {
	/** Background at the image centre, counts. */
	offset_counts: number;
	/** Counts per pixel along x (columns) and y (rows). */
	slopeX_countsPerPx: number;
	slopeY_countsPerPx: number;
	/** Image centre (xc, yc) the plane is referred to, pixels. */
	xc_px: number;
	yc_px: number;
	/** rms of the region's pixels about the plane, counts. */
	noise_counts: number;
	/** Pixels the final fit used. */
	pixels: number;
	/** Where they came from. */
	region: 'border' | 'outsideArea';
}

/** Pixels a background fit may use: a border frame, or everything outside a rectangle (inclusive bounds). */
export type BackgroundRegion = { frame_px: number } | { outside: { x0: number; y0: number; x1: number; y1: number } };

/** Column ranges [c0, c1) of row r inside the region, written into seg; returns the count of numbers written. */
function segments(r: number, W: number, H: number, region: BackgroundRegion, seg: Int32Array): number {
	if ('frame_px' in region) {
		const f = region.frame_px;
		if (r < f || r >= H - f) {
			seg[0] = 0;
			seg[1] = W;
			return 2;
		}
		seg[0] = 0;
		seg[1] = f;
		seg[2] = W - f;
		seg[3] = W;
		return 4;
	}
	const o = region.outside;
	if (r < o.y0 || r > o.y1) {
		seg[0] = 0;
		seg[1] = W;
		return 2;
	}
	seg[0] = 0;
	seg[1] = Math.max(0, o.x0);
	seg[2] = Math.min(W, o.x1 + 1);
	seg[3] = W;
	return 4;
}

/**
 * One pass over the region: plane-fit sums of v' = v − ref(x, y) (n, Σx, Σy, Σx², Σy², Σxy, Σv', Σv'·x,
 * Σv'·y, Σv'²; x, y from the image centre), skipping pixels further than `cut` from `ref`. Working on
 * v' (noise-sized numbers) keeps Σv'² free of cancellation, so the fit and its rms come from one pass.
 * Plain loops over contiguous segments: no per-pixel calls or allocation.
 */
function regionSums(img: GreyImage, region: BackgroundRegion, ref: Plane, cut: number, acc: Float64Array): void {
	const { width: W, height: H, data } = img;
	const xc = (W - 1) / 2;
	const yc = (H - 1) / 2;
	const px = ref.sx;
	const seg = new Int32Array(4);
	acc.fill(0);
	for (let r = 0; r < H; r++) {
		const y = r - yc;
		const row = r * W;
		const base = ref.p0 + ref.sy * y - px * xc;
		const ns = segments(r, W, H, region, seg);
		for (let k = 0; k < ns; k += 2) {
			let n = 0, sx = 0, sxx = 0, sv = 0, svx = 0, svv = 0;
			for (let c = seg[k]; c < seg[k + 1]; c++) {
				const v = data[row + c] - base - px * c;
				if (v > cut || v < -cut) continue;
				const x = c - xc;
				n++;
				sx += x;
				sxx += x * x;
				sv += v;
				svx += v * x;
				svv += v * v;
			}
			acc[0] += n;
			acc[1] += sx;
			acc[2] += n * y;
			acc[3] += sxx;
			acc[4] += n * y * y;
			acc[5] += sx * y;
			acc[6] += sv;
			acc[7] += svx;
			acc[8] += sv * y;
			acc[9] += svv;
		}
	}
}

interface Plane {
	p0: number;
	sx: number;
	sy: number;
}

function fitRegion(img: GreyImage, region: BackgroundRegion, ref: Plane, cut: number): Background | null {
	const acc = new Float64Array(10);
	regionSums(img, region, ref, cut, acc);
	const [n, sx, sy, sxx, syy, sxy, sv, svx, svy, svv] = acc;
	if (n < 12) return null;
	const M = [n, sx, sy, sx, sxx, sxy, sy, sxy, syy];
	const inv = invert3(M);
	if (!inv) return null;
	const p = [inv[0] * sv + inv[1] * svx + inv[2] * svy, inv[3] * sv + inv[4] * svx + inv[5] * svy, inv[6] * sv + inv[7] * svx + inv[8] * svy];
	// Σ(v' − p·X)² = Σv'² − 2·p·(XᵀV) + pᵀ(XᵀX)p
	let quad = 0;
	for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) quad += p[i] * M[3 * i + j] * p[j];
	const ss = Math.max(0, svv - 2 * (p[0] * sv + p[1] * svx + p[2] * svy) + quad);
	return {
		offset_counts: ref.p0 + p[0],
		slopeX_countsPerPx: ref.sx + p[1],
		slopeY_countsPerPx: ref.sy + p[2],
		xc_px: (img.width - 1) / 2,
		yc_px: (img.height - 1) / 2,
		noise_counts: Math.sqrt(ss / Math.max(1, n - 3)),
		pixels: n,
		region: 'frame_px' in region ? 'border' : 'outsideArea'
	};
}

const asPlane = (b: Background): Plane => ({ p0: b.offset_counts, sx: b.slopeX_countsPerPx, sy: b.slopeY_countsPerPx });

/**
 * Fit the background plane to a border frame (`{ frame_px }`) or to every pixel outside a rectangle
 * (`{ outside }`), leaving out pixels more than 3σ off; returns the plane and the noise (rms about it).
 * Without `prior`, the median and MAD of the region set the first 3σ band, and two clipped fits
 * follow; with a prior (e.g. the border estimate when refitting outside the integration area) one
 * clipped pass suffices.
 * Units: counts and pixels. Example: an image that is 100 + 0.5·x counts everywhere (x in pixels
 * from the left edge) on 64 × 64 pixels with a 4-pixel frame → offset_counts 115.75 (the value at the
 * centre x = 31.5), slopeX_countsPerPx 0.5, slopeY_countsPerPx 0, noise_counts 0.
 * Throws RangeError when the region holds fewer than 12 pixels or cannot fix a plane.
 * Source: least-squares plane (normal equations); background from the unilluminated part of the
 * frame after ISO/TR 11146-3:2004, clause 3 (from memory).
 */
export function estimateBackground(img: GreyImage, region: BackgroundRegion, prior?: Background): Background {
	if ('frame_px' in region) {
		const maxFrame = Math.floor(Math.min(img.width, img.height) / 4);
		const f = region.frame_px;
		if (!(Number.isInteger(f) && f >= 1 && f <= maxFrame)) {
			throw new RangeError(`background frame must be a whole number of pixels from 1 to ${maxFrame} (a quarter of the shorter side) — got ${f}`);
		}
	}
	const fail = () =>
		new RangeError(`background region must hold at least 12 pixels that fix a plane — got a ${img.width} × ${img.height} image and ${JSON.stringify(region)}`);
	if (prior && prior.noise_counts > 0) {
		const fit = fitRegion(img, region, asPlane(prior), 3 * prior.noise_counts);
		if (!fit) throw fail();
		return fit;
	}
	// Robust start: median and MAD of (a sample of) the region, so that a beam wing or hot pixels
	// covering part of the region do not drag the first plane; then two 3σ-clipped plane fits.
	const { median, sigma } = robustLevel(img, region);
	let fit: Background | null;
	if (sigma > 0) {
		fit = fitRegion(img, region, { p0: median, sx: 0, sy: 0 }, 3 * sigma);
		if (fit && fit.noise_counts > 0) fit = fitRegion(img, region, asPlane(fit), 3 * fit.noise_counts) ?? fit;
	} else {
		fit = fitRegion(img, region, { p0: median, sx: 0, sy: 0 }, Infinity);
	}
	if (!fit) throw fail();
	return fit;
}

/**
 * Median and 1.4826·MAD (the normal-consistent robust σ; F. R. Hampel, J. Am. Stat. Assoc. 69, 1974)
 * of up to 16 384 evenly strided pixels of the region.
 */
function robustLevel(img: GreyImage, region: BackgroundRegion): { median: number; sigma: number } {
	const { width: W, height: H, data } = img;
	const seg = new Int32Array(4);
	let count = 0;
	for (let r = 0; r < H; r++) {
		const ns = segments(r, W, H, region, seg);
		for (let k = 0; k < ns; k += 2) count += Math.max(0, seg[k + 1] - seg[k]);
	}
	if (count === 0) return { median: 0, sigma: 0 };
	const stride = Math.max(1, Math.ceil(count / 16384));
	const sample = new Float64Array(Math.ceil(count / stride));
	let i = 0, n = 0;
	for (let r = 0; r < H; r++) {
		const ns = segments(r, W, H, region, seg);
		for (let k = 0; k < ns; k += 2) {
			for (let c = seg[k]; c < seg[k + 1]; c++, i++) if (i % stride === 0 && n < sample.length) sample[n++] = data[r * W + c];
		}
	}
	const s = sample.subarray(0, n).sort();
	const median = s[n >> 1];
	for (let k = 0; k < n; k++) s[k] = Math.abs(s[k] - median);
	s.sort();
	return { median, sigma: 1.4826 * s[n >> 1] };
}
