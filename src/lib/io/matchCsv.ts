/**
 * Match results as CSV (see csvOut.ts for the layout): the ranked lens solutions, and the beam
 * expanders from the shelf. Units are in the column names; fractions are written in percent.
 */
import type { MatchSolution } from '../optics/solve/types';
import type { Expander } from '../optics/solve/expander';
import { toCsv, type CsvColumn } from './csvOut';

export function solutionsCsv(solutions: readonly MatchSolution[], setup: string, rankedBy: string, date?: Date): string {
	const nLens = Math.max(1, ...solutions.map((s) => s.lenses.length));
	const columns: CsvColumn[] = [{ name: 'rank', about: `place in the ranking (ranked by ${rankedBy})` }];
	for (let j = 1; j <= nLens; j++) {
		columns.push(
			{ name: `lens${j}_label`, about: `lens ${j} in beam order: its label on the shelf` },
			{ name: `lens${j}_f_mm`, about: `lens ${j} focal length, mm` },
			{ name: `lens${j}_z_mm`, about: `lens ${j} position on the bench, mm` },
			{ name: `lens${j}_loss_1mm_percent`, about: `efficiency lost (absolute, %) when lens ${j} alone moves 1 mm, the worse side` },
			{ name: `lens${j}_loss_1pct_f_percent`, about: `efficiency lost (absolute, %) when lens ${j}'s focal length is 1 % off, the worse side` }
		);
	}
	columns.push(
		{ name: 'coupling_x_percent', about: 'mode coupling on x, %' },
		{ name: 'coupling_y_percent', about: 'mode coupling on y, %' },
		{ name: 'apertures_pass_percent', about: 'power fraction through the lens clear apertures, %' },
		{ name: 'efficiency_percent', about: 'coupling x × coupling y × apertures pass, % (embedded Gaussian; an upper estimate for M² > 1)' },
		{ name: 'fundamental_mode_power_percent', about: 'efficiency × fraction of the input power in its fundamental mode, %' },
		{ name: 'length_mm', about: 'first lens to the target plane, mm' }
	);
	const rows = solutions.map((s, i) => {
		const r: Array<number | string | null> = [i + 1];
		for (let j = 0; j < nLens; j++) {
			const l = s.lenses[j];
			if (l) r.push(l.label, l.f_m * 1e3, l.z_m * 1e3, l.positionLoss * 100, l.focalLoss * 100);
			else r.push(null, null, null, null, null);
		}
		r.push(s.couplingX * 100, s.couplingY * 100, s.transmitted * 100, s.efficiency * 100, s.fundamentalModePower * 100, s.length_m * 1e3);
		return r;
	});
	return toCsv({ title: 'Match: ranked lens solutions', setup, date, columns, rows });
}

export function expandersCsv(list: readonly Expander[], setup: string, lens1At_m: number, date?: Date): string {
	return toCsv({
		title: 'Match: beam expanders from the shelf (x axis)',
		setup,
		date,
		notes: [`Lens 1 at z = ${+(lens1At_m * 1e3).toPrecision(6)} mm`],
		columns: [
			{ name: 'type', about: 'Keplerian (two positive lenses) or Galilean (one negative lens)' },
			{ name: 'lens1', about: 'lens 1 label' },
			{ name: 'lens2', about: 'lens 2 label' },
			{ name: 'f1_mm', about: 'lens 1 focal length, mm' },
			{ name: 'f2_mm', about: 'lens 2 focal length, mm' },
			{ name: 'magnification', about: 'nominal magnification |f2/f1|' },
			{ name: 'spacing_mm', about: 'lens spacing, mm' },
			{ name: 'spacing_tolerance_mm', about: '± spacing that keeps the divergence within 10 % of its least value, mm' },
			{ name: 'output_w0_mm', about: 'output waist radius w₀ (1/e²), mm' },
			{ name: 'output_w0_after_lens2_mm', about: 'output waist distance after lens 2, mm' },
			{ name: 'half_angle_mrad', about: 'far-field half-angle θ, mrad' }
		],
		rows: list.map((e) => [e.kind, e.lens1, e.lens2, e.f1_m * 1e3, e.f2_m * 1e3, e.magnification, e.spacing_m * 1e3, e.spacingTolerance_m * 1e3, e.outputWaist_m * 1e3, e.outputWaistAfter_m * 1e3, e.divergence_rad * 1e3])
	});
}

/** The exact single lenses per axis (continuous focal length), with whether each sits on the rail. */
export function singleLensCsv(perAxis: { x: readonly { f_m: number; z_m: number; onRail: boolean }[]; y: readonly { f_m: number; z_m: number; onRail: boolean }[] }, setup: string, rail: { from_m: number; to_m: number }, date?: Date): string {
	const rows: Array<Array<number | string | null>> = [];
	for (const axis of ['x', 'y'] as const) {
		const list = perAxis[axis];
		if (list.length === 0) rows.push([axis, null, null, 'none: no single lens can do it']);
		for (const s of list) rows.push([axis, s.f_m * 1e3, s.z_m * 1e3, s.onRail ? 'yes' : 'no']);
	}
	return toCsv({
		title: 'Match: one lens, any focal length (exact thin lens per axis)',
		setup,
		date,
		notes: [`Rail from z = ${+(rail.from_m * 1e3).toPrecision(6)} mm to z = ${+(rail.to_m * 1e3).toPrecision(6)} mm`],
		columns: [
			{ name: 'axis', about: 'x or y' },
			{ name: 'f_mm', about: 'focal length of the thin lens that turns the input waist into the target waist on this axis, mm' },
			{ name: 'z_mm', about: 'lens position on the bench axis z, mm' },
			{ name: 'on_rail', about: 'yes when the position lies on the rail, no when outside it; "none" when no single lens can do it' }
		],
		rows
	});
}
