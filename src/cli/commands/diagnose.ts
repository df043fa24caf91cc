import { readText } from '../readText';
import { allowOnly, CliInputError, optString, parseArgs, requireString } from '../args';
import { readSetupFile } from '../setupFile';
import { compileLabForCli } from './labShared';
import { diagnoseLab, parsePeaksCsv, parseFraction } from '../../lib/document/cavityLab';

export const summary = 'From measured peak heights of a cavity scan: misalignment and mismatch per axis with uncertainties, and the corrections (steering-mirror turns, lens moves).';
export const usage = 'npx beamwright diagnose setup.json --peaks peaks.csv [--noise 1%]   (peaks.csv: rows "peak,height" with peak 00, 10, 01, 20, 02, optional 11 and sum; or a trace "detuning_Hz,power")';

export async function run(argv: string[]) {
	const args = parseArgs(argv);
	allowOnly(args, ['peaks', 'noise'], { files: { max: 1, label: 'setup', example: 'npx beamwright diagnose setup.json --peaks peaks.csv' } });
	const file = args.positionals[0];
	const peaksFile = requireString(args, 'peaks', 'peaks.csv', 'the path of a CSV file of peak heights or of a scan trace');
	const noiseText = optString(args, 'noise', '> 0 and < 50 % of the largest peak, e.g. --noise 1%');
	let noise = 0.01;
	if (noiseText !== undefined) {
		const r = parseFraction(String(noiseText), '--noise');
		if (!r.ok || !(r.value > 0 && r.value < 0.5)) throw new CliInputError(`--noise: must be > 0 and < 50 % of the largest peak (e.g. 1% or 0.01) — got ${String(noiseText)}`);
		noise = r.value;
	}
	const doc = await readSetupFile(file, 'diagnose');
	const { report } = compileLabForCli(doc, file);
	let csv: string;
	try {
		csv = await readText(peaksFile);
	} catch {
		throw new CliInputError(`--peaks: cannot read "${peaksFile}"`);
	}
	const p = parsePeaksCsv(csv, report.spectrum);
	if (!p.ok) throw new CliInputError(`--peaks: ${p.message}`);
	const d = diagnoseLab(doc, report, { ...p.peaks, noise });
	const axis = (a: 'x' | 'y') => {
		const e = d[a];
		const walk = (w: typeof e.walkIfOffset) => (w ? { mirror1_rad: w.mirror1_rad, mirror2_rad: w.mirror2_rad, mirror1_turns: w.turns1, mirror2_turns: w.turns2 } : null);
		return {
			misalignment: e.epsilon,
			offsetIfAllOffset_m: e.offsetIfAll_m,
			tiltIfAllTilt_rad: e.tiltIfAll_rad,
			mismatch: e.beta,
			waistRatioIfAllSize: e.sizeRatioIfAll,
			waistDistanceIfAllPosition_m: e.waistDistanceIfAll_m,
			steerIfOffset: walk(e.walkIfOffset),
			steerIfTilt: walk(e.walkIfTilt)
		};
	};
	const finite = (v: number) => (Number.isFinite(v) ? v : null);
	return {
		peaks: p.peaks,
		unassignedPeaks_Hz: p.unassigned,
		estimate: { x: axis('x'), y: axis('y'), coupling: d.fit.coupling, scale: d.fit.scale, residualRms: d.fit.residualRms, fitted: d.fit.fitted },
		corrections: {
			lensMoves: d.lensMoves.map((l) => ({ id: l.id, label: l.label, move_m: l.moveA_m, orMove_m: l.moveB_m, misfit: finite(l.misfit) })),
			note: 'Steering turns are for the + sign of the offset or tilt; if the first-order peak grows, turn the other way. A lens move is one of two candidates (move_m or orMove_m) that would each explain the mismatch if that lens alone were off.'
		},
		ambiguity: d.ambiguity
	};
}
