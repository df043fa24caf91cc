/**
 * Propagation of a real, simply astigmatic Gaussian beam through an optical train.
 *
 * The train is a list of positioned elements. Each compiles into primitive steps (elements.ts);
 * between elements the beam travels through the current medium. On each axis q̂ follows the ABCD law
 * q̂′ = (A·q̂ + B)/(C·q̂ + D) (Kogelnik & Li 1966, eq. 26); free space adds d/n to q̂.
 * The Gouy phase accumulates as −arg(A + B/q̂) through each step (Siegman 1986, §20.1).
 */
import { paraxialProblem } from './paraxial';
import { beamFromQ, type BeamAt, type QHat } from './beam';
import { compileElement, type ElementSpec, type Mat2, type Step } from './elements';
import { resolveAxis, type AxisWaist, type SourceSpec } from './source';
import { clippedTransmission } from './aperture';

export interface TrainElement {
	id: string;
	label: string;
	/** Position of the element's entrance along the axis, m. */
	z_m: number;
	/** Clear-aperture diameter, m; null when not limiting. */
	aperture_m: number | null;
	spec: ElementSpec;
}

export interface TrainInput {
	source: SourceSpec;
	elements: TrainElement[];
	/** Where the plot and the last segment end, m (when the last element ends past it: 5 % beyond that element). */
	end_m: number;
}

/** One stretch of medium on which q̂ changes linearly with z. */
export interface Segment {
	z0_m: number;
	z1_m: number;
	index: number;
	/** Reduced length per metre of axis, per axis (1/n in plain media, different in a tilted plate). */
	kx: number;
	ky: number;
	qx: QHat;
	qy: QHat;
	gouyX_rad: number;
	gouyY_rad: number;
	/** Element whose inside this is, or null for the space between elements. */
	insideId: string | null;
	/** Label of the element this stretch follows (null for the first stretch after the source). */
	afterLabel: string | null;
}

export interface Waist {
	axis: 'x' | 'y';
	segment: number;
	/** Waist position, m (may lie outside its segment: then virtual). */
	z_m: number;
	w0_m: number;
	zR_m: number;
	virtual: boolean;
	insideId: string | null;
}

export type WarningCode = 'clipped' | 'larger-than-aperture' | 'virtual-waist' | 'overlap' | 'source-note' | 'not-paraxial';

export interface TrainWarning {
	code: WarningCode;
	/** 'warning' needs the user's attention (clipping, overlap); 'info' is a note (virtual waists, source fit notes). */
	level: 'warning' | 'info';
	elementId: string | null;
	message: string;
	/** Transmitted fraction for clipping warnings. */
	transmitted?: number;
}

export interface ElementReport {
	id: string;
	label: string;
	z_m: number;
	length_m: number;
	/** Beam arriving at the element's entrance, and leaving its exit. */
	in: { x: BeamAt; y: BeamAt };
	out: { x: BeamAt; y: BeamAt };
	/** Fraction of power passing the clear aperture (1 when none is set). */
	transmitted: number;
}

export interface Propagation {
	wavelength_m: number;
	m2x: number;
	m2y: number;
	sourceWaists: { x: AxisWaist; y: AxisWaist };
	segments: Segment[];
	elements: ElementReport[];
	waists: Waist[];
	warnings: TrainWarning[];
	start_m: number;
	end_m: number;
	/** Power fraction left after every aperture. */
	transmitted: number;
}

/**
 * One q-propagation step: q̂′ = (A·q̂ + B)/(C·q̂ + D) (Kogelnik & Li 1966, eq. 26), with the Gouy phase
 * gained, −arg(A + B/q̂). Plain-number complex arithmetic; this is the engine's hot path.
 */
export function applyMat(m: Mat2, q: QHat): { q: QHat; dGouy: number } {
	// q' = (A q + B) / (C q + D) with plain complex arithmetic.
	const nr = m[0] * q.re + m[1];
	const ni = m[0] * q.im;
	const dr = m[2] * q.re + m[3];
	const di = m[2] * q.im;
	const den = dr * dr + di * di;
	// A + B/q = (C q + D)/q · q'/... use the identity A + B/q̂ = (A q̂ + B)/q̂.
	const qq = q.re * q.re + q.im * q.im;
	const gr = (nr * q.re + ni * q.im) / qq;
	const gi = (ni * q.re - nr * q.im) / qq;
	return { q: { re: (nr * dr + ni * di) / den, im: (ni * dr - nr * di) / den }, dGouy: -Math.atan2(gi, gr) };
}

/** Propagate the source through the train. Throws RangeError for invalid source or element parameters. */
export function propagate(input: TrainInput): Propagation {
	const { source } = input;
	const lam = source.wavelength_m;
	const wx = resolveAxis(source.x, lam, source.index);
	const wy = resolveAxis(source.y, lam, source.index);
	const propsX = { wavelength_m: lam, m2: wx.m2 };
	const propsY = { wavelength_m: lam, m2: wy.m2 };
	const warnings: TrainWarning[] = [];
	for (const [axis, w] of [['x', wx], ['y', wy]] as const) {
		if (w.note) warnings.push({ code: 'source-note', level: 'info', elementId: null, message: `Source ${axis}: ${w.note}` });
	}

	let n = source.index;
	const zRx = (Math.PI * n * wx.w0_m ** 2) / (wx.m2 * lam);
	const zRy = (Math.PI * n * wy.w0_m ** 2) / (wy.m2 * lam);
	const start = 0;
	let qx: QHat = { re: (start - wx.z0_m) / n, im: zRx / n };
	let qy: QHat = { re: (start - wy.z0_m) / n, im: zRy / n };
	let gx = Math.atan2(qx.re, qx.im);
	let gy = Math.atan2(qy.re, qy.im);
	let z = start;

	const segments: Segment[] = [];
	const reports: ElementReport[] = [];
	const sorted = input.elements.map((e, i) => ({ e, i })).sort((a, b) => a.e.z_m - b.e.z_m || a.i - b.i).map((p) => p.e);

	const travel = (length: number, redX: number, redY: number, index: number, insideId: string | null) => {
		if (length <= 0) return;
		// Plain media advance q̂ by exactly 1/n per metre (kept exact so that the beam read out is too).
		const k = (red: number) => (red === length / index ? 1 / index : red / length);
		segments.push({ z0_m: z, z1_m: z + length, index, kx: k(redX), ky: k(redY), qx, qy, gouyX_rad: gx, gouyY_rad: gy, insideId, afterLabel });
		const nqx = { re: qx.re + redX, im: qx.im };
		const nqy = { re: qy.re + redY, im: qy.im };
		gx += Math.atan2(nqx.re, nqx.im) - Math.atan2(qx.re, qx.im);
		gy += Math.atan2(nqy.re, nqy.im) - Math.atan2(qy.re, qy.im);
		qx = nqx;
		qy = nqy;
		z += length;
	};
	const snapshot = (): { x: BeamAt; y: BeamAt } => ({
		x: { ...beamFromQ(qx, propsX, n), gouy_rad: gx },
		y: { ...beamFromQ(qy, propsY, n), gouy_rad: gy }
	});

	let transmittedTotal = 1;
	let afterLabel: string | null = null;
	for (const el of sorted) {
		if (!Number.isFinite(el.z_m)) throw new RangeError(`${el.label} position must be a finite distance — got ${el.z_m} m`);
		const gap = el.z_m - z;
		if (gap < -1e-12) {
			warnings.push({
				code: 'overlap',
				level: 'warning',
				elementId: el.id,
				message: `${el.label} at ${fmtM(el.z_m)} starts inside the previous element or before the source plane (which ends at ${fmtM(z)}); it is placed there`
			});
		}
		if (gap > 0) travel(gap, gap / n, gap / n, n, null);
		let compiled;
		try {
			compiled = compileElement(el.spec, n);
		} catch (e) {
			throw new RangeError(`${el.label}: ${(e as Error).message}`);
		}
		const zIn = z;
		const before = snapshot();
		let transmitted = 1;
		if (el.aperture_m !== null) {
			const a = el.aperture_m / 2;
			const wMax = Math.max(before.x.w_m, before.y.w_m);
			// Past a = 3·w the power outside is below exp(−18) ≈ 1.5e-8 for any ellipse (the round
			// beam of the larger radius bounds it; Siegman 1986, eq. 17.9): skip the angular integral.
			transmitted = a > 3 * wMax ? 1 : clippedTransmission(a, before.x.w_m, before.y.w_m);
			if (wMax >= a) {
				warnings.push({
					code: 'larger-than-aperture',
					level: 'warning',
					elementId: el.id,
					transmitted,
					message: `${el.label}: the beam radius (${fmtM(wMax)}) is larger than the clear aperture radius (${fmtM(a)}) — only ${(transmitted * 100).toPrecision(3)} % passes`
				});
			} else if (transmitted < 0.999) {
				warnings.push({
					code: 'clipped',
					level: 'warning',
					elementId: el.id,
					transmitted,
					message: `${el.label}: the beam is clipped by the ${fmtM(el.aperture_m)} clear aperture — ${(transmitted * 100).toPrecision(4)} % passes`
				});
			}
			transmittedTotal *= transmitted;
		}
		runSteps(compiled.steps, el.id);
		n = compiled.indexAfter;
		afterLabel = el.label;
		reports.push({ id: el.id, label: el.label, z_m: zIn, length_m: compiled.length_m, in: before, out: snapshot(), transmitted });
	}
	function runSteps(steps: Step[], id: string) {
		for (const s of steps) {
			if (s.op === 'travel') travel(s.length_m, s.reducedX_m, s.reducedY_m, s.index, id);
			else {
				const rx = applyMat(s.x, qx);
				const ry = applyMat(s.y, qy);
				qx = rx.q;
				qy = ry.q;
				gx += rx.dGouy;
				gy += ry.dGouy;
			}
		}
	}
	// Past the requested end? Extend it a little beyond the last element so that element stays visible.
	const end = z > input.end_m ? z + 0.05 * Math.max(z - start, 1e-3) : input.end_m;
	if (end > z) travel(end - z, (end - z) / n, (end - z) / n, n, null);
	if (segments.length === 0) {
		// A train of zero length: keep one degenerate segment so lookups still work.
		segments.push({ z0_m: z, z1_m: z, index: n, kx: 1 / n, ky: 1 / n, qx, qy, gouyX_rad: gx, gouyY_rad: gy, insideId: null, afterLabel });
	}

	const waists: Waist[] = [];
	segments.forEach((s, i) => {
		for (const axis of ['x', 'y'] as const) {
			const q = physicalQ(axis === 'x' ? s.qx : s.qy, axis === 'x' ? s.kx : s.ky, s.index);
			const props = axis === 'x' ? propsX : propsY;
			// In the true reduced q̂ the beam advances by 1/n per metre of path.
			const zw = s.z0_m - q.re * s.index;
			const b = beamFromQ({ re: 0, im: q.im }, props, s.index);
			const virtual = zw < s.z0_m - 1e-12 || zw > s.z1_m + 1e-12;
			waists.push({ axis, segment: i, z_m: zw, w0_m: b.w_m, zR_m: q.im * s.index, virtual, insideId: s.insideId });
		}
	});
	for (const w of waists) {
		const s = segments[w.segment];
		if (!w.virtual || s.insideId !== null || s.afterLabel === null || w.z_m >= s.z0_m) continue;
		const prev = waists.find((o) => o.segment === w.segment - 1 && o.axis === w.axis);
		if (prev && Math.abs(prev.z_m - w.z_m) <= 1e-9 * Math.max(1, Math.abs(w.z_m)) && Math.abs(prev.w0_m - w.w0_m) <= 1e-9 * w.w0_m) continue;
		warnings.push({
			code: 'virtual-waist',
			level: 'info',
			elementId: null,
			message: `after ${s.afterLabel} the ${w.axis} beam diverges from a virtual waist at ${fmtM(w.z_m)} (no real ${w.axis} waist between ${fmtM(s.z0_m)} and ${fmtM(s.z1_m)})`
		});
	}
	// A focus tighter than the paraxial range (paraxial.ts) is flagged: the numbers past it are not a real beam.
	for (const w of waists) {
		if (w.virtual) continue;
		const s = segments[w.segment];
		const p = paraxialProblem(w.w0_m, lam, w.axis === 'x' ? wx.m2 : wy.m2, s.index, `the ${w.axis} waist ${s.afterLabel ? `after ${s.afterLabel}` : 'of the source'}`);
		if (p) warnings.push({ code: 'not-paraxial', level: 'warning', elementId: null, message: `${p} — the beam past this point is outside what the model describes` });
	}

	return {
		wavelength_m: lam,
		m2x: wx.m2,
		m2y: wy.m2,
		sourceWaists: { x: wx, y: wy },
		segments,
		elements: reports,
		waists,
		warnings,
		start_m: start,
		end_m: end,
		transmitted: transmittedTotal
	};
}

/**
 * The true reduced q̂ on a segment from the one the train carries. In plain media they are the same
 * (k = 1/n). Inside a tilted plate the train carries the outside-equivalent q̂, which advances by the
 * plate's effective reduced length k per metre of path (Kogelnik, Ippen, Dienes & Shank, IEEE JQE 8,
 * 373 (1972), eqs. 4–5); the beam inside has q̂_in = q̂·cos²θ2/cos²θ1 on the tangential axis, i.e.
 * q̂/(k·n), so that its width scales by cosθ2/cosθ1 and it advances by 1/n per metre.
 */
function physicalQ(q: QHat, k: number, index: number): QHat {
	const s = plateScale(k, index);
	return s === 1 ? q : { re: q.re * s, im: q.im * s };
}

/** 1/(k·n): 1 in plain media (exactly, so that rounding leaves their beams untouched). */
function plateScale(k: number, index: number): number {
	const kn = k * index;
	return Math.abs(kn - 1) < 1e-12 ? 1 : 1 / kn;
}

/** Index of the segment holding z (the first one at a shared boundary downstream of an element). */
export function segmentAt(p: Propagation, z_m: number): number {
	const segs = p.segments;
	let lo = 0;
	let hi = segs.length - 1;
	if (z_m <= segs[0].z0_m) return 0;
	if (z_m >= segs[hi].z0_m) return hi;
	while (lo < hi) {
		const mid = (lo + hi + 1) >> 1;
		if (segs[mid].z0_m <= z_m) lo = mid;
		else hi = mid - 1;
	}
	return lo;
}

/**
 * The beam on both axes at any z of the train (z before the source plane or past the end is read
 * from the first or last segment's free-space law).
 */
export function beamAt(p: Propagation, z_m: number): { x: BeamAt; y: BeamAt } {
	const s = p.segments[segmentAt(p, z_m)];
	const dz = z_m - s.z0_m;
	const qx = physicalQ({ re: s.qx.re + dz * s.kx, im: s.qx.im }, s.kx, s.index);
	const qy = physicalQ({ re: s.qy.re + dz * s.ky, im: s.qy.im }, s.ky, s.index);
	const bx = beamFromQ(qx, { wavelength_m: p.wavelength_m, m2: p.m2x }, s.index);
	const by = beamFromQ(qy, { wavelength_m: p.wavelength_m, m2: p.m2y }, s.index);
	bx.gouy_rad = s.gouyX_rad + Math.atan2(qx.re, qx.im) - Math.atan2(s.qx.re, s.qx.im);
	by.gouy_rad = s.gouyY_rad + Math.atan2(qy.re, qy.im) - Math.atan2(s.qy.re, s.qy.im);
	return { x: bx, y: by };
}

/** Beam radius only (fast path for sampling): w² = M²λ·|q̂|²/(π·Im q̂). */
export function radiusAt(p: Propagation, z_m: number, axis: 'x' | 'y'): number {
	const s = p.segments[segmentAt(p, z_m)];
	const dz = z_m - s.z0_m;
	const q = axis === 'x' ? s.qx : s.qy;
	const k = axis === 'x' ? s.kx : s.ky;
	const re = q.re + dz * k;
	const m2 = axis === 'x' ? p.m2x : p.m2y;
	// Scaled to the true q̂ inside a tilted plate (see physicalQ): w² scales with it.
	return Math.sqrt((m2 * p.wavelength_m * (re * re + q.im * q.im) * plateScale(k, s.index)) / (Math.PI * q.im));
}

function fmtM(v: number): string {
	const a = Math.abs(v);
	if (a >= 1) return `${+v.toPrecision(4)} m`;
	if (a >= 1e-3) return `${+(v * 1e3).toPrecision(4)} mm`;
	return `${+(v * 1e6).toPrecision(4)} µm`;
}
