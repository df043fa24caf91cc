/**
 * IEC 60825-1:2014 (edition 3), Annex A: maximum permissible exposures (MPE) at the cornea and skin,
 * with its correction factors (IEC names C1–C7, T1, T2, γ_ph, α_min, α_max, T_i). The values are those
 * of ICNIRP, "Guidelines on limits of exposure to laser radiation of wavelengths between 180 nm and
 * 1,000 µm", Health Physics 105(3):271–295 (2013).
 *
 * Provenance: the standard is not public; every row and factor below is recalled, not read, and is
 * marked "(from memory)". Where a recollection was uncertain the stricter reading is kept and said so
 * in `notes` (these travel with every result).
 *
 * Differences from the EU Directive edition (ICNIRP 2000) that this file encodes: retinal thermal
 * limits below 10 s break at 5 µs (400–1050 nm) and 13 µs (1050–1400 nm) with 2·10⁻³ and 2·10⁻²
 * J/m² plateaus; α_max depends on the duration (5 mrad below 625 µs, 200·t^0.5 mrad up to 0.25 s,
 * 100 mrad after); C6 stops at α_max/α_min; UV 302.5–315 nm follows C1/C2 with break time T1;
 * 315–400 nm goes to 10 W/m² after 1000 s; the repetitive-pulse factor C5 applies to retinal thermal
 * limits only.
 */
import { sci } from './sci';
import { BOTH, EYE, SKIN, extendedAfterT2, extendedUpToT2, farIrBands, farIrRows, limitingAperture_m, pointSource, row as sharedRow, type ApertureRule, type RowSpec } from './shared';
import { recalledIecLabel, type Edition, type FactorValues, type LimitRow } from './types';

const A1 = 'IEC 60825-1:2014 Annex A, MPE table for the eye';
const SK = 'IEC 60825-1:2014 Annex A, MPE table for the skin';
const MEM = ' (from memory)';

/** α_max of the 2014 edition (ICNIRP 2013), mrad. */
export function iecAlphaMax_mrad(t_s: number): number {
	if (t_s < 625e-6) return 5;
	if (t_s <= 0.25) return 200 * Math.sqrt(t_s);
	return 100;
}

/** Correction factors and break times (IEC Annex A factor table), from memory. */
export function iecFactors(lambda_nm: number, t_s: number, alpha_mrad: number): FactorValues {
	const l = lambda_nm;
	const CA = l < 700 ? 1 : l < 1050 ? 10 ** (0.002 * (l - 700)) : 5; // C4
	const CB = l < 450 ? 1 : 10 ** (0.02 * (Math.min(l, 600) - 450)); // C3 (photochemical rows stop at 600 nm)
	const CC = l < 1150 ? 1 : l < 1200 ? 10 ** (0.018 * (l - 1150)) : 8; // C7, kept at 8 above 1200 nm (see notes)
	const alphaMin = 1.5;
	const alphaMax = iecAlphaMax_mrad(t_s);
	const a = alpha_mrad;
	const CE = a <= alphaMin ? 1 : a <= alphaMax ? a / alphaMin : alphaMax / alphaMin; // C6
	const T2_s = a <= 1.5 ? 10 : a <= 100 ? 10 * 10 ** ((a - 1.5) / 98.5) : 100;
	const T1_s = l >= 302.5 && l < 315 ? 10 ** (0.8 * (l - 295)) * 1e-15 : NaN;
	const gamma_mrad = t_s <= 100 ? 11 : t_s < 1e4 ? 1.1 * Math.sqrt(t_s) : 110;
	const C2 = l >= 302.5 && l < 315 ? 10 ** (0.2 * (l - 295)) : NaN;
	return { CA, CB, CC, CE, T1_s, T2_s, gamma_mrad, alphaMin_mrad: alphaMin, alphaMax_mrad: alphaMax, alpha_mrad: a, C1: 5.6e3 * t_s ** 0.25, C2 };
}

/** Every row of this edition is recalled (the standard's tables were not reachable as text). */
const row = (r: Omit<RowSpec, 'provenance'>): LimitRow => sharedRow({ ...r, provenance: 'recalled' });

const uvRows: LimitRow[] = [
	row({ id: 'uv-ultrashort', targets: BOTH, wavelength_nm: [180, 400], duration_s: [1e-13, 1e-9], mechanism: 'thermal', kind: 'irradiance',
		expression: 'E = 3·10¹⁰ W/m²', value: () => 3e10, source: `${A1} and ${SK}, 180–400 nm, 10⁻¹³–10⁻⁹ s${MEM}` }),
	row({ id: 'uv-180-302', targets: BOTH, wavelength_nm: [180, 302.5], duration_s: [1e-9, 3e4], mechanism: 'photochemical', kind: 'radiantExposure',
		expression: 'H = 30 J/m²', value: () => 30, source: `${A1}, 180–302.5 nm, 10⁻⁹–3·10⁴ s; skin as eye${MEM}` }),
	row({ id: 'uv-302-315-thermal', targets: BOTH, wavelength_nm: [302.5, 315], duration_s: [1e-9, 10], mechanism: 'thermal', kind: 'radiantExposure', uses: ['C1', 'T1_s'],
		condition: 't ≤ T1', when: ({ t_s, f }) => t_s <= f.T1_s, expression: 'H = C1 = 5.6·10³·t^0.25 J/m²', value: ({ t_s }) => 5.6e3 * t_s ** 0.25,
		source: `${A1}, 302.5–315 nm, 10⁻⁹ s–T1; skin as eye${MEM}` }),
	row({ id: 'uv-302-315-photochem', targets: BOTH, wavelength_nm: [302.5, 315], duration_s: [1e-9, 3e4], mechanism: 'photochemical', kind: 'radiantExposure', uses: ['C2', 'T1_s'],
		condition: 't > T1', when: ({ t_s, f }) => t_s > f.T1_s, expression: 'H = C2 = 10^(0.2(λ−295)) J/m²', value: ({ f }) => f.C2,
		source: `${A1}, 302.5–315 nm, T1–3·10⁴ s; skin as eye${MEM}` }),
	row({ id: 'uva-thermal', targets: BOTH, wavelength_nm: [315, 400], duration_s: [1e-9, 10], mechanism: 'thermal', kind: 'radiantExposure', uses: ['C1'],
		expression: 'H = C1 = 5.6·10³·t^0.25 J/m²', value: ({ t_s }) => 5.6e3 * t_s ** 0.25, source: `${A1}, 315–400 nm, 10⁻⁹–10 s; skin as eye${MEM}` }),
	row({ id: 'uva-dose', targets: BOTH, wavelength_nm: [315, 400], duration_s: [10, 1e3], mechanism: 'photochemical', kind: 'radiantExposure',
		expression: 'H = 10⁴ J/m²', value: () => 1e4, source: `${A1}, 315–400 nm, 10–10³ s; skin as eye${MEM}` }),
	row({ id: 'uva-irradiance', targets: BOTH, wavelength_nm: [315, 400], duration_s: [1e3, 3e4], mechanism: 'photochemical', kind: 'irradiance',
		expression: 'E = 10 W/m²', value: () => 10, source: `${A1}, 315–400 nm, 10³–3·10⁴ s; skin as eye${MEM}` })
];

const retinalShort: Array<{ band: readonly [number, number]; ps: number; ns: number; k: number; tBreak: number; fx: (f: FactorValues) => number; fxText: string; uses: LimitRow['uses'] }> = [
	{ band: [400, 700], ps: 1e-3, ns: 2e-3, k: 18, tBreak: 5e-6, fx: (f) => f.CE, fxText: 'C6', uses: ['CE'] },
	{ band: [700, 1050], ps: 1e-3, ns: 2e-3, k: 18, tBreak: 5e-6, fx: (f) => f.CA * f.CE, fxText: 'C4·C6', uses: ['CA', 'CE'] },
	{ band: [1050, 1400], ps: 1e-2, ns: 2e-2, k: 90, tBreak: 13e-6, fx: (f) => f.CC * f.CE, fxText: 'C7·C6', uses: ['CC', 'CE'] }
];

const retinalRows: LimitRow[] = retinalShort.flatMap(({ band, ps, ns, k, tBreak, fx, fxText, uses }) => {
	const b = `${band[0]}–${band[1]} nm`;
	return [
		row({ id: `retina-${band[0]}-ps`, targets: EYE, wavelength_nm: band, duration_s: [1e-13, 1e-11], mechanism: 'thermal', kind: 'radiantExposure', uses,
			expression: `H = ${sci(ps)}·${fxText} J/m²`, value: ({ f }) => ps * fx(f), source: `${A1}, ${b}, 10⁻¹³–10⁻¹¹ s${MEM}` }),
		row({ id: `retina-${band[0]}-ns`, targets: EYE, wavelength_nm: band, duration_s: [1e-11, tBreak], mechanism: 'thermal', kind: 'radiantExposure', uses,
			expression: `H = ${sci(ns)}·${fxText} J/m²`, value: ({ f }) => ns * fx(f), source: `${A1}, ${b}, 10⁻¹¹–${sci(tBreak)} s${MEM}` }),
		row({ id: `retina-${band[0]}-long-pulse`, targets: EYE, wavelength_nm: band, duration_s: [tBreak, 10], mechanism: 'thermal', kind: 'radiantExposure', uses,
			expression: `H = ${k}·t^0.75·${fxText} J/m²`, value: ({ t_s, f }) => k * t_s ** 0.75 * fx(f), source: `${A1}, ${b}, ${sci(tBreak)}–10 s${MEM}` })
	];
});

const longRetinalRows: LimitRow[] = [
	row({ id: 'photochem-10-100', targets: EYE, wavelength_nm: [400, 600], duration_s: [10, 100], mechanism: 'photochemical', kind: 'radiantExposure', uses: ['CB', 'gamma_mrad'],
		expression: 'H = 100·C3 J/m² (γ_ph = 11 mrad)', value: ({ f }) => 100 * f.CB, source: `${A1}, 400–600 nm photochemical, 10–100 s${MEM}` }),
	row({ id: 'photochem-100-3e4', targets: EYE, wavelength_nm: [400, 600], duration_s: [100, 3e4], mechanism: 'photochemical', kind: 'irradiance', uses: ['CB', 'gamma_mrad'],
		expression: 'E = 1·C3 W/m² (γ_ph = 1.1·t^0.5 mrad, 110 mrad from 10⁴ s)', value: ({ f }) => f.CB, source: `${A1}, 400–600 nm photochemical, 100–3·10⁴ s${MEM}` }),
	row({ id: 'thermal-long-400-point', targets: EYE, wavelength_nm: [400, 700], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'irradiance',
		condition: 'α ≤ 1.5 mrad', when: pointSource, expression: 'E = 10 W/m²', value: () => 10, source: `${A1}, 400–700 nm thermal, 10–3·10⁴ s, α ≤ α_min${MEM}` }),
	row({ id: 'thermal-long-400-ext', targets: EYE, wavelength_nm: [400, 700], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'radiantExposure', uses: ['CE', 'T2_s'],
		condition: 'α > 1.5 mrad, t ≤ T2', when: extendedUpToT2, expression: 'H = 18·C6·t^0.75 J/m²', value: ({ t_s, f }) => 18 * f.CE * t_s ** 0.75,
		source: `${A1}, 400–700 nm thermal, 10 s–T2, α > α_min${MEM}` }),
	row({ id: 'thermal-long-400-ext-T2', targets: EYE, wavelength_nm: [400, 700], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'irradiance', uses: ['CE', 'T2_s'],
		condition: 'α > 1.5 mrad, t > T2', when: extendedAfterT2, expression: 'E = 18·C6·T2^−0.25 W/m²', value: ({ f }) => 18 * f.CE * f.T2_s ** -0.25,
		source: `${A1}, 400–700 nm thermal, T2–3·10⁴ s, α > α_min${MEM}` }),
	row({ id: 'thermal-long-700-point', targets: EYE, wavelength_nm: [700, 1400], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'irradiance', uses: ['CA', 'CC'],
		condition: 'α ≤ 1.5 mrad', when: pointSource, expression: 'E = 10·C4·C7 W/m²', value: ({ f }) => 10 * f.CA * f.CC, source: `${A1}, 700–1400 nm, 10–3·10⁴ s, α ≤ α_min${MEM}` }),
	row({ id: 'thermal-long-700-ext', targets: EYE, wavelength_nm: [700, 1400], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'radiantExposure', uses: ['CA', 'CC', 'CE', 'T2_s'],
		condition: 'α > 1.5 mrad, t ≤ T2', when: extendedUpToT2, expression: 'H = 18·C4·C6·C7·t^0.75 J/m²', value: ({ t_s, f }) => 18 * f.CA * f.CC * f.CE * t_s ** 0.75,
		source: `${A1}, 700–1400 nm, 10 s–T2, α > α_min${MEM}` }),
	row({ id: 'thermal-long-700-ext-T2', targets: EYE, wavelength_nm: [700, 1400], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'irradiance', uses: ['CA', 'CC', 'CE', 'T2_s'],
		condition: 'α > 1.5 mrad, t > T2', when: extendedAfterT2, expression: 'E = 18·C4·C6·C7·T2^−0.25 W/m²', value: ({ f }) => 18 * f.CA * f.CC * f.CE * f.T2_s ** -0.25,
		source: `${A1}, 700–1400 nm, T2–3·10⁴ s, α > α_min${MEM}` })
];

const irRows = farIrRows(farIrBands, (b, part, label) => {
	const cols = { ultrashort: '10⁻¹³–10⁻⁹ s', constant: `10⁻⁹–${sci(b.tEnd_s)} s`, t025: `${sci(b.tEnd_s)}–10 s`, long: '10–3·10⁴ s' }[part];
	const table = part === 'ultrashort' || part === 'long' ? `${A1} and ${SK}` : `${A1}; skin as eye`;
	return { provenance: 'recalled', source: `${table}, ${label}, ${cols}${MEM}` };
});

const skinRows: LimitRow[] = [
	row({ id: 'skin-400-ultrashort', targets: SKIN, wavelength_nm: [400, 1400], duration_s: [1e-13, 1e-9], mechanism: 'thermal', kind: 'irradiance',
		expression: 'E = 2·10¹¹ W/m²', value: () => 2e11, source: `${SK}, 400–1400 nm, 10⁻¹³–10⁻⁹ s${MEM}` }),
	row({ id: 'skin-400-ns', targets: SKIN, wavelength_nm: [400, 1400], duration_s: [1e-9, 1e-7], mechanism: 'thermal', kind: 'radiantExposure', uses: ['CA'],
		expression: 'H = 200·C4 J/m²', value: ({ f }) => 200 * f.CA, source: `${SK}, 400–1400 nm, 10⁻⁹–10⁻⁷ s${MEM}` }),
	row({ id: 'skin-400-t025', targets: SKIN, wavelength_nm: [400, 1400], duration_s: [1e-7, 10], mechanism: 'thermal', kind: 'radiantExposure', uses: ['CA'],
		expression: 'H = 1.1·10⁴·C4·t^0.25 J/m²', value: ({ t_s, f }) => 1.1e4 * f.CA * t_s ** 0.25, source: `${SK}, 400–1400 nm, 10⁻⁷–10 s${MEM}` }),
	row({ id: 'skin-400-long', targets: SKIN, wavelength_nm: [400, 1400], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'irradiance', uses: ['CA'],
		expression: 'E = 2·10³·C4 W/m²', value: ({ f }) => 2e3 * f.CA, source: `${SK}, 400–1400 nm, 10–3·10⁴ s${MEM}` })
];

/** Limiting apertures (Annex A aperture table), numbers only; the rule is shared. From memory. */
export const iecApertureRule: ApertureRule = { skin_m: 3.5e-3, retina_m: 7e-3, farIr_m: 11e-3, smallUntil_s: 0.35, smallInclusive: false, long_m: 3.5e-3 };

/** T_i, the time within which pulses count as one for C5 (retinal thermal only), s. */
function iecGroupingTime_s(lambda_nm: number): number {
	if (lambda_nm >= 400 && lambda_nm < 1050) return 5e-6;
	if (lambda_nm >= 1050 && lambda_nm < 1400) return 13e-6;
	return NaN;
}

export const iec608251_2014: Edition = {
	id: 'iec-60825-1-2014',
	title: 'IEC 60825-1:2014, Annex A (ICNIRP 2013 values)',
	short: 'IEC 60825-1:2014',
	rows: [...uvRows, ...retinalRows, ...longRetinalRows, ...irRows, ...skinRows],
	factors: iecFactors,
	aperture_m: (target, lambda_nm, t_s) => limitingAperture_m(iecApertureRule, target, lambda_nm, t_s),
	apertureSource: `IEC 60825-1:2014 Annex A, limiting apertures: eye 7 mm (400–1400 nm); 1 mm for t < 0.35 s, 1.5·t^0.375 mm for 0.35–10 s, 3.5 mm from 10 s (180–400 nm and 1400 nm–0.1 mm); 11 mm (0.1–1 mm); skin 3.5 mm${MEM}`,
	apertureSourceAt: () => ({ provenance: 'recalled', source: `IEC 60825-1:2014 Annex A, limiting apertures${MEM}` }),
	groupingTime_s: iecGroupingTime_s,
	groupingNote: () => null,
	groupingSource: `IEC 60825-1:2014, T_i: 5 µs (400–1050 nm), 13 µs (1050–1400 nm)${MEM}`,
	cpApplies: (target, lambda_nm, mechanism) => target === 'eye' && mechanism === 'thermal' && lambda_nm >= 400 && lambda_nm < 1400,
	cpSource: `IEC 60825-1:2014 / ICNIRP 2013: C5 = N^−0.25 applies to retinal thermal limits only (400–1400 nm); pulses within T_i count as one${MEM}`,
	notes: [
		'IEC 60825-1:2014 Annex A values are recalled from memory (ICNIRP 2013 values), not read from the standard. Verify against the standard.',
		'C7 (C_C) is kept at 8 for 1200–1400 nm; the 2014 edition relaxes it above 1250 nm together with a corneal limit not recalled here. This is stricter.',
		'For α > α_max the edition compares only the irradiance within α_max; here C6 = α_max/α_min is applied to the whole irradiance given, which is stricter.',
		"The edition's further qualifications of C5 (caps on N, small sources) are not modelled: C5 = N^−0.25 as given, which is stricter.",
		'Skin, 400–1400 nm, below 1 ns: taken as 2·10¹¹ W/m² without C_A, the stricter reading of a value recalled from memory.'
	],
	provenanceLabel: recalledIecLabel
};
