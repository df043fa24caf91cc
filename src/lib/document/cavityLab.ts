/**
 * The cavity lab: the part of the setup document's `match` section (`match.lab`) that describes the
 * cavity's mirrors and the steering mirrors, the perturbation the user tries, and the peak heights read
 * off a scan — and its compilation into the cavity spectrum, the injected beam's mode content, the
 * predicted scan, and the diagnosis with its corrections (engine: optics/spectrum, modeContent, scan,
 * diagnose).
 *
 * The cavity is the match section's target ('cavity', 'ring' or 'folded'); the beam is the bench's beam
 * (with the lenses put on the bench) at the target plane. Offset and tilt are taken at the cavity mode's
 * waist, per axis (x horizontal, y vertical). Errors are keyed by the field's path inside `lab`.
 */
import * as v from 'valibot';
import { parseQuantity, type FieldSpec } from '../units/parse';
import { compileElement, freeSpaceMatrix, identity, mul, type Mat2, type Step } from '../optics/elements';
import { propagate, beamAt, type TrainInput } from '../optics/train';
import { cavitySpectrum, type CavitySpectrum } from '../optics/spectrum';
import { modeContent, axisModeContent, sizeRatioFromBeta, waistDistanceFromBeta, type ModeContent } from '../optics/modeContent';
import { predictedScan, findPeaks, type PredictedScan } from '../optics/scan';
import { diagnosePeaks, walkBeam, knobTurns, lensMoveFor, type MeasuredPeaks, type PeakDiagnosis, type SteeringSolution } from '../optics/diagnose';
import type { QHat } from '../optics/beam';
import { compileSetup } from './compile';
import type { SetupDoc } from './schema';
import type { CompiledMatch } from './match';

export { LabSchema, defaultLab, type LabSection } from './sectionDefaults';
import { LabSchema, defaultLab, type LabSection } from './sectionDefaults';

/** Read `match.lab` (defaults for what is missing). */
export function readLab(match: unknown): LabSection {
	const raw = match && typeof match === 'object' ? (match as Record<string, unknown>).lab : undefined;
	const r = v.safeParse(LabSchema, raw ?? {});
	return r.success ? r.output : defaultLab();
}

/** A fraction written as "0.99" or "99 %": ≥ 0 and < 1 (or ≤ 1 with `allowOne`). */
export function parseFraction(t: string, label: string, allowOne = false): { ok: true; value: number } | { ok: false; message: string } {
	const s = t.trim();
	const pct = s.endsWith('%');
	const r = parseQuantity(pct ? s.slice(0, -1) : s, { label, kind: 'dimensionless' });
	if (!r.ok) return { ok: false, message: r.message.replace('plain number', 'plain number or a percentage') };
	const val = pct ? r.value_si / 100 : r.value_si;
	if (!(val >= 0 && (allowOne ? val <= 1 : val < 1))) return { ok: false, message: `${label} must be ≥ 0 and ${allowOne ? '≤ 1 (100 %)' : '< 1 (below 100 %)'} — got ${s}` };
	return { ok: true, value: val };
}

const LEN = (label: string, min = -1e3, max = 1e3): FieldSpec => ({ label, kind: 'length', min_si: min, max_si: max });

export interface CavityGeometry {
	kind: 'linear' | 'ring';
	/** Optical round-trip path, m. */
	path_m: number;
	reflections: number;
	matrices: { x: Mat2; y: Mat2 };
	/** The cavity mode as a free beam at the target plane (bench position `at_m`). */
	mode: { x: QHat; y: QHat };
	at_m: number;
}

export interface LabPerturbation {
	offset_m: { x: number; y: number };
	tilt_rad: { x: number; y: number };
	lensId: string | null;
	lensShift_m: number;
}

export interface LabReport {
	fieldErrors: Record<string, string>;
	errors: string[];
	/** Why nothing can be computed yet (no cavity target, bench needs fixing…), or null. */
	blocked: string | null;
	spectrum: CavitySpectrum | null;
	content: ModeContent | null;
	/**
	 * The predicted scan (3001 points × every mode), worked out when first read: the Scan page reads it
	 * only where the plot is drawn, in a task of its own (src/lib/ui/island). `hasScan` says whether
	 * there is one without working it out.
	 */
	scan: PredictedScan | null;
	hasScan: boolean;
	/** The cavity mode per axis: waist, far-field angle, Rayleigh range, waist position on the bench. */
	cavity: { x: AxisMode; y: AxisMode } | null;
	/** Lenses on the bench before the cavity that may be moved (Match lenses first). */
	lenses: { id: string; label: string; z_m: number }[];
	perturbation: LabPerturbation | null;
	/** Steering-mirror turns that remove the perturbation's offset and tilt, per axis. */
	walk: { x: SteeringTurns; y: SteeringTurns } | null;
	reflectivity: { r1: number; r2: number; loss: number } | null;
}

export interface AxisMode {
	w0_m: number;
	theta0_rad: number;
	zR_m: number;
	waistAt_m: number;
}

export interface SteeringTurns extends SteeringSolution {
	turns1: number | null;
	turns2: number | null;
}

interface Ctx {
	train: TrainInput;
	geometry: CavityGeometry;
	lam: number;
	/** Cached: the source's beam before the first element, and the elements compiled in z order. */
	base?: { z_m: number; x: QHat; y: QHat; m2x: number; m2y: number };
	compiled?: { id: string; z_m: number; steps: Step[]; length_m: number; indexAfter: number }[];
}

/** Ray matrix (reduced; plain in air) from bench position z0 to z1 through the train's elements. */
export function rayMatrix(train: TrainInput, z0_m: number, z1_m: number): { x: Mat2; y: Mat2 } {
	let x: Mat2 = identity;
	let y: Mat2 = identity;
	let z = z0_m;
	let n = train.source.index;
	const els = train.elements.filter((e) => e.z_m >= z0_m && e.z_m < z1_m).sort((a, b) => a.z_m - b.z_m);
	// The medium index at z0: the index after the last element before it (air on a normal bench).
	for (const e of train.elements.filter((e) => e.z_m < z0_m).sort((a, b) => a.z_m - b.z_m)) n = compileElement(e.spec, n).indexAfter;
	for (const e of els) {
		const f = freeSpaceMatrix(e.z_m - z, n);
		x = mul(f, x);
		y = mul(f, y);
		const c = compileElement(e.spec, n);
		for (const s of c.steps) {
			if (s.op === 'travel') {
				x = mul([1, s.reducedX_m, 0, 1], x);
				y = mul([1, s.reducedY_m, 0, 1], y);
			} else {
				x = mul(s.x, x);
				y = mul(s.y, y);
			}
		}
		n = c.indexAfter;
		z = e.z_m + c.length_m;
	}
	const f = freeSpaceMatrix(z1_m - z, n);
	return { x: mul(f, x), y: mul(f, y) };
}

/**
 * The beam's q̂ per axis arriving at the target plane (the cavity's input mirror itself and anything at or
 * after it left out), with one element moved by `shift_m`. The source's beam is propagated once to the
 * first element; from there the ray matrices of the (moved) train carry it to the target.
 */
function beamAtTarget(ctx: Ctx, lensId: string | null, shift_m: number): { x: QHat; y: QHat; m2x: number; m2y: number } {
	const at = ctx.geometry.at_m;
	const base = ctx.base ?? (ctx.base = sourceBeam(ctx));
	let first = base.z_m;
	for (const e of ctx.train.elements) first = Math.min(first, e.id === lensId ? e.z_m + shift_m : e.z_m);
	if (first < base.z_m) {
		// A moved element now sits before the reference plane: propagate from the source directly.
		const elements = ctx.train.elements.map((e) => (lensId !== null && e.id === lensId ? { ...e, z_m: e.z_m + shift_m } : e)).filter((e) => e.z_m < at);
		const r = propagate({ ...ctx.train, elements, end_m: Math.max(ctx.train.end_m, at + 0.01) });
		const b = beamAt(r, at);
		return { x: b.x.q, y: b.y.q, m2x: r.m2x, m2y: r.m2y };
	}
	const m = compiledRayMatrix(ctx, lensId, shift_m, base.z_m, at);
	return { x: applyQ(m.x, base.x), y: applyQ(m.y, base.y), m2x: base.m2x, m2y: base.m2y };
}

function applyQ(mm: Mat2, q: QHat): QHat {
	const [A, B, C, D] = mm;
	const nr = A * q.re + B;
	const ni = A * q.im;
	const dr = C * q.re + D;
	const di = C * q.im;
	const den = dr * dr + di * di;
	return { re: (nr * dr + ni * di) / den, im: (ni * dr - nr * di) / den };
}

/** rayMatrix over the train's elements compiled once (cached on ctx), with one element moved. Air before the first element. */
function compiledRayMatrix(ctx: Ctx, movedId: string | null, shift_m: number, z0_m: number, z1_m: number): { x: Mat2; y: Mat2 } {
	if (!ctx.compiled) {
		let n = ctx.train.source.index;
		ctx.compiled = [...ctx.train.elements]
			.sort((a, b) => a.z_m - b.z_m)
			.map((e) => {
				const c = compileElement(e.spec, n);
				n = c.indexAfter;
				return { id: e.id, z_m: e.z_m, steps: c.steps, length_m: c.length_m, indexAfter: c.indexAfter };
			});
	}
	const els = ctx.compiled;
	let order = els;
	if (movedId !== null && shift_m !== 0) {
		order = els.map((e) => (e.id === movedId ? { ...e, z_m: e.z_m + shift_m } : e));
		order.sort((a, b) => a.z_m - b.z_m);
	}
	let x: Mat2 = identity;
	let y: Mat2 = identity;
	let z = z0_m;
	let n = 1;
	for (const e of order) {
		if (e.z_m < z0_m || e.z_m >= z1_m) continue;
		const d = (e.z_m - z) / n;
		x = [x[0] + d * x[2], x[1] + d * x[3], x[2], x[3]];
		y = [y[0] + d * y[2], y[1] + d * y[3], y[2], y[3]];
		for (const s of e.steps) {
			if (s.op === 'travel') {
				x = [x[0] + s.reducedX_m * x[2], x[1] + s.reducedX_m * x[3], x[2], x[3]];
				y = [y[0] + s.reducedY_m * y[2], y[1] + s.reducedY_m * y[3], y[2], y[3]];
			} else {
				x = mul(s.x, x);
				y = mul(s.y, y);
			}
		}
		n = e.indexAfter;
		z = e.z_m + e.length_m;
	}
	const d = (z1_m - z) / n;
	return { x: [x[0] + d * x[2], x[1] + d * x[3], x[2], x[3]], y: [y[0] + d * y[2], y[1] + d * y[3], y[2], y[3]] };
}

/** The source's beam in air at a plane before every element (or at the target when there are none). */
function sourceBeam(ctx: Ctx): { z_m: number; x: QHat; y: QHat; m2x: number; m2y: number } {
	const at = ctx.geometry.at_m;
	const r = propagate({ ...ctx.train, elements: [], end_m: Math.max(ctx.train.end_m, at + 0.01) });
	const firstEl = ctx.train.elements.reduce((m, e) => Math.min(m, e.z_m), at);
	const z = Math.min(firstEl, at) - 0.05;
	const b = beamAt(r, z);
	if (Math.abs(b.x.index - 1) > 1e-9) throw new RangeError(`the beam must travel in air between the source and the cavity — the source medium has index ${b.x.index}`);
	return { z_m: z, x: b.x.q, y: b.y.q, m2x: r.m2x, m2y: r.m2y };
}

const MAX_ORDER = 6;

/**
 * Compile the cavity lab from the whole document and the compiled match section (which supplies the
 * cavity). Never throws; problems come back as field errors or `blocked`.
 */
export function compileLab(doc: SetupDoc, match: CompiledMatch): LabReport & { ctx: Ctx | null } {
	const lab = readLab(doc.match);
	const out: LabReport & { ctx: Ctx | null } = { fieldErrors: {}, errors: [], blocked: null, spectrum: null, content: null, scan: null, hasScan: false, cavity: null, lenses: [], perturbation: null, walk: null, reflectivity: null, ctx: null };
	const err = (path: string, message: string) => {
		if (!(path in out.fieldErrors)) out.fieldErrors[path] = message;
		out.errors.push(message);
	};
	const frac = (path: string, t: string, label: string) => {
		const r = parseFraction(t, label);
		if (!r.ok) err(path, r.message);
		return r.ok ? r.value : NaN;
	};
	const r1 = frac('reflectivity1', lab.reflectivity1, 'Mirror 1 (input) reflectivity');
	const r2 = frac('reflectivity2', lab.reflectivity2, 'Output mirror reflectivity');
	const loss = frac('loss', lab.loss, 'Round-trip loss');
	if ([r1, r2, loss].every(Number.isFinite)) {
		const rt = r1 * r2 * (1 - loss);
		if (!(rt > 0.0295)) err('reflectivity1', `Mirror reflectivities and loss leave ${+(rt * 100).toPrecision(3)} % per round trip — must be above 2.95 % for separate resonance lines (raise R1 or R2)`);
		else out.reflectivity = { r1, r2, loss };
	}
	const q = (path: string, t: string, spec: FieldSpec) => {
		const r = parseQuantity(t, spec);
		if (!r.ok) err(path, r.message);
		return r.ok ? r.value_si : NaN;
	};
	const p = lab.perturb;
	const pert: LabPerturbation = {
		offset_m: { x: q('perturb.offsetX', p.offsetX, LEN('Offset x', -0.01, 0.01)), y: q('perturb.offsetY', p.offsetY, LEN('Offset y', -0.01, 0.01)) },
		tilt_rad: {
			x: q('perturb.tiltX', p.tiltX, { label: 'Tilt x', kind: 'angle', min_si: -0.1, max_si: 0.1 }),
			y: q('perturb.tiltY', p.tiltY, { label: 'Tilt y', kind: 'angle', min_si: -0.1, max_si: 0.1 })
		},
		lensId: p.lensId.trim() === '' ? null : p.lensId,
		lensShift_m: p.lensId.trim() === '' ? 0 : q('perturb.lensShift', p.lensShift, LEN('Lens move', -0.2, 0.2))
	};

	// The cavity.
	const rt = match.roundTrip ?? null;
	if (!rt) {
		out.blocked =
			match.cavity || match.ring
				? 'The cavity has no stable mode (see Match); its spectrum cannot be computed.'
				: 'The Match target is not a cavity. Choose a two-mirror, ring or folded cavity as the target on the Match page.';
		return out;
	}
	const c = compileSetup(doc);
	if (!c.ok) {
		out.blocked = `The bench needs fixing first: ${c.errors[0].message}`;
		return out;
	}
	const lam = c.input.source.wavelength_m;
	const ctx: Ctx = { train: c.input, geometry: rt, lam };
	out.ctx = ctx;
	const axisMode = (qq: QHat): AxisMode => {
		const w0 = Math.sqrt((lam * qq.im) / Math.PI);
		return { w0_m: w0, theta0_rad: lam / (Math.PI * w0), zR_m: qq.im, waistAt_m: rt.at_m - qq.re };
	};
	out.cavity = { x: axisMode(rt.mode.x), y: axisMode(rt.mode.y) };
	out.lenses = c.input.elements
		.filter((e) => e.z_m < rt.at_m && (e.spec.kind === 'thinLens' || e.spec.kind === 'thickLens' || e.spec.kind === 'cylLens'))
		.sort((a, b) => Number(b.id.startsWith('match-')) - Number(a.id.startsWith('match-')) || a.z_m - b.z_m)
		.map((e) => ({ id: e.id, label: e.label, z_m: e.z_m }));
	if (pert.lensId !== null && !out.lenses.some((l) => l.id === pert.lensId)) err('perturb.lensId', `Lens to move: "${pert.lensId}" is not a lens on the bench before the cavity`);

	if (out.reflectivity) {
		try {
			out.spectrum = cavitySpectrum({ kind: rt.kind, roundTrip_m: rt.path_m, matrices: rt.matrices, reflectivity1: out.reflectivity.r1, reflectivity2: out.reflectivity.r2, roundTripLoss: out.reflectivity.loss, reflections: rt.reflections, maxOrder: MAX_ORDER });
		} catch (e) {
			out.blocked = (e as Error).message;
			return out;
		}
	}
	if (out.errors.length) return out;
	out.perturbation = pert;
	try {
		const b = beamAtTarget(ctx, pert.lensId, pert.lensShift_m);
		out.content = modeContent(rt.mode, { x: { q: b.x, m2: b.m2x, offset_m: pert.offset_m.x, tilt_rad: pert.tilt_rad.x }, y: { q: b.y, m2: b.m2y, offset_m: pert.offset_m.y, tilt_rad: pert.tilt_rad.y } }, lam, MAX_ORDER);
	} catch (e) {
		out.blocked = `The beam cannot be put into the cavity: ${(e as Error).message}`;
		return out;
	}
	if (out.spectrum && out.reflectivity) {
		const { spectrum, reflectivity } = out;
		const modes = out.content.modes;
		const fsr = spectrum.fsr_Hz;
		let scan: PredictedScan | undefined;
		Object.defineProperty(out, 'scan', {
			enumerable: true,
			get: () => (scan ??= predictedScan(spectrum, modes, { reflectivity1: reflectivity.r1, reflectivity2: reflectivity.r2, roundTripLoss: reflectivity.loss }, 1, { from_Hz: -0.05 * fsr, to_Hz: 1.05 * fsr, points: 3001, minPeak: 1e-4 }))
		});
		out.hasScan = true;
	}
	const walk = steeringFor(ctx, lab, out, err, pert.offset_m, pert.tilt_rad);
	out.walk = walk;
	return out;
}

/** Steering-mirror turns (per axis) that remove an offset and tilt at the cavity waist; null while a field needs fixing. */
function steeringFor(ctx: Ctx, lab: LabSection, out: LabReport, err: (p: string, m: string) => void, offset: { x: number; y: number }, tilt: { x: number; y: number }): { x: SteeringTurns; y: SteeringTurns } | null {
	const q = (path: string, t: string, spec: FieldSpec) => {
		const r = parseQuantity(t, spec);
		if (!r.ok) err(path, r.message);
		return r.ok ? r.value_si : NaN;
	};
	const at = ctx.geometry.at_m;
	const z1 = q('steer1At', lab.steer1At, LEN('Steering mirror 1 position', -100, 100));
	const z2 = q('steer2At', lab.steer2At, LEN('Steering mirror 2 position', -100, 100));
	const aoi = q('steerAngle', lab.steerAngle, { label: 'Steering mirror angle of incidence', kind: 'angle', min_si: 0, max_si: (80 * Math.PI) / 180, defaultUnit: '°' });
	const perTurnText = lab.anglePerTurn.trim();
	const perTurn = perTurnText === '' ? null : q('anglePerTurn', lab.anglePerTurn, { label: 'Mount angle per knob turn', kind: 'angle', above_si: 0, max_si: 0.5 });
	if (![z1, z2, aoi].every(Number.isFinite) || (perTurn !== null && !Number.isFinite(perTurn))) return null;
	if (!(z1 < z2)) {
		err('steer2At', `Steering mirror 2 must come after mirror 1 (${lab.steer1At.trim()}) — got ${lab.steer2At.trim()}`);
		return null;
	}
	if (!(z2 < at)) {
		err('steer2At', `Steering mirror 2 must come before the cavity's input mirror (${(at * 1000).toPrecision(4)} mm) — got ${lab.steer2At.trim()}`);
		return null;
	}
	const m1 = rayMatrix(ctx.train, z1, at);
	const m2 = rayMatrix(ctx.train, z2, at);
	const toWaist = (m: { x: Mat2; y: Mat2 }, a: 'x' | 'y') => mul(freeSpaceMatrix(-ctx.geometry.mode[a].re), m[a]);
	const gain = { x: 2, y: 2 * Math.cos(aoi) };
	try {
		const axis = (a: 'x' | 'y'): SteeringTurns => {
			const s = walkBeam(toWaist(m1, a), toWaist(m2, a), offset[a], tilt[a], gain[a]);
			return { ...s, turns1: perTurn === null ? null : knobTurns(s.mirror1_rad, perTurn), turns2: perTurn === null ? null : knobTurns(s.mirror2_rad, perTurn) };
		};
		return { x: axis('x'), y: axis('y') };
	} catch (e) {
		err('steer2At', `Steering mirrors: ${(e as Error).message}`);
		void out;
		return null;
	}
}

/** Peak heights from the form's text (''/blank optional ones → null); errors keyed "peaks.<name>". */
export function readPeaks(lab: LabSection): { ok: true; peaks: MeasuredPeaks } | { ok: false; fieldErrors: Record<string, string> } {
	const fe: Record<string, string> = {};
	const names: Record<string, string> = { p00: 'TEM00 peak', p10: 'TEM10 peak', p01: 'TEM01 peak', p20: 'TEM20 peak', p02: 'TEM02 peak', p11: 'TEM11 peak', sum: 'Sum of all peaks' };
	const val = (k: keyof typeof names, optional: boolean): number | null => {
		const t = (lab.peaks as Record<string, string>)[k].trim();
		if (t === '') {
			if (optional) return null;
			fe[`peaks.${k}`] = `${names[k]} is empty — enter its height (any one unit for all peaks, e.g. volts on the scope), 0 if not seen`;
			return NaN;
		}
		const n = Number(t.replace(/[−–]/g, '-').replace(/(\d),(\d)/, '$1.$2').replace(/\s*(mV|V|mW|µW|uW|W|nW|%)$/i, ''));
		if (!(Number.isFinite(n) && n >= 0)) {
			fe[`peaks.${k}`] = `${names[k]} must be a number ≥ 0 (any one unit for all peaks) — got "${t}"`;
			return NaN;
		}
		return n;
	};
	const peaks = { p00: val('p00', false)!, p10: val('p10', false)!, p01: val('p01', false)!, p20: val('p20', false)!, p02: val('p02', false)!, p11: val('p11', true), sum: val('sum', true) };
	const noise = parseFraction(lab.peaks.noise, 'Reading uncertainty');
	if (!noise.ok) fe['peaks.noise'] = noise.message;
	else if (!(noise.value > 0 && noise.value < 0.5)) fe['peaks.noise'] = `Reading uncertainty must be > 0 and < 50 % of the largest peak — got ${lab.peaks.noise.trim()}`;
	if (!fe['peaks.p00'] && peaks.p00 === 0) fe['peaks.p00'] = 'TEM00 peak must be > 0 (the fundamental must be seen)';
	if (Object.keys(fe).length === 0 && peaks.sum !== null) {
		const total = peaks.p00 + peaks.p10 + peaks.p01 + peaks.p20 + peaks.p02 + (peaks.p11 ?? 0);
		if (total > peaks.sum * (1 + 1e-9)) fe['peaks.sum'] = `The peaks add up to ${+total.toPrecision(6)}, more than the sum of all peaks entered (${peaks.sum}) — check the heights or leave the sum empty`;
	}
	if (Object.keys(fe).length) return { ok: false, fieldErrors: fe };
	return { ok: true, peaks: { ...peaks, noise: noise.ok ? noise.value : 0.01 } };
}

export interface AxisEstimate {
	/** Misalignment size ε and, if it were all offset / all tilt at the cavity waist, its size (sign unknown). */
	epsilon: { value: number; sigma: number };
	offsetIfAll_m: { value: number; sigma: number };
	tiltIfAll_rad: { value: number; sigma: number };
	/** Mismatch size |β| and, if it were all waist size / all waist position, its size. */
	beta: { value: number; sigma: number };
	/** Beam waist / cavity waist (or its inverse: sign unknown), and waist distance ± (sign unknown). */
	sizeRatioIfAll: number;
	waistDistanceIfAll_m: { value: number; sigma: number };
	/** Steering turns that remove the offset (if all offset) or the tilt (if all tilt), for the + sign. */
	walkIfOffset: SteeringTurns | null;
	walkIfTilt: SteeringTurns | null;
}

export interface LabDiagnosis {
	fit: PeakDiagnosis;
	x: AxisEstimate;
	y: AxisEstimate;
	/** For each movable lens: the move back (correction) that would remove the mismatch if that lens alone were off, both signs. */
	lensMoves: { id: string; label: string; moveA_m: number | null; moveB_m: number | null; misfit: number }[];
	ambiguity: string;
}

/** Diagnose the measured peaks against the cavity of the compiled lab (throws RangeError for bad peaks). */
export function diagnoseLab(doc: SetupDoc, report: LabReport & { ctx: Ctx | null }, peaks: MeasuredPeaks): LabDiagnosis {
	const fit = diagnosePeaks(peaks);
	const ctx = report.ctx;
	if (!ctx || !report.cavity) throw new RangeError(report.blocked ?? 'cavity lab: the cavity and the bench beam are needed for the corrections');
	const lab = readLab(doc.match);
	const noop = () => {};
	const axis = (a: 'x' | 'y'): AxisEstimate => {
		const m = report.cavity![a];
		const e = fit.misalignment[a];
		const b = fit.mismatch[a];
		const off = { value: e.value * m.w0_m, sigma: e.sigma * m.w0_m };
		const tilt = { value: e.value * m.theta0_rad, sigma: e.sigma * m.theta0_rad };
		const bv = Math.min(b.value, 0.999);
		const dist = waistDistanceFromBeta(bv, m.zR_m);
		const dd = (2 * m.zR_m) / Math.pow(1 - bv * bv, 1.5);
		const walkOff = steeringFor(ctx, lab, report, noop, { x: a === 'x' ? off.value : 0, y: a === 'y' ? off.value : 0 }, { x: 0, y: 0 });
		const walkTilt = steeringFor(ctx, lab, report, noop, { x: 0, y: 0 }, { x: a === 'x' ? tilt.value : 0, y: a === 'y' ? tilt.value : 0 });
		return {
			epsilon: e,
			offsetIfAll_m: off,
			tiltIfAll_rad: tilt,
			beta: b,
			sizeRatioIfAll: sizeRatioFromBeta(bv),
			waistDistanceIfAll_m: { value: dist, sigma: Number.isFinite(b.sigma) ? dd * b.sigma : Infinity },
			walkIfOffset: walkOff ? walkOff[a] : null,
			walkIfTilt: walkTilt ? walkTilt[a] : null
		};
	};
	const measured = { x: fit.mismatch.x.value, y: fit.mismatch.y.value };
	const lensMoves = report.lenses.map((l) => {
		const betaAt = (d: number) => {
			const b = beamAtTarget(ctx, l.id, d);
			const bx = axisModeContent(ctx.geometry.mode.x, { q: b.x }, ctx.lam, 0).beta;
			const by = axisModeContent(ctx.geometry.mode.y, { q: b.y }, ctx.lam, 0).beta;
			return { x: Math.hypot(bx.re, bx.im), y: Math.hypot(by.re, by.im) };
		};
		try {
			const r = lensMoveFor(betaAt, measured, 0.03, 21);
			const tidy = (v: number | null) => (v === null ? null : Math.abs(v) < 1e-6 ? 0 : -v);
			return { id: l.id, label: l.label, moveA_m: tidy(r.plus), moveB_m: tidy(r.minus), misfit: Math.min(r.misfit.plus, r.misfit.minus) };
		} catch {
			return { id: l.id, label: l.label, moveA_m: null, moveB_m: null, misfit: Infinity };
		}
	});
	return { fit, x: axis('x'), y: axis('y'), lensMoves, ambiguity: fit.ambiguity };
}

/**
 * Peaks from a CSV: either rows "peak,height" (peak one of 00, 10, 01, 20, 02, 11, sum; a header row is
 * allowed), or a trace "detuning_Hz,power" whose peaks are found and assigned to the nearest predicted
 * mode frequency (the highest peak is TEM00). Returns the peak heights or the line-numbered reason.
 */
export function parsePeaksCsv(csv: string, spectrum: CavitySpectrum | null): { ok: true; peaks: MeasuredPeaks; unassigned: number[] } | { ok: false; message: string } {
	const lines = csv
		.split(/\r?\n/)
		.map((l, i) => ({ n: i + 1, cells: l.split(/[,;\t]/).map((c) => c.trim()) }))
		.filter((l) => l.cells.some((c) => c !== '') && !l.cells[0].startsWith('#'));
	if (lines.length === 0) return { ok: false, message: 'peaks CSV: no rows — expected "peak,height" rows (00, 10, 01, 20, 02, 11, sum) or a trace "detuning_Hz,power"' };
	const names = ['00', '10', '01', '20', '02', '11', 'sum'];
	const norm = (s: string) => s.replace(/^tem/i, '').replace(/^'|'$/g, '').toLowerCase();
	const labelled = lines.some((l) => names.includes(norm(l.cells[0])));
	if (labelled) {
		const got: Record<string, number> = {};
		for (const l of lines) {
			const k = norm(l.cells[0]);
			if (!names.includes(k)) {
				if (l === lines[0]) continue; // header
				return { ok: false, message: `peaks CSV line ${l.n}: "${l.cells[0]}" is not a peak — one of ${names.join(', ')}` };
			}
			const h = Number(l.cells[1]);
			if (!(l.cells[1] !== undefined && l.cells[1] !== '' && Number.isFinite(h) && h >= 0)) return { ok: false, message: `peaks CSV line ${l.n}: height of ${k} must be a number ≥ 0 — got "${l.cells[1] ?? ''}"` };
			got[k] = h;
		}
		for (const k of ['00', '10', '01', '20', '02']) if (!(k in got)) return { ok: false, message: `peaks CSV: the row for peak ${k} is missing (0 if not seen)` };
		return { ok: true, peaks: { p00: got['00'], p10: got['10'], p01: got['01'], p20: got['20'], p02: got['02'], p11: got['11'] ?? null, sum: got['sum'] ?? null }, unassigned: [] };
	}
	// A trace.
	const rows = lines.filter((l, i) => !(i === 0 && !Number.isFinite(Number(l.cells[0]))));
	const det: number[] = [];
	const pw: number[] = [];
	for (const l of rows) {
		const a = Number(l.cells[0]);
		const b = Number(l.cells[1]);
		if (!(Number.isFinite(a) && Number.isFinite(b))) return { ok: false, message: `peaks CSV line ${l.n}: expected two numbers "detuning_Hz,power" — got "${l.cells.join(',')}"` };
		det.push(a);
		pw.push(b);
	}
	if (!spectrum) return { ok: false, message: 'peaks CSV: a trace needs the cavity spectrum to name its peaks — the cavity must be stable' };
	if (det.length < 3) return { ok: false, message: 'peaks CSV: a trace needs at least 3 rows of detuning_Hz,power' };
	const fsr = spectrum.fsr_Hz;
	const tol = Math.max(3 * spectrum.linewidth_Hz, 0.005 * fsr);
	const found = findPeaks(det, pw, tol);
	if (found.length === 0) return { ok: false, message: 'peaks CSV: no peak found in the trace' };
	const top = found.reduce((a, b) => (b.height > a.height ? b : a));
	const want: Record<string, number> = { '00': 0, '10': 0, '01': 0, '20': 0, '02': 0, '11': 0 };
	const unassigned: number[] = [];
	for (const pk of found) {
		let off = (pk.detuning_Hz - top.detuning_Hz) % fsr;
		if (off < 0) off += fsr;
		let best: { k: string; d: number } | null = null;
		for (const m of spectrum.modes.filter((mm) => mm.m + mm.n <= 2)) {
			const d = Math.min(Math.abs(off - m.folded_Hz), fsr - Math.abs(off - m.folded_Hz));
			if (d <= tol && (!best || d < best.d)) best = { k: `${m.m}${m.n}`, d };
		}
		if (best) want[best.k] = Math.max(want[best.k], pk.height);
		else unassigned.push(pk.detuning_Hz);
	}
	return { ok: true, peaks: { p00: want['00'], p10: want['10'], p01: want['01'], p20: want['20'], p02: want['02'], p11: want['11'], sum: null }, unassigned };
}
