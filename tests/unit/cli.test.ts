/**
 * The CLI's `beam` and `propagate` commands, run in-process through the same main() as
 * `bin/beamwright.js` (tests/cli.ts); the packaging test starts the real program.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { expectClose } from '../helpers';
import { runCli, type CliRun as Run } from '../cli';
import { demoSetup } from '../../src/lib/document';

const dir = mkdtempSync(join(tmpdir(), 'beamwright-cli-'));
const demoFile = join(dir, 'demo.json');
const badFile = join(dir, 'bad.json');
writeFileSync(demoFile, JSON.stringify(demoSetup(), null, 2));
writeFileSync(badFile, JSON.stringify({ ...demoSetup(), source: { ...demoSetup().source, wavelength: '5 s' } }));

const runs: Record<string, Run> = {};
const plan: Record<string, string[]> = {
	beam2m: ['beam', '--wavelength', '632.8nm', '--waist', '0.5mm', '--at', '2m'],
	beam0: ['beam', '--wavelength', '632.8nm', '--waist', '0.5mm', '--at', '0'],
	beamM2: ['beam', '--wavelength', '1064 nm', '--waist', '0.3mm', '--m2', '1.3', '--index', '1.45', '--at', '-0.4m'],
	badWaist: ['beam', '--wavelength', '632.8nm', '--waist', '-0.5mm'],
	badUnit: ['beam', '--wavelength', '632.8 s', '--waist', '0.5mm'],
	propagate: ['propagate', demoFile],
	propagateBad: ['propagate', badFile]
};

beforeAll(async () => {
	for (const n of Object.keys(plan)) runs[n] = await runCli(...plan[n]);
});

afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('beamwright beam', () => {
	it('prints zR, θ, w, R and the Gouy phase at --at 2m, matching the Gaussian-beam formulas (Kogelnik & Li 1966; Siegman 1986)', () => {
		const r = runs.beam2m;
		expect(r.code, r.stderr).toBe(0);
		const out = JSON.parse(r.stdout);
		expect(Object.keys(out).sort()).toEqual(['R_m', 'gouy_rad', 'theta_rad', 'w_m', 'zR_m']);
		const lam = 632.8e-9;
		const w0 = 0.5e-3;
		const z = 2;
		const zR = (Math.PI * w0 * w0) / lam;
		expectClose(out.zR_m, zR, 1e-12);
		expectClose(out.theta_rad, lam / (Math.PI * w0), 1e-12);
		expectClose(out.w_m, w0 * Math.sqrt(1 + (z / zR) ** 2), 1e-12);
		expectClose(out.R_m, z * (1 + (zR / z) ** 2), 1e-12);
		expectClose(out.gouy_rad, Math.atan(z / zR), 1e-12);
	});

	it('prints R_m null (flat wavefront) and Gouy phase 0 at the waist', () => {
		const r = runs.beam0;
		expect(r.code, r.stderr).toBe(0);
		const out = JSON.parse(r.stdout);
		expect(out.R_m).toBeNull();
		expect(out.gouy_rad).toBe(0);
		expectClose(out.w_m, 0.5e-3, 1e-14);
	});

	it('uses M² and the medium index: zR = π·n·w0²/(M²λ0), θ = M²λ0/(π·n·w0) (Siegman 1986, ch. 17), before the waist R < 0', () => {
		const r = runs.beamM2;
		expect(r.code, r.stderr).toBe(0);
		const out = JSON.parse(r.stdout);
		const lam = 1064e-9;
		const w0 = 0.3e-3;
		const zR = (Math.PI * 1.45 * w0 * w0) / (1.3 * lam);
		expectClose(out.zR_m, zR, 1e-12);
		expectClose(out.theta_rad, (1.3 * lam) / (Math.PI * 1.45 * w0), 1e-12);
		expectClose(out.w_m, w0 * Math.sqrt(1 + (0.4 / zR) ** 2), 1e-12);
		expect(out.R_m).toBeLessThan(0);
		expectClose(out.gouy_rad, Math.atan(-0.4 / zR), 1e-12);
	});

	for (const [name, arg] of [
		['badWaist', '--waist'],
		['badUnit', '--wavelength']
	] as const) {
		it(`bad input (${plan[name].slice(1).join(' ')}) exits 2 with one stderr line naming ${arg}`, () => {
			const r = runs[name];
			expect(r.code).toBe(2);
			expect(r.stdout).toBe('');
			const lines = r.stderr.trimEnd().split('\n');
			expect(lines).toHaveLength(1);
			expect(lines[0]).toContain(arg);
		});
	}

	it('states the accepted range for an out-of-range value', () => {
		expect(runs.badWaist.stderr).toMatch(/--waist must be > 0 m and ≤ 1 m/);
	});
});

describe('beamwright propagate', () => {
	it('propagates the demo setup: the beam at each element per axis, every waist, the warnings', () => {
		const r = runs.propagate;
		expect(r.code, r.stderr).toBe(0);
		const out = JSON.parse(r.stdout);
		expect(out.name).toBe(demoSetup().name);
		expectClose(out.wavelength_m, 1064e-9, 1e-12);
		expect(out.m2).toEqual({ x: 1.3, y: 1.6 });
		expect(out.elements.map((e: { label: string }) => e.label)).toEqual(['L1', 'L2', 'M1', 'M2']);
		// The beam arriving at L1 (250 mm) is the source's free-space beam (Kogelnik & Li 1966, eq. 20, number from memory).
		const lam = 1064e-9;
		for (const [ax, m2, w0, z0] of [['x', 1.3, 0.45e-3, -0.04], ['y', 1.6, 0.4e-3, -0.01]] as const) {
			const zR = (Math.PI * w0 * w0) / (m2 * lam);
			const b = out.elements[0][ax].in;
			expectClose(b.w_m, w0 * Math.sqrt(1 + ((0.25 - z0) / zR) ** 2), 1e-12, ax);
			expectClose(b.R_m, (0.25 - z0) * (1 + (zR / (0.25 - z0)) ** 2), 1e-12, ax);
			expectClose(b.q_m.re, 0.25 - z0, 1e-12, ax);
			expectClose(b.q_m.im, zR, 1e-12, ax);
		}
		// Every waist is reported per axis and per segment, with size and Rayleigh range.
		expect(out.waists.length).toBeGreaterThanOrEqual(2 * out.elements.length);
		for (const w of out.waists) {
			expect(['x', 'y']).toContain(w.axis);
			expect(w.w0_m).toBeGreaterThan(0);
			expect(w.zR_m).toBeGreaterThan(0);
			expect(typeof w.virtual).toBe('boolean');
		}
		expect(Array.isArray(out.warnings)).toBe(true);
		expect(out.transmitted).toBeGreaterThan(0);
		expect(out.transmitted).toBeLessThanOrEqual(1);
	});

	it('refuses a setup with a bad field: exit 2, one line naming the field path', () => {
		const r = runs.propagateBad;
		expect(r.code).toBe(2);
		const lines = r.stderr.trimEnd().split('\n');
		expect(lines).toHaveLength(1);
		expect(lines[0]).toMatch(/source\.wavelength/);
	});
});
