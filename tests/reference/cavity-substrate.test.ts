/**
 * The substrate of a curved cavity input mirror is a lens: the match targets the mode outside the
 * mirror's back face.
 *
 * Sources:
 * - H. Kogelnik & T. Li, "Laser Beams and Resonators", Appl. Opt. 5, 1550 (1966): two-mirror mode,
 *   eqs. 61–64 (w0, t1 = L·g2(1 − g1)/(g1 + g2 − 2g1g2)); Table I ray matrices; q law eq. 26.
 * - A. E. Siegman, "Lasers" (1986), Table 15.1: refraction at a spherical surface n1 → n2 of radius R,
 *   [[1, 0], [−(n2 − n1)/R, 1]] on (r, n·r′); a length t of index n, [[1, t/n], [0, 1]].
 * - Lensmaker equation, thin plano-concave lens: f = −R/(n − 1) (E. Hecht, "Optics", §5.2, from memory).
 * - Overlap of two TEM00 beams at one plane: η = 4·Im q1·Im q2/|q1* − q2|² (H. Kogelnik, "Coupling and
 *   conversion coefficients for optical modes", 1964; from memory).
 * Expected values are computed here from these forms, never by the engine.
 */
import { describe, expect, it } from 'vitest';
import { expectClose } from '../helpers';
import { compileMatchSection, defaultMatchSection, readMatchSection, type MatchSection } from '../../src/lib/document/match';
import type { SourceSpec } from '../../src/lib/optics';

const lam = 1064e-9;
const source: SourceSpec = { wavelength_m: lam, index: 1, x: { m2: 1, spec: { kind: 'waist', w0_m: 0.5e-3, z0_m: 0 } }, y: { m2: 1, spec: { kind: 'waist', w0_m: 0.5e-3, z0_m: 0 } } };

type C = { re: number; im: number };
const cdiv = (a: C, b: C): C => {
	const d = b.re * b.re + b.im * b.im;
	return { re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d };
};

/** Kogelnik & Li 1966, eqs. 61–64: q at mirror 1 (physical, in air, +z into the cavity). */
function cavityQ(R1: number, R2: number, L: number): C {
	const g1 = 1 - L / R1;
	const g2 = 1 - L / R2;
	const p = g1 * g2;
	const den = g1 + g2 - 2 * p;
	const w0sq = ((lam * L) / Math.PI) * Math.sqrt((p * (1 - p)) / (den * den));
	const t1 = (L * g2 * (1 - g1)) / den;
	return { re: -t1, im: (Math.PI * w0sq) / lam };
}

/** q̂ before the matrix M = [[A, B], [C, D]] given q̂ after it: solve q_after = (A q + B)/(C q + D). */
function before(m: [number, number, number, number], q: C): C {
	const [A, B, Cc, D] = m;
	return cdiv({ re: D * q.re - B, im: D * q.im }, { re: A - Cc * q.re, im: -Cc * q.im });
}

/** Substrate for a beam entering the cavity: back face (radius Rb, air → n), thickness t, coated face (+R1, n → air). */
function substrate(R1: number, Rb: number, t: number, n: number): [number, number, number, number] {
	const c1 = Number.isFinite(Rb) ? -(n - 1) / Rb : 0; // air → glass at the back face
	const c2 = -(1 - n) / R1; // glass → air at the coated face, centre towards the cavity
	// M = refraction2 · travel(t/n) · refraction1
	const A = 1 + (t / n) * c1;
	const B = t / n;
	const Cc = c2 * A + c1;
	const D = c2 * B + 1;
	return [A, B, Cc, D];
}

function section(sub: { thickness: string; n: string; rBack: string } | undefined): MatchSection {
	const m = defaultMatchSection();
	m.target = { ...m.target, kind: 'cavity', at: '900 mm', r1: '1 m', r2: '500 mm', length: '250 mm' };
	if (sub) m.target.substrate = sub;
	return m;
}

describe('input mirror substrate as a lens (Siegman 1986, Table 15.1; Kogelnik & Li 1966)', () => {
	const R1 = 1;
	const qCav = cavityQ(R1, 0.5, 0.25);

	it('a flat-backed fused-silica substrate (6.35 mm, n 1.45): target plane at the back face, q̂ taken back through the substrate', () => {
		const t = 6.35e-3;
		const c = compileMatchSection(section({ thickness: '6.35 mm', n: '1.45', rBack: 'flat' }), source);
		expect(c.errors).toEqual([]);
		const tg = c.problem!.target;
		expectClose(tg.z_m, 0.9 - t, 1e-12, 'target plane');
		const want = before(substrate(R1, Infinity, t, 1.45), qCav);
		expectClose(tg.x.re, want.re, 1e-9, 'Re q̂');
		expectClose(tg.x.im, want.im, 1e-9, 'Im q̂');
		expectClose(tg.y.im, want.im, 1e-9, 'y');
		expect(c.substrate).not.toBeNull();
	});

	it('a thin substrate acts as the plano-concave lens f = −R1/(n − 1): 1/q_out = 1/q_in − (n − 1)/R1 (lensmaker, from memory)', () => {
		const c = compileMatchSection(section({ thickness: '0.1 µm', n: '1.5', rBack: 'flat' }), source);
		const tg = c.problem!.target;
		const inv = cdiv({ re: 1, im: 0 }, qCav);
		const want = cdiv({ re: 1, im: 0 }, { re: inv.re - 0.5 / R1, im: inv.im });
		expectClose(tg.x.re, want.re, 1e-6);
		expectClose(tg.x.im, want.im, 1e-6);
	});

	it('a curved back face adds its own power: back radius 0.5 m (meniscus) against the hand-built matrices', () => {
		const c = compileMatchSection(section({ thickness: '5 mm', n: '1.5', rBack: '500 mm' }), source);
		const want = before(substrate(R1, 0.5, 5e-3, 1.5), qCav);
		expectClose(c.problem!.target.x.re, want.re, 1e-9);
		expectClose(c.problem!.target.x.im, want.im, 1e-9);
	});

	it('leaving it out costs coupling: 0.3 % for this R1 = 1 m fused-silica mirror (Kogelnik 1964 overlap, computed here)', () => {
		const t = 6.35e-3;
		const out = before(substrate(R1, Infinity, t, 1.45), qCav);
		// The target without the substrate, seen at the same plane (t before mirror 1, in air).
		const naive = { re: qCav.re - t, im: qCav.im };
		const d = { re: out.re - naive.re, im: -out.im - naive.im };
		const eta = (4 * out.im * naive.im) / (d.re * d.re + d.im * d.im);
		expectClose(1 - eta, 0.00298, 0.01);
		// The engine's target, carried to that plane, is the substrate-corrected one, not the naive one.
		const tg = compileMatchSection(section({ thickness: '6.35 mm', n: '1.45', rBack: 'flat' }), source).problem!.target;
		const at = { re: tg.x.re + (0.9 - t - tg.z_m), im: tg.x.im };
		expectClose(at.re, out.re, 1e-9);
		expectClose(at.im, out.im, 1e-9);
	});

	it('without a thickness the substrate is left out: the target is the mode at mirror 1 as before', () => {
		const c = compileMatchSection(section(undefined), source);
		const tg = c.problem!.target;
		expectClose(tg.z_m, 0.9, 1e-12);
		expectClose(tg.x.re, qCav.re, 1e-9);
		expectClose(tg.x.im, qCav.im, 1e-9);
		expect(c.substrate).toBeNull();
	});

	it('an older section without the field reads with the default (no substrate, flat back face)', () => {
		const old = JSON.parse(JSON.stringify(defaultMatchSection()));
		delete old.target.substrate;
		const r = readMatchSection(old);
		expect(r.problem).toBeNull();
		expect(r.section.target.substrate).toEqual({ thickness: '', n: '1.45', rBack: 'flat' });
	});

	it('bad substrate input names the field and keeps the text', () => {
		const m = section({ thickness: '-2 mm', n: '0.5', rBack: '0 mm' });
		const c = compileMatchSection(m, source);
		expect(c.problem).toBeNull();
		expect(c.fieldErrors['target.substrate.thickness']).toMatch(/Substrate thickness/);
		expect(c.fieldErrors['target.substrate.n']).toMatch(/Substrate index/);
		expect(c.fieldErrors['target.substrate.rBack']).toMatch(/back face radius/);
		expect(m.target.substrate.thickness).toBe('-2 mm');
	});
});
