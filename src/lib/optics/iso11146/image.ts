/**
 * The greyscale image the moment code reads: row-major pixel values, row 0 at the top.
 * Coordinates: pixel (col, row) has its centre at x = col, y = row (pixels); y points down the image.
 */

export type PixelArray = Uint8Array | Uint8ClampedArray | Uint16Array | Float32Array | Float64Array;

export interface GreyImage {
	width: number;
	height: number;
	/** width·height values, row-major. */
	data: PixelArray;
	/** Largest value the camera can record (255, 65535, …), used to spot saturation; omit if unknown. */
	maxValue?: number;
}

/**
 * Check the shape of an image: whole width and height of at least 8 pixels and width·height values.
 * Throws a RangeError naming the rule. Example: checkImage({ width: 4, height: 4, data }) throws
 * "image must be at least 8 × 8 pixels — got 4 × 4". Source: our own input rule (pixels, no physics).
 */
export function checkImage(img: GreyImage): void {
	const { width, height, data } = img;
	if (!(Number.isInteger(width) && width >= 8 && Number.isInteger(height) && height >= 8)) {
		throw new RangeError(`image must be at least 8 × 8 pixels — got ${width} × ${height}`);
	}
	if (data.length !== width * height) {
		throw new RangeError(`image data must hold width × height = ${width * height} values — got ${data.length}`);
	}
}
