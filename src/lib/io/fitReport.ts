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
