/**
 * The bench's tables as CSV files (see csvOut.ts for the layout): the beam along the train at a
 * chosen step, the waists, and the beam arriving at each element. Units are in the column names.
 */
import { beamAt, type Propagation } from '../optics/train';
import { toCsv, type CsvColumn } from './csvOut';

const flat = (r: number) => (Number.isFinite(r) && Math.abs(r) < 1e12 ? r : null);
const deg = (rad: number) => (rad * 180) / Math.PI;

export const MAX_BEAM_ROWS = 100_000;

/** The z values from the start to the end of the plotted range at `step_m` (the end is always included). */
export function stepGrid(from_m: number, to_m: number, step_m: number): number[] {
	if (!(step_m > 0) || !Number.isFinite(step_m)) throw new RangeError(`Step must be a positive length — got ${step_m} m`);
	const n = Math.floor((to_m - from_m) / step_m + 1e-9);
	if (n + 2 > MAX_BEAM_ROWS) throw new RangeError(`Step must give at most ${MAX_BEAM_ROWS} rows over ${+(to_m - from_m).toPrecision(4)} m — got ${step_m} m`);
	const zs: number[] = [];
	for (let i = 0; i <= n; i++) zs.push(from_m + i * step_m);
	if (to_m - zs[zs.length - 1] > 1e-9 * Math.max(1, Math.abs(to_m))) zs.push(to_m);
	return zs;
}

const beamColumns: CsvColumn[] = [
	{ name: 'z_mm', about: 'position along the beam axis from the source plane, mm' },
	{ name: 'w_x_mm', about: 'x beam radius w (1/e² intensity), mm; the diameter is d = 2w' },
	{ name: 'w_y_mm', about: 'y beam radius w (1/e² intensity), mm' },
	{ name: 'R_x_m', about: 'x wavefront radius of curvature, m (> 0 diverging, < 0 converging; empty = flat)' },
	{ name: 'R_y_m', about: 'y wavefront radius of curvature, m (same sign rule)' },
	{ name: 'gouy_x_deg', about: 'x Gouy phase accumulated from the source plane, degrees' },
	{ name: 'gouy_y_deg', about: 'y Gouy phase accumulated from the source plane, degrees' }
];

export function beamAlongTrainCsv(p: Propagation, step_m: number, setup: string, date?: Date): string {
	const rows = stepGrid(p.start_m, p.end_m, step_m).map((z) => {
		const b = beamAt(p, z);
		return [z * 1e3, b.x.w_m * 1e3, b.y.w_m * 1e3, flat(b.x.R_m), flat(b.y.R_m), deg(b.x.gouy_rad), deg(b.y.gouy_rad)];
	});
	return toCsv({
		title: 'Beam along the train',
		setup,
		date,
		notes: [`Wavelength: ${+(p.wavelength_m * 1e9).toPrecision(6)} nm; M² x ${+p.m2x.toPrecision(4)}, y ${+p.m2y.toPrecision(4)}`, `Step: ${+(step_m * 1e3).toPrecision(6)} mm`],
		columns: beamColumns,
		rows
	});
}

export function waistsCsv(p: Propagation, setup: string, where: (segment: number) => string, date?: Date): string {
	const ws = p.waists.filter((w) => !w.virtual).sort((a, b) => a.z_m - b.z_m || a.axis.localeCompare(b.axis));
	return toCsv({
		title: 'Waists',
		setup,
		date,
		columns: [
			{ name: 'where', about: 'stretch of the train the waist lies in' },
			{ name: 'axis', about: 'x or y' },
			{ name: 'z0_mm', about: 'waist position, mm' },
			{ name: 'w0_mm', about: 'waist radius w₀ (1/e²), mm' },
			{ name: 'd0_mm', about: 'waist diameter d₀ = 2w₀, mm' },
			{ name: 'zR_mm', about: 'Rayleigh range in the medium, mm' }
		],
		rows: ws.map((w) => [where(w.segment), w.axis, w.z_m * 1e3, w.w0_m * 1e3, 2 * w.w0_m * 1e3, w.zR_m * 1e3])
	});
}

export function elementsCsv(p: Propagation, setup: string, date?: Date): string {
	return toCsv({
		title: 'Beam at each element',
		setup,
		date,
		columns: [
			{ name: 'element', about: 'element label' },
			{ name: 'z_mm', about: 'element entrance position, mm' },
			{ name: 'w_x_mm', about: 'x beam radius w (1/e²) arriving, mm' },
			{ name: 'w_y_mm', about: 'y beam radius w (1/e²) arriving, mm' },
			{ name: 'd_x_mm', about: 'x beam diameter d = 2w arriving, mm' },
			{ name: 'd_y_mm', about: 'y beam diameter d = 2w arriving, mm' },
			{ name: 'R_x_m', about: 'x wavefront radius arriving, m (empty = flat)' },
			{ name: 'R_y_m', about: 'y wavefront radius arriving, m (empty = flat)' },
			{ name: 'passes_percent', about: 'power fraction passing the clear aperture, %' }
		],
		rows: p.elements.map((e) => [e.label, e.z_m * 1e3, e.in.x.w_m * 1e3, e.in.y.w_m * 1e3, 2e3 * e.in.x.w_m, 2e3 * e.in.y.w_m, flat(e.in.x.R_m), flat(e.in.y.R_m), e.transmitted * 100])
	});
}
