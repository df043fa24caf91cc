/**
 * The `mpe` and `hazard` commands through the real entry point (node bin/beamwright.js): keys of the
 * JSON, the caution, and exit code 2 with one line naming the argument on bad input.
 */
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';
import { expectClose } from '../helpers';
import { cautionLines } from '../../src/lib/safety/cautions';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
function cli(...args: string[]) {
	const r = spawnSync(process.execPath, [join(root, 'bin', 'beamwright.js'), ...args], { cwd: root, encoding: 'utf8', timeout: 60_000 });
	return { code: r.status, out: r.stdout, err: r.stderr };
}

describe('beamwright mpe', () => {
	it('prints the limit with the keys the issue names and the caution', () => {
		const r = cli('mpe', '--standard', 'eu-2006-25', '--wavelength', '532nm', '--duration', '0.25s');
		expect(r.code).toBe(0);
		const j = JSON.parse(r.out);
		for (const k of ['radiantExposure_J_m2', 'irradiance_W_m2', 'limitingAperture_m', 'rule', 'factors', 'standard', 'caution']) expect(j).toHaveProperty(k);
		// Directive 2006/25/EC Annex II Table 2.2, 400–700 nm, 1.8·10⁻⁵–10 s: H = 18·t^0.75 (from memory)
		expectClose(j.radiantExposure_J_m2, 18 * 0.25 ** 0.75, 1e-12);
		expectClose(j.irradiance_W_m2, j.radiantExposure_J_m2 / 0.25, 1e-12);
		expect(j.limitingAperture_m).toBe(0.007);
		for (const line of cautionLines) expect(j.caution).toContain(line);
	});
	it('with pulse options reports each rule and the one that limits', () => {
		const j = JSON.parse(cli('mpe', '--standard', 'eu-2006-25', '--wavelength', '532nm', '--duration', '0.25s', '--pulse-width', '10ns', '--repetition-rate', '10kHz').out);
		expect(j.rule).toBe('repetitive pulse (C_P)');
		expect(j.rules.map((r: { rule: string }) => r.rule)).toEqual(['single pulse', 'average power', 'repetitive pulse (C_P)']);
		expectClose(j.radiantExposure_J_m2, 5e-3 * 2500 ** -0.25, 1e-12);
	});
	it('refuses a wavelength outside the tables with exit 2 and one line naming the argument and range', () => {
		const r = cli('mpe', '--standard', 'iec-60825-1-2014', '--wavelength', '150nm', '--duration', '1s');
		expect(r.code).toBe(2);
		expect(r.out).toBe('');
		expect(r.err.trim().split('\n')).toHaveLength(1);
		expect(r.err).toMatch(/^--wavelength must be ≥ 180 nm and ≤ 1 mm — got 150 nm/);
	});
	it('refuses an unknown standard and a lone pulse option', () => {
		expect(cli('mpe', '--standard', 'ansi', '--wavelength', '532nm').err).toMatch(/--standard: "ansi" is not accepted — one of stricter, eu-2006-25, iec-60825-1-2014/);
		const r = cli('mpe', '--wavelength', '532nm', '--pulse-width', '10ns');
		expect(r.code).toBe(2);
		expect(r.err).toMatch(/--repetition-rate: required with --pulse-width/);
	});
});

describe('beamwright hazard', () => {
	it('prints both NOHDs, the OD and the caution for the issue example', () => {
		const r = cli('hazard', '--standard', 'eu-2006-25', '--wavelength', '514.5nm', '--power', '5W', '--diameter', '2.83mm', '--divergence', '1.41mrad', '--duration', '0.25s');
		expect(r.code).toBe(0);
		const j = JSON.parse(r.out);
		for (const k of ['mpe_W_m2', 'nohdFormula_m', 'nohd_m', 'odRequired', 'caution']) expect(j).toHaveProperty(k);
		// IEC TR 60825-14 / ANSI Z136.1 form with a = d/√2, φ = Θ/√2
		const E = (18 * 0.25 ** 0.75) / 0.25;
		expectClose(j.nohdFormula_m, (Math.sqrt(20 / (Math.PI * E)) - 2.83e-3 / Math.SQRT2) / (1.41e-3 / Math.SQRT2), 1e-9);
		expect(j.odWhole).toBe(4);
		for (const line of cautionLines) expect(j.caution).toContain(line);
	});
	it('reads a lab inventory as JSON and as CSV', () => {
		const j = JSON.parse(cli('hazard', '--inventory', 'static/demo/hazard-lab-lasers.csv').out);
		expect(j.lasers.length).toBeGreaterThan(3);
		expect(j.lasers.every((l: { ok: boolean }) => l.ok)).toBe(true);
		expect(j.caution).toContain(cautionLines[0]);
		const csv = cli('hazard', '--inventory', 'static/demo/hazard-lab-lasers.csv', '--format', 'csv');
		expect(csv.code).toBe(0);
		expect(csv.out.split('\n')[0]).toMatch(/^line,name,room,wavelength_nm/);
	});
	it('exit 2 for a missing file, a missing power and a bad divergence', () => {
		const a = cli('hazard', '--inventory', 'no-such-file.csv');
		expect(a.code).toBe(2);
		expect(a.err).toMatch(/^--inventory: cannot read "no-such-file.csv"/);
		const b = cli('hazard', '--wavelength', '532nm', '--diameter', '1mm', '--divergence', '1mrad');
		expect(b.code).toBe(2);
		expect(b.err).toMatch(/^--power: required/);
		const c = cli('hazard', '--wavelength', '532nm', '--power', '1W', '--diameter', '1mm', '--divergence', '-1mrad');
		expect(c.code).toBe(2);
		expect(c.err).toMatch(/^--divergence/);
	});
});

describe('beamwright hazard, pulsed', () => {
	it('a pulse train uses the pulse rules; a single pulse refuses an exposure duration', () => {
		const j = JSON.parse(cli('hazard', '--standard', 'iec-60825-1-2014', '--wavelength', '1064nm', '--pulse-energy', '1mJ', '--pulse-width', '10ns', '--repetition-rate', '10Hz', '--diameter', '2mm', '--divergence', '1mrad').out);
		expect(j.emission).toBe('pulse train');
		expect(j.rule).toBe('repetitive pulse (C_P)');
		// IEC 60825-1:2014 (from memory): 2·10⁻² J/m² at 10 ns, 1050–1400 nm; C5 = N^−0.25, N = 10 Hz × 10 s
		expectClose(j.mpe_J_m2, 2e-2 * 100 ** -0.25, 1e-12);
		const r = cli('hazard', '--wavelength', '1064nm', '--pulse-energy', '1mJ', '--pulse-width', '10ns', '--diameter', '2mm', '--divergence', '1mrad', '--duration', '1s');
		expect(r.code).toBe(2);
		expect(r.err).toMatch(/^--duration: a single pulse is exposed for its width/);
	});
});
