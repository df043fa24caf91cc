/**
 * The `fit` and `moments` commands, run in-process through the CLI's main() (tests/cli.ts).
 * Input files are made in the test from the closed forms in tests/beams.ts (caustic, Gaussian image).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { encode } from 'fast-png';
import { expectClose } from '../helpers';
import { runCli } from '../cli';
import { caustic, gaussianImage } from '../beams';

const cli = (args: string[]) => runCli(...args);

let dir = '';
const lam = 1064e-9;
const ks = [-0.9, -0.5, -0.1, 0.3, 0.8, 2.2, 2.6, 3.1, 3.7, 4.5];
const zR = 1e-3 / ((4 * 1.3 * lam) / (Math.PI * 1e-3));

beforeAll(() => {
	dir = mkdtempSync(join(tmpdir(), 'bw-measure-'));
	// Exact caustics: x d0 1 mm at 200 mm, M² 1.3; y d0 0.9 mm at 210 mm, M² 1.5; z in mm, d in µm.
	const xy = ['z,dx,dy'];
	const single = ['z,d'];
	for (const k of ks) {
		const z = 0.2 + k * zR;
		const dx = caustic(1e-3, 0.2, 1.3, lam, z);
		const dy = caustic(0.9e-3, 0.21, 1.5, lam, z);
		xy.push(`${z * 1e3},${dx * 1e6},${dy * 1e6}`);
		single.push(`${z * 1e3},${dx * 1e6}`);
	}
	single.push('999,-5'); // flagged line 12
	writeFileSync(join(dir, 'xy.csv'), xy.join('\n'));
	writeFileSync(join(dir, 'd.csv'), single.join('\n'));
	writeFileSync(join(dir, 'bad.csv'), 'z,d\n1,abc\n2,-1\n3,5\n');
	const img = gaussianImage({ width: 200, height: 160, x0: 101, y0: 77, w1: 20, w2: 14, peak: 30000, offset: 500, noise: 20, seed: 2 });
	writeFileSync(join(dir, 'beam.png'), encode({ width: 200, height: 160, data: img.data as Uint16Array, depth: 16, channels: 1 }));
	writeFileSync(join(dir, 'rgb.png'), encode({ width: 16, height: 16, data: new Uint8Array(16 * 16 * 3), depth: 8, channels: 3 }));
});

afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('beamwright fit', () => {
	it('prints x and y with d0_m, z0_m, fullDivergence_rad, zR_m, m2 and the plan check', async () => {
		const r = await cli(['fit', join(dir, 'xy.csv'), '--wavelength', '1064nm']);
		expect(r.code).toBe(0);
		const out = JSON.parse(r.stdout);
		for (const axis of ['x', 'y']) {
			for (const key of ['d0_m', 'z0_m', 'fullDivergence_rad', 'zR_m', 'm2']) expect(typeof out[axis][key]).toBe('number');
			expect(typeof out.plan[axis].ok).toBe('boolean');
		}
		// The planes were laid out for x (five within zR, five beyond 2zR); y has a shorter zR.
		expect(out.plan.x.ok).toBe(true);
		expectClose(out.x.m2, 1.3, 1e-6, 'M²x');
		expectClose(out.y.m2, 1.5, 1e-6, 'M²y');
		expectClose(out.x.d0_m, 1e-3, 1e-6, 'd0x');
		expectClose(out.y.z0_m, 0.21, 1e-6, 'z0y');
	});

	it('uses the key d for a single diameter column and lists flagged lines', async () => {
		const r = await cli(['fit', join(dir, 'd.csv'), '--wavelength', '1.064um', '--z-unit', 'mm', '--d-unit', 'um']);
		expect(r.code).toBe(0);
		const out = JSON.parse(r.stdout);
		expect(out.x).toBeUndefined();
		expectClose(out.d.m2, 1.3, 1e-6);
		expect(out.flagged).toEqual([{ line: 12, problem: 'd must be > 0 — got -5', text: '999,-5' }]);
	});

	it('exits 2 with one line naming the argument for bad input', async () => {
		const cases: Array<[string[], RegExp]> = [
			[['fit', join(dir, 'xy.csv')], /^--wavelength: required/],
			[['fit', join(dir, 'xy.csv'), '--wavelength', '5 s'], /^--wavelength: .* wrong unit/],
			[['fit', join(dir, 'xy.csv'), '--wavelength', '1064nm', '--z-unit', 's'], /^--z-unit: "s" is not a length unit/],
			[['fit', join(dir, 'missing.csv'), '--wavelength', '1064nm'], /^widths file: cannot read/],
			[['fit', join(dir, 'bad.csv'), '--wavelength', '1064nm'], /at least 3 planes at different z — got 1 usable \(2 lines flagged: 2, 3/],
			[['fit', join(dir, 'xy.csv'), '--wavelength', '1064nm', '--weighting', 'heavy'], /^--weighting: "heavy" is not accepted/]
		];
		for (const [args, re] of cases) {
			const r = await cli(args);
			expect(r.code, args.join(' ')).toBe(2);
			expect(r.stderr.trim().split('\n')).toHaveLength(1);
			expect(r.stderr).toMatch(re);
		}
	});
});

describe('beamwright moments', () => {
	it('prints the centroid and D4σ widths of a 16-bit PNG', async () => {
		const r = await cli(['moments', join(dir, 'beam.png'), '--pixel', '5.5um']);
		expect(r.code).toBe(0);
		const out = JSON.parse(r.stdout);
		expectClose(out.centroid_px.x, 101, 0.002);
		expectClose(out.dx_m, 40 * 5.5e-6, 0.01);
		expectClose(out.dy_m, 28 * 5.5e-6, 0.01);
		for (const key of ['orientation_rad', 'dxPrincipal_m', 'dyPrincipal_m', 'ellipticity', 'dCircular_m']) expect(typeof out[key]).toBe('number');
	});

	it('exits 2 for a colour PNG, a missing pitch and an out-of-range area', async () => {
		const cases: Array<[string[], RegExp]> = [
			[['moments', join(dir, 'rgb.png'), '--pixel', '5.5um'], /image must be greyscale \(1 channel\) — got 3 channels/],
			[['moments', join(dir, 'beam.png')], /^--pixel: required/],
			[['moments', join(dir, 'beam.png'), '--pixel', '5.5um', '--area', '20'], /^--area must be ≥ 1.5 and ≤ 10/]
		];
		for (const [args, re] of cases) {
			const r = await cli(args);
			expect(r.code, args.join(' ')).toBe(2);
			expect(r.stderr).toMatch(re);
		}
	});
});
