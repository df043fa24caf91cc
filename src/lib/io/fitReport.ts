/**
 * The Measure fit report as files: JSON (format "beamwright-fit-report", version 1, SI units in the
 * key names) and CSV (one row per axis, units in the column names). Both carry the wavelength the fit
 * used and the measurement-plan check.
 */
import type { AxisName, WidthsResult } from '../optics/iso11146/widths';
import { toCsv } from './csvOut';

export interface FitReportContext {
	setup: string;
	/** Vacuum wavelength used for M², m; null when none was given. */
	wavelength_m: number | null;
	date?: Date;
}

const figures = ['d0_m', 'z0_m', 'fullDivergence_rad', 'zR_m', 'm2'] as const;

export function fitReportJson(r: WidthsResult, c: FitReportContext): string {
	const axes: Record<string, unknown> = {};
	for (const [name, a] of Object.entries(r.axes) as Array<[AxisName, NonNullable<WidthsResult['axes'][AxisName]>]>) {
		const f = a.fit;
		axes[name] = f.physical
			? {
					physical: true,
					planes: f.n,
					weighting: f.weighting,
					...Object.fromEntries(figures.map((k) => [k, f[k]])),
					uncertainty: f.uncertainty,
					rmsRelativeResidual: f.rmsRelativeResidual,
					residuals: f.residuals,
					plan: a.plan
				}
			: { physical: false, planes: f.n, reason: f.reason };
	}
	return (
		JSON.stringify(
			{
				format: 'beamwright-fit-report',
				version: 1,
				exported: (c.date ?? new Date()).toISOString(),
				setup: c.setup,
				units: 'SI: lengths in m, angles in rad; d is the second-moment (D4σ) diameter; uncertainties are 1σ from the fit covariance',
				wavelength_m: c.wavelength_m,
				columns: r.columns,
				axes
			},
			null,
			2
		) + '\n'
	);
}

export function fitReportCsv(r: WidthsResult, c: FitReportContext): string {
	const rows: Array<Array<number | string | null>> = [];
	for (const [name, a] of Object.entries(r.axes) as Array<[AxisName, NonNullable<WidthsResult['axes'][AxisName]>]>) {
		const f = a.fit;
		if (!f.physical) {
			rows.push([name, null, null, null, null, null, null, null, null, null, null, f.n, null, 'not a beam caustic', null, null, null, f.reason]);
			continue;
		}
		const u = f.uncertainty;
		const p = a.plan;
		rows.push([
			name,
			f.d0_m * 1e3,
			u?.d0_m == null ? null : u.d0_m * 1e3,
			f.z0_m * 1e3,
			u?.z0_m == null ? null : u.z0_m * 1e3,
			f.fullDivergence_rad * 1e3,
			u?.fullDivergence_rad == null ? null : u.fullDivergence_rad * 1e3,
			f.zR_m * 1e3,
			u?.zR_m == null ? null : u.zR_m * 1e3,
			f.m2,
			u?.m2 ?? null,
			f.n,
			f.rmsRelativeResidual * 100,
			p ? (p.ok ? 'meets the rule' : 'does not meet the rule') : 'not checked',
			p?.near ?? null,
			p?.between ?? null,
			p?.far ?? null,
			p ? p.findings.join(' | ') : ''
		]);
	}
	return toCsv({
		title: 'Beam-quality fit report',
		setup: c.setup,
		date: c.date,
		notes: [
			`Wavelength (vacuum): ${c.wavelength_m === null ? 'not given (no M²)' : `${+(c.wavelength_m * 1e9).toPrecision(6)} nm`}`,
			'Diameters are second-moment (D4σ) diameters d = 2w; u_… columns are 1σ standard uncertainties from the fit (empty when there are only 3 planes)',
			'Plan rule: ' + (Object.values(r.axes).find((a) => a?.plan)?.plan?.rule ?? 'ISO 11146-1 plane placement')
		],
		columns: [
			{ name: 'axis', about: 'd (one diameter column), x or y' },
			{ name: 'd0_mm', about: 'waist diameter, mm' },
			{ name: 'u_d0_mm', about: 'its standard uncertainty, mm' },
			{ name: 'z0_mm', about: 'waist location in the measurement z, mm' },
			{ name: 'u_z0_mm', about: 'its standard uncertainty, mm' },
			{ name: 'full_divergence_mrad', about: 'full far-field divergence angle Θ, mrad' },
			{ name: 'u_full_divergence_mrad', about: 'its standard uncertainty, mrad' },
			{ name: 'zR_mm', about: 'Rayleigh length, mm' },
			{ name: 'u_zR_mm', about: 'its standard uncertainty, mm' },
			{ name: 'M2', about: 'beam propagation ratio M² (needs the wavelength)' },
			{ name: 'u_M2', about: 'its standard uncertainty' },
			{ name: 'planes', about: 'number of planes fitted' },
			{ name: 'rms_residual_percent', about: 'root-mean-square relative residual of the fit, %' },
			{ name: 'plan', about: 'plan check verdict' },
			{ name: 'planes_near', about: 'planes within one Rayleigh length of the waist' },
			{ name: 'planes_between', about: 'planes between one and two Rayleigh lengths' },
			{ name: 'planes_far', about: 'planes beyond two Rayleigh lengths' },
			{ name: 'plan_findings', about: 'what the plan check found, separated by |' }
		],
		rows
	});
}

/** One knife-edge or slit scan's fit, as the Measure page shows it. */
export interface KnifeFitRow {
	scan: number;
	axis: string;
	kind: string;
	/** Plane of the scan, m (null when its z is not valid yet). */
	z_m: number | null;
	w_m: number;
	u_w_m: number;
	d4sigma_m: number;
	u_d4sigma_m: number;
	d4sigmaFrom: string;
	center_m: number;
	u_center_m: number;
	clip10_90_m: number | null;
	clip16_84_m: number | null;
	residual_percent: number;
	points: number;
	flagged: number;
}

/** The knife-edge / slit scan fits (one row per scan that fits). */
export function knifeFitsCsv(rows: readonly KnifeFitRow[], setup: string, date?: Date): string {
	const mm = (v: number | null) => (v === null ? null : v * 1e3);
	return toCsv({
		title: 'Measure: knife-edge and slit scan fits',
		setup,
		date,
		notes: ['Uncertainties are standard uncertainties (1σ) from the fit.'],
		columns: [
			{ name: 'scan', about: 'scan number on the page' },
			{ name: 'axis', about: 'x or y' },
			{ name: 'kind', about: 'knife (edge) or slit' },
			{ name: 'z_mm', about: 'plane of the scan, mm (empty: not given yet)' },
			{ name: 'w_mm', about: 'radius w (1/e², error-function fit), mm' },
			{ name: 'u_w_mm', about: 'standard uncertainty of w, mm' },
			{ name: 'd_mm', about: 'diameter d = D4σ, mm (see d_from)' },
			{ name: 'u_d_mm', about: 'standard uncertainty of d, mm' },
			{ name: 'd_from', about: 'clip10_90: 1.5606 × the 10/90 % clip distance; fit: 2w' },
			{ name: 'centre_mm', about: 'beam centre on the blade axis, mm' },
			{ name: 'u_centre_mm', about: 'standard uncertainty of the centre, mm' },
			{ name: 'clip10_90_mm', about: '10/90 % clip distance, mm (empty: not reached)' },
			{ name: 'clip16_84_mm', about: '16/84 % clip distance, mm (empty: not reached)' },
			{ name: 'residual_rms_percent', about: 'RMS residual of the fit, % of the beam power' },
			{ name: 'points', about: 'points used' },
			{ name: 'flagged_lines', about: 'lines of the scan that could not be read' }
		],
		rows: rows.map((r) => [r.scan, r.axis, r.kind, mm(r.z_m), mm(r.w_m), mm(r.u_w_m), mm(r.d4sigma_m), mm(r.u_d4sigma_m), r.d4sigmaFrom, mm(r.center_m), mm(r.u_center_m), mm(r.clip10_90_m), mm(r.clip16_84_m), r.residual_percent, r.points, r.flagged])
	});
}
