import { describe, expect, it } from 'vitest';
import { propagate, beamAt } from '../../src/lib/optics/train';
import { axisCoupling } from '../../src/lib/optics/overlap';
import { throughLens } from '../../src/lib/optics/solve/evaluate';
import { expanderFor, parseLensCsv, searchMatches, singleLensExact, waistTarget, cavityTarget, type InputBeam, type MatchProblem, type StockLens } from '../../src/lib/optics/solve';
import { expectClose } from '../helpers';
import { runCli } from '../cli';

const lam = 1064e-9;
const zr = (w: number) => (Math.PI * w * w) / lam;
const round = (w0: number, z0: number): InputBeam => ({ wavelength_m: lam, x: { q: { re: -z0, im: zr(w0) }, m2: 1 }, y: { q: { re: -z0, im: zr(w0) }, m2: 1 } });
const shelf: StockLens[] = [-50, 50, 75, 100, 150, 200, 300, 500].map((f) => ({ label: `test ${f}`, f_m: f / 1000, diameter_m: 0.0254, count: 1 }));

function onBench(p: MatchProblem, lenses: { f_m: number; z_m: number }[], source: { w0x: number; z0x: number; m2x: number; w0y: number; z0y: number; m2y: number }) {
	const r = propagate({
		source: { wavelength_m: lam, index: 1, x: { m2: source.m2x, spec: { kind: 'waist', w0_m: source.w0x, z0_m: source.z0x } }, y: { m2: source.m2y, spec: { kind: 'waist', w0_m: source.w0y, z0_m: source.z0y } } },
		elements: lenses.map((l, i) => ({ id: `l${i}`, label: `L${i}`, z_m: l.z_m, aperture_m: null, spec: { kind: 'thinLens', f_m: l.f_m } })),
		end_m: p.target.z_m + 0.1
	});
	const b = beamAt(r, p.target.z_m);
	// The search's figure is the overlap of the embedded Gaussian (q of the real beam, M² left out of the overlap).
	return {
		x: axisCoupling({ q: b.x.q }, { q: p.target.x }, lam),
		y: axisCoupling({ q: b.y.q }, { q: p.target.y }, lam)
	};
}

describe('searchMatches', () => {
	const problem: MatchProblem = {
		input: { wavelength_m: lam, x: { q: { re: 0.04, im: zr(0.45e-3) / 1.2 }, m2: 1.2 }, y: { q: { re: 0.01, im: zr(0.4e-3) / 1.5 }, m2: 1.5 } },
		target: cavityTarget(Infinity, 0.5, 0.25, 0.9, lam),
		inventory: shelf,
		constraints: { rail: { from_m: 0.05, to_m: 0.85 }, slots: [], keepOut: [{ from_m: 0.4, to_m: 0.45 }], minSpacing_m: 0.025, lensCounts: [1, 2] }
	};
	const sols = searchMatches(problem);
	it('finds ranked solutions that respect the rail, the keep-out zone and the spacing', () => {
		expect(sols.length).toBeGreaterThan(3);
		for (const s of sols) {
			s.lenses.forEach((l, i) => {
				expect(l.z_m).toBeGreaterThanOrEqual(0.05);
				expect(l.z_m).toBeLessThanOrEqual(0.85);
				expect(l.z_m < 0.4 || l.z_m > 0.45).toBe(true);
				if (i > 0) expect(l.z_m - s.lenses[i - 1].z_m).toBeGreaterThanOrEqual(0.025 - 1e-12);
			});
			for (const v of [s.efficiency, s.sensitivity, s.length_m]) expect(Number.isFinite(v)).toBe(true);
		}
	});
	it('a found solution put on the bench and propagated independently gives the reported coupling (astigmatic M² source; Kogelnik & Li 1966 ABCD law)', () => {
		const s = sols[0];
		const c = onBench(problem, s.lenses, { w0x: 0.45e-3, z0x: -0.04, m2x: 1.2, w0y: 0.4e-3, z0y: -0.01, m2y: 1.5 });
		expectClose(c.x, s.couplingX, 1e-9);
		expectClose(c.y, s.couplingY, 1e-9);
	});
	it('a target made by a stock lens is matched at 100 % with that lens at its place', () => {
		const input = round(0.5e-3, -0.1);
		const q = throughLens(input.x.q, 0.3, 0.15);
		const target = { z_m: 0.7, x: { re: q.re + 0.4, im: q.im }, y: { re: q.re + 0.4, im: q.im }, what: 'waist' };
		const best = searchMatches({ input, target, inventory: shelf, constraints: { rail: { from_m: 0, to_m: 0.7 }, slots: [], keepOut: [], minSpacing_m: 0.01, lensCounts: [1] }, rankBy: 'efficiency' })[0];
		expect(best.efficiency).toBeGreaterThan(1 - 1e-8);
		expect(best.lenses[0].f_m).toBe(0.15);
		expectClose(best.lenses[0].z_m, 0.3, 1e-4);
	});
	it('tolerances are real losses: moving lens 1 by 1 mm costs what it reports', () => {
		const s = sols[0];
		expect(s.sensitivity).toBeGreaterThan(0);
		expect(s.lenses.every((l) => l.positionLoss >= 0 && l.focalLoss >= 0)).toBe(true);
	});
	it('refuses an empty inventory with a RangeError', () => {
		expect(() => searchMatches({ ...problem, inventory: [] })).toThrow(/lens inventory must be at least one lens/);
	});
});

describe('singleLensExact', () => {
	it('each exact solution images the input waist onto the target waist: 100 % on the bench (Kogelnik & Li 1966, §VI mode matching; Self 1983)', () => {
		const input = round(0.5e-3, -0.05);
		const t = waistTarget(60e-6, 60e-6, 0.6, lam);
		const sols = singleLensExact(input.x.q, t.x, t.z_m);
		expect(sols.length).toBeGreaterThan(0);
		for (const s of sols) {
			const q = throughLens(input.x.q, s.z_m, s.f_m);
			expectClose(axisCoupling({ q: { re: q.re + (0.6 - s.z_m), im: q.im } }, { q: t.x }, lam), 1, 1e-9);
		}
	});
});

describe('expanderFor', () => {
	it('a Keplerian telescope collimates at f1 + f2 for a beam whose waist is far away (Self 1983, eq. 9: s′ → f as s → ∞)', () => {
		const q0 = { re: 500, im: zr(2e-3) }; // waist 500 m upstream
		const e = expanderFor(q0, 1, lam, 0.05, 0.2, { lens1At_m: 0, waistAfter_m: null })!;
		expectClose(e.spacing_m, 0.25, 1e-4);
		expectClose(e.outputWaistAfter_m, 0.2, 1e-12);
	});
	it('a Galilean pair collimates at d = s′1 + f2, s′1 = f1 + (s − f1)·f1²/((s − f1)² + zR²) the virtual waist of lens 1 (Self 1983, eq. 9)', () => {
		const e = expanderFor({ re: 0, im: zr(0.5e-3) }, 1, lam, -0.05, 0.15, { lens1At_m: 0.1, waistAfter_m: null })!;
		const [s, f1, z] = [0.1, -0.05, zr(0.5e-3)];
		expectClose(e.spacing_m, f1 + ((s - f1) * f1 * f1) / ((s - f1) ** 2 + z * z) + 0.15, 1e-12);
		expectClose(e.outputWaistAfter_m, 0.15, 1e-12);
	});
	it('put on the bench, the reported output waist and place come out of propagate()', () => {
		const e = expanderFor({ re: 0.2, im: zr(0.4e-3) }, 1, lam, 0.05, 0.2, { lens1At_m: 0.1, waistAfter_m: 1.5 })!;
		const r = propagate({
			source: { wavelength_m: lam, index: 1, x: { m2: 1, spec: { kind: 'waist', w0_m: 0.4e-3, z0_m: -0.2 } }, y: { m2: 1, spec: { kind: 'waist', w0_m: 0.4e-3, z0_m: -0.2 } } },
			elements: [
				{ id: 'a', label: 'A', z_m: 0.1, aperture_m: null, spec: { kind: 'thinLens', f_m: 0.05 } },
				{ id: 'b', label: 'B', z_m: 0.1 + e.spacing_m, aperture_m: null, spec: { kind: 'thinLens', f_m: 0.2 } }
			],
			end_m: 3
		});
		const b = beamAt(r, 0.1 + e.spacing_m + 1.5);
		expectClose(b.x.toWaist_m + 1, 1, 1e-9);
		expectClose(b.x.w0_m, e.outputWaist_m, 1e-9);
	});
});

describe('parseLensCsv', () => {
	it('reads our columns in any order and names the line of a bad value', () => {
		const r = parseLensCsv('# shelf\nqty,f_mm,lens,dia_mm\n2,100,"A, 1",25.4\n1,-50,B,\n');
		expect(r.ok && r.lenses).toEqual([
			{ label: 'A, 1', f_m: 0.1, diameter_m: 0.0254, count: 2 },
			{ label: 'B', f_m: -0.05, diameter_m: null, count: 1 }
		]);
		const bad = parseLensCsv('lens,f_mm\nX,zero\n');
		expect(!bad.ok && bad.message).toMatch(/line 2: f_mm must be a non-zero number/);
	});
});

describe('CLI', () => {
	it('cavity prints the issue’s keys; bad input exits 2 with one line naming the argument', async () => {
		const out = JSON.parse((await runCli('cavity', '--r1', 'flat', '--r2', '1m', '--length', '0.5m', '--wavelength', '1064nm')).stdout);
		expect(Object.keys(out)).toEqual(['stable', 'g1', 'g2', 'w0_m', 'waistFromMirror1_m', 'wMirror1_m', 'wMirror2_m']);
		expectClose(out.w0_m, Math.sqrt((lam / Math.PI) * 0.5), 1e-12);
		const bad = await runCli('fiber', '--core-radius', '4.1um', '--na', '3', '--wavelength', '1550nm');
		expect(bad.code).toBe(2);
		expect(bad.stderr.trim().split('\n')).toHaveLength(1);
		expect(bad.stderr).toMatch(/--na/);
	});
	it('match reads the demo setup and prints ranked solutions', async () => {
		const out = JSON.parse((await runCli('match', 'static/demo/match-cavity.json', '--top', '3')).stdout);
		expect(out.solutions).toHaveLength(3);
		expect(out.solutions[0].efficiency).toBeGreaterThan(0.99);
	});
});

describe('document match section (src/lib/document/match.ts)', () => {
	it('the example section compiles; each bad field gets a message naming it and its range', async () => {
		const { compileMatchDoc, defaultMatchSection } = await import('../../src/lib/document/match');
		const { emptySetup } = await import('../../src/lib/document/demo');
		const doc = { ...emptySetup(), match: defaultMatchSection() };
		const ok = compileMatchDoc(doc);
		expect(ok.errors).toEqual([]);
		expect(ok.problem?.target.what).toBe('cavity');
		expect(ok.cavity?.stable).toBe(true);
		// (A+D)/2 of the round trip equals 2·g1·g2 − 1 for a two-mirror cavity (Kogelnik & Li 1966, §V).
		expectClose(ok.cavity!.halfTrace, 2 * ok.cavity!.g1g2 - 1, 1e-12);
		const bad = defaultMatchSection();
		bad.rail.to = '';
		bad.minSpacing = '-3 mm';
		bad.inventory[0].focal = '0 mm';
		bad.inventory[1].count = 'two';
		bad.target.r2 = '5 s';
		const c = compileMatchDoc({ ...doc, match: bad });
		expect(c.problem).toBeNull();
		expect(c.fieldErrors['rail.to']).toMatch(/Rail end is empty/);
		expect(c.fieldErrors['minSpacing']).toMatch(/Minimum spacing must be ≥ 0 m/);
		expect(c.fieldErrors['inventory.0.focal']).toMatch(/focal length must be at least 1 mm/);
		expect(c.fieldErrors['inventory.1.count']).toMatch(/count must be a whole number/);
		expect(c.fieldErrors['target.r2']).toMatch(/wrong unit/);
	});
	it('an unstable cavity is reported as such, with g1·g2 and (A+D)/2', async () => {
		const { compileMatchDoc, defaultMatchSection } = await import('../../src/lib/document/match');
		const { emptySetup } = await import('../../src/lib/document/demo');
		const m = defaultMatchSection();
		m.target.length = '600 mm'; // flat + R = 500 mm: g1·g2 = 1 − 600/500 < 0
		const c = compileMatchDoc({ ...emptySetup(), match: m });
		expect(c.cavity?.stable).toBe(false);
		expect(c.fieldErrors['target.cavity']).toMatch(/no stable mode.*g1·g2 = −?-?0\.2/);
	});
	it('the bench beam at the rail start as input equals the source when nothing is upstream', async () => {
		const { benchInput, compileMatchDoc, defaultMatchSection } = await import('../../src/lib/document/match');
		const { emptySetup, makeElement } = await import('../../src/lib/document/demo');
		const doc = { ...emptySetup(), match: { ...defaultMatchSection(), input: { from: 'bench' as const } } };
		const src = compileMatchDoc({ ...doc, match: defaultMatchSection() }).problem!.input;
		const b = benchInput(doc, 0.05);
		expectClose(b.x.q.re, src.x.q.re, 1e-12);
		expectClose(b.x.q.im, src.x.q.im, 1e-12);
		// A lens from an earlier apply is left out; a bench lens upstream changes the input.
		doc.elements = [makeElement('thinLens', 'match-1', 'ML1', '20 mm', { f: '100 mm' })];
		expectClose(benchInput(doc, 0.05).x.q.re, src.x.q.re, 1e-12);
		doc.elements = [makeElement('thinLens', 'e1', 'L1', '20 mm', { f: '100 mm' })];
		const moved = benchInput(doc, 0.05);
		const after = throughLens(src.x.q, 0.02, 0.1);
		expectClose(moved.x.q.re + 0.02, after.re, 1e-9);
		expectClose(moved.x.q.im, after.im, 1e-9);
	});
	it('ring target: the demo bow-tie is stable on both axes, its target is the eigenmode at the input mirror, an unstable ring blocks the search (Siegman, "Lasers", 1986, §21.1: stable when |(A+D)/2| < 1)', async () => {
		const { compileMatchDoc, defaultMatchSection } = await import('../../src/lib/document/match');
		const { emptySetup } = await import('../../src/lib/document/demo');
		const m = defaultMatchSection();
		m.target.kind = 'ring';
		const c = compileMatchDoc({ ...emptySetup(), match: m });
		expect(c.ring?.stable).toBe(true);
		expect(c.problem?.target.what).toBe('cavity');
		// Per axis (A+D)/2 = 2(1 − d1/2f)(1 − d2/2f) − 1 with f_t = f·cosθ, f_s = f/cosθ (Kogelnik, Ippen, Dienes & Shank,
		// IEEE JQE 8, 373, 1972, eq. 1; two equal lenses with alternating spacings, Kogelnik & Li 1966 §IV). Demo: R = 100 mm, θ = 8°, d1 = 115 mm, d2 = 380 mm.
		const th = (8 * Math.PI) / 180;
		for (const [a, f] of [['x', 0.05 * Math.cos(th)], ['y', 0.05 / Math.cos(th)]] as const) {
			expectClose(c.ring![a].halfTrace, 2 * (1 - 0.115 / (2 * f)) * (1 - 0.38 / (2 * f)) - 1, 1e-12, a);
			// One waist in the short arm (3 → 4) and one on the long way, per axis.
			expect(c.ring![a].waists.map((w) => w.arm).sort()).toContain(2);
			expect(c.ring![a].wInput_m).toBeGreaterThan(0);
		}
		// The target's Rayleigh range at the input mirror equals the mode's (w at the input mirror from the q).
		const t = c.problem!.target;
		const lamDoc = c.inputBeam!.wavelength_m;
		expectClose(Math.sqrt((lamDoc * (t.x.re ** 2 + t.x.im ** 2)) / (Math.PI * t.x.im)), c.ring!.x.wInput_m!, 1e-12);
		// Between R·cosθ and R/cosθ (d1 = 100 mm at θ = 15°) only x is stable: reported, and no search.
		m.target.ring.mirrors = m.target.ring.mirrors.map((r) => ({ ...r, angle: '15°' }));
		m.target.ring.mirrors[2].arm = '100 mm';
		const u = compileMatchDoc({ ...emptySetup(), match: m });
		expect([u.ring?.x.stable, u.ring?.y.stable, u.ring?.stable]).toEqual([true, false, false]);
		expect(u.problem).toBeNull();
		expect(u.fieldErrors['target.ring']).toMatch(/no stable mode.*y sagittal \(A\+D\)\/2 = /);
		expect(u.ring!.y.waists).toEqual([]);
		// Bad typing names the mirror and the field.
		m.target.ring.mirrors[1].angle = '95°';
		m.target.ring.mirrors[3].arm = '0 mm';
		m.target.ring.mirrors[0].r = 'round';
		const b = compileMatchDoc({ ...emptySetup(), match: m });
		expect(b.fieldErrors['target.ring.mirrors.1.angle']).toMatch(/Mirror 2 angle of incidence must be ≥ 0° and < 80°/);
		expect(b.fieldErrors['target.ring.mirrors.3.arm']).toMatch(/Arm 4 → 1 length must be > 0/);
		expect(b.fieldErrors['target.ring.mirrors.0.r']).toMatch(/Mirror 1 radius/);
		expect(b.ring).toBeNull();
	});
	it('two-mirror cavity with an intracavity thin lens: equivalent g1 = 1 − L2/f − L0/R1, g2 = 1 − L1/f − L0/R2, L0 = L1 + L2 − L1·L2/f, w1² = (λL0/π)·sqrt(g2/(g1(1 − g1g2))) (Kogelnik, "Imaging of optical modes — resonators with internal lenses", Bell Syst. Tech. J. 44, 455, 1965; from memory)', async () => {
		const { compileMatchDoc, defaultMatchSection } = await import('../../src/lib/document/match');
		const { emptySetup } = await import('../../src/lib/document/demo');
		const m = defaultMatchSection();
		m.target.r1 = '2 m';
		m.target.r2 = '1 m';
		m.target.length = '400 mm';
		m.target.lensF = '750 mm';
		m.target.lensAt = '150 mm';
		const c = compileMatchDoc({ ...emptySetup(), match: m });
		const [R1, R2, L1, L2, f] = [2, 1, 0.15, 0.25, 0.75];
		const L0 = L1 + L2 - (L1 * L2) / f;
		const g1 = 1 - L2 / f - L0 / R1;
		const g2 = 1 - L1 / f - L0 / R2;
		expect(c.cavity?.stable).toBe(true);
		expect(c.cavity?.lens).toEqual({ f_m: 0.75, fromMirror1_m: 0.15 });
		expectClose(c.cavity!.g1g2, g1 * g2, 1e-12, 'g1·g2');
		expectClose(c.cavity!.halfTrace, 2 * g1 * g2 - 1, 1e-12, '(A+D)/2');
		const k = (c.inputBeam!.wavelength_m * L0) / Math.PI;
		expectClose(c.cavity!.wMirror1_m!, Math.sqrt(k * Math.sqrt(g2 / (g1 * (1 - g1 * g2)))), 1e-9, 'w on mirror 1');
		expectClose(c.cavity!.wMirror2_m!, Math.sqrt(k * Math.sqrt(g1 / (g2 * (1 - g1 * g2)))), 1e-9, 'w on mirror 2');
		expect(c.problem).not.toBeNull();
		// A strong lens makes it unstable: reported with (A+D)/2 and no search.
		m.target.lensF = '50 mm';
		const u = compileMatchDoc({ ...emptySetup(), match: m });
		expect(u.cavity?.stable).toBe(false);
		expect(u.problem).toBeNull();
		expect(u.fieldErrors['target.cavity']).toMatch(/no stable mode.*\(A\+D\)\/2 = /);
		m.target.lensAt = '500 mm';
		expect(compileMatchDoc({ ...emptySetup(), match: m }).fieldErrors['target.lensAt']).toMatch(/less than the cavity length/);
	});
	it('a lens CSV with several bad lines names every one', () => {
		const r = parseLensCsv('lens,f_mm,dia_mm,qty\nA,100,25.4,1\nB,,25.4,1\nC,50,-1,x\n');
		expect(r.ok).toBe(false);
		if (!r.ok) {
			expect(r.messages).toHaveLength(2);
			expect(r.messages[0]).toMatch(/line 3: f_mm/);
			expect(r.messages[1]).toMatch(/line 4: dia_mm .*; qty/);
		}
	});
});
