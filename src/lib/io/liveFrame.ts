/**
 * Frames from a live camera, turned into the greyscale images the moment code reads: colour to grey,
 * averaging of N frames, dark-frame subtraction and the checks that matter at the bench (saturated
 * pixels, too little signal). Pure functions, no DOM: the page grabs RGBA pixels from a <video> through
 * a canvas and hands them to a worker that calls these.
 *
 * Grey value: the largest of R, G and B. A monochrome sensor behind a browser gives R = G = B; for a
 * colour sensor the largest channel is the one that saturates first, so it is the one to watch (our own
 * choice; a luma weighting would hide a saturated red or blue channel).
 */
import type { GreyImage } from '../optics/iso11146/image';

/** Grey values (0–255) of an RGBA frame, and how many pixels have a channel at 255. */
export function greyOfRgba(rgba: Uint8Array | Uint8ClampedArray, width: number, height: number): { grey: Uint8Array; saturated: number } {
	const n = width * height;
	if (rgba.length !== 4 * n) throw new RangeError(`frame must hold 4 × width × height = ${4 * n} bytes — got ${rgba.length}`);
	const grey = new Uint8Array(n);
	let saturated = 0;
	for (let i = 0, j = 0; i < n; i++, j += 4) {
		const r = rgba[j], g = rgba[j + 1], b = rgba[j + 2];
		const m = r > g ? (r > b ? r : b) : g > b ? g : b;
		grey[i] = m;
		if (m === 255) saturated++;
	}
	return { grey, saturated };
}

/**
 * A running average of the last N frames (N ≥ 1), kept as a sum so each new frame costs one pass.
 */
export class FrameAverager {
	readonly width: number;
	readonly height: number;
	#frames: Uint8Array[] = [];
	#sum: Float64Array;
	#n: number;

	constructor(width: number, height: number, n: number) {
		if (!(Number.isInteger(n) && n >= 1 && n <= 100)) throw new RangeError(`frames to average must be a whole number from 1 to 100 — got ${n}`);
		this.width = width;
		this.height = height;
		this.#n = n;
		this.#sum = new Float64Array(width * height);
	}

	get count(): number {
		return this.#frames.length;
	}

	push(grey: Uint8Array): void {
		if (grey.length !== this.#sum.length) throw new RangeError(`frame must have ${this.#sum.length} pixels — got ${grey.length}`);
		const s = this.#sum;
		for (let i = 0; i < s.length; i++) s[i] += grey[i];
		this.#frames.push(grey);
		while (this.#frames.length > this.#n) {
			const old = this.#frames.shift()!;
			for (let i = 0; i < s.length; i++) s[i] -= old[i];
		}
	}

	/** The mean of the frames held, minus `dark` (a mean dark frame of the same size) when given. */
	mean(dark?: Float32Array | null): Float32Array {
		const k = this.#frames.length;
		if (k === 0) throw new RangeError('no frame to average yet');
		if (dark && dark.length !== this.#sum.length) throw new RangeError('dark frame must have the size of the camera frame — capture it again');
		const out = new Float32Array(this.#sum.length);
		for (let i = 0; i < out.length; i++) out[i] = this.#sum[i] / k - (dark ? dark[i] : 0);
		return out;
	}
}

export interface SignalCheck {
	/** Peak minus median of the image, counts. */
	peakAboveMedian: number;
	/** True when the beam stands less than `minCounts` above the floor. */
	weak: boolean;
}

/**
 * Is there enough signal? The peak above the median (a robust floor: the beam covers under half of a
 * sensibly framed image) compared with `minCounts` (default 20 of 255: below that, 8-bit quantisation
 * alone limits the widths to a few per cent — common practice, our threshold).
 */
export function checkSignal(img: GreyImage, minCounts = 20): SignalCheck {
	const d = img.data;
	// Median by a 1024-bin histogram over the value range (frames here are 8-bit or differences of them).
	let lo = Infinity, hi = -Infinity;
	for (let i = 0; i < d.length; i++) {
		if (d[i] < lo) lo = d[i];
		if (d[i] > hi) hi = d[i];
	}
	if (!(hi > lo)) return { peakAboveMedian: 0, weak: true };
	const bins = new Uint32Array(1024);
	const scale = 1023 / (hi - lo);
	for (let i = 0; i < d.length; i++) bins[Math.floor((d[i] - lo) * scale)]++;
	let acc = 0, b = 0;
	const half = d.length / 2;
	for (; b < 1024; b++) {
		acc += bins[b];
		if (acc >= half) break;
	}
	const median = lo + b / scale;
	const peakAboveMedian = hi - median;
	return { peakAboveMedian, weak: peakAboveMedian < minCounts };
}
