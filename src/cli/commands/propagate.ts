import { allowOnly, CliInputError, parseArgs } from '../args';
import { readSetupFile } from '../setupFile';
import { compileSetup } from '../../lib/document/compile';
import { propagate } from '../../lib/optics/train';
import type { BeamAt } from '../../lib/optics/beam';

export const summary = 'Propagate a setup document (exported from the app): the beam at each element per axis, every waist, the warnings.';
export const usage = 'npx beamwright propagate setup.json';

const beamJson = (b: BeamAt) => ({
	w_m: b.w_m,
	R_m: Number.isFinite(b.R_m) ? b.R_m : null,
	gouy_rad: b.gouy_rad,
	q_m: { re: b.q.re * b.index, im: b.q.im * b.index }
});

export async function run(argv: string[]) {
	const args = parseArgs(argv);
	allowOnly(args, [], { files: { max: 1, label: 'setup', example: 'npx beamwright propagate setup.json' } });
	const doc = await readSetupFile(args.positionals[0], 'propagate');
	const compiled = compileSetup(doc);
	if (!compiled.ok) throw new CliInputError(`setup: ${compiled.errors[0].path}: ${compiled.errors[0].message}${compiled.errors.length > 1 ? ` (and ${compiled.errors.length - 1} more)` : ''}`);
	const p = propagate(compiled.input);
	return {
		name: doc.name,
		wavelength_m: p.wavelength_m,
		m2: { x: p.m2x, y: p.m2y },
		elements: p.elements.map((e) => ({
			id: e.id,
			label: e.label,
			z_m: e.z_m,
			transmitted: e.transmitted,
			x: { in: beamJson(e.in.x), out: beamJson(e.out.x) },
			y: { in: beamJson(e.in.y), out: beamJson(e.out.y) }
		})),
		waists: p.waists.map((w) => ({ axis: w.axis, segment: w.segment, z_m: w.z_m, w0_m: w.w0_m, zR_m: w.zR_m, virtual: w.virtual })),
		warnings: p.warnings.map((w) => ({ code: w.code, level: w.level, element: w.elementId, message: w.message })),
		transmitted: p.transmitted
	};
}
