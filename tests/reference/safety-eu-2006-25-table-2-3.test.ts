/**
 * Directive 2006/25/EC Annex II Table 2.3 (eye, exposure ≥ 10 s) and the one damaged cell of Table 2.2
 * (2600 nm–1 mm, 10⁻⁷–10 s): no reproduction searched gives them as text, so their rows stay recalled
 * ("from memory"). What the read text does allow is checked here, each check naming the table, the row
 * and the text read; every expected value is worked out by hand from the printed formula beside it:
 *
 *   - Table 2.2 (read in the French labour code reproduction and in DAR II-A n.º 121 p. 50, Quadro 2.2)
 *     at t just below 10 s against the recalled Table 2.3 row from 10 s: the joins;
 *   - note B to Quadro 2.3 (read in DAR II-A n.º 75 p. 43): "the photochemical retinal hazard limit can
 *     also be expressed as the time-integrated radiance G = 10⁶ C_B J m⁻² sr⁻¹ for t > 10 s up to
 *     t = 10 000 s and L = 100 C_B W m⁻² sr⁻¹ for t > 10 000 s", measured over γ (note D), and "for small
 *     sources subtending 1.5 mrad or less, the dual visible limit from 400 to 600 nm reduces to the thermal
 *     limits for 10 s < t < T_1 and to the photochemical limits for longer durations";
 *   - Table 2.5 (read in FR and in the Norwegian Annex 4 Table 4.5): C_A, C_B, C_C, T_1.
 */
import { describe, expect, it } from 'vitest';
import { expectClose } from '../helpers';
import { eu200625 as ed, evaluateEdition, evaluateLimit, T23_SEARCHED } from '../../src/lib/safety';

const T22 = 'Directive 2006/25/EC Annex II Table 2.2';
const T23 = 'Directive 2006/25/EC Annex II Table 2.3';

// Table 2.5 (read), written out again here.
const CA = (nm: number) => (nm < 700 ? 1 : nm < 1050 ? 10 ** (0.002 * (nm - 700)) : 5);
const CC = (nm: number) => (nm < 1150 ? 1 : nm < 1200 ? 10 ** (0.018 * (nm - 1150)) : 8);
const CB = (nm: number) => (nm < 450 ? 1 : 10 ** (0.02 * (nm - 450)));
const T1 = (nm: number) => (nm < 450 ? 10 : nm < 500 ? 10 * 10 ** (0.02 * (nm - 450)) : 100);

const H = (nm: number, t: number, alpha_rad = 0) => evaluateEdition(ed, { wavelength_m: nm * 1e-9, duration_s: t, alpha_rad });

describe(`${T23}: every row says it is recalled, why, and what was searched`, () => {
	const long = ed.rows.filter((r) => r.duration_s[0] >= 10 && r.targets.includes('eye'));
	it('the ≥ 10 s eye rows are all recalled', () => {
		expect(long.length).toBeGreaterThanOrEqual(20);
		for (const r of long) expect(r.provenance, r.id).toBe('recalled');
	});
	it('each gives the reason, the reproductions searched and the check the read text allows', () => {
		for (const r of long) {
			expect(r.source, r.id).toMatch(/from memory: Table 2\.3 was not reachable as text — searched: /);
			for (const text of ['French labour code', 'DAR II-A', 'Norwegian', 'CELEX 02006L0025', 'Real Decreto 486/2010', 'Allegato XXXVII', 'TROS', 'non-binding guide'])
				expect(r.source, `${r.id}: ${text}`).toContain(text);
			expect(r.source, r.id).toMatch(/Check: /);
		}
		expect(T23_SEARCHED).toMatch(/^searched: /);
	});
	it('the aperture from 10 s is recalled where Table 2.3 alone would give it (400–1400 nm: 7 mm; 180–400 nm: 3.5 mm) and says what was searched', () => {
		for (const [nm, mm] of [[532, 7], [1064, 7], [308, 3.5]] as const) {
			expect(evaluateLimit('eu-2006-25', { wavelength_m: nm * 1e-9, duration_s: 100 }).limitingAperture_m).toBe(mm * 1e-3);
			const ap = ed.apertureSourceAt('eye', nm, 100);
			expect(ap.provenance).toBe('recalled');
			expect(ap.source).toMatch(/from memory: Table 2\.3 not reachable as text — searched: /);
		}
	});
	it('the aperture from 10 s read in the notes to Quadro 2.3 (note C: 3.5 mm for 1400–10⁵ nm, 11 mm for 10⁵–10⁶ nm) is not recalled', () => {
		for (const nm of [1550, 500_000]) {
			const ap = ed.apertureSourceAt('eye', nm, 100);
			expect(ap.provenance).toBe('published-text');
			expect(ap.source).toMatch(/note C/);
		}
	});
});

/**
 * Joins at t = 10 s: just below, the read Table 2.2 cell; from 10 s, the recalled Table 2.3 row.
 * [λ, Table 2.2 row and printed form, H(10 s⁻) by hand, Table 2.3 row and recalled form, H(10 s) by hand, largest step]
 */
const joins: ReadonlyArray<readonly [number, string, number, string, number, number]> = [
	[248, 'row 180–280 nm, "H = 30 J m⁻²"', 30, 'row 180–280 nm, H = 30 J/m²', 30, 0],
	[308, 'row 308 nm, "H = 400 J m⁻²"', 400, 'row 308 nm, H = 400 J/m²', 400, 0],
	[355, 'row 315–400 nm, "H = 5.6·10³ t^0.25 J m⁻²"', 5.6e3 * 10 ** 0.25, 'row 315–400 nm, H = 10⁴ J/m²', 1e4, 0.005],
	[532, 'row 400–700 nm, "H = 18 t^0.75 C_E J m⁻²"', 18 * 10 ** 0.75, 'row 400–700 nm thermal, α < 1.5 mrad, E = 10 W/m²', 10 * 10, 0.013],
	[808, 'row 700–1050 nm, "H = 18 t^0.75 C_A C_E J m⁻²"', 18 * 10 ** 0.75 * CA(808), 'row 700–1400 nm, α < 1.5 mrad, E = 10 C_A C_C W/m²', 10 * CA(808) * 10, 0.013],
	[1064, 'row 1050–1400 nm, "H = 90 t^0.75 C_C C_E J m⁻²"', 90 * 10 ** 0.75, 'row 700–1400 nm, α < 1.5 mrad, E = 10 C_A C_C W/m² (C_A = 5)', 10 * 5 * 10, 0.013],
	[1319, 'row 1050–1400 nm, "H = 90 t^0.75 C_C C_E J m⁻²" (C_C = 8)', 90 * 8 * 10 ** 0.75, 'row 700–1400 nm, α < 1.5 mrad, E = 10 C_A C_C W/m² (C_A = 5, C_C = 8)', 10 * 5 * 8 * 10, 0.013],
	[1450, 'row 1400–1500 nm, "H = 5.6·10³ t^0.25 J m⁻²"', 5.6e3 * 10 ** 0.25, 'row 1400 nm–1 mm, E = 1000 W/m²', 1000 * 10, 0.005],
	[1550, 'row 1500–1800 nm, "H = 10⁴ J m⁻²"', 1e4, 'row 1400 nm–1 mm, E = 1000 W/m²', 1000 * 10, 0],
	[2000, 'row 1800–2600 nm, "H = 5.6·10³ t^0.25 J m⁻²"', 5.6e3 * 10 ** 0.25, 'row 1400 nm–1 mm, E = 1000 W/m²', 1000 * 10, 0.005]
];

describe(`${T23} (recalled) joins ${T22} (read) at 10 s`, () => {
	for (const [nm, t22, below, t23, at10, step] of joins) {
		it(`${nm} nm: ${T22} ${t22} → ${+below.toPrecision(5)} J/m² just below 10 s; ${T23} ${t23} → ${at10} J/m² at 10 s (within ${step * 100} %)`, () => {
			const lo = H(nm, 10 * (1 - 1e-12));
			const hi = H(nm, 10);
			expect(lo.row.provenance).toBe('published-text');
			expect(hi.row.provenance).toBe('recalled');
			expectClose(lo.radiantExposure_J_m2, below, 1e-9, `${nm} nm, Table 2.2 at 10 s⁻`);
			expectClose(hi.radiantExposure_J_m2, at10, 1e-9, `${nm} nm, Table 2.3 at 10 s`);
			expect(Math.abs(at10 / below - 1)).toBeLessThanOrEqual(step + 1e-9);
		});
	}
});

describe(`${T23}, row 400–600 nm photochemical (recalled), against note B to Quadro 2.3 (read, DAR II-A n.º 75 p. 43)`, () => {
	// Note B: G = 10⁶ C_B J m⁻² sr⁻¹ (10 s < t ≤ 10⁴ s), L = 100 C_B W m⁻² sr⁻¹ (t > 10⁴ s), averaged over the
	// field of view γ (Table 2.5, read: 11 mrad to 100 s, 1.1·t^0.5 mrad to 10⁴ s, 110 mrad beyond). Over the
	// γ cone the solid angle is Ω = π·γ²/4 (small angle), so the corneal radiant exposure is G·Ω or L·Ω·t.
	// The recalled irradiance forms (100 C_B J/m², 1 C_B W/m²) are 4/(1.21·π) = 1.0523 times that: the table
	// rounds π·(11 mrad)²/4 = 0.95·10⁻⁴ sr to 10⁻⁴ sr. The check pins that ratio at every column.
	const gamma_rad = (t: number) => (t <= 100 ? 11e-3 : t < 1e4 ? 1.1e-3 * Math.sqrt(t) : 110e-3);
	const noteB = (nm: number, t: number) => (t <= 1e4 ? 1e6 * CB(nm) : 100 * CB(nm) * t) * ((Math.PI * gamma_rad(t) ** 2) / 4);
	const rounding = 4 / (1.21 * Math.PI);
	for (const nm of [420, 460, 480, 550, 590])
		for (const t of [30, 1000, 2e4]) {
			it(`${nm} nm, ${t} s: recalled photochemical limit = ${+rounding.toPrecision(5)} × note B's radiance form over γ`, () => {
				const photo = H(nm, t).candidates.find((c) => c.mechanism === 'photochemical');
				expect(photo).toBeDefined();
				expectClose(photo!.radiantExposure_J_m2 / noteB(nm, t), rounding, 1e-9);
			});
		}
});

describe(`${T23}, α ≤ 1.5 mrad, 400–500 nm: note B to Quadro 2.3 (read) hands the limit from thermal to photochemical at T_1 (Table 2.5, read)`, () => {
	// Thermal (recalled): E = 10 W/m²; photochemical (recalled): H = 100 C_B J/m² to 100 s, E = C_B W/m² after.
	// T_1 = 10 s below 450 nm and 10·10^0.02(λ−450) s = 10·C_B s to 500 nm, so at T_1 both give 100·C_B J/m².
	for (const nm of [420, 460, 475, 490]) {
		const t1 = T1(nm);
		it(`${nm} nm: T_1 = ${+t1.toPrecision(4)} s; thermal limits for 10 s < t < T_1, photochemical after; both ${+(100 * CB(nm)).toPrecision(4)} J/m² at T_1`, () => {
			const at = H(nm, t1);
			const byMech = (m: string) => at.candidates.find((c) => c.mechanism === m)!.radiantExposure_J_m2;
			expectClose(byMech('thermal'), 10 * t1, 1e-12, 'thermal at T_1');
			expectClose(byMech('photochemical'), 100 * CB(nm), 1e-12, 'photochemical at T_1');
			expectClose(10 * t1, 100 * CB(nm), 1e-12, 'the hand-over of note B falls at T_1');
			if (t1 * 0.8 > 10) {
				const before = H(nm, t1 * 0.8);
				expect(before.mechanism).toBe('thermal');
				expectClose(before.radiantExposure_J_m2, 10 * t1 * 0.8, 1e-12);
			}
			const after = H(nm, t1 * 1.25);
			expect(after.mechanism).toBe('photochemical');
			expectClose(after.radiantExposure_J_m2, t1 * 1.25 <= 100 ? 100 * CB(nm) : CB(nm) * t1 * 1.25, 1e-12);
		});
	}
});

describe(`${T22}, row 2600 nm–1 mm, column 10⁻⁷–10 s (printed damaged in the French reproduction, recalled)`, () => {
	const row = ed.rows.find((r) => r.id === 'ir-2600-t025')!;
	it('says why it is recalled, what was searched, and why the literal reading is not a candidate', () => {
		expect(row.provenance).toBe('recalled');
		expect(row.source).toMatch(/from memory: the French reproduction prints this cell damaged/);
		expect(row.source).toMatch(/searched: /);
		expect(row.source).toMatch(/not a candidate/);
	});
	it('joins the read cells on both sides: 100 J/m² at 10⁻⁷ s (5.6·10³·(10⁻⁷)^0.25 = 99.58 J/m²) and 1000 W/m² from 10 s (996 W/m²)', () => {
		expectClose(H(10600, 1e-7 * (1 - 1e-12)).radiantExposure_J_m2, 100, 1e-9, 'Table 2.2 row 2600 nm–1 mm, 10⁻⁹–10⁻⁷ s: "H = 100 J m⁻²" (read)');
		expectClose(H(10600, 1e-7).radiantExposure_J_m2, 5.6e3 * 1e-7 ** 0.25, 1e-9);
		expectClose(5.6e3 * 1e-7 ** 0.25, 99.58, 1e-4);
		expectClose(H(10600, 10 * (1 - 1e-12)).irradiance_W_m2, (5.6e3 * 10 ** 0.25) / 10, 1e-9);
		expectClose(H(10600, 10).irradiance_W_m2, 1000, 1e-12);
	});
	it('the limit never falls as the exposure lengthens across the row (as every read row of the table)', () => {
		let prev = 0;
		for (let e = -7; e <= 1; e += 0.25) {
			const h = H(10600, 10 ** e).radiantExposure_J_m2;
			expect(h).toBeGreaterThanOrEqual(prev);
			prev = h;
		}
	});
});

describe(`${T23}, row 700–1400 nm, α > 1.5 mrad, t > T_2 (recalled): the stricter remembered printing, "E = 18 C_A C_C C_E T_2^−0.25 W m⁻² (not to exceed 1000 W m⁻²)"`, () => {
	// Table 2.5 (read): C_E = α/α_min to 100 mrad (α = 100 mrad: C_E = 100/1.5), T_2 = 100 s from 100 mrad; C_A = 5 and C_C = 8 at 1300 nm.
	it('1300 nm, α = 100 mrad, 1000 s: 18·5·8·(100/1.5)·100^−0.25 = 15.18 kW/m² is capped at 1000 W/m²', () => {
		const uncapped = 18 * 5 * 8 * (100 / 1.5) * 100 ** -0.25;
		expectClose(uncapped, 15179.3, 1e-4);
		const r = H(1300, 1000, 0.1);
		expect(r.row.rowId).toBe('thermal-long-700-ext-T2');
		expectClose(r.irradiance_W_m2, 1000, 1e-12);
		expect(r.row.source).toMatch(/not to exceed 1000 W m⁻²/);
	});
	it('808 nm, α = 10 mrad, 1000 s: 18·C_A·(10/1.5)·T_2^−0.25 with T_2 = 10·10^(8.5/98.5) s = 105.6 W/m², below the cap, unchanged', () => {
		const T2 = 10 * 10 ** (8.5 / 98.5);
		const E = 18 * CA(808) * (10 / 1.5) * T2 ** -0.25;
		expectClose(E, 105.6, 1e-3);
		const r = H(808, 1000, 0.01);
		expect(r.row.rowId).toBe('thermal-long-700-ext-T2');
		expectClose(r.irradiance_W_m2, E, 1e-12);
	});
	it('the cap never lifts a limit: at 1064 nm, α = 50 mrad, 10³–3·10⁴ s the limit is min(18·C_A·C_C·C_E·T_2^−0.25, 1000) W/m²', () => {
		const T2 = 10 * 10 ** (48.5 / 98.5);
		const E = Math.min(18 * 5 * CC(1064) * (50 / 1.5) * T2 ** -0.25, 1000);
		for (const t of [1e3, 1e4, 3e4]) expectClose(H(1064, t, 0.05).irradiance_W_m2, E, 1e-12);
	});
});
