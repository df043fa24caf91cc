/**
 * Property tests of the engine (fast-check): algebraic facts of reduced ABCD matrices and the q law
 * (Kogelnik & Li, "Laser Beams and Resonators", Appl. Opt. 5, 1550, 1966; Siegman, "Lasers", 1986, §15.2)
 * that must hold for every valid input, not only for the reference cases.
 */
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import './seed';
import { expectClose } from '../helpers';
import {
	beamAt,
	elementMatrices,
	freeSpaceMatrix,
	identity,
	mul,
	propagate,
	sampleCaustic,
	thinLensMatrix,
	type ElementSpec,
	type Mat2,
	type QHat,
	type SourceSpec,
	type TrainElement,
	type TrainInput
} from '../../src/lib/optics';

const RUNS = { numRuns: 150 };

// ---- arbitraries -------------------------------------------------------------------------------

const sign = fc.constantFrom(1, -1);
/** A length with a random sign, magnitude log-uniform in [lo, hi]. */
const signedLength = (lo: number, hi: number) =>
	fc.tuple(sign, fc.double({ min: Math.log(lo), max: Math.log(hi), noNaN: true })).map(([s, l]) => s * Math.exp(l));
const positive = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true });
const index = positive(1, 4);
const angle = positive(0, 1.4);
const axis = fc.constantFrom<'x' | 'y'>('x', 'y');
const radius = fc.oneof(signedLength(5e-3, 10), fc.constant(Infinity));

/** A reduced matrix with determinant 1 built from A, B, C (D = (1 + B·C)/A). */
const unimodular: fc.Arbitrary<Mat2> = fc
	.tuple(signedLength(0.2, 5), signedLength(1e-3, 1), signedLength(1e-2, 10))
	.map(([a, b, c]) => [a, b, c, (1 + b * c) / a] as const);

/** Every element kind, with random valid parameters. */
const anyElement: fc.Arbitrary<ElementSpec> = fc.oneof(
	signedLength(1e-2, 10).map((f_m): ElementSpec => ({ kind: 'thinLens', f_m })),
	fc.record({ r1_m: radius, r2_m: radius, thickness_m: positive(0, 0.03), index }).map((r): ElementSpec => ({ kind: 'thickLens', ...r })),
	fc.record({ r_m: signedLength(1e-2, 10), angle_rad: angle, plane: axis }).map((r): ElementSpec => ({ kind: 'mirror', ...r })),
	fc.record({ angle_rad: angle, plane: axis }).map((r): ElementSpec => ({ kind: 'foldMirror', ...r })),
	fc.record({ f_m: signedLength(1e-2, 10), axis }).map((r): ElementSpec => ({ kind: 'cylLens', ...r })),
	fc.record({ indexAfter: index, r_m: radius }).map((r): ElementSpec => ({ kind: 'interface', ...r })),
	fc.record({ thickness_m: positive(1e-4, 0.02), index, angle_rad: angle, plane: axis }).map((r): ElementSpec => ({ kind: 'plate', ...r })),
	fc.record({ fx_m: signedLength(1e-2, 10), fy_m: signedLength(1e-2, 10) }).map((r): ElementSpec => ({ kind: 'thermalLens', ...r })),
	fc.record({ length_m: positive(0, 0.1), index }).map((r): ElementSpec => ({ kind: 'medium', ...r })),
	fc.record({ x: unimodular, y: unimodular }).map((r): ElementSpec => ({ kind: 'abcd', ...r }))
);

/** Elements that leave the medium index as they found it and keep the beam physical (no abcd: it may scale w at one plane). */
const trainElement: fc.Arbitrary<ElementSpec> = fc.oneof(
	signedLength(0.05, 5).map((f_m): ElementSpec => ({ kind: 'thinLens', f_m })),
	fc.record({ r_m: signedLength(0.1, 5), angle_rad: positive(0, 0.6), plane: axis }).map((r): ElementSpec => ({ kind: 'mirror', ...r })),
	fc.record({ f_m: signedLength(0.05, 5), axis }).map((r): ElementSpec => ({ kind: 'cylLens', ...r })),
	fc.record({ thickness_m: positive(1e-3, 0.02), index: positive(1.3, 3), angle_rad: positive(0, 1.2), plane: axis }).map((r): ElementSpec => ({ kind: 'plate', ...r })),
	fc.record({ length_m: positive(1e-3, 0.1), index: positive(1.3, 3) }).map((r): ElementSpec => ({ kind: 'medium', ...r })),
	fc.record({ r1_m: fc.oneof(signedLength(0.02, 1), fc.constant(Infinity)), r2_m: fc.oneof(signedLength(0.02, 1), fc.constant(Infinity)), thickness_m: positive(0, 0.01), index: positive(1.3, 2) }).map(
		(r): ElementSpec => ({ kind: 'thickLens', ...r })
	)
);

const sourceArb: fc.Arbitrary<SourceSpec> = fc
	.record({
		wavelength_m: positive(300e-9, 3e-6),
		index: fc.oneof(fc.constant(1), positive(1, 2)),
		w0x: positive(20e-6, 3e-3),
		w0y: positive(20e-6, 3e-3),
		z0x: positive(-1, 1),
		z0y: positive(-1, 1),
		m2x: positive(1, 5),
		m2y: positive(1, 5)
	})
	.map((r) => ({
		wavelength_m: r.wavelength_m,
		index: r.index,
		x: { m2: r.m2x, spec: { kind: 'waist' as const, w0_m: r.w0x, z0_m: r.z0x } },
		y: { m2: r.m2y, spec: { kind: 'waist' as const, w0_m: r.w0y, z0_m: r.z0y } }
	}));

/** A train: elements at increasing positions with gaps in [0, 0.5] m, beginning at the source plane or later. */
const trainArb: fc.Arbitrary<TrainInput> = fc
	.record({ source: sourceArb, parts: fc.array(fc.tuple(positive(0, 0.5), trainElement), { minLength: 0, maxLength: 6 }), tail: positive(0.01, 1) })
	.map(({ source, parts, tail }) => {
		let z = 0;
		const n0 = source.index;
		const elements: TrainElement[] = parts.map(([gap, spec0], i) => {
			// Keep a plate below its critical angle in the source's medium (past it the input is invalid).
			const spec: ElementSpec =
				spec0.kind === 'plate' && Math.sin(spec0.angle_rad) * n0 >= 0.999 * spec0.index ? { ...spec0, angle_rad: 0.9 * Math.asin(spec0.index / n0) } : spec0;
			z += gap;
			const e = { id: `e${i}`, label: `E${i}`, z_m: z, aperture_m: null, spec };
			z += elementLength(spec, n0);
			return e;
		});
		return { source, elements, end_m: z + tail };
	});

/** Axial length an element occupies (the train places the next element after it). */
function elementLength(spec: ElementSpec, n0: number): number {
	if (spec.kind === 'medium') return spec.length_m;
	if (spec.kind === 'thickLens') return spec.thickness_m;
	if (spec.kind === 'plate') {
		// Snell (common practice): n·sinθ2 = n0·sinθ1; the geometric path is t/cosθ2.
		const sin2 = (n0 * Math.sin(spec.angle_rad)) / spec.index;
		return spec.thickness_m / Math.sqrt(1 - sin2 * sin2);
	}
	return 0;
}

// ---- helpers -----------------------------------------------------------------------------------

/** The q law q′ = (A·q + B)/(C·q + D) in plain complex arithmetic (Kogelnik & Li 1966, eq. 26, from memory). */
function qLaw(m: Mat2, q: QHat): QHat {
	const nr = m[0] * q.re + m[1];
	const ni = m[0] * q.im;
	const dr = m[2] * q.re + m[3];
	const di = m[2] * q.im;
	const den = dr * dr + di * di;
	return { re: (nr * dr + ni * di) / den, im: (ni * dr - nr * di) / den };
}

function inverse(m: Mat2): Mat2 {
	return [m[3], -m[1], -m[2], m[0]];
}

function expectQClose(a: QHat, b: QHat, relTol: number, what: string) {
	const scale = Math.hypot(b.re, b.im);
	const err = Math.hypot(a.re - b.re, a.im - b.im) / scale;
	expect(err, `${what}: q ${a.re}+${a.im}i vs ${b.re}+${b.im}i`).toBeLessThanOrEqual(relTol);
}

const roundSource = (w0_m: number, z0_m: number, wavelength_m: number, index = 1): SourceSpec => {
	const a = { m2: 1, spec: { kind: 'waist' as const, w0_m, z0_m } };
	return { wavelength_m, index, x: a, y: a };
};

// ---- properties --------------------------------------------------------------------------------

describe('free space: d1 then d2 equals d1 + d2', () => {
	it('as matrices (reduced lengths add)', () => {
		fc.assert(
			fc.property(positive(1e-9, 10), positive(1e-9, 10), index, (d1, d2, n) => {
				const m = mul(freeSpaceMatrix(d2, n), freeSpaceMatrix(d1, n));
				const one = freeSpaceMatrix(d1 + d2, n);
				for (let i = 0; i < 4; i++) expectClose(m[i], one[i], 1e-14);
			}),
			RUNS
		);
	});

	it('through propagate(): two medium blocks of index n back to back equal one block of the summed length', () => {
		fc.assert(
			fc.property(sourceArb, positive(1e-3, 1), positive(1e-3, 1), index, positive(0, 0.5), (source, d1, d2, n, at) => {
				const two = propagate({
					source,
					elements: [
						{ id: 'a', label: 'A', z_m: at, aperture_m: null, spec: { kind: 'medium', length_m: d1, index: n } },
						{ id: 'b', label: 'B', z_m: at + d1, aperture_m: null, spec: { kind: 'medium', length_m: d2, index: n } }
					],
					end_m: at + d1 + d2 + 1
				});
				const one = propagate({ source, elements: [{ id: 'a', label: 'A', z_m: at, aperture_m: null, spec: { kind: 'medium', length_m: d1 + d2, index: n } }], end_m: at + d1 + d2 + 1 });
				for (const ax of ['x', 'y'] as const) {
					expectQClose(two.elements[1].out[ax].q, one.elements[0].out[ax].q, 1e-12, ax);
					expectClose(beamAt(two, at + d1 + d2 + 0.5)[ax].w_m, beamAt(one, at + d1 + d2 + 0.5)[ax].w_m, 1e-12);
				}
			}),
			RUNS
		);
	});

	it('through propagate(): beamAt(d1 + d2) of an empty train equals the q law applied twice', () => {
		fc.assert(
			fc.property(sourceArb, positive(0, 5), positive(0, 5), (source, d1, d2) => {
				const p = propagate({ source, elements: [], end_m: 10 });
				const q0 = beamAt(p, 0).x.q;
				const n = source.index;
				const twice = qLaw(freeSpaceMatrix(d2, n), qLaw(freeSpaceMatrix(d1, n), q0));
				expectQClose(beamAt(p, d1 + d2).x.q, twice, 1e-12, 'x');
			}),
			RUNS
		);
	});
});

describe('a lens f followed by a lens −f is the identity', () => {
	it('as matrices', () => {
		fc.assert(
			fc.property(signedLength(1e-3, 1e3), (f) => {
				const m = mul(thinLensMatrix(-f), thinLensMatrix(f));
				expect([...m]).toEqual([...identity]);
			}),
			RUNS
		);
	});

	it('through propagate(): the beam after both lenses equals the beam before them', () => {
		fc.assert(
			fc.property(sourceArb, signedLength(1e-2, 10), positive(0, 1), (source, f, at) => {
				const p = propagate({
					source,
					elements: [
						{ id: 'a', label: 'A', z_m: at, aperture_m: null, spec: { kind: 'thinLens', f_m: f } },
						{ id: 'b', label: 'B', z_m: at, aperture_m: null, spec: { kind: 'thinLens', f_m: -f } }
					],
					end_m: at + 1
				});
				for (const ax of ['x', 'y'] as const) {
					expectQClose(p.elements[1].out[ax].q, p.elements[0].in[ax].q, 1e-9, ax);
					expectClose(p.elements[1].out[ax].w_m, p.elements[0].in[ax].w_m, 1e-9);
				}
			}),
			RUNS
		);
	});
});

describe('every element kind has reduced matrices of determinant 1 (Siegman 1986, §15.2)', () => {
	it('for random valid parameters of every kind and any surrounding index', () => {
		fc.assert(
			fc.property(anyElement, index, (spec, n0) => {
				// A plate of lower index than its surroundings past the critical angle is not a valid input (see below).
				fc.pre(!(spec.kind === 'plate' && Math.sin(spec.angle_rad) * n0 >= spec.index));
				const { x, y } = elementMatrices(spec, n0);
				for (const m of [x, y]) {
					for (const v of m) expect(Number.isFinite(v)).toBe(true);
					const scale = Math.max(1, Math.abs(m[0] * m[3]) + Math.abs(m[1] * m[2]));
					expect(Math.abs(m[0] * m[3] - m[1] * m[2] - 1), `${spec.kind} ${JSON.stringify(m)}`).toBeLessThanOrEqual(1e-12 * scale);
				}
			}),
			{ numRuns: 400 }
		);
	});
});

describe('a tilted plate beyond the critical angle (total internal reflection, common practice)', () => {
	it('is refused with a RangeError naming the rule, never a silent NaN', () => {
		fc.assert(
			fc.property(positive(1, 2), positive(1e-4, 0.02), positive(0.3, 1.4), (n, t, theta) => {
				const n0 = (n / Math.sin(theta)) * 1.0001;
				expect(() => elementMatrices({ kind: 'plate', thickness_m: t, index: n, angle_rad: theta, plane: 'x' }, n0)).toThrow(/plate angle must be below the critical angle/);
			}),
			RUNS
		);
	});
});

describe('the sampled caustic is smallest at each reported real waist', () => {
	it('no sample inside the waist’s segment is smaller than w0, and the waist itself is sampled', () => {
		fc.assert(
			fc.property(trainArb, (input) => {
				const p = propagate(input);
				const c = sampleCaustic(p);
				// sampleCaustic merges samples closer than 1e-12 of the span; widen the segment by that much.
				const tol = 1e-12 * Math.max(1, p.end_m - p.start_m);
				for (const w of p.waists) {
					if (w.virtual) continue;
					const seg = p.segments[w.segment];
					// At the faces of a tilted plate the tangential width jumps by cosθ2/cosθ1 (Kogelnik, Ippen,
					// Dienes & Shank 1972): there only samples strictly inside the plate belong to its segment.
					const el = input.elements.find((e) => e.id === seg.insideId);
					const jumps = el !== undefined && el.spec.kind === 'plate' && el.spec.angle_rad > 0;
					const s = jumps ? { z0_m: seg.z0_m + tol, z1_m: seg.z1_m - tol } : { z0_m: seg.z0_m - tol, z1_m: seg.z1_m + tol };
					if (jumps && (w.z_m <= s.z0_m || w.z_m >= s.z1_m)) continue;
					const ws = w.axis === 'x' ? c.wx_m : c.wy_m;
					let min = Infinity;
					for (let i = 0; i < c.z_m.length; i++) {
						const z = c.z_m[i];
						// A sample on a boundary is read from the next segment; apart from tilted plates the elements of
						// these trains leave w continuous there, so the closed interval is fair.
						if (z >= s.z0_m && z <= s.z1_m) {
							expect(ws[i], `${w.axis} sample at ${z} m vs waist ${w.w0_m} m at ${w.z_m} m`).toBeGreaterThanOrEqual(w.w0_m * (1 - 1e-9));
							min = Math.min(min, ws[i]);
						}
					}
					// The waist itself is among the samples: the sampled minimum is w0.
					expect(min / w.w0_m - 1, `${w.axis} waist at ${w.z_m} m`).toBeLessThanOrEqual(1e-9);
				}
			}),
			RUNS
		);
	});
});

describe('M² is unchanged by any train', () => {
	it('in every segment of plain medium, w0²/zR = M²·λ0/(π·n), the embedded-Gaussian invariant (Siegman 1986, ch. 17)', () => {
		fc.assert(
			fc.property(trainArb, (input) => {
				const p = propagate(input);
				for (const w of p.waists) {
					const s = p.segments[w.segment];
					const k = w.axis === 'x' ? s.kx : s.ky;
					// A tilted plate has different reduced lengths per axis: its segments are not plain medium.
					if (Math.abs(k * s.index - 1) > 1e-12) continue;
					const m2 = w.axis === 'x' ? p.m2x : p.m2y;
					// w0·θ with θ = w0/zR, the far-field half-angle along the axis.
					expectClose((w.w0_m * w.w0_m) / w.zR_m, (m2 * p.wavelength_m) / (Math.PI * s.index), 1e-9, `${w.axis} segment ${w.segment}`);
				}
			}),
			RUNS
		);
	});

	it('the M² read back from a caustic fit at three planes of the last segment equals the source M²', () => {
		fc.assert(
			fc.property(trainArb, (input) => {
				const p = propagate(input);
				const last = p.segments.length - 1;
				const s = p.segments[last];
				for (const ax of ['x', 'y'] as const) {
					const w = p.waists.find((o) => o.segment === last && o.axis === ax)!;
					// Planes within a few Rayleigh ranges of the waist keep the fit well conditioned; beamAt reads
					// planes past the end from the last segment's free-space law.
					const start = Math.max(w.z_m, s.z0_m);
					if (start - w.z_m > 3 * w.zR_m) continue;
					const z = [start, start + w.zR_m, start + 2 * w.zR_m];
					// Fit w²(z) = a + b·z + c·z² through the three planes (ISO 11146-1:2005 caustic form), then
					// M² = (π·n/λ0)·sqrt(a·c − b²/4) (ISO 11146-1:2005, clause 9, from memory). Relative z keeps it exact.
					const w2 = z.map((zz) => beamAt(p, zz)[ax].w_m ** 2);
					const h = w.zR_m;
					const c = (w2[2] - 2 * w2[1] + w2[0]) / (2 * h * h);
					const b = (w2[1] - w2[0]) / h - c * h; // about z[0]
					const a = w2[0];
					const m2 = ((Math.PI * s.index) / p.wavelength_m) * Math.sqrt(a * c - (b * b) / 4);
					expectClose(m2, ax === 'x' ? p.m2x : p.m2y, 1e-6, ax);
				}
			}),
			RUNS
		);
	});
});

describe('propagating forward then backward returns the input q', () => {
	it('any train: q_out = M·q_in (engine vs the q law), and [D, −B, −C, A]·q_out = q_in', () => {
		fc.assert(
			fc.property(trainArb, (input) => {
				const p = propagate(input);
				const lastZ = p.end_m;
				for (const ax of ['x', 'y'] as const) {
					// Overall reduced matrix of the train: gaps as free space in the current medium, elements' own matrices.
					let m: Mat2 = identity;
					let z = 0;
					let n = input.source.index;
					for (const e of input.elements) {
						m = mul(freeSpaceMatrix(e.z_m - z, n), m);
						m = mul(elementMatrices(e.spec, n)[ax], m);
						z = e.z_m + elementLength(e.spec, n);
					}
					m = mul(freeSpaceMatrix(lastZ - z, n), m);
					// The source's own q at z = 0 (an element at z = 0 would make beamAt(p, 0) read the beam after it).
					const qIn = beamAt(propagate({ source: input.source, elements: [], end_m: 1 }), 0)[ax].q;
					const qOut = beamAt(p, lastZ)[ax].q;
					expectQClose(qOut, qLaw(m, qIn), 1e-9, `${ax} forward`);
					expectQClose(qLaw(inverse(m), qOut), qIn, 1e-9, `${ax} backward`);
				}
			}),
			RUNS
		);
	});

	it('a single random element of any kind: forward then its inverse returns q', () => {
		fc.assert(
			fc.property(anyElement, positive(20e-6, 3e-3), positive(-1, 1), positive(400e-9, 2e-6), (spec, w0, z0, lam) => {
				const q0 = beamAt(propagate({ source: roundSource(w0, z0, lam), elements: [], end_m: 1 }), 0).x.q;
				const m = elementMatrices(spec).x;
				expectQClose(qLaw(inverse(m), qLaw(m, q0)), q0, 1e-9, spec.kind);
			}),
			RUNS
		);
	});
});
