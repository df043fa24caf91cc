/**
 * Directive 2006/25/EC of the European Parliament and of the Council (artificial optical radiation),
 * Annex II "Laser optical radiation": exposure limit values (ICNIRP 1996/2000 values).
 *
 *   Table 2.2 — eye, exposure duration < 10 s
 *   Table 2.3 — eye, exposure duration ≥ 10 s
 *   Table 2.4 — skin
 *   Table 2.5 — correction factors and other parameters (C_A, C_B, C_C, C_E, T_1, T_2, γ, α_min)
 *   Table 2.6 — correction for repetitive exposure (C_P = N^−0.25, T_min)
 *
 * Provenance, stated once here and beside every row: Tables 2.5 and 2.6 were read from the published
 * text (consolidated text CELEX 02006L0025; Table 2.5 also as reproduced word for word in the
 * Norwegian transposition, Regulations concerning action and limit values, Annex 4 Table 4.5).
 * Rows of Tables 2.2–2.4 are transcribed from memory of the Annex: each is marked "(from memory)",
 * and the reference tests check where the forms join at their break times.
 *
 * Wavelengths in nm and angles in mrad as the Directive prints them; values in SI (J/m², W/m²).
 */
import { sci } from './sci';
import type { Edition, FactorValues, LimitRow, Target } from './types';

const T22 = 'Directive 2006/25/EC Annex II Table 2.2';
const T23 = 'Directive 2006/25/EC Annex II Table 2.3';
const T24 = 'Directive 2006/25/EC Annex II Table 2.4';
const MEM = ' (from memory)';
const EYE: readonly Target[] = ['eye'];
const SKIN: readonly Target[] = ['skin'];
const BOTH: readonly Target[] = ['eye', 'skin'];

/** Table 2.5, read: C_A, C_B, C_C, T_1, α_min, C_E, T_2, γ. */
export function euFactors(lambda_nm: number, t_s: number, alpha_mrad: number): FactorValues {
	const l = lambda_nm;
	const CA = l < 700 ? 1 : l < 1050 ? 10 ** (0.002 * (l - 700)) : 5;
	const CB = l < 450 ? 1 : 10 ** (0.02 * (Math.min(l, 700) - 450));
	const CC = l < 1150 ? 1 : l < 1200 ? 10 ** (0.018 * (l - 1150)) : 8;
	const T1_s = l < 450 ? 10 : l < 500 ? 10 * 10 ** (0.02 * (l - 450)) : 100;
	const alphaMin = 1.5;
	const alphaMax = 100;
	const a = alpha_mrad;
	const CE = a <= alphaMin ? 1 : a <= alphaMax ? a / alphaMin : (a * a) / (alphaMin * alphaMax);
	const T2_s = a <= 1.5 ? 10 : a <= 100 ? 10 * 10 ** ((a - 1.5) / 98.5) : 100;
	const gamma_mrad = t_s <= 100 ? 11 : t_s < 1e4 ? 1.1 * Math.sqrt(t_s) : 110;
	return { CA, CB, CC, CE, T1_s, T2_s, gamma_mrad, alphaMin_mrad: alphaMin, alphaMax_mrad: alphaMax, alpha_mrad: a, C1: 5.6e3 * t_s ** 0.25, C2: NaN };
}

type RowSpec = Omit<LimitRow, 'uses'> & { uses?: LimitRow['uses'] };
const row = (r: RowSpec): LimitRow => ({ uses: [], ...r });
const pointSource = ({ f }: { f: FactorValues }) => f.alpha_mrad <= f.alphaMin_mrad;
const extendedUpToT2 = ({ f, t_s }: { f: FactorValues; t_s: number }) => f.alpha_mrad > f.alphaMin_mrad && t_s <= f.T2_s;
const extendedAfterT2 = ({ f, t_s }: { f: FactorValues; t_s: number }) => f.alpha_mrad > f.alphaMin_mrad && t_s > f.T2_s;

/** UV photochemical doses printed per wavelength, 303–314 nm (Tables 2.2 and 2.3), J/m². */
export const euUvDoses: ReadonlyArray<readonly [number, number]> = [
	[303, 40], [304, 60], [305, 100], [306, 160], [307, 250], [308, 400],
	[309, 630], [310, 1.0e3], [311, 1.6e3], [312, 2.5e3], [313, 4.0e3], [314, 6.3e3]
];

const uvRows: LimitRow[] = [
	row({ id: 'uv-ultrashort', targets: BOTH, wavelength_nm: [180, 400], duration_s: [1e-13, 1e-9], mechanism: 'thermal', kind: 'irradiance',
		expression: 'E = 3·10¹⁰ W/m²', value: () => 3e10, source: `${T22} and ${T24}, rows 180–400 nm, columns 10⁻¹³–10⁻⁹ s${MEM}` }),
	row({ id: 'uv-180-302-short', targets: BOTH, wavelength_nm: [180, 302.5], duration_s: [1e-9, 10], mechanism: 'photochemical', kind: 'radiantExposure',
		expression: 'H = 30 J/m²', value: () => 30, source: `${T22}, rows 180–280 and 280–302 nm, columns 10⁻⁹–10 s; skin as eye (${T24})${MEM}` }),
	row({ id: 'uv-180-302-long', targets: BOTH, wavelength_nm: [180, 302.5], duration_s: [10, 3e4], mechanism: 'photochemical', kind: 'radiantExposure',
		expression: 'H = 30 J/m²', value: () => 30, source: `${T23}, rows 180–280 and 280–302 nm, columns 10–3·10⁴ s; skin as eye (${T24})${MEM}` }),
	...euUvDoses.map(([nm, H]) =>
		row({ id: `uv-${nm}`, targets: BOTH, wavelength_nm: [nm - 0.5, nm === 314 ? 315 : nm + 0.5], duration_s: [1e-9, 3e4], mechanism: 'photochemical', kind: 'radiantExposure',
			expression: `H = ${H} J/m²`, value: () => H,
			source: `${T22} and ${T23}, row ${nm} nm (applied to the 1-nm band centred on it), columns 10⁻⁹–3·10⁴ s; skin as eye${MEM}` })
	),
	row({ id: 'uv-302-400-thermal', targets: BOTH, wavelength_nm: [302.5, 400], duration_s: [1e-9, 10], mechanism: 'thermal', kind: 'radiantExposure',
		expression: 'H = 5.6·10³·t^0.25 J/m²', value: ({ t_s }) => 5.6e3 * t_s ** 0.25,
		source: `${T22}, rows 303–314 nm ("if t < … then H = 5.6·10³ t^0.25") and row 315–400 nm, columns 10⁻⁹–10 s${MEM}` }),
	row({ id: 'uva-long', targets: BOTH, wavelength_nm: [315, 400], duration_s: [10, 3e4], mechanism: 'photochemical', kind: 'radiantExposure',
		expression: 'H = 10⁴ J/m²', value: () => 1e4, source: `${T23}, row 315–400 nm, columns 10–3·10⁴ s; skin as eye (${T24})${MEM}` })
];

/** Retinal thermal rows for t < 10 s: [band, short constant, t^0.75 coefficient (10⁻¹¹–10⁻⁹ s), ns constant, t^0.75 coefficient, break time, factor text]. */
const retinalShort: Array<{ band: readonly [number, number]; ps: number; k1: number; ns: number; k2: number; tBreak: number; fx: (f: FactorValues) => number; fxText: string; uses: LimitRow['uses'] }> = [
	{ band: [400, 700], ps: 1.5e-4, k1: 2.7e4, ns: 5e-3, k2: 18, tBreak: 1.8e-5, fx: (f) => f.CE, fxText: 'C_E', uses: ['CE'] },
	{ band: [700, 1050], ps: 1.5e-4, k1: 2.7e4, ns: 5e-3, k2: 18, tBreak: 1.8e-5, fx: (f) => f.CA * f.CE, fxText: 'C_A·C_E', uses: ['CA', 'CE'] },
	{ band: [1050, 1400], ps: 1.5e-3, k1: 2.7e5, ns: 5e-2, k2: 90, tBreak: 5e-5, fx: (f) => f.CC * f.CE, fxText: 'C_C·C_E', uses: ['CC', 'CE'] }
];

const retinalRows: LimitRow[] = retinalShort.flatMap(({ band, ps, k1, ns, k2, tBreak, fx, fxText, uses }) => {
	const b = `${band[0]}–${band[1]} nm`;
	return [
		row({ id: `retina-${band[0]}-ps`, targets: EYE, wavelength_nm: band, duration_s: [1e-13, 1e-11], mechanism: 'thermal', kind: 'radiantExposure', uses,
			expression: `H = ${sci(ps)}·${fxText} J/m²`, value: ({ f }) => ps * fx(f), source: `${T22}, row ${b}, column 10⁻¹³–10⁻¹¹ s${MEM}` }),
		row({ id: `retina-${band[0]}-sub-ns`, targets: EYE, wavelength_nm: band, duration_s: [1e-11, 1e-9], mechanism: 'thermal', kind: 'radiantExposure', uses,
			expression: `H = ${sci(k1)}·t^0.75·${fxText} J/m²`, value: ({ t_s, f }) => k1 * t_s ** 0.75 * fx(f), source: `${T22}, row ${b}, column 10⁻¹¹–10⁻⁹ s${MEM}` }),
		row({ id: `retina-${band[0]}-ns`, targets: EYE, wavelength_nm: band, duration_s: [1e-9, tBreak], mechanism: 'thermal', kind: 'radiantExposure', uses,
			expression: `H = ${sci(ns)}·${fxText} J/m²`, value: ({ f }) => ns * fx(f), source: `${T22}, row ${b}, columns 10⁻⁹–${sci(tBreak)} s${MEM}` }),
		row({ id: `retina-${band[0]}-long-pulse`, targets: EYE, wavelength_nm: band, duration_s: [tBreak, 10], mechanism: 'thermal', kind: 'radiantExposure', uses,
			expression: `H = ${k2}·t^0.75·${fxText} J/m²`, value: ({ t_s, f }) => k2 * t_s ** 0.75 * fx(f), source: `${T22}, row ${b}, columns ${sci(tBreak)}–10 s${MEM}` })
	];
});

const longRetinalRows: LimitRow[] = [
	row({ id: 'photochem-10-100', targets: EYE, wavelength_nm: [400, 600], duration_s: [10, 100], mechanism: 'photochemical', kind: 'radiantExposure', uses: ['CB', 'gamma_mrad'],
		expression: 'H = 100·C_B J/m² (γ = 11 mrad)', value: ({ f }) => 100 * f.CB, source: `${T23}, row 400–600 nm (photochemical), column 10–10² s${MEM}` }),
	row({ id: 'photochem-100-1e4', targets: EYE, wavelength_nm: [400, 600], duration_s: [100, 1e4], mechanism: 'photochemical', kind: 'irradiance', uses: ['CB', 'gamma_mrad'],
		expression: 'E = 1·C_B W/m² (γ = 1.1·t^0.5 mrad)', value: ({ f }) => f.CB, source: `${T23}, row 400–600 nm (photochemical), column 10²–10⁴ s${MEM}` }),
	row({ id: 'photochem-1e4-3e4', targets: EYE, wavelength_nm: [400, 600], duration_s: [1e4, 3e4], mechanism: 'photochemical', kind: 'irradiance', uses: ['CB', 'gamma_mrad'],
		expression: 'E = 1·C_B W/m² (γ = 110 mrad)', value: ({ f }) => f.CB, source: `${T23}, row 400–600 nm (photochemical), column 10⁴–3·10⁴ s${MEM}` }),
	row({ id: 'thermal-long-400-point', targets: EYE, wavelength_nm: [400, 700], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'irradiance',
		condition: 'α < 1.5 mrad', when: pointSource, expression: 'E = 10 W/m²', value: () => 10, source: `${T23}, row 400–700 nm (thermal), α < 1.5 mrad${MEM}` }),
	row({ id: 'thermal-long-400-ext', targets: EYE, wavelength_nm: [400, 700], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'radiantExposure', uses: ['CE', 'T2_s'],
		condition: 'α > 1.5 mrad, t ≤ T_2', when: extendedUpToT2, expression: 'H = 18·C_E·t^0.75 J/m²', value: ({ t_s, f }) => 18 * f.CE * t_s ** 0.75,
		source: `${T23}, row 400–700 nm (thermal), α > 1.5 mrad and t ≤ T_2${MEM}` }),
	row({ id: 'thermal-long-400-ext-T2', targets: EYE, wavelength_nm: [400, 700], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'irradiance', uses: ['CE', 'T2_s'],
		condition: 'α > 1.5 mrad, t > T_2', when: extendedAfterT2, expression: 'E = 18·C_E·T_2^−0.25 W/m²', value: ({ f }) => 18 * f.CE * f.T2_s ** -0.25,
		source: `${T23}, row 400–700 nm (thermal), α > 1.5 mrad and t > T_2${MEM}` }),
	row({ id: 'thermal-long-700-point', targets: EYE, wavelength_nm: [700, 1400], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'irradiance', uses: ['CA', 'CC'],
		condition: 'α < 1.5 mrad', when: pointSource, expression: 'E = 10·C_A·C_C W/m²', value: ({ f }) => 10 * f.CA * f.CC, source: `${T23}, row 700–1400 nm, α < 1.5 mrad${MEM}` }),
	row({ id: 'thermal-long-700-ext', targets: EYE, wavelength_nm: [700, 1400], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'radiantExposure', uses: ['CA', 'CC', 'CE', 'T2_s'],
		condition: 'α > 1.5 mrad, t ≤ T_2', when: extendedUpToT2, expression: 'H = 18·C_A·C_C·C_E·t^0.75 J/m²', value: ({ t_s, f }) => 18 * f.CA * f.CC * f.CE * t_s ** 0.75,
		source: `${T23}, row 700–1400 nm, α > 1.5 mrad and t ≤ T_2${MEM}` }),
	row({ id: 'thermal-long-700-ext-T2', targets: EYE, wavelength_nm: [700, 1400], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'irradiance', uses: ['CA', 'CC', 'CE', 'T2_s'],
		condition: 'α > 1.5 mrad, t > T_2', when: extendedAfterT2, expression: 'E = 18·C_A·C_C·C_E·T_2^−0.25 W/m²', value: ({ f }) => 18 * f.CA * f.CC * f.CE * f.T2_s ** -0.25,
		source: `${T23}, row 700–1400 nm, α > 1.5 mrad and t > T_2${MEM}` })
];

/** Far-infrared bands (cornea and skin alike): [band, ultrashort E, constant H, end of the constant, then 5.6·10³·t^0.25 up to 10 s]. */
const irBands: Array<{ band: readonly [number, number]; E0: number; H: number; tEnd: number }> = [
	{ band: [1400, 1500], E0: 1e12, H: 1e3, tEnd: 1e-3 },
	{ band: [1500, 1800], E0: 1e13, H: 1e4, tEnd: 10 },
	{ band: [1800, 2600], E0: 1e12, H: 1e3, tEnd: 1e-3 },
	{ band: [2600, 1e6], E0: 1e11, H: 100, tEnd: 1e-7 }
];

const irRows: LimitRow[] = irBands.flatMap(({ band, E0, H, tEnd }) => {
	const b = band[1] === 1e6 ? '2600 nm–1 mm' : `${band[0]}–${band[1]} nm`;
	const rows: LimitRow[] = [
		row({ id: `ir-${band[0]}-ultrashort`, targets: BOTH, wavelength_nm: band, duration_s: [1e-13, 1e-9], mechanism: 'thermal', kind: 'irradiance',
			expression: `E = ${sci(E0)} W/m²`, value: () => E0, source: `${T22} and ${T24}, row ${b}, columns 10⁻¹³–10⁻⁹ s${MEM}` }),
		row({ id: `ir-${band[0]}-constant`, targets: BOTH, wavelength_nm: band, duration_s: [1e-9, tEnd], mechanism: 'thermal', kind: 'radiantExposure',
			expression: `H = ${H} J/m²`, value: () => H, source: `${T22}, row ${b}, columns 10⁻⁹–${sci(tEnd)} s; skin as eye (${T24})${MEM}` })
	];
	if (tEnd < 10)
		rows.push(row({ id: `ir-${band[0]}-t025`, targets: BOTH, wavelength_nm: band, duration_s: [tEnd, 10], mechanism: 'thermal', kind: 'radiantExposure', uses: ['C1'],
			expression: 'H = 5.6·10³·t^0.25 J/m²', value: ({ t_s }) => 5.6e3 * t_s ** 0.25, source: `${T22}, row ${b}, columns ${sci(tEnd)}–10 s; skin as eye (${T24})${MEM}` }));
	rows.push(row({ id: `ir-${band[0]}-long`, targets: BOTH, wavelength_nm: band, duration_s: [10, 3e4], mechanism: 'thermal', kind: 'irradiance',
		expression: 'E = 1000 W/m²', value: () => 1000, source: `${T23} and ${T24}, row ${b}, columns 10–3·10⁴ s${MEM}` }));
	return rows;
});

const skinRows: LimitRow[] = [
	row({ id: 'skin-400-ultrashort', targets: SKIN, wavelength_nm: [400, 1400], duration_s: [1e-13, 1e-9], mechanism: 'thermal', kind: 'irradiance',
		expression: 'E = 2·10¹¹ W/m²', value: () => 2e11, source: `${T24}, row 400–1400 nm, column < 10⁻⁹ s${MEM}` }),
	row({ id: 'skin-400-ns', targets: SKIN, wavelength_nm: [400, 1400], duration_s: [1e-9, 1e-7], mechanism: 'thermal', kind: 'radiantExposure', uses: ['CA'],
		expression: 'H = 200·C_A J/m²', value: ({ f }) => 200 * f.CA, source: `${T24}, row 400–1400 nm, column 10⁻⁹–10⁻⁷ s${MEM}` }),
	row({ id: 'skin-400-t025', targets: SKIN, wavelength_nm: [400, 1400], duration_s: [1e-7, 10], mechanism: 'thermal', kind: 'radiantExposure', uses: ['CA'],
		expression: 'H = 1.1·10⁴·C_A·t^0.25 J/m²', value: ({ t_s, f }) => 1.1e4 * f.CA * t_s ** 0.25, source: `${T24}, row 400–1400 nm, columns 10⁻⁷–10 s${MEM}` }),
	row({ id: 'skin-400-long', targets: SKIN, wavelength_nm: [400, 1400], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'irradiance', uses: ['CA'],
		expression: 'E = 2·10³·C_A W/m²', value: ({ f }) => 2e3 * f.CA, source: `${T24}, row 400–1400 nm, columns 10–3·10⁴ s${MEM}` })
];

/** Limiting aperture (Tables 2.2–2.4 aperture column), m. */
function euAperture_m(target: Target, lambda_nm: number, t_s: number): number {
	if (lambda_nm >= 1e5) return 11e-3;
	if (target === 'skin') return 3.5e-3;
	if (lambda_nm >= 400 && lambda_nm < 1400) return 7e-3;
	if (t_s < 0.3) return 1e-3;
	if (t_s < 10) return 1.5e-3 * t_s ** 0.375;
	return 3.5e-3;
}

/** T_min of Table 2.6 (read for 315–1800 nm; the two bands above 1800 nm from memory), s. */
function euGroupingTime_s(lambda_nm: number): number {
	const l = lambda_nm;
	if (l <= 315) return NaN;
	if (l <= 400) return 1e-9;
	if (l <= 1050) return 18e-6;
	if (l <= 1400) return 50e-6;
	if (l <= 1500) return 1e-3;
	if (l <= 1800) return 10;
	if (l <= 2600) return 1e-3;
	return 1e-7;
}

export const eu200625: Edition = {
	id: 'eu-2006-25',
	title: 'Directive 2006/25/EC, Annex II (ICNIRP 1996/2000 values)',
	short: 'EU 2006/25/EC',
	rows: [...uvRows, ...retinalRows, ...longRetinalRows, ...irRows, ...skinRows],
	factors: euFactors,
	aperture_m: euAperture_m,
	apertureSource: `${T22}–2.4, aperture column: eye 7 mm (400–1400 nm); 1 mm for t < 0.3 s, 1.5·t^0.375 mm for 0.3–10 s, 3.5 mm from 10 s (180–400 nm and 1400 nm–0.1 mm); 11 mm (0.1–1 mm); skin 3.5 mm${MEM}`,
	groupingTime_s: euGroupingTime_s,
	groupingSource: 'Directive 2006/25/EC Annex II Table 2.6, T_min (315–1800 nm read; 1800–2600 nm: 10⁻³ s and 2600 nm–1 mm: 10⁻⁷ s from memory)',
	cpApplies: (_target, _lambda_nm, mechanism) => mechanism === 'thermal',
	cpSource: 'Directive 2006/25/EC Annex II Table 2.6, rule 3: C_P = N^−0.25 applies only to limits protecting against thermal injury; pulses within T_min count as one',
	notes: [
		'Rows of Annex II Tables 2.2–2.4 are transcribed from memory; Tables 2.5 and 2.6 were read from the published text. Verify values against the Official Journal.',
		'Rows printed for single wavelengths 303–314 nm are applied to the 1-nm band centred on each.',
		'α = 1.5 mrad exactly is treated as a point source.',
		'Skin, 400–1400 nm, below 1 ns: taken as 2·10¹¹ W/m² without C_A, the stricter reading of a value recalled from memory.'
	]
};
