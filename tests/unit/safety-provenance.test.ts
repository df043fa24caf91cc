/**
 * Provenance of every safety figure: the CLI `mpe` and `hazard` JSON carry `provenance`
 * ("published-text" | "recalled"), `limitSource` (table + row + source) and a `provenanceLine`; every
 * IEC 60825-1:2014 result says its values are recalled (ICNIRP 2013) and not verified against the
 * standard. Commands run in-process (this is not a test of the process itself).
 */
import { describe, expect, it } from 'vitest';
import { run as mpe } from '../../src/cli/commands/mpe';
import { run as hazard } from '../../src/cli/commands/hazard';
import { evaluateLimit, evaluatePulseTrain, assessBeam, recalledIecLabel, cautionLines } from '../../src/lib/safety';

type Json = Record<string, unknown>;

describe('CLI mpe: provenance and limitSource', () => {
	it('Directive, skin, 150 µm, 10 s: aperture 3.5 mm from Table 2.4 (read in the French labour code reproduction)', async () => {
		const j = (await mpe(['--standard', 'eu-2006-25', '--wavelength', '150um', '--duration', '10s', '--target', 'skin'])) as Json;
		expect(j.limitingAperture_m).toBe(0.0035);
		expect(j.limitSource).toMatch(/Table 2\.4, aperture column: "3\.5 mm"/);
		// Table 2.3 row 1400 nm–1 mm, ≥ 10 s (skin: "see eye limits") is not reachable as text → recalled
		expect(j.provenance).toBe('recalled');
		expect(j.limitSource).toMatch(/Table 2\.3.*from memory: Table 2\.3 was not reachable as text/);
	});
	it('Directive, eye, 532 nm, 0.25 s: Table 2.2 row 400–700 nm read from the published text', async () => {
		const j = (await mpe(['--standard', 'eu-2006-25', '--wavelength', '532nm', '--duration', '0.25s'])) as Json;
		expect(j.provenance).toBe('published-text');
		expect(j.limitSource).toMatch(/Table 2\.2, row 400–700 nm, columns 1\.8·10⁻⁵–10 s: "H = 18 t\^0\.75 C_E J m⁻²"/);
		expect(j.limitSource).not.toMatch(/from memory/);
		for (const line of cautionLines) expect(j.caution as string).toContain(line);
	});
	it('IEC 60825-1:2014: every result labelled "values recalled (ICNIRP 2013), not verified against the standard"', async () => {
		const j = (await mpe(['--standard', 'iec-60825-1-2014', '--wavelength', '532nm', '--duration', '0.25s'])) as Json;
		expect(j.provenance).toBe('recalled');
		expect(j.provenanceLine).toContain(recalledIecLabel);
		const p = (await mpe(['--standard', 'iec-60825-1-2014', '--wavelength', '1064nm', '--duration', '1s', '--pulse-width', '10ns', '--repetition-rate', '1kHz'])) as Json;
		expect(p.provenance).toBe('recalled');
		expect(p.provenanceLine).toContain(recalledIecLabel);
	});
	it('pulse train, Directive: provenance and source of the rows behind the limiting rule', async () => {
		const j = (await mpe(['--standard', 'eu-2006-25', '--wavelength', '532nm', '--duration', '0.25s', '--pulse-width', '10ns', '--repetition-rate', '10kHz'])) as Json;
		expect(j.rule).toBe('repetitive pulse (C_P)');
		expect(j.provenance).toBe('published-text');
		expect(j.limitSource).toMatch(/Table 2\.2, row 400–700 nm.*Table 2\.6, rule 3/);
	});
});

describe('CLI hazard: provenance and limitSource', () => {
	it('carries provenance, limitSource and provenanceLine beside the caution', async () => {
		const j = (await hazard(['--standard', 'eu-2006-25', '--wavelength', '532nm', '--power', '5W', '--diameter', '2.83mm', '--divergence', '1.41mrad', '--duration', '0.25s'])) as Json;
		expect(j.provenance).toBe('published-text');
		expect(j.limitSource).toMatch(/Table 2\.2/);
		expect(typeof j.provenanceLine).toBe('string');
		const i = (await hazard(['--standard', 'iec-60825-1-2014', '--wavelength', '532nm', '--power', '5W', '--diameter', '2.83mm', '--divergence', '1.41mrad', '--duration', '0.25s'])) as Json;
		expect(i.provenance).toBe('recalled');
		expect(i.provenanceLine).toContain(recalledIecLabel);
	});
});

describe('engine results carry provenance everywhere', () => {
	it('evaluateLimit, evaluatePulseTrain and assessBeam for IEC say recalled with the label', () => {
		const a = evaluateLimit('iec-60825-1-2014', { wavelength_m: 1064e-9, duration_s: 10 });
		expect(a.provenanceLine).toContain(recalledIecLabel);
		const b = evaluatePulseTrain('iec-60825-1-2014', { wavelength_m: 1064e-9, duration_s: 10, pulseWidth_s: 1e-8, repetitionRate_Hz: 10 });
		expect(b.provenanceLine).toContain(recalledIecLabel);
		const c = assessBeam({ standard: 'iec-60825-1-2014', wavelength_m: 1064e-9, power_W: 1, diameter_m: 2e-3, fullDivergence_rad: 1e-3 });
		expect(c.provenanceLine).toContain(recalledIecLabel);
	});
});
