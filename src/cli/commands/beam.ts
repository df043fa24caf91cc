import { allowOnly, CliInputError, optQuantity, parseArgs, requireQuantity } from '../args';
import { beamFromQ, farFieldHalfAngle_rad, qFromWaist, rayleighRange_m } from '../../lib/optics/beam';
import { sourceFields } from '../../lib/document/compile';
import { paraxialProblem } from '../../lib/optics/paraxial';

export const summary = 'Beam at a plane z from its waist: Rayleigh range, far-field half-angle, radius, wavefront radius, Gouy phase.';
export const usage = 'npx beamwright beam --wavelength 632.8nm --waist 0.5mm [--m2 1.3] [--index 1] [--at 2m]';

export async function run(argv: string[]) {
	const args = parseArgs(argv);
	allowOnly(args, ['wavelength', 'waist', 'm2', 'index', 'at']);
	const wavelength_m = requireQuantity(args, 'wavelength', sourceFields.wavelength, '1064nm');
	const w0_m = requireQuantity(args, 'waist', sourceFields.waist, '0.5mm');
	const m2 = optQuantity(args, 'm2', sourceFields.m2, '1.3') ?? 1;
	const index = optQuantity(args, 'index', sourceFields.index, '1') ?? 1;
	const z_m = optQuantity(args, 'at', { kind: 'length', min_si: -1e6, max_si: 1e6 }, '2m') ?? 0;
	const notParaxial = paraxialProblem(w0_m, wavelength_m, m2, index, '--waist');
	if (notParaxial) throw new CliInputError(notParaxial);
	const props = { wavelength_m, m2 };
	// The plane sits z downstream of the waist: the waist is −z from the plane.
	const b = beamFromQ(qFromWaist(w0_m, -z_m, props, index), props, index);
	return {
		zR_m: rayleighRange_m(w0_m, wavelength_m, m2, index),
		theta_rad: farFieldHalfAngle_rad(w0_m, wavelength_m, m2, index),
		w_m: b.w_m,
		R_m: Number.isFinite(b.R_m) ? b.R_m : null,
		gouy_rad: b.gouy_rad
	};
}
