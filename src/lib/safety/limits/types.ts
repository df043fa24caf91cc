/**
 * Shared shapes of the exposure-limit tables. Each standard edition lives in its own file
 * (eu-2006-25.ts, iec-60825-1-2014.ts) as a list of rows with the source beside every row, plus the
 * edition's correction factors, limiting apertures and pulse-grouping time.
 *
 * Units: SI at every boundary (m, s, rad, J/m², W/m²). Table rows are written the way the standards
 * print them, with the wavelength in nm and angles in mrad, and converted at the evaluator.
 */

export type StandardId = 'eu-2006-25' | 'iec-60825-1-2014';
export type Target = 'eye' | 'skin';
/** Biological mechanism a row protects against; where both apply both are evaluated. */
export type Mechanism = 'thermal' | 'photochemical';
/** How the table states the limit: as a radiant exposure H (J/m²) or an irradiance E (W/m²). */
export type UnitKind = 'radiantExposure' | 'irradiance';
/** Whether a limit was read from a reachable published text or recalled (not verified against the text). */
export type Provenance = 'published-text' | 'recalled';

/** The label every IEC 60825-1:2014 result carries (its tables were not reachable as text). */
export const recalledIecLabel = 'values recalled (ICNIRP 2013), not verified against the standard';

/** Correction factors and break times of an edition at one (λ, t, α). Angles in mrad as tabulated. */
export interface FactorValues {
	CA: number;
	CB: number;
	CC: number;
	CE: number;
	/** Break time T2 for extended sources, s. */
	T2_s: number;
	/** Photochemical break time T1 (EU: Table 2.5; IEC: the UV break 302.5–315 nm), s; NaN where undefined. */
	T1_s: number;
	/** Limiting cone angle γ for photochemical limits, mrad. */
	gamma_mrad: number;
	alphaMin_mrad: number;
	alphaMax_mrad: number;
	alpha_mrad: number;
	/** IEC C1 = 5.6·10³·t^0.25 (the corneal/skin thermal form), J/m². */
	C1: number;
	/** IEC C2 = 10^(0.2(λ−295)) (UV photochemical dose 302.5–315 nm), J/m². */
	C2: number;
}

export type FactorKey = keyof FactorValues;

/** Context a row's formula receives. */
export interface RowContext {
	lambda_nm: number;
	t_s: number;
	f: FactorValues;
}

export interface LimitRow {
	/** Stable id, unique within the edition (used by tests and reports). */
	id: string;
	targets: readonly Target[];
	/** [from, to) in nm; the top of the last band (10⁶ nm) is inclusive. */
	wavelength_nm: readonly [number, number];
	/** [from, to) in s; 3·10⁴ s is inclusive. */
	duration_s: readonly [number, number];
	mechanism: Mechanism;
	kind: UnitKind;
	/** The limit as printed, e.g. "H = 18·t^0.75·C_E J/m²". */
	expression: string;
	/** Extra condition as printed, e.g. "α < 1.5 mrad" (absent when none). */
	condition?: string;
	when?: (c: RowContext) => boolean;
	/** Value in SI of `kind` (J/m² or W/m²). */
	value: (c: RowContext) => number;
	/** Factors the expression uses, reported with the result. */
	uses: readonly FactorKey[];
	/** Where the row comes from: table, row, column and the text it was read from; "(from memory)" with the reason where recalled. */
	source: string;
	provenance: Provenance;
}

/** A factor as reported: its ICNIRP/Directive name, the IEC name, value and meaning. */
export interface FactorReport {
	name: string;
	iecName: string;
	value: number;
	unit: string;
	meaning: string;
}

export interface Edition {
	id: StandardId;
	/** Full title with edition. */
	title: string;
	/** Short label for tables. */
	short: string;
	rows: readonly LimitRow[];
	factors: (lambda_nm: number, t_s: number, alpha_mrad: number) => FactorValues;
	/** Limiting aperture diameter, m. */
	aperture_m: (target: Target, lambda_nm: number, t_s: number) => number;
	/** Where the aperture rule comes from (all cases, one text). */
	apertureSource: string;
	/** Where the aperture used at (target, λ, t) comes from, read or recalled. */
	apertureSourceAt: (target: Target, lambda_nm: number, t_s: number) => { source: string; provenance: Provenance };
	/** Pulse-grouping time (Directive T_min, IEC T_i), s; NaN where the edition lists none. */
	groupingTime_s: (lambda_nm: number) => number;
	groupingSource: string;
	/** Whether the repetitive-pulse factor C_P applies to a limit of this mechanism. */
	cpApplies: (target: Target, lambda_nm: number, mechanism: Mechanism) => boolean;
	cpSource: string;
	/** Notes that travel with results (values from memory, simplifications). */
	notes: readonly string[];
	/** A label every result of this edition carries (e.g. that its values are recalled); null when none. */
	provenanceLabel: string | null;
	/** Extra basis of the grouping time at this wavelength (where the text is ambiguous), else null. */
	groupingNote: (lambda_nm: number) => string | null;
}

export interface LimitInput {
	wavelength_m: number;
	duration_s: number;
	target?: Target;
	/** Apparent source angle α, rad (0 for a laser beam viewed directly: a point source). */
	alpha_rad?: number;
}

/** One evaluated row. */
export interface LimitCandidate {
	rowId: string;
	mechanism: Mechanism;
	kind: UnitKind;
	radiantExposure_J_m2: number;
	irradiance_W_m2: number;
	expression: string;
	condition?: string;
	source: string;
	provenance: Provenance;
}

export interface LimitResult {
	standardId: StandardId;
	standard: string;
	target: Target;
	wavelength_m: number;
	duration_s: number;
	alpha_rad: number;
	/** The stricter of the evaluated limits, as radiant exposure over the duration and as mean irradiance. */
	radiantExposure_J_m2: number;
	irradiance_W_m2: number;
	/** Unit kind in which the limiting row is tabulated. */
	kind: UnitKind;
	mechanism: Mechanism;
	limitingAperture_m: number;
	/** The row that limits. */
	row: LimitCandidate;
	/** Every row evaluated (thermal and photochemical where both apply). */
	candidates: LimitCandidate[];
	/** Factors the evaluated rows use. */
	factors: FactorReport[];
	/** Every factor and break time of the edition defined at this case (for display). */
	allFactors: FactorReport[];
	notes: readonly string[];
	/** Read from the published text, or recalled: of the limiting row (and of the edition's aperture). */
	provenance: Provenance;
	/** Table + row + the source text of the limiting row, and of the limiting aperture. */
	limitSource: string;
	/** One line saying where the figure comes from, shown wherever the figure is shown. */
	provenanceLine: string;
	caution: string;
}
