/**
 * `beamwright moments image.png --pixel 5.5um [--area 3] [--clip 0] [--frame 20]`
 * Centroid and second-moment (D4σ) widths of a beam image (8/16-bit greyscale PNG or CSV matrix),
 * after background removal, over an iterated integration area.
 */
import { readFile } from 'node:fs/promises';
import { CliInputError, allowOnly, optInteger, optQuantity, parseArgs, requireQuantity } from '../args';
import { decodeBeamImage } from '../../lib/io/beamImage';
import { beamMoments } from '../../lib/optics/iso11146/index';

export const summary = 'Centroid, D4σ widths, orientation and ellipticity of a beam image (ISO 11146-1 second moments, background removed).';
export const usage =
	'npx beamwright moments image.png --pixel 5.5um [--area 3] [--clip 0] [--frame 20]\n' +
	'  image: 8- or 16-bit greyscale PNG, or a CSV matrix (one image row per line)\n' +
	'  --area: integration rectangle in D4σ widths (1.5–10, default 3); --clip: zero pixels below this many noise σ (0–10, default 0 = off);\n' +
	'  --frame: border frame for the background, pixels (default 3 % of the shorter side)';

export async function run(argv: string[]) {
	const args = parseArgs(argv);
	allowOnly(args, ['pixel', 'area', 'clip', 'frame'], { files: { max: 1, label: 'image file', example: 'npx beamwright moments image.png --pixel 5.5um' } });
	const file = args.positionals[0];
	if (!file) throw new CliInputError('image file: required — e.g. npx beamwright moments image.png --pixel 5.5um');
	const pixelPitch_m = requireQuantity(args, 'pixel', { kind: 'length', above_si: 0, max_si: 1e-3 }, '5.5um');
	const areaFactor = optQuantity(args, 'area', { kind: 'dimensionless', min_si: 1.5, max_si: 10 }, '3');
	const clip_sigma = optQuantity(args, 'clip', { kind: 'dimensionless', min_si: 0, max_si: 10 }, '2');
	const frame_px = args.options.has('frame') ? optInteger(args, 'frame', 1, 10000, 0) : undefined;
	let bytes: Uint8Array;
	try {
		bytes = new Uint8Array(await readFile(file));
	} catch {
		throw new CliInputError(`image file: cannot read "${file}" — give the path of a greyscale PNG or a CSV matrix`);
	}
	let img;
	try {
		img = decodeBeamImage(bytes);
	} catch (e) {
		if (e instanceof RangeError) throw new CliInputError(`${file}: ${e.message}`);
		throw e;
	}
	const m = beamMoments(img, { pixelPitch_m, areaFactor, clip_sigma, frame_px });
	return {
		image: { width_px: img.width, height_px: img.height, pixelPitch_m },
		centroid_px: m.centroid_px,
		centroid_m: m.centroid_m,
		dx_m: m.dx_m,
		dy_m: m.dy_m,
		orientation_rad: m.orientation_rad,
		dxPrincipal_m: m.dxPrincipal_m,
		dyPrincipal_m: m.dyPrincipal_m,
		ellipticity: m.ellipticity,
		circular: m.circular,
		dCircular_m: m.dCircular_m,
		background: m.background,
		area_px: m.area_px,
		iterations: m.iterations,
		converged: m.converged,
		warnings: m.warnings,
		conventions: 'x right, y down from the centre of the top-left pixel; orientation of the principal axis nearest x, positive from +x towards +y (clockwise as displayed)'
	};
}
