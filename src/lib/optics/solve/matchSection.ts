/**
 * The inside of the setup document's `match` section (text with units, as typed), its valibot schema,
 * and its compilation into a MatchProblem. Lives here until the document layer takes it over.
 */
import * as v from 'valibot';
import { parseQuantity, type FieldSpec } from '../../units/parse';
import { fiberMode } from '../fiber';
import { resolveAxis, type SourceSpec } from '../source';
import { cavityTarget, fiberTarget, waistTarget } from './targets';
import type { MatchProblem, RankBy } from './search';
import type { InputBeam, Interval, TargetMode } from './types';

const text = v.string();
const range = v.object({ from: text, to: text });

export const MatchSectionSchema = v.object({
	target: v.object({
		kind: v.picklist(['waist', 'cavity', 'fiber']),
		/** waist: waist position; cavity: position of mirror 1 (input mirror); fiber: fibre face. */
		at: text,
		wx: v.optional(text, ''),
		wy: v.optional(text, ''),
		r1: v.optional(text, ''),
		r2: v.optional(text, ''),
		length: v.optional(text, ''),
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
	rankBy: v.optional(v.picklist(['robust', 'efficiency', 'tolerance', 'length']), 'robust')
});
export type MatchSection = v.InferOutput<typeof MatchSectionSchema>;

const L = (label: string, extra: Partial<FieldSpec> = {}): FieldSpec => ({ label, kind: 'length', min_si: -1e3, max_si: 1e3, ...extra });

function radius(t: string, label: string, errors: string[]): number {
	const s = t.trim().toLowerCase();
	if (s === 'flat' || s === 'inf') return Infinity;
	const r = parseQuantity(t, L(label, { min_si: -1e4, max_si: 1e4 }));
	if (!r.ok) errors.push(r.message);
	return r.ok ? r.value_si : NaN;
}

/** Compile the match section with the document's (compiled) source. Errors are messages naming the field. */
export function compileMatch(raw: unknown, source: SourceSpec): { ok: true; problem: MatchProblem } | { ok: false; errors: string[] } {
	const parsed = v.safeParse(MatchSectionSchema, raw);
	if (!parsed.success) return { ok: false, errors: [`match.${v.getDotPath(parsed.issues[0]) ?? ''}: ${parsed.issues[0].message}`] };
	const m = parsed.output;
	const errors: string[] = [];
	const q = (t: string, spec: FieldSpec) => {
		const r = parseQuantity(t, spec);
		if (!r.ok) errors.push(r.message);
		return r.ok ? r.value_si : NaN;
	};
	const lam = source.wavelength_m;
	const interval = (r: { from: string; to: string }, what: string): Interval => ({ from_m: q(r.from, L(`${what} from`)), to_m: q(r.to, L(`${what} to`)) });
	const t = m.target;
	const at = q(t.at, L('Target position'));
	let target: TargetMode | null = null;
	if (t.kind === 'waist') {
		const wx = q(t.wx, L('Target waist (x)', { above_si: 0, min_si: undefined, max_si: 1 }));
		const wy = t.wy.trim() === '' ? wx : q(t.wy, L('Target waist (y)', { above_si: 0, min_si: undefined, max_si: 1 }));
		if (!errors.length) target = waistTarget(wx, wy, at, lam);
	} else if (t.kind === 'cavity') {
		const r1 = radius(t.r1, 'Mirror 1 radius', errors);
		const r2 = radius(t.r2, 'Mirror 2 radius', errors);
		const len = q(t.length, L('Cavity length', { above_si: 0, min_si: undefined }));
		if (!errors.length) target = cavityTarget(r1, r2, len, at, lam);
	} else {
		let mfd: number;
		if (t.mfd.trim() !== '') mfd = q(t.mfd, L('Mode-field diameter', { above_si: 0, min_si: undefined, max_si: 1e-3 }));
		else {
			const a = q(t.coreRadius, L('Core radius', { above_si: 0, min_si: undefined, max_si: 1e-3 }));
			const na = q(t.na, { label: 'NA', kind: 'dimensionless', above_si: 0, max_si: 0.99 });
			mfd = errors.length ? NaN : fiberMode(a, na, lam).mfd_m;
		}
		if (!errors.length) target = fiberTarget(mfd, at, lam);
	}
	const inventory = m.inventory.map((l, i) => {
		const f = q(l.focal, L(`Lens ${i + 1} (${l.label}) focal length`, { min_si: -1e2, max_si: 1e2 }));
		const d = l.diameter.trim() === '' ? null : q(l.diameter, L(`Lens ${i + 1} diameter`, { above_si: 0, min_si: undefined, max_si: 1 }));
		const c = Number(l.count);
		if (!(Number.isInteger(c) && c >= 0)) errors.push(`Lens ${i + 1} count must be a whole number ≥ 0 — got "${l.count}"`);
		return { label: l.label || `lens ${i + 1}`, f_m: f, diameter_m: d, count: c };
	});
	const constraints = {
		rail: interval(m.rail, 'Rail'),
		slots: m.slots.map((s, i) => interval(s, `Lens ${i + 1} range`)),
		keepOut: m.keepOut.map((s, i) => interval(s, `Keep-out ${i + 1}`)),
		minSpacing_m: q(m.minSpacing, L('Minimum spacing', { min_si: 0 })),
		lensCounts: m.lensCounts
	};
	if (errors.length || !target) return { ok: false, errors };
	const wx = resolveAxis(source.x, lam, source.index);
	const wy = resolveAxis(source.y, lam, source.index);
	const zr = (w0: number, m2: number) => (Math.PI * w0 * w0) / (m2 * lam);
	const input: InputBeam = {
		wavelength_m: lam,
		x: { q: { re: -wx.z0_m, im: zr(wx.w0_m, wx.m2) }, m2: wx.m2 },
		y: { q: { re: -wy.z0_m, im: zr(wy.w0_m, wy.m2) }, m2: wy.m2 }
	};
	return { ok: true, problem: { input, target, inventory, constraints, rankBy: m.rankBy as RankBy } };
}
