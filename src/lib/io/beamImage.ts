/**
 * Decode beam images into the greyscale form the moment code reads: 8- or 16-bit greyscale PNG
 * (fast-png, runs in the browser and in Node) or a CSV matrix of pixel values (one image row per line).
 * Nothing leaves the caller: bytes in, typed array out.
 */
import { decode } from 'fast-png';
import type { GreyImage } from '../optics/iso11146/image';

/**
 * Decode a greyscale PNG. Accepts 8- and 16-bit greyscale, with or without an alpha channel (the
 * alpha is dropped). Colour, palette and 1/2/4-bit images are refused with a RangeError that says why.
 * Example: a 640 × 480 16-bit greyscale PNG → { width: 640, height: 480, data: Uint16Array(307200), maxValue: 65535 }.
 */
export function decodeBeamPng(bytes: Uint8Array | ArrayBuffer): GreyImage {
	let png;
	try {
		png = decode(bytes instanceof ArrayBuffer ? new Uint8Array(bytes) : bytes);
	} catch (e) {
		throw new RangeError(`image must be a readable PNG file — ${(e as Error).message}`);
	}
	if (png.palette) throw new RangeError('image must be greyscale — got a palette (indexed colour) PNG; save the camera frame as 8- or 16-bit greyscale');
	if (png.channels !== 1 && png.channels !== 2) {
		throw new RangeError(`image must be greyscale (1 channel) — got ${png.channels} channels; save the camera frame as 8- or 16-bit greyscale`);
	}
	if (png.depth !== 8 && png.depth !== 16) throw new RangeError(`image bit depth must be 8 or 16 — got ${png.depth}`);
	const n = png.width * png.height;
	let data: Uint8Array | Uint16Array =
		png.data instanceof Uint8ClampedArray ? new Uint8Array(png.data.buffer, png.data.byteOffset, png.data.length) : png.data;
	if (png.channels === 2) {
		const grey = png.depth === 16 ? new Uint16Array(n) : new Uint8Array(n);
		for (let i = 0; i < n; i++) grey[i] = data[2 * i];
		data = grey;
	}
	return { width: png.width, height: png.height, data, maxValue: png.depth === 16 ? 65535 : 255 };
}

/**
 * Read a CSV matrix: each line is one image row of numbers separated by commas, semicolons, tabs or
 * spaces; blank lines and lines starting with `#` are skipped. Every row must have the same length and
 * every cell must be a number: a bad cell is a RangeError naming its line and column (an image cannot
 * lose pixels quietly).
 * Example: "0,1,0\n1,5,1\n0,1,0" → 3 × 3 image with the value 5 at (1, 1) (but beamMoments needs ≥ 8 × 8).
 */
export function parseMatrixCsv(text: string): GreyImage {
	const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\r|\n/);
	const values: number[] = [];
	let width = -1;
	let height = 0;
	const num = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;
	for (let i = 0; i < lines.length; i++) {
		const t = lines[i].trim();
		if (t === '' || t.startsWith('#')) continue;
		const cells = t.includes(',') ? t.split(',') : t.includes(';') ? t.split(';') : t.includes('\t') ? t.split('\t') : t.split(/\s+/);
		if (width < 0) width = cells.length;
		else if (cells.length !== width) throw new RangeError(`matrix line ${i + 1} must have ${width} values like the first row — got ${cells.length}`);
		for (let k = 0; k < cells.length; k++) {
			const c = cells[k].trim();
			if (!num.test(c)) throw new RangeError(`matrix line ${i + 1}, column ${k + 1}: "${c}" is not a number`);
			values.push(Number(c));
		}
		height++;
	}
	if (height === 0) throw new RangeError('matrix must have at least one row of numbers — got none');
	return { width, height, data: Float64Array.from(values) };
}

/** PNG by its signature, otherwise CSV text. */
export function decodeBeamImage(bytes: Uint8Array): GreyImage {
	const sig = [0x89, 0x50, 0x4e, 0x47];
	if (bytes.length >= 4 && sig.every((b, i) => bytes[i] === b)) return decodeBeamPng(bytes);
	return parseMatrixCsv(new TextDecoder().decode(bytes));
}
