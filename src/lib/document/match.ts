/**
 * The setup document's `match` section (Match workspace and `beamwright match`): its valibot schema,
 * defaults, and its compilation into engine input — the matching problem, the expander options and the
 * read-outs of the target (cavity stability, fibre V number, alignment tolerance) — with each error
 * keyed by the field's path inside the section ("target.wx", "inventory.2.focal", "keepOut.0.from").
 *
 * Everything the user typed is kept as text with units, so nothing is lost while it is invalid.
 * Lenses put on the bench by the Match workspace carry element ids starting with `MATCH_ID_PREFIX`;
 * a later apply replaces them, and the bench beam used as the search's input leaves them out.
 */
import * as v from 'valibot';
import { parseQuantity, type FieldSpec } from '../units/parse';
import { fiberMode, type FiberMode } from '../optics/fiber';
import { twoMirrorCavity, roundTripEigenmode, linearRoundTrip, mirrorRoundTrip, eigenmodeAlong, type TwoMirrorCavity, type RoundTripPart, type RoundTripEigenmode } from '../optics/cavity';
import { alignmentTolerance } from '../optics/overlap';
import { resolveAxis, type SourceSpec } from '../optics/source';
import { propagate, beamAt } from '../optics/train';
import { cavityTarget, fiberTarget, roundTripTarget, waistTarget } from '../optics/solve/targets';
import { parseLensCsv } from '../optics/solve/inventory';
import { targetOutsideSubstrate } from '../optics/substrate';
import type { ExpanderOptions } from '../optics/solve/expander';
import type { MatchProblem, RankBy } from '../optics/solve/search';
import type { InputBeam, Interval, StockLens, TargetMode } from '../optics/solve/types';
import { compileSetup, compileSource, type FieldError } from './compile';
import type { SetupDoc } from './schema';
import { repairSection } from './repair';
import { LabSchema, defaultLab, type CavityGeometry } from './cavityLab';
import { defaultSubstrate } from './sectionDefaults';
export { defaultSubstrate, emptyMatchSection } from './sectionDefaults';
import { roundTripMatrices } from '../optics/cavity';

/** Element ids of lenses that the Match workspace put on the bench start with this. */
export const MATCH_ID_PREFIX = 'match-';

const text = v.string();
const range = v.object({ from: text, to: text });

/** A ring or folded cavity: its mirrors in beam order, each with the arm to the next mirror. */
const RingSchema = v.object({
	/** 'ring': closed loop, the last arm returns to mirror 1; 'folded': standing wave from the first to the last mirror (end mirrors at normal incidence). */
	type: v.picklist(['ring', 'folded']),
	/** r: radius of curvature ("flat" or + concave); angle: angle of incidence; arm: length to the next mirror. */
	mirrors: v.array(v.object({ r: text, angle: text, arm: text })),
	/** 0-based: the beam enters through this mirror, into the arm towards the next mirror. */
	input: v.optional(v.pipe(v.number(), v.integer(), v.minValue(0)), 0)
});
export type RingSection = v.InferOutput<typeof RingSchema>;

/** The invented Demo lab's bow-tie ring: two flat and two 100 mm mirrors, all at 8°. */
export function defaultRing(): RingSection {
	return {
		type: 'ring',
		mirrors: [
			{ r: 'flat', angle: '8°', arm: '160 mm' },
			{ r: 'flat', angle: '8°', arm: '110 mm' },
			{ r: '100 mm', angle: '8°', arm: '115 mm' },
			{ r: '100 mm', angle: '8°', arm: '110 mm' }
		],
		input: 0
	};
}

export const MatchSectionSchema = v.object({
	/** Where the beam to be matched comes from: the bench's source itself, or the bench's beam at the rail start. */
	input: v.optional(v.object({ from: v.picklist(['source', 'bench']) }), { from: 'source' }),
	target: v.object({
		kind: v.picklist(['waist', 'cavity', 'ring', 'fiber']),
		/** waist: waist position; cavity: position of mirror 1 (input mirror); ring: position of the input mirror; fiber: fibre face. */
		at: text,
		wx: v.optional(text, ''),
		wy: v.optional(text, ''),
		r1: v.optional(text, ''),
		r2: v.optional(text, ''),
		length: v.optional(text, ''),
		/** cavity: an optional thin (e.g. thermal) lens between the mirrors: focal length ('' = none) and distance from mirror 1. */
		lensF: v.optional(text, ''),
		lensAt: v.optional(text, ''),
		/**
		 * cavity: the input mirror's substrate as a lens (thickness '' = left out). `at` is then the coated
		 * face; the target is the mode outside the back face. rBack: back face radius, + when its centre
		 * lies towards the cavity, "flat" by default. Optional with a default, so older documents read as before.
		 */
		substrate: v.optional(v.object({ thickness: text, n: text, rBack: text }), defaultSubstrate),
		ring: v.optional(RingSchema, defaultRing),
		/** fiber: 'mfd' (mode-field diameter given) or 'core' (core radius + NA). */
		fiberBy: v.optional(v.picklist(['mfd', 'core']), 'mfd'),
		mfd: v.optional(text, ''),
		coreRadius: v.optional(text, ''),
		na: v.optional(text, '')
	}),
	inventory: v.array(v.object({ label: text, focal: text, diameter: v.optional(text, ''), count: v.optional(text, '1') })),
	rail: range,
	slots: v.optional(v.array(range), []),
	keepOut: v.optional(v.array(range), []),
	minSpacing: v.optional(text, '10 mm'),
	lensCounts: v.optional(v.array(v.picklist([1, 2, 3])), [1, 2]),
	rankBy: v.optional(v.picklist(['robust', 'efficiency', 'tolerance', 'length']), 'robust'),
	expander: v.optional(v.object({ magMin: text, magMax: text, lens1At: text, waistAfter: text }), { magMin: '2', magMax: '5', lens1At: '100 mm', waistAfter: '' }),
	/** Cavity lab (Scan workspace): mirror reflectivities, steering mirrors, perturbation, measured peaks. Optional; defaults fill older documents. */
	lab: v.optional(LabSchema, defaultLab)
});
export type MatchSection = v.InferOutput<typeof MatchSectionSchema>;
export type InventoryRow = MatchSection['inventory'][number];

/** The starting section: the invented Demo lab couples its rod laser into a reference cavity. */
export function defaultMatchSection(): MatchSection {
	return {
		input: { from: 'source' },
		target: { kind: 'cavity', at: '900 mm', wx: '50 µm', wy: '', r1: 'flat', r2: '500 mm', length: '250 mm', lensF: '', lensAt: '', substrate: defaultSubstrate(), ring: defaultRing(), fiberBy: 'mfd', mfd: '6.2 µm', coreRadius: '3 µm', na: '0.13' },
		inventory: stockToRows([
			{ label: 'Shelf lens A1 (−50)', f_m: -0.05, diameter_m: 0.0127, count: 2 },
			{ label: 'Shelf lens B2 (+50)', f_m: 0.05, diameter_m: 0.0254, count: 2 },
			{ label: 'Shelf lens B4 (+100)', f_m: 0.1, diameter_m: 0.0254, count: 3 },
			{ label: 'Shelf lens B6 (+150)', f_m: 0.15, diameter_m: 0.0254, count: 2 },
			{ label: 'Shelf lens C1 (+200)', f_m: 0.2, diameter_m: 0.0254, count: 2 },
			{ label: 'Shelf lens C3 (+300)', f_m: 0.3, diameter_m: 0.0254, count: 1 },
			{ label: 'Shelf lens C5 (+500)', f_m: 0.5, diameter_m: 0.0508, count: 1 }
		]),
		rail: { from: '50 mm', to: '850 mm' },
		slots: [],
		keepOut: [{ from: '400 mm', to: '450 mm' }],
		minSpacing: '25 mm',
		lensCounts: [1, 2],
		rankBy: 'robust',
		expander: { magMin: '2', magMax: '5', lens1At: '100 mm', waistAfter: '' },
		lab: defaultLab()
	};
}

/**
 * Read the stored section (filling defaults for optional parts), repairing field by field: a field
 * that cannot be read is reset, its old text kept under `unreadable`, and `problem` names it.
 */
export function readMatchSection(raw: unknown): { section: MatchSection; problem: string | null } {
	const r = repairSection(MatchSectionSchema as never, raw, defaultMatchSection(), 'match settings');
	return { section: r.section as MatchSection, problem: r.problem };
}

/** Millimetre text with up to 6 significant digits: 0.1234 → "123.4 mm". */
export function mmText(value_m: number): string {
	return `${+(value_m * 1000).toPrecision(6)} mm`;
}

/** Stock lenses (CSV import, demo shelf) as inventory rows of text. */
export function stockToRows(lenses: StockLens[]): InventoryRow[] {
	return lenses.map((l) => ({ label: l.label, focal: mmText(l.f_m), diameter: l.diameter_m === null ? '' : mmText(l.diameter_m), count: String(l.count) }));
}

/** Lens CSV (columns lens, f_mm, dia_mm, qty) → rows, or every line's error. */
export function importLensCsv(csv: string): { ok: true; rows: InventoryRow[] } | { ok: false; messages: string[] } {
	const r = parseLensCsv(csv);
	if (r.ok) return { ok: true, rows: stockToRows(r.lenses) };
	return { ok: false, messages: r.messages ?? [r.message] };
}

const L = (label: string, extra: Partial<FieldSpec> = {}): FieldSpec => ({ label, kind: 'length', min_si: -1e3, max_si: 1e3, ...extra });
const POS = (label: string) => L(label, { min_si: -100, max_si: 100 });

export interface TargetReadout {
	/** Target waist per axis (radius) and where it is on the bench. */
	w0x_m: number;
	w0y_m: number;
	waistX_m: number;
	waistY_m: number;
	/** Lateral offset and tilt that alone cost 1 % per axis at the target plane (Joyce & DeLoach 1984). */
	align: { x: { offset_m: number; tilt_rad: number }; y: { offset_m: number; tilt_rad: number } } | null;
}

export interface CavityReadout extends TwoMirrorCavity {
	/** g1·g2; with an intracavity lens, the round trip's equivalent (1 + (A + D)/2)/2. */
	g1g2: number;
	/** (A + D)/2 of the round trip (Siegman 1986, eq. 21.8); stable when |(A + D)/2| < 1. */
	halfTrace: number;
	/** The intracavity thin lens, when one is given. */
	lens: { f_m: number; fromMirror1_m: number } | null;
}

/** One axis of a ring or folded cavity. */
export interface RingAxisReadout {
	/** (A + D)/2 of the round trip on this axis; stable when between −1 and 1. */
	halfTrace: number;
	stable: boolean;
	/** Mode radius at the input mirror, null when unstable. */
	wInput_m: number | null;
	/** Waists of the mode: arm (0-based, from mirror arm to arm + 1), distance from the arm's first mirror. */
	waists: { arm: number; fromMirror_m: number; w0_m: number }[];
}

export interface RingReadout {
	type: 'ring' | 'folded';
	/** x: tangential (in the plane of the fold), y: sagittal. */
	x: RingAxisReadout;
	y: RingAxisReadout;
	stable: boolean;
	/** Optical path of one round trip. */
	roundTrip_m: number;
	/** 0-based input mirror. */
	input: number;
	/** Arms as "from → to" mirror numbers (1-based), in the section's order. */
	arms: [number, number][];
}

export interface CompiledMatch {
	/** The search problem, or null while a field needs fixing. */
	problem: MatchProblem | null;
	/** Field path inside the section → message. */
	fieldErrors: Record<string, string>;
	/** All messages in order, each naming its field. */
	errors: string[];
	cavity: CavityReadout | null;
	/** The input mirror's substrate, when given: the target is then the mode outside its back face (at coatedFaceAt_m − thickness_m). */
	substrate: { thickness_m: number; index: number; backR_m: number; coatedFaceAt_m: number } | null;
	ring: RingReadout | null;
	fiber: FiberMode | null;
	target: TargetReadout | null;
	/** Where the input beam came from, in words, and its waist per axis. */
	input: { from: 'source' | 'bench'; w0x_m: number; z0x_m: number; w0y_m: number; z0y_m: number; m2x: number; m2y: number } | null;
	/** Bench elements the search does not see (besides lenses from an earlier apply), by label and position. */
	ignored: { id: string; label: string; z_m: number }[];
	/** The stock lenses when every inventory field is valid (for the expander read-out), else null. */
	inventory: StockLens[] | null;
	/** The input beam (q̂ referred to z = 0, air), when it could be computed. */
	inputBeam: InputBeam | null;
	/** The rail range, when valid. */
	rail: Interval | null;
	/** The target cavity's round trip and mode at the target plane, when it is a stable cavity (for the cavity lab). */
	roundTrip?: CavityGeometry | null;
}

function radiusText(t: string, label: string, path: string, err: (p: string, m: string) => void): number {
	const s = t.trim().toLowerCase();
	if (s === 'flat' || s === 'inf' || s === '∞') return Infinity;
	const r = parseQuantity(t, L(label, { min_si: -1e4, max_si: 1e4 }));
	if (!r.ok) {
		err(path, r.message + (r.message.includes('empty') ? ' or "flat"' : ''));
		return NaN;
	}
	if (Math.abs(r.value_si) < 1e-3) {
		err(path, `${label} must be at least 1 mm in size (or "flat") — got ${t.trim()}`);
		return NaN;
	}
	return r.value_si;
}

/**
 * Compile the match section. `source` is the bench's compiled source; `doc` (the whole setup) is needed
 * when the section takes the bench's beam at the rail start as its input.
 */
export function compileMatchSection(raw: unknown, source: SourceSpec, doc?: SetupDoc): CompiledMatch {
	const out: CompiledMatch = { problem: null, fieldErrors: {}, errors: [], cavity: null, substrate: null, ring: null, fiber: null, target: null, input: null, ignored: [], rail: null, inventory: null, inputBeam: null };
	const err = (path: string, message: string) => {
		if (!(path in out.fieldErrors)) out.fieldErrors[path] = message;
		out.errors.push(message);
	};
	// Field by field: a field that cannot be read is named (at its path) and blocks the search until
	// the user edits it; the rest of the section is read as stored.
	const repaired = repairSection(MatchSectionSchema as never, raw, defaultMatchSection(), 'match settings');
	for (const r of repaired.resets) err(r.path.replace(/^\(whole section\)$/, ''), `match.${r.path}: the stored value ${r.text.length > 40 ? r.text.slice(0, 40) + '…' : r.text} could not be read — it is reset to the default at your next change`);
	const m = repaired.section as MatchSection;
	const n0 = () => out.errors.length;
	const q = (path: string, t: string, spec: FieldSpec) => {
		const r = parseQuantity(t, spec);
		if (!r.ok) err(path, r.message);
		return r.ok ? r.value_si : NaN;
	};
	const lam = source.wavelength_m;
	const lamOk = Number.isFinite(lam) && lam > 0;

	// The rail and the other places.
	const railFrom = q('rail.from', m.rail.from, POS('Rail start'));
	const railTo = q('rail.to', m.rail.to, POS('Rail end'));
	if (Number.isFinite(railFrom) && Number.isFinite(railTo) && !(railTo > railFrom)) err('rail.to', `Rail end must be after the rail start (${m.rail.from.trim()}) — got ${m.rail.to.trim()}`);
	const railOk = Number.isFinite(railFrom) && Number.isFinite(railTo) && railTo > railFrom;
	if (railOk) out.rail = { from_m: railFrom, to_m: railTo };
	const interval = (r: { from: string; to: string }, path: string, what: string, blankIsRail: boolean): Interval => {
		if (blankIsRail && r.from.trim() === '' && r.to.trim() === '') return { from_m: railFrom, to_m: railTo };
		const from = r.from.trim() === '' && blankIsRail ? railFrom : q(`${path}.from`, r.from, POS(`${what} from`));
		const to = r.to.trim() === '' && blankIsRail ? railTo : q(`${path}.to`, r.to, POS(`${what} to`));
		if (Number.isFinite(from) && Number.isFinite(to) && !(to > from)) err(`${path}.to`, `${what}: "to" must be after "from" (${r.from.trim() || 'rail start'}) — got ${r.to.trim() || 'rail end'}`);
		return { from_m: from, to_m: to };
	};

	// Target.
	const t = m.target;
	const atName = t.kind === 'cavity' ? 'Mirror 1 position' : t.kind === 'ring' ? 'Input mirror position' : t.kind === 'fiber' ? 'Fibre face position' : 'Target waist position';
	const at = q('target.at', t.at, POS(atName));
	if (Number.isFinite(at) && railOk && !(at > railFrom)) err('target.at', `${atName} must lie after the rail start (${m.rail.from.trim()}) — got ${t.at.trim()}`);
	let target: TargetMode | null = null;
	const before = n0();
	const wSpec = (label: string) => L(label, { min_si: undefined, above_si: 0, max_si: 0.1 });
	if (t.kind === 'waist') {
		const wx = q('target.wx', t.wx, wSpec('Target waist radius (x)'));
		const wy = t.wy.trim() === '' ? wx : q('target.wy', t.wy, wSpec('Target waist radius (y)'));
		if (n0() === before && Number.isFinite(at) && lamOk) target = waistTarget(wx, wy, at, lam);
	} else if (t.kind === 'cavity') {
		const r1 = radiusText(t.r1, 'Mirror 1 radius', 'target.r1', err);
		const r2 = radiusText(t.r2, 'Mirror 2 radius', 'target.r2', err);
		const len = q('target.length', t.length, L('Cavity length', { min_si: undefined, above_si: 0, max_si: 100 }));
		const hasLens = t.lensF.trim() !== '' || t.lensAt.trim() !== '';
		let lensF = NaN;
		let lensAt = NaN;
		if (hasLens) {
			lensF = q('target.lensF', t.lensF, L('Intracavity lens focal length', { min_si: -1e3, max_si: 1e3 }));
			if (Number.isFinite(lensF) && Math.abs(lensF) < 1e-3) {
				err('target.lensF', `Intracavity lens focal length must be at least 1 mm in size (negative for a diverging lens) — got ${t.lensF.trim()}`);
				lensF = NaN;
			}
			lensAt = q('target.lensAt', t.lensAt, L('Intracavity lens distance from mirror 1', { min_si: 0, max_si: 100 }));
			if (Number.isFinite(lensAt) && Number.isFinite(len) && !(lensAt < len)) err('target.lensAt', `Intracavity lens distance from mirror 1 must be less than the cavity length (${t.length.trim()}) — got ${t.lensAt.trim()}`);
		}
		if (n0() === before && lamOk) {
			const c = twoMirrorCavity(r1, r2, len, lam);
			if (!hasLens) {
				let halfTrace = 2 * c.g1 * c.g2 - 1;
				try {
					halfTrace = roundTripEigenmode(linearRoundTrip(r1, r2, [{ kind: 'space', length_m: len }]), lam).x.halfTrace;
				} catch {
					// keep the closed form 2·g1·g2 − 1
				}
				out.cavity = { ...c, g1g2: c.g1 * c.g2, halfTrace, lens: null };
				const lim = c.limit;
				if (c.status === 'boundary' && lim && lim.finite && lim.w0_m !== null && lim.waistFromMirror1_m !== null) {
					// Confocal: match the limit of the symmetric cavity (reported as such on the page).
					if (Number.isFinite(at)) {
						const qq = { re: -lim.waistFromMirror1_m, im: (Math.PI * lim.w0_m * lim.w0_m) / lam };
						target = { z_m: at, x: qq, y: { ...qq }, what: 'cavity' };
					}
				} else if (c.status === 'boundary') err('target.cavity', `The cavity has no confined mode to match: it is ${c.reason}. Change R1, R2 or the length.`);
				else if (!c.stable) err('target.cavity', `The cavity has no stable mode to match: g1·g2 = ${(c.g1 * c.g2).toPrecision(4)} (must lie between 0 and 1), (A+D)/2 = ${halfTrace.toPrecision(4)} (must lie between −1 and 1). Change R1, R2 or the length.`);
				else if (Number.isFinite(at)) {
					target = cavityTarget(r1, r2, len, at, lam);
					out.roundTrip = { kind: 'linear', path_m: 2 * len, reflections: 2, matrices: roundTripMatrices(linearRoundTrip(r1, r2, [{ kind: 'space', length_m: len }])), mode: { x: { ...target.x }, y: { ...target.y } }, at_m: at };
				}
			} else {
				const oneWay: RoundTripPart[] = [{ kind: 'space', length_m: lensAt }, { kind: 'element', spec: { kind: 'thinLens', f_m: lensF } }, { kind: 'space', length_m: len - lensAt }];
				const parts = linearRoundTrip(r1, r2, oneWay);
				const mode = roundTripEigenmode(parts, lam);
				const ax = mode.x;
				const halfTrace = ax.halfTrace;
				const g1g2 = (1 + halfTrace) / 2;
				let w0: number | null = null;
				let waistAt: number | null = null;
				let wM2: number | null = null;
				if (ax.stable && ax.q) {
					const along = eigenmodeAlong(parts, ax.q, lam, 'x');
					// Parts 0 and 2 are the way from mirror 1 to mirror 2 (before and after the lens).
					const a = along.find((p) => p.part === 0);
					const b = along.find((p) => p.part === 2);
					if (a?.waist) [w0, waistAt] = [a.waist.w0_m, a.waist.fromStart_m];
					else if (b?.waist) [w0, waistAt] = [b.waist.w0_m, lensAt + b.waist.fromStart_m];
					wM2 = b ? b.wEnd_m : null;
				}
				const stable = ax.stable && ax.q !== null;
				out.cavity = {
					...c,
					stable,
					status: stable ? 'stable' : ax.boundary ? 'boundary' : 'unstable',
					limit: null,
					reason: stable
						? null
						: ax.boundary
							? 'on the stability boundary: with the lens, (A+D)/2 of the round trip is ±1, where the round trip fixes no Gaussian mode'
							: 'unstable: with the lens, (A+D)/2 of the round trip must lie between −1 and 1',
					g1g2,
					halfTrace,
					w0_m: w0,
					waistFromMirror1_m: waistAt,
					wMirror1_m: stable ? ax.w_m : null,
					wMirror2_m: wM2,
					zR_m: w0 === null ? null : (Math.PI * w0 * w0) / lam,
					lens: { f_m: lensF, fromMirror1_m: lensAt }
				};
				if (!stable) err('target.cavity', `The cavity with its lens has no stable mode to match: (A+D)/2 = ${halfTrace.toPrecision(4).replace('-', '−')} (must lie between −1 and 1). Change R1, R2, the length or the lens.`);
				else if (Number.isFinite(at)) {
					target = roundTripTarget(mode, at);
					out.roundTrip = { kind: 'linear', path_m: 2 * len, reflections: 2, matrices: mode.matrices, mode: { x: { ...target.x }, y: { ...target.y } }, at_m: at };
				}
			}
		}
		// The input mirror's substrate: the target becomes the mode outside its back face.
		const sub = t.substrate;
		if (sub.thickness.trim() !== '') {
			const before2 = n0();
			const thickness = q('target.substrate.thickness', sub.thickness, L('Substrate thickness', { min_si: undefined, above_si: 0, max_si: 0.1 }));
			const index = q('target.substrate.n', sub.n, { label: 'Substrate index', kind: 'dimensionless', min_si: 1, max_si: 5 });
			const backR = radiusText(sub.rBack.trim() === '' ? 'flat' : sub.rBack, 'Substrate back face radius', 'target.substrate.rBack', err);
			if (Number.isFinite(thickness) && !Number.isNaN(r1) && thickness >= Math.abs(r1)) {
				err('target.substrate.thickness', `Substrate thickness must be less than the mirror 1 radius (${t.r1.trim()}) — got ${sub.thickness.trim()}`);
			}
			if (n0() === before2 && target) {
				out.substrate = { thickness_m: thickness, index, backR_m: backR, coatedFaceAt_m: target.z_m };
				target = targetOutsideSubstrate(target, r1, { thickness_m: thickness, index, backR_m: backR });
				// The cavity lab sees the mode as it leaves the back face (its spectrum is unchanged).
				if (out.roundTrip) out.roundTrip = { ...out.roundTrip, mode: { x: { ...target.x }, y: { ...target.y } }, at_m: target.z_m };
			} else if (n0() !== before2) {
				target = null;
				out.roundTrip = null;
			}
		}
	} else if (t.kind === 'ring') {
		const r = compileRing(t.ring, lam, lamOk, err);
		if (r) {
			out.ring = r.readout;
			if (!r.readout.stable) {
				const bad = (['x', 'y'] as const).filter((a) => !r.readout[a].stable).map((a) => `${a === 'x' ? 'x tangential' : 'y sagittal'} (A+D)/2 = ${r.readout[a].halfTrace.toPrecision(4).replace('-', '−')}${r.mode[a].boundary ? ' (on the stability boundary, where the round trip fixes no mode)' : ''}`);
				err('target.ring', `The ${t.ring.type === 'ring' ? 'ring' : 'folded'} cavity has no stable mode to match: ${bad.join(', ')} (must lie between −1 and 1). Change the mirror radii, angles or arm lengths.`);
			} else if (n0() === before && Number.isFinite(at)) {
				target = roundTripTarget(r.mode, at);
				const ring = t.ring.type === 'ring';
				out.roundTrip = { kind: ring ? 'ring' : 'linear', path_m: r.readout.roundTrip_m, reflections: ring ? t.ring.mirrors.length : 2 * (t.ring.mirrors.length - 1), matrices: r.mode.matrices, mode: { x: { ...target.x }, y: { ...target.y } }, at_m: at };
			}
		}
	} else {
		let mfd = NaN;
		if (t.fiberBy === 'mfd') mfd = q('target.mfd', t.mfd, L('Mode-field diameter', { min_si: 0.5e-6, max_si: 1e-3 }));
		else {
			const a = q('target.coreRadius', t.coreRadius, L('Core radius', { min_si: 0.2e-6, max_si: 0.5e-3 }));
			const na = q('target.na', t.na, { label: 'NA', kind: 'dimensionless', above_si: 0, max_si: 0.9 });
			if (n0() === before && lamOk) {
				try {
					out.fiber = fiberMode(a, na, lam);
					mfd = out.fiber.mfd_m;
				} catch (e) {
					err('target.na', (e as Error).message.replace(/^V number/, 'V number (2π·a·NA/λ)'));
				}
			}
		}
		if (n0() === before && Number.isFinite(at) && lamOk) target = fiberTarget(mfd, at, lam);
	}

	// Inventory.
	if (m.inventory.length === 0) err('inventory', 'Lens inventory is empty — add lenses, import a CSV or load the demo shelf');
	const inventory: StockLens[] = m.inventory.map((l, i) => {
		const name = `Lens ${i + 1}${l.label.trim() ? ` (${l.label.trim()})` : ''}`;
		let f = q(`inventory.${i}.focal`, l.focal, L(`${name} focal length`, { min_si: -10, max_si: 10 }));
		if (Number.isFinite(f) && Math.abs(f) < 1e-3) {
			err(`inventory.${i}.focal`, `${name} focal length must be at least 1 mm in size (negative for a diverging lens) — got ${l.focal.trim()}`);
			f = NaN;
		}
		const d = l.diameter.trim() === '' ? null : q(`inventory.${i}.diameter`, l.diameter, L(`${name} diameter`, { min_si: 1e-3, max_si: 0.5 }));
		const ct = l.count.trim();
		const c = ct === '' ? NaN : Number(ct);
		if (!(Number.isInteger(c) && c >= 0 && c <= 100)) err(`inventory.${i}.count`, `${name} count must be a whole number from 0 to 100 — got "${l.count}"`);
		return { label: l.label.trim() || `lens ${i + 1}`, f_m: f, diameter_m: d, count: c };
	});
	if (m.inventory.length > 0 && inventory.every((l) => !(l.count >= 1))) err('inventory', 'Lens inventory has no lens with a count of 1 or more');
	if (!Object.keys(out.fieldErrors).some((k) => k.startsWith('inventory'))) out.inventory = inventory;

	// Constraints.
	const slots = m.slots.map((s, i) => interval(s, `slots.${i}`, `Lens ${i + 1} range`, true));
	const keepOut = m.keepOut.map((s, i) => interval(s, `keepOut.${i}`, `Keep-out zone ${i + 1}`, false));
	const minSpacing_m = q('minSpacing', m.minSpacing, L('Minimum spacing', { min_si: 0, max_si: 10 }));
	if (m.lensCounts.length === 0) err('lensCounts', 'Number of lenses: tick at least one of 1, 2 or 3');

	// Input beam.
	let input: InputBeam | null = null;
	if (lamOk) {
		try {
			if (m.input.from === 'bench') {
				if (!doc) err('input.from', 'The bench beam as input needs the whole setup; using it here is not possible');
				else if (railOk) input = benchInput(doc, railFrom);
			} else {
				const wx = resolveAxis(source.x, lam, source.index);
				const wy = resolveAxis(source.y, lam, source.index);
				const zr = (w0: number, m2: number) => (Math.PI * w0 * w0) / (m2 * lam);
				input = { wavelength_m: lam, x: { q: { re: -wx.z0_m, im: zr(wx.w0_m, wx.m2) }, m2: wx.m2 }, y: { q: { re: -wy.z0_m, im: zr(wy.w0_m, wy.m2) }, m2: wy.m2 } };
			}
		} catch (e) {
			err('input.from', `The bench beam cannot be computed: ${(e as Error).message}`);
		}
	} else err('input.from', 'The bench source needs fixing first (wavelength) — see the Bench page');
	out.inputBeam = input;
	if (input) {
		const ax = (a: { q: { re: number; im: number }; m2: number }) => ({ w0: Math.sqrt((a.m2 * lam * a.q.im) / Math.PI), z0: -a.q.re });
		const x = ax(input.x);
		const y = ax(input.y);
		out.input = { from: m.input.from, w0x_m: x.w0, z0x_m: x.z0, w0y_m: y.w0, z0y_m: y.z0, m2x: input.x.m2, m2y: input.y.m2 };
	}
	if (doc) {
		const first = m.input.from === 'bench' && railOk ? railFrom : -Infinity;
		const end = Number.isFinite(at) ? at : Infinity;
		const compiled = compileSetup(doc);
		if (compiled.ok) out.ignored = compiled.input.elements.filter((e) => !e.id.startsWith(MATCH_ID_PREFIX) && e.z_m >= first && e.z_m < end).map((e) => ({ id: e.id, label: e.label, z_m: e.z_m }));
	}

	if (target && lamOk) {
		const tol = (qq: { re: number; im: number }) => {
			try {
				const a = alignmentTolerance({ q: qq }, { q: qq }, lam, 0.01);
				return Number.isFinite(a.offset_m) && Number.isFinite(a.tilt_rad) ? a : null;
			} catch {
				return null;
			}
		};
		const ax = tol(target.x);
		const ay = tol(target.y);
		out.target = {
			w0x_m: Math.sqrt((lam * target.x.im) / Math.PI),
			w0y_m: Math.sqrt((lam * target.y.im) / Math.PI),
			waistX_m: target.z_m - target.x.re,
			waistY_m: target.z_m - target.y.re,
			align: ax && ay ? { x: ax, y: ay } : null
		};
	}
	if (out.errors.length === 0 && target && input) {
		out.problem = { input, target, inventory, constraints: { rail: { from_m: railFrom, to_m: railTo }, slots, keepOut, minSpacing_m, lensCounts: [...m.lensCounts].sort() }, rankBy: m.rankBy as RankBy };
	}
	return out;
}

const MAX_ANGLE_DEG = 80;

/**
 * Compile a ring or folded cavity (errors keyed "target.ring.mirrors.<i>.<r|angle|arm>"): its round trip
 * from the input mirror, the eigenmode per axis and the read-out; null while a field needs fixing.
 */
function compileRing(ring: RingSection, lam: number, lamOk: boolean, err: (p: string, m: string) => void): { mode: RoundTripEigenmode; readout: RingReadout } | null {
	const n = ring.mirrors.length;
	const folded = ring.type === 'folded';
	const min = folded ? 2 : 3;
	let ok = true;
	const fail = (p: string, m: string) => {
		ok = false;
		err(p, m);
	};
	if (n < min || n > 8) fail('target.ring', `A ${folded ? 'folded' : 'ring'} cavity needs ${min} to 8 mirrors — got ${n}`);
	const nArms = folded ? n - 1 : n;
	if (!(ring.input < nArms)) fail('target.ring.input', `Input mirror must be one of mirrors 1 to ${nArms}${folded ? ' (not the last end mirror)' : ''} — got ${ring.input + 1}`);
	const mirrors = ring.mirrors.map((mm, i) => {
		const name = `Mirror ${i + 1}`;
		const r = radiusText(mm.r, `${name} radius`, `target.ring.mirrors.${i}.r`, fail);
		const end = folded && (i === 0 || i === n - 1);
		let angle = 0;
		if (!end) {
			const a = parseQuantity(mm.angle, { label: `${name} angle of incidence`, kind: 'angle', min_si: 0, defaultUnit: '°' });
			if (!a.ok) {
				if (a.pending) ok = false;
				else fail(`target.ring.mirrors.${i}.angle`, a.message);
				angle = NaN;
			} else if (!(a.value_si < (MAX_ANGLE_DEG * Math.PI) / 180)) {
				fail(`target.ring.mirrors.${i}.angle`, `${name} angle of incidence must be ≥ 0° and < ${MAX_ANGLE_DEG}° — got ${mm.angle.trim()}`);
				angle = NaN;
			} else angle = a.value_si;
		}
		return { r_m: r, angle_rad: angle };
	});
	const arms = ring.mirrors.slice(0, nArms).map((mm, i) => {
		const to = (i + 1) % n;
		const a = parseQuantity(mm.arm, L(`Arm ${i + 1} → ${to + 1} length`, { min_si: undefined, above_si: 0, max_si: 100 }));
		if (!a.ok) {
			if (a.pending) ok = false;
			else fail(`target.ring.mirrors.${i}.arm`, a.message);
			return NaN;
		}
		return a.value_si;
	});
	if (!ok || !lamOk || mirrors.some((m) => !Number.isFinite(m.angle_rad) || Number.isNaN(m.r_m)) || arms.some((a) => !Number.isFinite(a))) return null;
	const { parts, places } = mirrorRoundTrip(ring.type, mirrors, arms, ring.input);
	const mode = roundTripEigenmode(parts, lam);
	const axis = (a: 'x' | 'y') => {
		const m = mode[a];
		const waists: RingAxisReadout['waists'] = [];
		if (m.stable && m.q) {
			for (const pw of eigenmodeAlong(parts, m.q, lam, a)) {
				const place = places[pw.part];
				if (place && place.forward && pw.waist) waists.push({ arm: place.arm, fromMirror_m: pw.waist.fromStart_m, w0_m: pw.waist.w0_m });
			}
			waists.sort((p, q) => p.arm - q.arm || p.fromMirror_m - q.fromMirror_m);
		}
		return { halfTrace: m.halfTrace, stable: m.stable, wInput_m: m.stable ? m.w_m : null, waists };
	};
	const readout: RingReadout = {
		type: ring.type,
		x: axis('x'),
		y: axis('y'),
		stable: mode.stable,
		roundTrip_m: arms.reduce((s, a) => s + a, 0) * (folded ? 2 : 1),
		input: ring.input,
		arms: arms.map((_a, i) => [i + 1, ((i + 1) % n) + 1])
	};
	return { mode, readout };
}

/**
 * The bench's beam at z (the rail start), lenses from an earlier Match apply left out, as the search's
 * input: the free-space q̂ referred back to z = 0 (valid from z on, where the rail begins).
 */
export function benchInput(doc: SetupDoc, z_m: number): InputBeam {
	const c = compileSetup(doc);
	if (!c.ok) throw new RangeError(`${c.errors[0].message} (fix it on the Bench page)`);
	const elements = c.input.elements.filter((e) => !e.id.startsWith(MATCH_ID_PREFIX) && e.z_m < z_m);
	const r = propagate({ ...c.input, elements, end_m: Math.max(c.input.end_m, z_m + 0.01) });
	const b = beamAt(r, z_m);
	if (Math.abs(b.x.index - 1) > 1e-9) throw new RangeError(`the bench beam at the rail start is in a medium of index ${b.x.index}; the rail must be in air`);
	return { wavelength_m: r.wavelength_m, x: { q: { re: b.x.q.re - z_m, im: b.x.q.im }, m2: r.m2x }, y: { q: { re: b.y.q.re - z_m, im: b.y.q.im }, m2: r.m2y } };
}

/** Compile the section of a whole setup document (the page; the CLI uses `compileMatch`). */
export function compileMatchDoc(doc: SetupDoc): CompiledMatch {
	const errs: FieldError[] = [];
	const source = compileSource(doc, errs);
	if (errs.length) {
		const out: CompiledMatch = { problem: null, fieldErrors: { 'input.from': `The bench source needs fixing first: ${errs[0].message}` }, errors: [], cavity: null, substrate: null, ring: null, fiber: null, target: null, input: null, ignored: [], rail: null, inventory: null, inputBeam: null };
		out.errors.push(out.fieldErrors['input.from']);
		return out;
	}
	return compileMatchSection(doc.match ?? defaultMatchSection(), source, doc);
}

/** The CLI's entry: the problem, or the messages naming each field. */
export function compileMatch(raw: unknown, source: SourceSpec, doc?: SetupDoc): { ok: true; problem: MatchProblem } | { ok: false; errors: string[] } {
	const c = compileMatchSection(raw, source, doc);
	return c.problem ? { ok: true, problem: c.problem } : { ok: false, errors: c.errors.length ? c.errors : ['match: the section is incomplete'] };
}

/** Expander options from the section (errors keyed "expander.*"). */
export function compileExpander(raw: unknown): { ok: true; options: ExpanderOptions } | { ok: false; fieldErrors: Record<string, string> } {
	const { section } = readMatchSection(raw);
	const e = section.expander;
	const fe: Record<string, string> = {};
	const q = (path: string, t: string, spec: FieldSpec) => {
		const r = parseQuantity(t, spec);
		if (!r.ok && !(path in fe)) fe[path] = r.message;
		return r.ok ? r.value_si : NaN;
	};
	const magMin = q('expander.magMin', e.magMin, { label: 'Smallest magnification', kind: 'dimensionless', min_si: 0.01, max_si: 100 });
	const magMax = q('expander.magMax', e.magMax, { label: 'Largest magnification', kind: 'dimensionless', min_si: 0.01, max_si: 100 });
	if (Number.isFinite(magMin) && Number.isFinite(magMax) && magMax < magMin) fe['expander.magMax'] = `Largest magnification must be ≥ the smallest (${e.magMin.trim()}) — got ${e.magMax.trim()}`;
	const lens1At_m = q('expander.lens1At', e.lens1At, POS('First lens position'));
	const waistAfter_m = e.waistAfter.trim() === '' ? null : q('expander.waistAfter', e.waistAfter, L('Output waist after lens 2', { min_si: 0.001, max_si: 1e3 }));
	if (Object.keys(fe).length) return { ok: false, fieldErrors: fe };
	return { ok: true, options: { magMin, magMax, lens1At_m, waistAfter_m } };
}
