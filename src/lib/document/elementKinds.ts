/**
 * The catalogue of element kinds as the setup document stores them: each parameter is kept as the
 * text the user typed ("100 mm", "flat", "45 deg"), with the rule that turns it into the engine's SI
 * value. The bench form, the document validator and the CLI all read this one table.
 */
import { parseQuantity, type FieldSpec, type ParseResult } from '../units/parse';
import type { ElementSpec, ElementKind, Axis } from '../optics/elements';

export type ParamDef =
	| { key: string; type: 'quantity'; spec: FieldSpec; default: string; help?: string }
	/** A surface/mirror radius: a length, or "flat" / "inf" for a plane surface. */
	| { key: string; type: 'radius'; label: string; default: string; help?: string }
	| { key: string; type: 'choice'; label: string; choices: readonly string[]; default: string; help?: string };

export interface KindDef {
	kind: ElementKind;
	name: string;
	/** Short description for the add menu. */
	blurb: string;
	params: ParamDef[];
	build(v: Record<string, number | string>): ElementSpec;
}

const len = (label: string, extra: Partial<FieldSpec> = {}): FieldSpec => ({ label, kind: 'length', max_si: 1e4, min_si: -1e4, ...extra });
const idx = (label: string): FieldSpec => ({ label, kind: 'dimensionless', min_si: 1, max_si: 5 });
const ang = (label: string): FieldSpec => ({ label, kind: 'angle', min_si: 0, max_si: (89.9 * Math.PI) / 180 });
const axisChoice = ['x', 'y'] as const;

export const elementKinds: KindDef[] = [
	{
		kind: 'thinLens',
		name: 'Lens (thin)',
		blurb: 'spherical lens, focal length f (negative: diverging)',
		params: [{ key: 'f', type: 'quantity', spec: len('Focal length'), default: '100 mm', help: 'negative for a diverging lens; in a medium, f as measured in that medium' }],
		build: (v) => ({ kind: 'thinLens', f_m: v.f as number })
	},
	{
		kind: 'thickLens',
		name: 'Lens (thick)',
		blurb: 'two spherical surfaces, thickness and glass index',
		params: [
			{ key: 'r1', type: 'radius', label: 'Radius, first surface', default: '51.5 mm', help: '+ when its centre lies downstream; "flat" for plane' },
			{ key: 'r2', type: 'radius', label: 'Radius, second surface', default: '-51.5 mm' },
			{ key: 'thickness', type: 'quantity', spec: len('Centre thickness', { min_si: 0, max_si: 1 }), default: '5 mm' },
			{ key: 'n', type: 'quantity', spec: idx('Glass index'), default: '1.507' }
		],
		build: (v) => ({ kind: 'thickLens', r1_m: v.r1 as number, r2_m: v.r2 as number, thickness_m: v.thickness as number, index: v.n as number })
	},
	{
		kind: 'mirror',
		name: 'Curved mirror',
		blurb: 'spherical mirror at an angle of incidence (astigmatic when tilted)',
		params: [
			{ key: 'r', type: 'radius', label: 'Radius of curvature', default: '200 mm', help: '+ for concave (focusing), f = R/2 in any medium' },
			{ key: 'angle', type: 'quantity', spec: ang('Angle of incidence'), default: '0 deg' },
			{ key: 'plane', type: 'choice', label: 'Plane of incidence', choices: axisChoice, default: 'x' }
		],
		build: (v) => ({ kind: 'mirror', r_m: v.r as number, angle_rad: v.angle as number, plane: v.plane as Axis })
	},
	{
		kind: 'foldMirror',
		name: 'Flat mirror',
		blurb: 'fold mirror: changes direction, not the beam',
		params: [
			{ key: 'angle', type: 'quantity', spec: ang('Angle of incidence'), default: '45 deg' },
			{ key: 'plane', type: 'choice', label: 'Plane of incidence', choices: axisChoice, default: 'x' }
		],
		build: (v) => ({ kind: 'foldMirror', angle_rad: v.angle as number, plane: v.plane as Axis })
	},
	{
		kind: 'cylLens',
		name: 'Cylindrical lens',
		blurb: 'focuses one axis only',
		params: [
			{ key: 'f', type: 'quantity', spec: len('Focal length'), default: '150 mm', help: 'in a medium, f as measured in that medium' },
			{ key: 'axis', type: 'choice', label: 'Focusing axis', choices: axisChoice, default: 'x' }
		],
		build: (v) => ({ kind: 'cylLens', f_m: v.f as number, axis: v.axis as Axis })
	},
	{
		kind: 'interface',
		name: 'Interface',
		blurb: 'enter a new medium (flat or curved surface)',
		params: [
			{ key: 'n', type: 'quantity', spec: idx('Index after the surface'), default: '1.45' },
			{ key: 'r', type: 'radius', label: 'Surface radius', default: 'flat' }
		],
		build: (v) => ({ kind: 'interface', indexAfter: v.n as number, r_m: v.r as number })
	},
	{
		kind: 'plate',
		name: 'Tilted plate',
		blurb: 'window or Brewster plate: astigmatic path length',
		params: [
			{ key: 'thickness', type: 'quantity', spec: len('Thickness', { min_si: 0, max_si: 1 }), default: '3 mm' },
			{ key: 'n', type: 'quantity', spec: idx('Plate index'), default: '1.45' },
			{ key: 'angle', type: 'quantity', spec: ang('Angle of incidence'), default: '55.4 deg' },
			{ key: 'plane', type: 'choice', label: 'Plane of incidence', choices: axisChoice, default: 'x' }
		],
		build: (v) => ({ kind: 'plate', thickness_m: v.thickness as number, index: v.n as number, angle_rad: v.angle as number, plane: v.plane as Axis })
	},
	{
		kind: 'thermalLens',
		name: 'Thermal lens',
		blurb: 'heat-induced lens of a gain medium, per axis',
		params: [
			{ key: 'fx', type: 'quantity', spec: len('Focal length x'), default: '2 m', help: 'in a medium, f as measured in that medium' },
			{ key: 'fy', type: 'quantity', spec: len('Focal length y'), default: '2 m' }
		],
		build: (v) => ({ kind: 'thermalLens', fx_m: v.fx as number, fy_m: v.fy as number })
	},
	{
		kind: 'medium',
		name: 'Medium block',
		blurb: 'a length of glass, crystal or cell (flat faces)',
		params: [
			{ key: 'length', type: 'quantity', spec: len('Length', { min_si: 0, max_si: 10 }), default: '20 mm' },
			{ key: 'n', type: 'quantity', spec: idx('Index'), default: '1.8' }
		],
		build: (v) => ({ kind: 'medium', length_m: v.length as number, index: v.n as number })
	},
	{
		kind: 'abcd',
		name: 'ABCD matrix',
		blurb: 'any reduced ray matrix, x and y (AD − BC = 1)',
		params: [
			...(['x', 'y'] as const).flatMap((a) => [
				{ key: `a${a}`, type: 'quantity' as const, spec: { label: `A (${a})`, kind: 'dimensionless' as const, min_si: -1e6, max_si: 1e6 }, default: '1' },
				{ key: `b${a}`, type: 'quantity' as const, spec: len(`B (${a})`), default: '0 m' },
				{ key: `c${a}`, type: 'quantity' as const, spec: { label: `C (${a}), in 1/m`, kind: 'dimensionless' as const, min_si: -1e6, max_si: 1e6 }, default: '0' },
				{ key: `d${a}`, type: 'quantity' as const, spec: { label: `D (${a})`, kind: 'dimensionless' as const, min_si: -1e6, max_si: 1e6 }, default: '1' }
			])
		],
		build: (v) => ({
			kind: 'abcd',
			x: [v.ax as number, v.bx as number, v.cx as number, v.dx as number],
			y: [v.ay as number, v.by as number, v.cy as number, v.dy as number]
		})
	}
];

export const kindByName: Record<string, KindDef> = Object.fromEntries(elementKinds.map((k) => [k.kind, k]));

/** Parse a radius field: "flat", "inf", "∞" → Infinity; otherwise a non-zero length. */
export function parseRadius(text: string, label: string): ParseResult {
	const t = (text ?? '').trim().toLowerCase();
	if (t === 'flat' || t === 'inf' || t === 'infinity' || t === '∞' || t === 'plane') return { ok: true, value_si: Infinity };
	const r = parseQuantity(text, { label, kind: 'length', min_si: -1e4, max_si: 1e4 });
	if (r.ok && r.value_si === 0) return { ok: false, message: `${label} must be non-zero — use "flat" for a plane surface` };
	return r;
}

/** Parse one parameter's text by its definition. */
export function parseParam(def: ParamDef, text: string): { ok: true; value: number | string } | { ok: false; message: string } {
	if (def.type === 'choice') {
		return def.choices.includes(text) ? { ok: true, value: text } : { ok: false, message: `${def.label} must be one of ${def.choices.join(', ')} — got "${text}"` };
	}
	const r = def.type === 'radius' ? parseRadius(text, def.label) : parseQuantity(text, def.spec);
	if (!r.ok) return r;
	if (def.type === 'quantity' && def.spec.kind === 'length' && /focal/i.test(def.spec.label) && r.value_si === 0) {
		return { ok: false, message: `${def.spec.label} must be non-zero (negative for a diverging lens)` };
	}
	return { ok: true, value: r.value_si };
}

export function paramLabel(def: ParamDef): string {
	return def.type === 'quantity' ? def.spec.label : def.label;
}

export function defaultParams(kind: ElementKind): Record<string, string> {
	return Object.fromEntries(kindByName[kind].params.map((p) => [p.key, p.default]));
}
