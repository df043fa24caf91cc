/**
 * Background of a beam image: a plane b(x, y) = offset + slopeX·(x − xc) + slopeY·(y − yc) fitted by
 * least squares to a frame of pixels along the image border, where the beam should not reach, and
 * the rms noise about that plane. A plane rather than a constant copes with a background that tilts
 * across the sensor (stray light, a warm corner). Pixels more than 3σ from the first fit (hot pixels,
 * a beam wing) are left out of a second fit.
 * Approach after ISO/TR 11146-3:2004, clause 3 (background from an unilluminated part of the
 * frame, subtracted before the moments; from memory); the plane and the 3σ re-fit are ours.
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
	/** rms of the border pixels about the plane, counts. */
	noise_counts: number;
	/** Width of the border frame, pixels. */
	frame_px: number;
}

/** Column ranges [c0, c1) of row r that belong to the border frame. */
function frameSegments(r: number, W: number, H: number, frame: number): number[] {
	return r < frame || r >= H - frame ? [0, W] : [0, frame, W - frame, W];
}

/**
 * Accumulate the normal-equation sums of a plane fit over the frame into acc
 * (n, Σx, Σy, Σx², Σy², Σxy, Σv, Σv·x, Σv·y; x, y from the image centre), skipping pixels further
 * than `cut` from `plane`. Plain loops over contiguous segments: no per-pixel calls or allocation.
 */
function frameSums(img: GreyImage, frame: number, plane: Background | null, cut: number, acc: Float64Array): void {
	const { width: W, height: H, data } = img;
	const xc = (W - 1) / 2;
	const yc = (H - 1) / 2;
	const px = plane ? plane.slopeX_countsPerPx : 0;
	acc.fill(0);
	for (let r = 0; r < H; r++) {
		const y = r - yc;
		const row = r * W;
		const base = plane ? plane.offset_counts + plane.slopeY_countsPerPx * y - px * xc : 0;
		const seg = frameSegments(r, W, H, frame);
		for (let k = 0; k < seg.length; k += 2) {
			let n = 0, sx = 0, sxx = 0, sv = 0, svx = 0;
			for (let c = seg[k]; c < seg[k + 1]; c++) {
				const v = data[row + c];
				if (plane && Math.abs(v - base - px * c) > cut) continue;
				const x = c - xc;
				n++;
				sx += x;
				sxx += x * x;
				sv += v;
				svx += v * x;
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
		}
	}
}

/** rms about `fit` of the frame pixels that lie within `cut` of `plane` (all of them when plane is null). */
function frameRms(img: GreyImage, frame: number, fit: Background, plane: Background | null, cut: number): number {
	const { width: W, height: H, data } = img;
	let ss = 0, m = 0;
	for (let r = 0; r < H; r++) {
		const base = fit.offset_counts + fit.slopeY_countsPerPx * (r - fit.yc_px) - fit.slopeX_countsPerPx * fit.xc_px;
		const pbase = plane ? plane.offset_counts + plane.slopeY_countsPerPx * (r - plane.yc_px) - plane.slopeX_countsPerPx * plane.xc_px : 0;
		const seg = frameSegments(r, W, H, frame);
		const row = r * W;
		for (let k = 0; k < seg.length; k += 2) {
			for (let c = seg[k]; c < seg[k + 1]; c++) {
				const v = data[row + c];
				if (plane && Math.abs(v - pbase - plane.slopeX_countsPerPx * c) > cut) continue;
				const res = v - base - fit.slopeX_countsPerPx * c;
				ss += res * res;
				m++;
			}
		}
	}
	return Math.sqrt(ss / Math.max(1, m - 3));
}

function fitFrame(img: GreyImage, frame: number, plane: Background | null, cut: number): Background | null {
	const acc = new Float64Array(9);
	frameSums(img, frame, plane, cut, acc);
	const [n, sx, sy, sxx, syy, sxy, sv, svx, svy] = acc;
	if (n < 12) return null;
	const inv = invert3([n, sx, sy, sx, sxx, sxy, sy, sxy, syy]);
	if (!inv) return null;
	const fit: Background = {
		offset_counts: inv[0] * sv + inv[1] * svx + inv[2] * svy,
		slopeX_countsPerPx: inv[3] * sv + inv[4] * svx + inv[5] * svy,
		slopeY_countsPerPx: inv[6] * sv + inv[7] * svx + inv[8] * svy,
		xc_px: (img.width - 1) / 2,
		yc_px: (img.height - 1) / 2,
		noise_counts: 0,
		frame_px: frame
	};
	fit.noise_counts = frameRms(img, frame, fit, plane, cut);
	return fit;
}

/**
 * Fit the background plane to a border frame `frame_px` pixels wide and return it with the noise.
 * Units: counts and pixels. Example: an image that is 100 + 0.5·x counts everywhere (x in pixels
 * from the left edge) on 64 × 64 pixels → offset 115.75 (at the centre x = 31.5), slopeX 0.5,
 * slopeY 0, noise 0 (keys offset_counts, slopeX_countsPerPx, …).
 * Source: least-squares plane (normal equations); background from the unilluminated border after
 * ISO/TR 11146-3:2004, clause 3 (from memory).
 */
export function estimateBackground(img: GreyImage, frame_px: number): Background {
	const maxFrame = Math.floor(Math.min(img.width, img.height) / 4);
	if (!(Number.isInteger(frame_px) && frame_px >= 1 && frame_px <= maxFrame)) {
		throw new RangeError(`background frame must be a whole number of pixels from 1 to ${maxFrame} (a quarter of the shorter side) — got ${frame_px}`);
	}
	const first = fitFrame(img, frame_px, null, Infinity);
	if (!first) throw new RangeError(`background frame must hold at least 12 pixels — got a ${img.width} × ${img.height} image with a ${frame_px}-pixel frame`);
	if (first.noise_counts === 0) return first;
	return fitFrame(img, frame_px, first, 3 * first.noise_counts) ?? first;
}
