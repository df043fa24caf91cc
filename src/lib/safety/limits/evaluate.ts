/**
 * The one evaluator every edition shares: find the rows that cover (target, λ, t, α), evaluate each,
 * report the stricter and name it. Nothing is extrapolated: a value outside the edition's ranges is
 * refused with the reason.
 */
import { caution } from '../cautions';
import type { Edition, FactorKey, FactorReport, FactorValues, LimitCandidate, LimitInput, LimitResult, LimitRow, Provenance, Target } from './types';

export const wavelengthRange_nm = [180, 1e6] as const;
export const durationRange_s = [1e-13, 3e4] as const;

const factorInfo: Record<FactorKey, { name: string; iecName: string; unit: string; meaning: string }> = {
	CA: { name: 'C_A', iecName: 'C4', unit: '', meaning: 'near-infrared correction of the retinal thermal limit (700–1400 nm)' },
	CB: { name: 'C_B', iecName: 'C3', unit: '', meaning: 'blue-light correction of the retinal photochemical limit (400–700 nm)' },
	CC: { name: 'C_C', iecName: 'C7', unit: '', meaning: 'near-infrared correction for ocular absorption (1150–1400 nm)' },
	CE: { name: 'C_E', iecName: 'C6', unit: '', meaning: 'extended-source correction from the apparent source angle α' },
	T2_s: { name: 'T_2', iecName: 'T2', unit: 's', meaning: 'break time after which the extended-source thermal limit is an irradiance' },
	T1_s: { name: 'T_1', iecName: 'T1', unit: 's', meaning: 'break time between thermal and photochemical forms' },
	gamma_mrad: { name: 'γ', iecName: 'γ_ph', unit: 'mrad', meaning: 'limiting cone angle of the measurement field of view (photochemical limits)' },
	alphaMin_mrad: { name: 'α_min', iecName: 'α_min', unit: 'mrad', meaning: 'angle below which a source counts as a point source' },
	alphaMax_mrad: { name: 'α_max', iecName: 'α_max', unit: 'mrad', meaning: 'angle above which C_E stops growing linearly' },
	alpha_mrad: { name: 'α', iecName: 'α', unit: 'mrad', meaning: 'apparent source angle (input)' },
	C1: { name: 'C_1', iecName: 'C1', unit: 'J/m²', meaning: 'corneal and skin thermal form 5.6·10³·t^0.25' },
	C2: { name: 'C_2', iecName: 'C2', unit: 'J/m²', meaning: 'UV photochemical dose 10^(0.2(λ−295)) (302.5–315 nm)' }
};

const factorOrder = Object.keys(factorInfo) as FactorKey[];

function fmtNm(nm: number): string {
	return nm >= 1e5 ? `${+(nm / 1e6).toPrecision(4)} mm` : nm >= 1e4 ? `${+(nm / 1e3).toPrecision(4)} µm` : `${+nm.toPrecision(5)} nm`;
}

/** Refuse inputs outside the tabulated ranges; the message names the value and the rule. */
export function checkLimitInput(input: LimitInput): { lambda_nm: number; t_s: number; target: Target; alpha_mrad: number } {
	const { wavelength_m, duration_s } = input;
	const target = input.target ?? 'eye';
	const alpha_rad = input.alpha_rad ?? 0;
	if (!Number.isFinite(wavelength_m)) throw new RangeError(`wavelength must be a finite number — got ${wavelength_m}`);
	const lambda_nm = wavelength_m * 1e9;
	if (!(lambda_nm >= wavelengthRange_nm[0] * (1 - 1e-12) && lambda_nm <= wavelengthRange_nm[1] * (1 + 1e-12)))
		throw new RangeError(`wavelength must be within 180 nm–1 mm — got ${fmtNm(lambda_nm)}`);
	if (!Number.isFinite(duration_s) || !(duration_s >= durationRange_s[0] * (1 - 1e-12) && duration_s <= durationRange_s[1] * (1 + 1e-12)))
		throw new RangeError(`exposure duration must be within 1e-13 s–3e4 s — got ${duration_s} s`);
	if (target !== 'eye' && target !== 'skin') throw new RangeError(`target must be eye or skin — got ${String(target)}`);
	if (!Number.isFinite(alpha_rad) || alpha_rad < 0 || alpha_rad > Math.PI)
		throw new RangeError(`apparent source angle α must be within 0–π rad — got ${alpha_rad} rad`);
	return {
		lambda_nm: Math.min(Math.max(lambda_nm, wavelengthRange_nm[0]), wavelengthRange_nm[1]),
		t_s: Math.min(Math.max(duration_s, durationRange_s[0]), durationRange_s[1]),
		target,
		alpha_mrad: alpha_rad * 1e3
	};
}

function inBand(x: number, [lo, hi]: readonly [number, number], top: number): boolean {
	return x >= lo && (x < hi || (hi === top && x <= hi));
}

const byTarget = new WeakMap<Edition, Record<Target, LimitRow[]>>();

/** Rows of `edition` that cover the case (before evaluating their values). */
export function matchingRows(edition: Edition, target: Target, lambda_nm: number, t_s: number, f: FactorValues): LimitRow[] {
	let idx = byTarget.get(edition);
	if (!idx) {
		idx = { eye: edition.rows.filter((r) => r.targets.includes('eye')), skin: edition.rows.filter((r) => r.targets.includes('skin')) };
		byTarget.set(edition, idx);
	}
	const out: LimitRow[] = [];
	let ctx: { lambda_nm: number; t_s: number; f: FactorValues } | null = null;
	for (const r of idx[target]) {
		if (!inBand(lambda_nm, r.wavelength_nm, wavelengthRange_nm[1]) || !inBand(t_s, r.duration_s, durationRange_s[1])) continue;
		if (r.when && !r.when((ctx ??= { lambda_nm, t_s, f }))) continue;
		out.push(r);
	}
	return out;
}

function candidateOf(r: LimitRow, lambda_nm: number, t_s: number, f: FactorValues): LimitCandidate {
	const v = r.value({ lambda_nm, t_s, f });
	const H = r.kind === 'irradiance' ? v * t_s : v;
	if (!(Number.isFinite(H) && H > 0)) throw new RangeError(`row ${r.id} gave no finite positive limit at ${fmtNm(lambda_nm)}, ${t_s} s — the case is outside what the row covers`);
	return {
		rowId: r.id,
		mechanism: r.mechanism,
		kind: r.kind,
		radiantExposure_J_m2: H,
		irradiance_W_m2: H / t_s,
		expression: r.expression,
		condition: r.condition,
		source: r.source,
		provenance: r.provenance
	};
}

/**
 * Where a figure comes from, in one line: the IEC edition's label when it has one, else whether the
 * limiting row and aperture were read from the published text or recalled.
 */
export function provenanceLineOf(edition: Edition, provenance: Provenance): string {
	if (edition.provenanceLabel) return `${edition.short}: ${edition.provenanceLabel}.`;
	return provenance === 'published-text'
		? `${edition.short}: limit and aperture read from the published text of the table row named.`
		: `${edition.short}: this row or its aperture is recalled (from memory), not read from a reachable published text — the reason is given with the row.`;
}

/**
 * Evaluate an edition's exposure limit.
 * Returns the stricter of the applicable rows (thermal and photochemical where both apply), the
 * limiting aperture, the factors with their ICNIRP and IEC names, and the caution.
 * Example: EU 2006/25, eye, 532 nm, 0.25 s → H = 18·0.25^0.75 = 6.364 J/m², E = 25.46 W/m², 7 mm (Table 2.2, read).
 */
export function evaluateEdition(edition: Edition, input: LimitInput): LimitResult {
	const { lambda_nm, t_s, target, alpha_mrad } = checkLimitInput(input);
	const f = edition.factors(lambda_nm, t_s, alpha_mrad);
	const rows = matchingRows(edition, target, lambda_nm, t_s, f);
	if (rows.length === 0) throw new RangeError(`${edition.short}: no table row covers ${target}, ${fmtNm(lambda_nm)}, ${t_s} s — not extrapolated`);
	const candidates = rows.map((r) => candidateOf(r, lambda_nm, t_s, f));
	const row = candidates.reduce((a, b) => (b.radiantExposure_J_m2 < a.radiantExposure_J_m2 ? b : a));
	const used = new Set<FactorKey>();
	for (const r of rows) for (const k of r.uses) used.add(k);
	if (used.has('CE')) for (const k of ['alpha_mrad', 'alphaMin_mrad', 'alphaMax_mrad'] as const) used.add(k);
	const factors: FactorReport[] = [];
	const allFactors: FactorReport[] = [];
	for (const k of factorOrder) {
		const v = f[k];
		if (!Number.isFinite(v)) continue;
		const i = factorInfo[k];
		const rep: FactorReport = { name: i.name, iecName: i.iecName, value: v, unit: i.unit, meaning: i.meaning };
		allFactors.push(rep);
		if (used.has(k)) factors.push(rep);
	}
	const ap = edition.apertureSourceAt(target, lambda_nm, t_s);
	const provenance: Provenance = row.provenance === 'recalled' || ap.provenance === 'recalled' || edition.provenanceLabel ? 'recalled' : 'published-text';
	return {
		standardId: edition.id,
		standard: edition.title,
		target,
		wavelength_m: lambda_nm * 1e-9,
		duration_s: t_s,
		alpha_rad: alpha_mrad * 1e-3,
		radiantExposure_J_m2: row.radiantExposure_J_m2,
		irradiance_W_m2: row.irradiance_W_m2,
		kind: row.kind,
		mechanism: row.mechanism,
		limitingAperture_m: edition.aperture_m(target, lambda_nm, t_s),
		row,
		candidates,
		factors,
		allFactors,
		notes: edition.notes,
		provenance,
		limitSource: `${row.source}. Limiting aperture: ${ap.source}`,
		provenanceLine: provenanceLineOf(edition, provenance),
		caution
	};
}

/** Only the limit of one mechanism (for the repetitive-pulse rule, which applies to thermal limits); null when none applies. */
export function evaluateMechanism(edition: Edition, input: LimitInput, mechanism: 'thermal' | 'photochemical'): LimitCandidate | null {
	const { lambda_nm, t_s, target, alpha_mrad } = checkLimitInput(input);
	const f = edition.factors(lambda_nm, t_s, alpha_mrad);
	const rows = matchingRows(edition, target, lambda_nm, t_s, f).filter((r) => r.mechanism === mechanism);
	if (rows.length === 0) return null;
	return rows.map((r) => candidateOf(r, lambda_nm, t_s, f)).reduce((a, b) => (b.radiantExposure_J_m2 < a.radiantExposure_J_m2 ? b : a));
}
