/**
 * A small greyscale preview of a beam image for the page (at most 240 pixels on the long side),
 * scaled from the image's own minimum to maximum. Plain TypeScript, runs in the worker.
 */
import type { GreyImage } from '$lib/optics/iso11146/index';

export interface Preview {
	width: number;
	height: number;
	/** Image pixels per preview pixel. */
	scale: number;
	/** RGBA bytes, width·height·4. */
	rgba: Uint8ClampedArray;
}

export function previewOf(img: GreyImage, maxSide = 240): Preview {
	const scale = Math.max(1, Math.ceil(Math.max(img.width, img.height) / maxSide));
	const w = Math.floor(img.width / scale);
	const h = Math.floor(img.height / scale);
	const d = img.data;
	let lo = Infinity, hi = -Infinity;
	for (let i = 0; i < d.length; i++) {
		const v = d[i];
		if (v < lo) lo = v;
		if (v > hi) hi = v;
	}
	const span = hi > lo ? hi - lo : 1;
	const rgba = new Uint8ClampedArray(w * h * 4);
	for (let r = 0; r < h; r++) {
		for (let c = 0; c < w; c++) {
			const v = Math.round((255 * (d[r * scale * img.width + c * scale] - lo)) / span);
			const k = 4 * (r * w + c);
			rgba[k] = rgba[k + 1] = rgba[k + 2] = v;
			rgba[k + 3] = 255;
		}
	}
	return { width: w, height: h, scale, rgba };
}
