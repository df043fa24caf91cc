/**
 * Physically invalid beams are flagged, not printed as valid.
 * Far-field half-angle θ = M²λ/(π·n·w0) (Siegman, "Lasers", 1986, eq. 17.16 with M²); the paraxial
 * bound θ ≤ 1 rad, i.e. w0 ≥ M²λ/(π·n), is our stated limit (common practice). NOHD by the formula
 * NOHD = (√(4P/(π·E)) − a)/φ (IEC 60825-1:2014 / ANSI Z136.1 beam formula, from memory).
 */
import { describe, expect, it } from 'vitest';
import { expectClose } from '../helpers';
import { minParaxialWaist_m, paraxialProblem } from '../../src/lib/optics/paraxial';
import { propagate } from '../../src/lib/optics/train';
import { run as beamCommand } from '../../src/cli/commands/beam';
import { SetupStore } from '../../src/lib/document/store.svelte';
import { assessBeam, MAX_PHYSICAL_NOHD_m } from '../../src/lib/safety/assess';
import { compileSetup, demoSetup, emptySetup } from '../../src/lib/document';

describe('paraxial range', () => {
	it('the smallest waist is M²λ/(πn): 10.6 µm, M² 1 → 3.374 µm', () => {
		expectClose(minParaxialWaist_m(10.6e-6), 10.6e-6 / Math.PI, 1e-12);
		expect(paraxialProblem(3.38e-6, 10.6e-6)).toBeNull();
		expect(paraxialProblem(1e-6, 10.6e-6)).toMatch(/≥ M²·λ\/\(π·n\) = 3\.374 µm .* got 1 µm \(θ would be 3\.374 rad\)/);
	});
	it('beam --wavelength 10.6um --waist 1um is refused (was: θ = 3.37 rad printed as valid)', async () => {
		await expect(beamCommand(['--wavelength', '10.6um', '--waist', '1um'])).rejects.toThrow(/--waist must be ≥ M²·λ\/\(π·n\)/);
		const ok = (await beamCommand(['--wavelength', '10.6um', '--waist', '1mm'])) as { theta_rad: number };
		expectClose(ok.theta_rad, 10.6e-6 / (Math.PI * 1e-3), 1e-12);
	});
	it('a source waist of 1e-300 m is an engine error, never a width of Infinity or 0', () => {
		const doc = demoSetup();
		doc.source.x.kind = 'waist';
		doc.source.x.waist = '1e-300 m';
		const c = compileSetup(doc);
		expect(c.ok).toBe(true);
		if (c.ok) expect(() => propagate(c.input)).toThrow(/source waist radius must be ≥ M²·λ\/\(π·n\)/);
		const store = new SetupStore(null);
		store.replace(doc);
		expect(store.outcome.ok).toBe(false);
		if (!store.outcome.ok) expect(store.outcome.engineError).toMatch(/paraxial/);
	});
});

describe('a focus tighter than the paraxial range', () => {
	it('a 1 mm lens on a 10 mm CO2 beam is flagged (w0′ ≈ λf/(πw) = 0.67 µm < λ/π = 3.37 µm)', () => {
		// Focused waist w0′ ≈ M²λf/(π·w) for a collimated beam (Siegman 1986, §17.1, from memory).
		const doc = emptySetup();
		doc.source.wavelength = '10.6 um';
		doc.source.x.waist = '5 mm';
		doc.elements = [{ id: 'l1', kind: 'thinLens', label: 'Shelf lens 4', at: '100 mm', aperture: '', params: { f: '1 mm' } }];
		const c = compileSetup(doc);
		expect(c.ok).toBe(true);
		if (!c.ok) return;
		const p = propagate(c.input);
		const flagged = p.warnings.filter((w) => w.code === 'not-paraxial');
		expect(flagged.length).toBeGreaterThan(0);
		expect(flagged[0].message).toMatch(/waist after Shelf lens 4 must be ≥ M²·λ\/\(π·n\) = 3\.374 µm/);
	});
	it('the demo bench carries no such flag', () => {
		const c = compileSetup(demoSetup());
		if (c.ok) expect(propagate(c.input).warnings.filter((w) => w.code === 'not-paraxial')).toEqual([]);
	});
});

describe('hazard distances beyond any physical range', () => {
	it('a 1 MW beam of 1 µrad is flagged, not just printed in km', () => {
		const a = assessBeam({ standard: 'eu-2006-25', wavelength_m: 532e-9, power_W: 1e6, diameter_m: 0.01, fullDivergence_rad: 1e-6, duration_s: 0.25 });
		// Formula: E = 25.46 W/m² at 0.25 s (the demo's limit) → √(4·1e6/(π·25.46)) = 223.6 m, less 0.01 m, over 1e-6 rad.
		expect(a.nohdFormula_m).toBeGreaterThan(MAX_PHYSICAL_NOHD_m);
		expect(a.notes.join(' ')).toMatch(/beyond any physical beam path/);
	});
	it('an ordinary lab laser carries no such note', () => {
		const a = assessBeam({ standard: 'eu-2006-25', wavelength_m: 514.5e-9, power_W: 5, diameter_m: 2.83e-3, fullDivergence_rad: 1.41e-3, duration_s: 0.25 });
		expect(a.notes.join(' ')).not.toMatch(/beyond any physical/);
	});
});
