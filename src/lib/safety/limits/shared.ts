/**
 * Code the edition files share: the row builder, the source-angle conditions, the far-infrared band
 * rows (1400 nm–1 mm, the same shape in both editions) and the limiting-aperture rule. Each edition's
 * file keeps only its data (numbers, break times, apertures) with the source beside every row.
 */
import { sci } from './sci';
import type { FactorValues, LimitRow, Provenance, Target } from './types';

export const EYE: readonly Target[] = ['eye'];
export const SKIN: readonly Target[] = ['skin'];
export const BOTH: readonly Target[] = ['eye', 'skin'];

export type RowSpec = Omit<LimitRow, 'uses'> & { uses?: LimitRow['uses'] };
export const row = (r: RowSpec): LimitRow => ({ uses: [], ...r });

export const pointSource = ({ f }: { f: FactorValues }) => f.alpha_mrad <= f.alphaMin_mrad;
export const extendedUpToT2 = ({ f, t_s }: { f: FactorValues; t_s: number }) => f.alpha_mrad > f.alphaMin_mrad && t_s <= f.T2_s;
export const extendedAfterT2 = ({ f, t_s }: { f: FactorValues; t_s: number }) => f.alpha_mrad > f.alphaMin_mrad && t_s > f.T2_s;

/** One far-infrared band as the tables print it: E below 1 ns, a constant H to tEnd, then 5.6·10³·t^0.25 to 10 s, E = 1000 W/m² from 10 s. */
export interface IrBand {
	band: readonly [number, number];
	E0_W_m2: number;
	H_J_m2: number;
	tEnd_s: number;
}

/** Where each part of a far-infrared band comes from, and whether it was read or recalled. */
export type IrPart = 'ultrashort' | 'constant' | 't025' | 'long';
export type IrSource = (b: IrBand, part: IrPart, label: string) => { source: string; provenance: Provenance };

export const farIrBands: readonly IrBand[] = [
	{ band: [1400, 1500], E0_W_m2: 1e12, H_J_m2: 1e3, tEnd_s: 1e-3 },
	{ band: [1500, 1800], E0_W_m2: 1e13, H_J_m2: 1e4, tEnd_s: 10 },
	{ band: [1800, 2600], E0_W_m2: 1e12, H_J_m2: 1e3, tEnd_s: 1e-3 },
	{ band: [2600, 1e6], E0_W_m2: 1e11, H_J_m2: 100, tEnd_s: 1e-7 }
];

/** Rows of the far-infrared bands (eye and skin alike), each with the source the edition gives. */
export function farIrRows(bands: readonly IrBand[], src: IrSource): LimitRow[] {
	return bands.flatMap((b) => {
		const { band, E0_W_m2: E0, H_J_m2: H, tEnd_s: tEnd } = b;
		const label = band[1] === 1e6 ? '2600 nm–1 mm' : `${band[0]}–${band[1]} nm`;
		const rows: LimitRow[] = [
			row({ id: `ir-${band[0]}-ultrashort`, targets: BOTH, wavelength_nm: band, duration_s: [1e-13, 1e-9], mechanism: 'thermal', kind: 'irradiance',
				expression: `E = ${sci(E0)} W/m²`, value: () => E0, ...src(b, 'ultrashort', label) }),
			row({ id: `ir-${band[0]}-constant`, targets: BOTH, wavelength_nm: band, duration_s: [1e-9, tEnd], mechanism: 'thermal', kind: 'radiantExposure',
				expression: `H = ${sci(H)} J/m²`, value: () => H, ...src(b, 'constant', label) })
		];
		if (tEnd < 10)
			rows.push(row({ id: `ir-${band[0]}-t025`, targets: BOTH, wavelength_nm: band, duration_s: [tEnd, 10], mechanism: 'thermal', kind: 'radiantExposure', uses: ['C1'],
				expression: 'H = 5.6·10³·t^0.25 J/m²', value: ({ t_s }) => 5.6e3 * t_s ** 0.25, ...src(b, 't025', label) }));
		rows.push(row({ id: `ir-${band[0]}-long`, targets: BOTH, wavelength_nm: band, duration_s: [10, 3e4], mechanism: 'thermal', kind: 'irradiance',
			expression: 'E = 1000 W/m²', value: () => 1000, ...src(b, 'long', label) }));
		return rows;
	});
}

/** The numbers of an edition's limiting-aperture rule (data; the rule itself is `limitingAperture_m`). */
export interface ApertureRule {
	/** Skin, every wavelength, m. */
	skin_m: number;
	/** Eye, 400–1400 nm (retinal hazard region), m. */
	retina_m: number;
	/** Eye, 0.1–1 mm, m. */
	farIr_m: number;
	/** Eye, 180–400 nm and 1400 nm–0.1 mm: 1 mm up to this time, then 1.5·t^0.375 mm to 10 s, s. */
	smallUntil_s: number;
	/** Whether `smallUntil_s` itself still gets 1 mm (t ≤ …) or already the growing form (t < …). */
	smallInclusive: boolean;
	/** Eye, 180–400 nm and 1400 nm–0.1 mm, from 10 s, m. */
	long_m: number;
}

/** Limiting aperture diameter for (target, λ, t), m. */
export function limitingAperture_m(rule: ApertureRule, target: Target, lambda_nm: number, t_s: number): number {
	if (target === 'skin') return rule.skin_m;
	if (lambda_nm >= 1e5) return rule.farIr_m;
	if (lambda_nm >= 400 && lambda_nm < 1400) return rule.retina_m;
	if (t_s < rule.smallUntil_s || (rule.smallInclusive && t_s === rule.smallUntil_s)) return 1e-3;
	if (t_s < 10) return 1.5e-3 * t_s ** 0.375;
	return rule.long_m;
}
