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
 * Provenance, beside every row: Tables 2.2, 2.4, 2.5 and 2.6 and the notes to Table 2.3 were read from
 * public reproductions of the Annex (named in `FR`, `PT121`, `PT75`, `NO`, `EN` below). Table 2.3 itself
 * was not reachable as text (the French reproduction gives it only as an image; the Portuguese journal's
 * text carries only its notes; the other reproductions searched, listed in `T23_SEARCHED`, did not come
 * through as far as the table): its rows are marked "(from memory)" with that reason, each with the
 * checks the read text allows (the join with Table 2.2 at 10 s; note B's radiance form of the
 * photochemical limit and its hand-over at T_1), and where a recalled row has a stricter candidate the
 * stricter is used.
 *
 * Wavelengths in nm and angles in mrad as the Directive prints them; values in SI (J/m², W/m²).
 */
import { sci } from './sci';
import { BOTH, EYE, SKIN, extendedAfterT2, extendedUpToT2, farIrBands, farIrRows, limitingAperture_m, pointSource, row, type ApertureRule, type IrSource } from './shared';
import type { Edition, FactorValues, LimitRow, Provenance, Target } from './types';

/** Reproductions of Annex II that were read. */
const FR = 'read in the French labour code reproduction (Code du travail, partie réglementaire, 4e partie, livre IV, titre V, chapitre II, annexe II)';
const PT121 = 'and in the Portuguese parliamentary journal (DAR II-A n.º 121, 17 July 2010, p. 50, Quadro 2.2)';
const PT75 = 'read in the notes to Quadro 2.3 of the Portuguese parliamentary journal (DAR II-A n.º 75, 6 May 2010, p. 43, notes B–D)';
const NO = 'and in the Norwegian Labour Inspection Authority, Regulations concerning Action and Limit Values, Annex 4, Table 4.5';
const EN = 'and in the consolidated English text CELEX 02006L0025, Table 2.6';
const T22 = 'Directive 2006/25/EC Annex II Table 2.2';
const T23 = 'Directive 2006/25/EC Annex II Table 2.3';
const T24 = 'Directive 2006/25/EC Annex II Table 2.4';
const READ: Provenance = 'published-text';
const RECALLED: Provenance = 'recalled';
/** Reproductions of Annex II searched for the text of Table 2.3 (and the damaged Table 2.2 cell), none of which gave it. */
export const T23_SEARCHED =
	'searched: French labour code annexe II (Table 2.3 as an image; Table 2.2 cell damaged), Portuguese DAR II-A n.º 75 p. 43 and n.º 121 p. 50 ' +
	'(only the notes to Quadro 2.3 and the head of Quadro 2.2 come through as text), Norwegian Regulations concerning Action and Limit Values Annex 4 ' +
	'(only Table 4.5 reached), CELEX 02006L0025 and legislation.gov.uk Annex II (only the opening and Tables 2.5–2.6 reached), Spanish Real Decreto 486/2010, ' +
	'Italian D.Lgs. 81/2008 Allegato XXXVII, Romanian HG 510/2010, Czech NV 291/2015 Sb. příloha č. 3 (the page reached masks its text), the Norwegian-language vedlegg 4 and the Belgian arrêté royal of 22 April 2010 (openings only), the lexaris.io and fantasticsearch.net copies of CELEX 02006L0025 (openings and Tables 2.5–2.6 only), the app.lexploria.com copy of the Official Journal text, the vdocuments.site copy of the legislation.gov.uk text, the French text on europadatenbank.iaaeu.de and the English translation of annexe II on french-business-law.com (openings only), Swedish, Danish and Polish texts, German TROS Laserstrahlung Teil 2 (opening pages only), the Commission non-binding guide (EN, PT, IT: opening pages only)';
/** Why a Table 2.3 row is recalled, and the check the read text allows for it. */
const t23Mem = (check: string) =>
	` (from memory: Table 2.3 was not reachable as text — ${T23_SEARCHED}. ${check} Where thermal and photochemical forms both apply, the more restrictive is used, per note a to Table 2.2 and note B to Quadro 2.3, DAR II-A n.º 75 p. 43, both read)`;
/** Check of a recalled ≥ 10 s row against the Table 2.2 row it continues (read) at t = 10 s. */
const joins = (t22: string, at10: string) => `Check: it joins ${T22} ${t22} (read) at 10 s — ${at10}.`;
/** Note B to Quadro 2.3 (read in PT75): the photochemical limit as integrated radiance over γ. */
const NOTE_B_PHOTO =
	'Check: note B to Quadro 2.3 (read, DAR II-A n.º 75 p. 43) gives the same limit as G = 10⁶ C_B J m⁻² sr⁻¹ for 10 s < t ≤ 10⁴ s and L = 100 C_B W m⁻² sr⁻¹ beyond, averaged over γ; over the γ cone (Ω = π·γ²/4) that is 0.95 of the recalled value (the standard rounds the solid angle), and note B hands the point-source limit from thermal to photochemical at T_1, where 10 W/m² × T_1 = 100 C_B J/m² (450–500 nm).';

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

/** UV photochemical doses printed per wavelength, 303–314 nm (Table 2.2, read), J/m². */
export const euUvDoses: ReadonlyArray<readonly [number, number]> = [
	[303, 40], [304, 60], [305, 100], [306, 160], [307, 250], [308, 400],
	[309, 630], [310, 1.0e3], [311, 1.6e3], [312, 2.5e3], [313, 4.0e3], [314, 6.3e3]
];

const uvRows: LimitRow[] = [
	row({ id: 'uv-ultrashort', targets: BOTH, wavelength_nm: [180, 400], duration_s: [1e-13, 1e-9], mechanism: 'thermal', kind: 'irradiance',
		expression: 'E = 3·10¹⁰ W/m²', value: () => 3e10, provenance: READ,
		source: `${T22}, rows 180–400 nm, columns 10⁻¹³–10⁻¹¹ and 10⁻¹¹–10⁻⁹ s: "E = 3·10¹⁰ W m⁻²"; skin: ${T24}, row 180–400 nm, column < 10⁻⁹ s, the same — ${FR} ${PT121}` }),
	row({ id: 'uv-180-302-short', targets: BOTH, wavelength_nm: [180, 302.5], duration_s: [1e-9, 10], mechanism: 'photochemical', kind: 'radiantExposure',
		expression: 'H = 30 J/m²', value: () => 30, provenance: READ,
		source: `${T22}, rows 180–280 and 280–302 nm, columns 10⁻⁹–10 s: "H = 30 J m⁻²"; skin: ${T24} row 180–400 nm "see eye limits" — ${FR} ${PT121}` }),
	row({ id: 'uv-180-302-long', targets: BOTH, wavelength_nm: [180, 302.5], duration_s: [10, 3e4], mechanism: 'photochemical', kind: 'radiantExposure',
		expression: 'H = 30 J/m²', value: () => 30, provenance: RECALLED,
		source: `${T23}, rows 180–280 and 280–302 nm, columns 10–3·10⁴ s: H = 30 J/m², the dose of ${T22} for the same rows (read) kept for longer exposures; skin as eye (${T24}, read)${t23Mem(joins('rows 180–280 and 280–302 nm', 'the same 30 J/m²'))}` }),
	...euUvDoses.map(([nm, H]) =>
		row({ id: `uv-${nm}`, targets: BOTH, wavelength_nm: [nm - 0.5, nm === 314 ? 315 : nm + 0.5], duration_s: [1e-9, 10], mechanism: 'photochemical', kind: 'radiantExposure',
			expression: `H = ${sci(H)} J/m²`, value: () => H, provenance: READ,
			source: `${T22}, row ${nm} nm (applied to the 1-nm band centred on it), columns 10⁻⁹–10 s: "H = ${sci(H)} J m⁻²"; skin as eye (${T24}, "see eye limits") — ${FR} ${PT121}` })
	),
	...euUvDoses.map(([nm, H]) =>
		row({ id: `uv-${nm}-long`, targets: BOTH, wavelength_nm: [nm - 0.5, nm === 314 ? 315 : nm + 0.5], duration_s: [10, 3e4], mechanism: 'photochemical', kind: 'radiantExposure',
			expression: `H = ${sci(H)} J/m²`, value: () => H, provenance: RECALLED,
			source: `${T23}, row ${nm} nm, columns 10–3·10⁴ s: H = ${sci(H)} J/m², the dose of ${T22} row ${nm} nm (read) kept for longer exposures${t23Mem(joins(`row ${nm} nm`, `the same ${sci(H)} J/m²`))}` })
	),
	row({ id: 'uv-302-400-thermal', targets: BOTH, wavelength_nm: [302.5, 400], duration_s: [1e-9, 10], mechanism: 'thermal', kind: 'radiantExposure', uses: ['C1'],
		expression: 'H = 5.6·10³·t^0.25 J/m²', value: ({ t_s }) => 5.6e3 * t_s ** 0.25, provenance: READ,
		source: `${T22}, rows 303–314 nm ("if t < … then H = 5.6·10³ t^0.25 J m⁻²", see note d) and row 315–400 nm ("H = 5.6·10³ t^0.25 J m⁻²"), columns 10⁻⁹–10 s — ${FR} ${PT121}` }),
	row({ id: 'uva-long', targets: BOTH, wavelength_nm: [315, 400], duration_s: [10, 3e4], mechanism: 'photochemical', kind: 'radiantExposure',
		expression: 'H = 10⁴ J/m²', value: () => 1e4, provenance: RECALLED,
		source: `${T23}, row 315–400 nm, columns 10–3·10⁴ s: H = 10⁴ J/m²; skin as eye (${T24}, read)${t23Mem(joins('row 315–400 nm', '5.6·10³·10^0.25 = 9.96·10³ J/m², within 0.5 %') + ' The other candidate remembered, E = 10 W/m² from 10³ s (the later ICNIRP and IEC form), is more lenient and not used.')}` })
];

/** Retinal thermal rows for t < 10 s (Table 2.2, read): [band, 10⁻¹³–10⁻¹¹ s constant, 10⁻¹¹–10⁻⁹ s t^0.75 coefficient, ns constant, t^0.75 coefficient, break time, factor text]. */
const retinalShort: Array<{ band: readonly [number, number]; ps: number; k1: number; ns: number; k2: number; tBreak: number; fx: (f: FactorValues) => number; fxText: string; uses: LimitRow['uses'] }> = [
	{ band: [400, 700], ps: 1.5e-4, k1: 2.7e4, ns: 5e-3, k2: 18, tBreak: 1.8e-5, fx: (f) => f.CE, fxText: 'C_E', uses: ['CE'] },
	{ band: [700, 1050], ps: 1.5e-4, k1: 2.7e4, ns: 5e-3, k2: 18, tBreak: 1.8e-5, fx: (f) => f.CA * f.CE, fxText: 'C_A·C_E', uses: ['CA', 'CE'] },
	{ band: [1050, 1400], ps: 1.5e-3, k1: 2.7e5, ns: 5e-2, k2: 90, tBreak: 5e-5, fx: (f) => f.CC * f.CE, fxText: 'C_C·C_E', uses: ['CC', 'CE'] }
];

const retinalRows: LimitRow[] = retinalShort.flatMap(({ band, ps, k1, ns, k2, tBreak, fx, fxText, uses }) => {
	const b = `${band[0]}–${band[1]} nm`;
	const read = (cols: string, printed: string) => ({ provenance: READ, source: `${T22}, row ${b}, ${cols}: "${printed}" — ${FR} ${PT121}` });
	return [
		row({ id: `retina-${band[0]}-ps`, targets: EYE, wavelength_nm: band, duration_s: [1e-13, 1e-11], mechanism: 'thermal', kind: 'radiantExposure', uses,
			expression: `H = ${sci(ps)}·${fxText} J/m²`, value: ({ f }) => ps * fx(f), ...read('column 10⁻¹³–10⁻¹¹ s', `H = ${sci(ps)} ${fxText} J m⁻²`) }),
		row({ id: `retina-${band[0]}-sub-ns`, targets: EYE, wavelength_nm: band, duration_s: [1e-11, 1e-9], mechanism: 'thermal', kind: 'radiantExposure', uses,
			expression: `H = ${sci(k1)}·t^0.75·${fxText} J/m²`, value: ({ t_s, f }) => k1 * t_s ** 0.75 * fx(f), ...read('column 10⁻¹¹–10⁻⁹ s', `H = ${sci(k1)} t^0.75 ${fxText} J m⁻²`) }),
		row({ id: `retina-${band[0]}-ns`, targets: EYE, wavelength_nm: band, duration_s: [1e-9, tBreak], mechanism: 'thermal', kind: 'radiantExposure', uses,
			expression: `H = ${sci(ns)}·${fxText} J/m²`, value: ({ f }) => ns * fx(f), ...read(`columns 10⁻⁹–${sci(tBreak)} s`, `H = ${sci(ns)} ${fxText} J m⁻²`) }),
		row({ id: `retina-${band[0]}-long-pulse`, targets: EYE, wavelength_nm: band, duration_s: [tBreak, 10], mechanism: 'thermal', kind: 'radiantExposure', uses,
			expression: `H = ${k2}·t^0.75·${fxText} J/m²`, value: ({ t_s, f }) => k2 * t_s ** 0.75 * fx(f), ...read(`columns ${sci(tBreak)}–10 s`, `H = ${k2} t^0.75 ${fxText} J m⁻²`) })
	];
});

const longRetinalRows: LimitRow[] = [
	row({ id: 'photochem-10-100', targets: EYE, wavelength_nm: [400, 600], duration_s: [10, 100], mechanism: 'photochemical', kind: 'radiantExposure', uses: ['CB', 'gamma_mrad'],
		expression: 'H = 100·C_B J/m² (γ = 11 mrad)', value: ({ f }) => 100 * f.CB, source: `${T23}, row 400–600 nm (photochemical), column 10–10² s${t23Mem(NOTE_B_PHOTO)}`, provenance: RECALLED }),
	row({ id: 'photochem-100-1e4', targets: EYE, wavelength_nm: [400, 600], duration_s: [100, 1e4], mechanism: 'photochemical', kind: 'irradiance', uses: ['CB', 'gamma_mrad'],
		expression: 'E = 1·C_B W/m² (γ = 1.1·t^0.5 mrad)', value: ({ f }) => f.CB, source: `${T23}, row 400–600 nm (photochemical), column 10²–10⁴ s${t23Mem(NOTE_B_PHOTO)}`, provenance: RECALLED }),
	row({ id: 'photochem-1e4-3e4', targets: EYE, wavelength_nm: [400, 600], duration_s: [1e4, 3e4], mechanism: 'photochemical', kind: 'irradiance', uses: ['CB', 'gamma_mrad'],
		expression: 'E = 1·C_B W/m² (γ = 110 mrad)', value: ({ f }) => f.CB, source: `${T23}, row 400–600 nm (photochemical), column 10⁴–3·10⁴ s${t23Mem(NOTE_B_PHOTO)}`, provenance: RECALLED }),
	row({ id: 'thermal-long-400-point', targets: EYE, wavelength_nm: [400, 700], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'irradiance',
		condition: 'α < 1.5 mrad', when: pointSource, expression: 'E = 10 W/m²', value: () => 10, source: `${T23}, row 400–700 nm (thermal), α < 1.5 mrad${t23Mem(joins('row 400–700 nm (18·t^0.75·C_E)', '18·10^0.75 = 101.2 J/m², i.e. 10.1 W/m² over 10 s, within 1.2 %') + ' Note B to Quadro 2.3 (read) hands this limit to the photochemical one at T_1: 10 W/m² × T_1 = 100 C_B J/m² for 450–500 nm.')}`, provenance: RECALLED }),
	row({ id: 'thermal-long-400-ext', targets: EYE, wavelength_nm: [400, 700], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'radiantExposure', uses: ['CE', 'T2_s'],
		condition: 'α > 1.5 mrad, t ≤ T_2', when: extendedUpToT2, expression: 'H = 18·C_E·t^0.75 J/m²', value: ({ t_s, f }) => 18 * f.CE * t_s ** 0.75,
		source: `${T23}, row 400–700 nm (thermal), α > 1.5 mrad and t ≤ T_2${t23Mem(joins('row 400–700 nm', 'the same form 18·t^0.75·C_E continued to T_2'))}`, provenance: RECALLED }),
	row({ id: 'thermal-long-400-ext-T2', targets: EYE, wavelength_nm: [400, 700], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'irradiance', uses: ['CE', 'T2_s'],
		condition: 'α > 1.5 mrad, t > T_2', when: extendedAfterT2, expression: 'E = 18·C_E·T_2^−0.25 W/m²', value: ({ f }) => 18 * f.CE * f.T2_s ** -0.25,
		source: `${T23}, row 400–700 nm (thermal), α > 1.5 mrad and t > T_2${t23Mem('Check: 18·C_E·T_2^−0.25 W/m² is the average of 18·C_E·T_2^0.75 J/m² over T_2, so it joins the t ≤ T_2 form at T_2.')}`, provenance: RECALLED }),
	row({ id: 'thermal-long-700-point', targets: EYE, wavelength_nm: [700, 1400], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'irradiance', uses: ['CA', 'CC'],
		condition: 'α < 1.5 mrad', when: pointSource, expression: 'E = 10·C_A·C_C W/m²', value: ({ f }) => 10 * f.CA * f.CC, source: `${T23}, row 700–1400 nm, α < 1.5 mrad${t23Mem(joins('rows 700–1050 nm (18·t^0.75·C_A·C_E) and 1050–1400 nm (90·t^0.75·C_C·C_E; C_A = 5 there, Table 2.5 read)', '10.1·C_A and 50.6·C_C W/m² over 10 s, within 1.2 %'))}`, provenance: RECALLED }),
	row({ id: 'thermal-long-700-ext', targets: EYE, wavelength_nm: [700, 1400], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'radiantExposure', uses: ['CA', 'CC', 'CE', 'T2_s'],
		condition: 'α > 1.5 mrad, t ≤ T_2', when: extendedUpToT2, expression: 'H = 18·C_A·C_C·C_E·t^0.75 J/m²', value: ({ t_s, f }) => 18 * f.CA * f.CC * f.CE * t_s ** 0.75,
		source: `${T23}, row 700–1400 nm, α > 1.5 mrad and t ≤ T_2${t23Mem(joins('rows 700–1050 and 1050–1400 nm', 'the same forms (18·C_A = 90 from 1050 nm) continued to T_2'))}`, provenance: RECALLED }),
	row({ id: 'thermal-long-700-ext-T2', targets: EYE, wavelength_nm: [700, 1400], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'irradiance', uses: ['CA', 'CC', 'CE', 'T2_s'],
		condition: 'α > 1.5 mrad, t > T_2', when: extendedAfterT2, expression: 'E = 18·C_A·C_C·C_E·T_2^−0.25 W/m², not to exceed 1000 W/m²',
		value: ({ f }) => Math.min(18 * f.CA * f.CC * f.CE * f.T2_s ** -0.25, 1000),
		source: `${T23}, row 700–1400 nm, α > 1.5 mrad and t > T_2${t23Mem('Two printings are remembered for this cell, one with "(not to exceed 1000 W m⁻²)" after the expression and one without; the stricter, with the cap, is used (it limits large sources from about 1150 nm, e.g. 1300 nm, α = 100 mrad: 15.2 kW/m² uncapped). Check: 18·C_A·C_C·C_E·T_2^−0.25 W/m² is the average of 18·C_A·C_C·C_E·T_2^0.75 J/m² over T_2, so where the cap does not act it joins the t ≤ T_2 form at T_2.')}`, provenance: RECALLED })
];


/** Far-infrared rows: Table 2.2 (< 10 s) and Table 2.4 (skin below 1 ns; "see eye limits" after), read; ≥ 10 s from Table 2.3, recalled. */
const irSource: IrSource = (b, part, label) => {
	const H = sci(b.H_J_m2);
	const tEnd = sci(b.tEnd_s);
	switch (part) {
		case 'ultrashort':
			return { provenance: READ, source: `${T22}, row ${label}, columns 10⁻¹³–10⁻⁹ s: "E = ${sci(b.E0_W_m2)} W m⁻²" (see note c); skin: ${T24}, row ${label}, column < 10⁻⁹ s, the same — ${FR} ${PT121}` };
		case 'constant':
			return { provenance: READ, source: `${T22}, row ${label}, columns 10⁻⁹–${tEnd} s: "H = ${H} J m⁻²"; skin: ${T24} "see eye limits" — ${FR} ${PT121}` };
		case 't025':
			return b.band[0] === 2600
				? { provenance: RECALLED, source: `${T22}, row ${label}, columns ${tEnd}–10 s: H = 5.6·10³·t^0.25 J/m² (from memory: the French reproduction prints this cell damaged, "H = 5,6·10³·t J m", without the exponent, and no other reachable text gives it — ${T23_SEARCHED}. Read literally the limit would fall 10⁵-fold, from 100 J/m² to 5.6·10⁻⁴ J/m², as the duration passes 10⁻⁷ s (no other row of Tables 2.2 and 2.4 falls with duration) and reach 5.6·10⁴ J/m² at 10 s, 5.6 times the 1000 W/m² that follows: it is not a candidate. The form printed in the same column for 1400–1500 and 1800–2600 nm, which joins the 100 J/m² cell at 10⁻⁷ s (5.6·10³·(10⁻⁷)^0.25 = 99.6 J/m²) and 1000 W/m² at 10 s (996 W/m²), is used); skin: ${T24} "see eye limits"` }
				: { provenance: READ, source: `${T22}, row ${label}, columns ${tEnd}–10 s: "H = 5.6·10³·t^0.25 J m⁻²"; skin: ${T24} "see eye limits" — ${FR} ${PT121}` };
		case 'long':
			return { provenance: RECALLED, source: `${T23}, row ${label}, columns 10–3·10⁴ s: E = 1000 W/m²; skin: ${T24} "see eye limits" (read)${t23Mem(joins(`row ${label}`, b.tEnd_s < 10 ? '5.6·10³·10^0.25 = 9.96·10³ J/m², i.e. 996 W/m² over 10 s, within 0.5 %' : '10⁴ J/m², i.e. 1000 W/m² over 10 s'))}` };
	}
};

const irRows = farIrRows(farIrBands, irSource);

const skinRows: LimitRow[] = [
	row({ id: 'skin-400-ultrashort', targets: SKIN, wavelength_nm: [400, 700], duration_s: [1e-13, 1e-9], mechanism: 'thermal', kind: 'irradiance',
		expression: 'E = 2·10¹¹ W/m²', value: () => 2e11, provenance: READ, source: `${T24}, row 400–700 nm, column < 10⁻⁹ s: "E = 2·10¹¹ W m⁻²" — ${FR}` }),
	row({ id: 'skin-700-ultrashort', targets: SKIN, wavelength_nm: [700, 1400], duration_s: [1e-13, 1e-9], mechanism: 'thermal', kind: 'irradiance', uses: ['CA'],
		expression: 'E = 2·10¹¹·C_A W/m²', value: ({ f }) => 2e11 * f.CA, provenance: READ, source: `${T24}, row 700–1400 nm, column < 10⁻⁹ s: "E = 2·10¹¹ C_A W m⁻²" — ${FR}` }),
	row({ id: 'skin-400-ns', targets: SKIN, wavelength_nm: [400, 1400], duration_s: [1e-9, 1e-7], mechanism: 'thermal', kind: 'radiantExposure', uses: ['CA'],
		expression: 'H = 200·C_A J/m²', value: ({ f }) => 200 * f.CA, provenance: READ, source: `${T24}, rows 400–700 and 700–1400 nm (one cell), column 10⁻⁹–10⁻⁷ s: "H = 200 C_A J m⁻²" — ${FR}` }),
	row({ id: 'skin-400-t025', targets: SKIN, wavelength_nm: [400, 1400], duration_s: [1e-7, 10], mechanism: 'thermal', kind: 'radiantExposure', uses: ['CA'],
		expression: 'H = 1.1·10⁴·C_A·t^0.25 J/m²', value: ({ t_s, f }) => 1.1e4 * f.CA * t_s ** 0.25, provenance: READ,
		source: `${T24}, rows 400–1400 nm (one cell), columns 10⁻⁷–10 s: "H = 1.1·10⁴ C_A t^0.25 J m⁻²" — ${FR} (the reproduction's merged cells split the 10⁻³–10 s column between this form and the next; this form to 10 s is the one that joins both neighbours, 200·C_A at 10⁻⁷ s and 2·10³·C_A·t at 10 s)` }),
	row({ id: 'skin-400-long', targets: SKIN, wavelength_nm: [400, 1400], duration_s: [10, 3e4], mechanism: 'thermal', kind: 'irradiance', uses: ['CA'],
		expression: 'E = 2·10³·C_A W/m²', value: ({ f }) => 2e3 * f.CA, provenance: READ, source: `${T24}, rows 400–1400 nm (one cell), columns 10¹–10³ and 10³–3·10⁴ s: "E = 2·10³ C_A W m⁻²" — ${FR}` })
];

/** Limiting apertures: Table 2.2 aperture column and note b, Table 2.4 aperture column, notes to Table 2.3 — numbers only; the rule is shared. */
export const euApertureRule: ApertureRule = { skin_m: 3.5e-3, retina_m: 7e-3, farIr_m: 11e-3, smallUntil_s: 0.3, smallInclusive: true, long_m: 3.5e-3 };

function euApertureSourceAt(target: Target, lambda_nm: number, t_s: number): { source: string; provenance: Provenance } {
	if (target === 'skin') return { provenance: READ, source: `${T24}, aperture column: "3.5 mm" for every row — ${FR}` };
	if (lambda_nm >= 1e5)
		return t_s < 10
			? { provenance: READ, source: `${T22} note b: "10⁵ ≤ λ < 10⁶ nm: limiting aperture diameter = 11 mm" — ${FR}` }
			: { provenance: READ, source: `${T23}, note C: 11 mm for 10⁵–10⁶ nm — ${PT75}` };
	if (lambda_nm >= 400 && lambda_nm < 1400)
		return t_s < 10
			? { provenance: READ, source: `${T22}, aperture column, rows 400–1400 nm: "7 mm" — ${FR} ${PT121}` }
			: { provenance: RECALLED, source: `${T23}, aperture 7 mm for 400–1400 nm (from memory: Table 2.3 not reachable as text — ${T23_SEARCHED}; 7 mm is the value of ${T22} for the same rows, read, and notes C–D to Quadro 2.3, read, name no other aperture for them)` };
	if (t_s < 10)
		return lambda_nm < 400
			? { provenance: READ, source: `${T22}, aperture column, rows 180–400 nm: "1 mm for t < 0.3 s; 1.5·t^0.375 for 0.3 < t < 10 s", with t = 0.3 s itself given 1 mm as in note b — ${FR} ${PT121}` }
			: { provenance: READ, source: `${T22} note b: "1400 ≤ λ < 10⁵ nm: limiting aperture diameter = 1 mm for t ≤ 0.3 s and 1.5·t^0.375 mm for 0.3 s < t < 10 s" — ${FR}` };
	return lambda_nm < 400
		? { provenance: RECALLED, source: `${T23}, aperture 3.5 mm for 180–400 nm from 10 s (from memory: Table 2.3 not reachable as text — ${T23_SEARCHED}; note C to Quadro 2.3, read, gives 3.5 mm only for 1400–10⁵ nm; 3.5 mm is the stricter candidate, smaller than the 1.5·t^0.375 ≥ 3.56 mm the shorter-exposure form would give)` }
		: { provenance: READ, source: `${T23}, note C: "1400–10⁵ nm: aperture diameter = 3.5 mm" — ${PT75}` };
}

/** T_min of Table 2.6 (read for every band it lists), s. Below 315 nm it lists none: see `euGroupingNote`. */
function euGroupingTime_s(lambda_nm: number): number {
	const l = lambda_nm;
	if (l <= 400) return 1e-9;
	if (l <= 1050) return 18e-6;
	if (l <= 1400) return 50e-6;
	if (l <= 1500) return 1e-3;
	if (l <= 1800) return 10;
	if (l <= 2600) return 1e-3;
	return 1e-7;
}

const belowTminNote =
	'T_min below 315 nm: Table 2.6 lists T_min only from 315 nm, while note d of Table 2.2 (rows 303–314 nm) refers repeated pulses to T_min of Table 2.6 and rule 3 applies to every thermal limit. Stricter reading used: rule 3 (C_P) applies below 315 nm too, with T_min = 1 ns, the value the table gives for 315–400 nm.';

export const eu200625: Edition = {
	id: 'eu-2006-25',
	title: 'Directive 2006/25/EC, Annex II (ICNIRP 1996/2000 values)',
	short: 'EU 2006/25/EC',
	rows: [...uvRows, ...retinalRows, ...longRetinalRows, ...irRows, ...skinRows],
	factors: euFactors,
	aperture_m: (target, lambda_nm, t_s) => limitingAperture_m(euApertureRule, target, lambda_nm, t_s),
	apertureSource: `${T22} aperture column and note b, ${T24} aperture column (read, ${FR.replace(/^read in /, '')}); notes to ${T23} (${PT75.replace(/^read in /, '')}): eye 7 mm (400–1400 nm); 1 mm for t ≤ 0.3 s, 1.5·t^0.375 mm for 0.3–10 s, 3.5 mm from 10 s (180–400 nm and 1400 nm–0.1 mm; 180–400 nm from 10 s from memory); 11 mm (0.1–1 mm); skin 3.5 mm`,
	apertureSourceAt: euApertureSourceAt,
	groupingTime_s: euGroupingTime_s,
	groupingSource: `Directive 2006/25/EC Annex II Table 2.6, T_min for 315 nm–1 mm — ${FR} ${EN}`,
	groupingNote: (lambda_nm) => (lambda_nm <= 315 ? belowTminNote : null),
	cpApplies: (_target, _lambda_nm, mechanism) => mechanism === 'thermal',
	cpSource: `Directive 2006/25/EC Annex II Table 2.6, rule 3: C_P = N^−0.25 applies only to limits protecting against thermal injury; all pulses delivered within T_min count as a single pulse — ${FR} ${EN}`,
	notes: [
		'Annex II Tables 2.2, 2.4, 2.5 and 2.6 and the notes to Table 2.3 were read from published reproductions (French labour code; Portuguese parliamentary journal DAR II-A; Norwegian Regulations concerning Action and Limit Values, Annex 4). Table 2.3 (eye, ≥ 10 s) was not reachable as text in any reproduction searched: its rows are recalled and say so, each checked against the read Table 2.2 at 10 s and, for the photochemical rows, against note B.',
		'Rows printed for single wavelengths 303–314 nm are applied to the 1-nm band centred on each.',
		'α = 1.5 mrad exactly is treated as a point source.',
		'Where thermal and photochemical limits both apply, the more restrictive is used (note a to Tables 2.2 and 2.4).'
	],
	provenanceLabel: null
};
