import { allowOnly, CliInputError, parseArgs, requireQuantity, requireString } from '../args';
import { twoMirrorCavity } from '../../lib/optics/cavity';
import { sourceFields } from '../../lib/document/compile';
import { parseQuantity } from '../../lib/units/parse';

export const summary = 'Two-mirror linear cavity: g-parameters, stability (stable, on the boundary with the limit mode, or unstable), waist, waist position from mirror 1, spot sizes on the mirrors.';
export const usage = 'npx beamwright cavity --r1 1m --r2 1m --length 0.5m --wavelength 1064nm   (a flat mirror: --r1 flat; convex: negative radius)';

function radius(text: string, name: string): number {
	const t = text.trim().toLowerCase();
	if (t === 'flat' || t === 'inf' || t === 'infinity') return Infinity;
	const r = parseQuantity(text, { label: `--${name}`, kind: 'length', min_si: -1e4, max_si: 1e4 });
	if (!r.ok) throw new CliInputError(r.message);
	if (r.value_si === 0) throw new CliInputError(`--${name}: must be a non-zero length between -10 km and 10 km, or "flat" — got ${text}`);
	return r.value_si;
}

export async function run(argv: string[]) {
	const args = parseArgs(argv);
	allowOnly(args, ['r1', 'r2', 'length', 'wavelength']);
	const r1 = radius(requireString(args, 'r1', '1m'), 'r1');
	const r2 = radius(requireString(args, 'r2', '1m'), 'r2');
	const length_m = requireQuantity(args, 'length', { kind: 'length', above_si: 0, max_si: 1e4 }, '0.5m');
	const wavelength_m = requireQuantity(args, 'wavelength', sourceFields.wavelength, '1064nm');
	const c = twoMirrorCavity(r1, r2, length_m, wavelength_m);
	const out: Record<string, unknown> = { stable: c.stable, g1: c.g1, g2: c.g2, w0_m: c.w0_m, waistFromMirror1_m: c.waistFromMirror1_m, wMirror1_m: c.wMirror1_m, wMirror2_m: c.wMirror2_m };
	// Not stable: say whether it is on the stability boundary or unstable, and why.
	if (!c.stable) {
		out.status = c.status;
		out.reason = c.reason;
	}
	// On the stability boundary: the mode's limit from the stable side (null figures grow without bound, listed in `unbounded`).
	if (c.limit) out.limit = c.limit;
	return out;
}
