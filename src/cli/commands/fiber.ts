import { allowOnly, parseArgs, requireQuantity } from '../args';
import { fiberMode } from '../../lib/optics/fiber';
import { sourceFields } from '../../lib/document/compile';

export const summary = 'Step-index fibre: V number and mode-field diameter (Marcuse 1977 fit).';
export const usage = 'npx beamwright fiber --core-radius 4.1um --na 0.14 --wavelength 1550nm';

export async function run(argv: string[]) {
	const args = parseArgs(argv);
	allowOnly(args, ['core-radius', 'na', 'wavelength']);
	const a = requireQuantity(args, 'core-radius', { kind: 'length', above_si: 0, max_si: 1e-3 }, '4.1um');
	const na = requireQuantity(args, 'na', { kind: 'dimensionless', above_si: 0, max_si: 0.99 }, '0.14');
	const wavelength_m = requireQuantity(args, 'wavelength', sourceFields.wavelength, '1550nm');
	const m = fiberMode(a, na, wavelength_m);
	return { V: m.V, mfd_m: m.mfd_m };
}
