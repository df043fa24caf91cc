/**
 * The `knife` command, run in-process through the CLI's main() (exit codes and stderr as a user sees
 * them). Scans are made here from the Gaussian's knife-edge integral ½[1 + erf(√2(x − c)/w)]; the erf used
 * to make them is checked against an independent Simpson integral in tests/reference/knife-edge.test.ts.
 */
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { main } from '../../src/cli/main';
import { erf } from '../../src/lib/optics/iso11146/knifeEdge';
import { expectClose } from '../helpers';

async function cli(args: string[]) {
	let stdout = '';
	let stderr = '';
	const o = vi.spyOn(process.stdout, 'write').mockImplementation((s) => ((stdout += String(s)), true));
	const e = vi.spyOn(process.stderr, 'write').mockImplementation((s) => ((stderr += String(s)), true));
	try {
		const code = await main(args);
		return { code, stdout, stderr };
	} finally {
		o.mockRestore();
		e.mockRestore();
	}
}

let dir = '';
beforeAll(() => {
	dir = mkdtempSync(join(tmpdir(), 'bw-knife-'));
	// w = 0.8 mm, centre 0.3 mm, 5 mW beam, 20 µW offset; x in mm, P in mW; coarse 0.1 mm steps.
	const rows = ['x (mm),P (mW)'];
	for (let i = 0; i <= 40; i++) {
		const x = -2 + (4 * i) / 40;
		rows.push(`${x.toFixed(3)},${(0.02 + 5 * 0.5 * (1 + erf((Math.SQRT2 * (x - 0.3)) / 0.8))).toFixed(6)}`);
	}
	writeFileSync(join(dir, 'scan.csv'), rows.join('\n'));
	writeFileSync(join(dir, 'semi.csv'), rows.map((r) => r.replace(',', ';').replace('.', ',').replace('.', ',')).join('\n'));
	writeFileSync(join(dir, 'short.csv'), rows.slice(0, 4).join('\n'));
	writeFileSync(join(dir, 'nohead.csv'), 'a,b\n1,2\n');
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('beamwright knife', () => {
	it('prints w, D4σ, centre and the 10/90 clip distance in SI (Gaussian: D4σ = 2w, Δx10/90 = 1.2816·w)', async () => {
		const r = await cli(['knife', join(dir, 'scan.csv')]);
		expect(r.code).toBe(0);
		const j = JSON.parse(r.stdout);
		expectClose(j.w_m, 0.8e-3, 1e-4, 'w');
		expectClose(j.center_m, 0.3e-3, 1e-4, 'centre');
		expectClose(j.d4sigma_m, 1.6e-3, 5e-4, 'D4σ');
		// Φ⁻¹(0.9) = 1.2815516 (standard normal table, e.g. Abramowitz & Stegun 1964, Table 26.5 — from memory).
		expectClose(j.clip10_90_m, 1.2815516 * 0.8e-3, 5e-4, '10/90 clip');
		for (const k of ['w_m', 'd4sigma_m', 'center_m', 'clip10_90_m']) expect(typeof j.uncertainty[k]).toBe('number');
		expect(typeof j.residualRms_W).toBe('number');
	});

	it('reads semicolons with decimal commas the same way', async () => {
		const r = await cli(['knife', join(dir, 'semi.csv')]);
		expect(r.code).toBe(0);
		expectClose(JSON.parse(r.stdout).w_m, 0.8e-3, 1e-4, 'w');
	});

	it('refuses bad input with exit code 2 and one line naming the problem', async () => {
		for (const [args, re] of [
			[['knife'], /scan file: required/],
			[['knife', join(dir, 'short.csv')], /at least 5 readable lines — got 3/],
			[['knife', join(dir, 'nohead.csv')], /header must name the columns x and P/],
			[['knife', join(dir, 'scan.csv'), '--kind', 'blade'], /--kind: "blade" is not accepted — one of knife, slit/],
			[['knife', join(dir, 'missing.csv')], /cannot read/]
		] as const) {
			const r = await cli([...args]);
			expect(r.code, args.join(' ')).toBe(2);
			expect(r.stderr).toMatch(re);
			expect(r.stderr.trim().split('\n')).toHaveLength(1);
		}
	});
});
