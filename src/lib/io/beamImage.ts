/**
 * Decode beam images into the greyscale form the moment code reads: 8- or 16-bit greyscale PNG
 * (fast-png, runs in the browser and in Node) or a CSV matrix of pixel values (one image row per line).
 * Nothing leaves the caller: bytes in, typed array out.
 */
import { decode } from 'fast-png';
import type { GreyImage } from '../optics/iso11146/image';
import { numberCell, readCsv } from './csv';

/** Largest image side we decode, pixels. */
export const MAX_IMAGE_SIDE = 16384;
/** Largest image we decode: 8192 × 8192 pixels (64 MP). Larger images are refused before decoding. */
export const MAX_IMAGE_PIXELS = 8192 * 8192;

/**
 * Width and height a PNG declares in its IHDR chunk (bytes 16–23), read without decoding anything;
 * null when the bytes are not a PNG or are too short.
 */
export function pngDeclaredSize(bytes: Uint8Array): { width: number; height: number } | null {
	const sig = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
	if (bytes.length < 24 || !sig.every((b, i) => bytes[i] === b)) return null;
	if (String.fromCharCode(bytes[12], bytes[13], bytes[14], bytes[15]) !== 'IHDR') return null;
	const u32 = (o: number) => ((bytes[o] << 24) >>> 0) + (bytes[o + 1] << 16) + (bytes[o + 2] << 8) + bytes[o + 3];
	return { width: u32(16), height: u32(20) };
}

/** Throws a RangeError when an image of this size is above the stated limits. */
export function checkImageSize(width: number, height: number): void {
	if (width > MAX_IMAGE_SIDE || height > MAX_IMAGE_SIDE || width * height > MAX_IMAGE_PIXELS) {
		throw new RangeError(
			`image must be at most ${MAX_IMAGE_SIDE} pixels a side and ${MAX_IMAGE_PIXELS / 2 ** 20} MP (8192 × 8192) — this one declares ${width} × ${height}; crop it around the beam or bin it`
		);
	}
}

/**
 * Decode a greyscale PNG. Accepts 8- and 16-bit greyscale, with or without an alpha channel (the
 * alpha is dropped). Colour, palette and 1/2/4-bit images are refused with a RangeError that says why.
 * Example: a 640 × 480 16-bit greyscale PNG → { width: 640, height: 480, data: Uint16Array(307200), maxValue: 65535 }.
 */
export function decodeBeamPng(bytes: Uint8Array | ArrayBuffer): GreyImage {
	const u8 = bytes instanceof ArrayBuffer ? new Uint8Array(bytes) : bytes;
	const declared = pngDeclaredSize(u8);
	if (declared) checkImageSize(declared.width, declared.height);
	let png;
	try {
		png = decode(u8);
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
	const read = readCsv(text, { what: 'matrix', maxRecords: MAX_IMAGE_SIDE });
	if (!read.ok) throw new RangeError(read.message);
	let width = -1;
	let height = 0;
	let values = new Float64Array(0);
	for (const { line, cells } of read.records) {
		if (width < 0) {
			width = cells.length;
			checkImageSize(width, Math.min(read.records.length, MAX_IMAGE_SIDE));
			values = new Float64Array(width * read.records.length);
		} else if (cells.length !== width) throw new RangeError(`matrix line ${line} must have ${width} values like the first row — got ${cells.length}`);
		for (let k = 0; k < cells.length; k++) {
			const c = cells[k].trim();
			const v = numberCell(c, read.decimalComma);
			if (v === null || !Number.isFinite(v)) throw new RangeError(`matrix line ${line}, column ${k + 1}: "${c}" is not a number`);
			values[height * width + k] = v;
		}
		height++;
	}
	if (height === 0) throw new RangeError('matrix must have at least one row of numbers — got none');
	return { width, height, data: values };
}

/** PNG by its signature, otherwise CSV text. */
export function decodeBeamImage(bytes: Uint8Array): GreyImage {
	const sig = [0x89, 0x50, 0x4e, 0x47];
	if (bytes.length >= 4 && sig.every((b, i) => bytes[i] === b)) return decodeBeamPng(bytes);
	return parseMatrixCsv(new TextDecoder().decode(bytes));
}
