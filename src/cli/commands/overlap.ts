import { allowOnly, optQuantity, parseArgs, requireQuantity } from '../args';
import { waistCoupling } from '../../lib/optics/overlap';
import { sourceFields } from '../../lib/document/compile';

export const summary = 'Power coupling of two aligned round TEM00 beams from their waists (1/e² radii) and the waist separation along the axis.';
export const usage = 'npx beamwright overlap --wavelength 1064nm --w1 0.5mm --w2 0.6mm [--separation 10cm]';

export async function run(argv: string[]) {
	const args = parseArgs(argv);
	allowOnly(args, ['wavelength', 'w1', 'w2', 'separation']);
	const wavelength_m = requireQuantity(args, 'wavelength', sourceFields.wavelength, '1064nm');
	const w1 = requireQuantity(args, 'w1', sourceFields.waist, '0.5mm');
	const w2 = requireQuantity(args, 'w2', sourceFields.waist, '0.6mm');
	const d = optQuantity(args, 'separation', { kind: 'length', min_si: -1e4, max_si: 1e4 }, '10cm') ?? 0;
	return { efficiency: waistCoupling(w1, w2, d, wavelength_m) };
}
