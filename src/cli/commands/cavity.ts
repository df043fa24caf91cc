import { allowOnly, CliInputError, optQuantity, parseArgs, requireQuantity, requireString } from '../args';
import { twoMirrorCavity } from '../../lib/optics/cavity';
import { sourceFields } from '../../lib/document/compile';

export const summary = 'Two-mirror linear cavity: g-parameters, stability (stable, on the boundary with the limit mode, or unstable), waist, waist position from mirror 1, spot sizes on the mirrors.';
export const usage = 'npx beamwright cavity --r1 1m --r2 1m --length 0.5m --wavelength 1064nm   (a flat mirror: --r1 flat; convex: negative radius)';

const radiusSpec = { kind: 'length', min_si: -1e4, max_si: 1e4 } as const;
const radiusAccepted = 'a non-zero length ≥ -10 km and ≤ 10 km (+ concave, − convex), or "flat"';

function radius(args: ReturnType<typeof parseArgs>, name: string, example: string): number {
	const text = requireString(args, name, example, radiusAccepted);
	const t = text.trim().toLowerCase();
	if (t === 'flat' || t === 'inf' || t === 'infinity') return Infinity;
	let r: number | undefined;
	try {
		r = optQuantity(args, name, radiusSpec, example);
	} catch (e) {
		if (e instanceof CliInputError && !/reading the unit/.test(e.message)) throw new CliInputError(`${e.message.split(' — accepted:')[0]} — accepted: ${radiusAccepted}`);
		throw e;
	}
	if (r === 0) throw new CliInputError(`--${name}: must not be 0 — accepted: ${radiusAccepted}, e.g. --${name} ${example}`);
	return r!;
}

export async function run(argv: string[]) {
	const args = parseArgs(argv);
	allowOnly(args, ['r1', 'r2', 'length', 'wavelength']);
	const r1 = radius(args, 'r1', '1m');
	const r2 = radius(args, 'r2', '1m');
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
