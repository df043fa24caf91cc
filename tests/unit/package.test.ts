/**
 * THE SLOW PACKAGING TEST (the one test that starts real processes): `npm pack`, install the tarball
 * in an empty folder, and run `npx beamwright beam …` and the typed library entry there. It packs
 * the CLI as last built by `npm run build:cli` (which `npm run test:unit` runs first), building it
 * once when `dist/` is missing. The tarball carries every runtime dependency bundled, so the install
 * fetches nothing from a registry.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { execFile } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { expectClose } from '../helpers';

const run = promisify(execFile);
const root = process.cwd();
const dir = mkdtempSync(join(tmpdir(), 'bw-pack-'));
const npm = process.platform === 'win32' ? 'npm.cmd' : 'npm';
const quiet = { ...process.env, npm_config_loglevel: 'error', npm_config_fund: 'false', npm_config_audit: 'false', npm_config_update_notifier: 'false' };

beforeAll(async () => {
	if (!existsSync(join(root, 'dist', 'cli.js'))) await run(npm, ['run', 'build:cli'], { cwd: root, env: quiet });
	await run(npm, ['pack', '--ignore-scripts', '--pack-destination', dir], { cwd: root, env: quiet });
	const tarball = readdirSync(dir).find((f) => f.endsWith('.tgz'))!;
	const app = join(dir, 'app');
	await run('mkdir', ['-p', app]);
	writeFileSync(join(app, 'package.json'), JSON.stringify({ name: 'bw-pack-check', private: true, type: 'module' }));
	await run(npm, ['install', '--offline', '--no-package-lock', join(dir, tarball)], { cwd: app, env: quiet });
}, 120_000);

afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('the packed package, installed in an empty folder', () => {
	it('npx beamwright beam … prints the beam (θ = λ/(π·w0), Siegman 1986, eq. 17.16, from memory)', async () => {
		const { stdout } = await run('npx', ['--no', 'beamwright', 'beam', '--wavelength', '632.8nm', '--waist', '0.5mm'], { cwd: join(dir, 'app'), env: quiet });
		const out = JSON.parse(stdout);
		expectClose(out.theta_rad, 632.8e-9 / (Math.PI * 0.5e-3), 1e-12);
	});

	it('exit code 2 and one line for bad input', async () => {
		const bin = join(dir, 'app', 'node_modules', '.bin', 'beamwright');
		const r = await run(bin, ['beam', '--wavelength', '632.8nm', '--waist', '0x5'], { cwd: join(dir, 'app'), env: quiet }).then(
			() => ({ code: 0, stderr: '' }),
			(e) => ({ code: e.code as number, stderr: e.stderr as string })
		);
		expect(r.code).toBe(2);
		expect(r.stderr.trim().split('\n')).toHaveLength(1);
	});

	it("import { propagate, twoMirrorCavity, mpe } from 'beamwright' works, with its types shipped", async () => {
		const script = join(dir, 'app', 'use.mjs');
		writeFileSync(
			script,
			`import { propagate, twoMirrorCavity, mpe } from 'beamwright';
const c = twoMirrorCavity(Infinity, 1, 0.5, 1064e-9);
const p = propagate({ source: { wavelength_m: 1064e-9, index: 1, x: { m2: 1, spec: { kind: 'waist', w0_m: 5e-4, z0_m: 0 } }, y: { m2: 1, spec: { kind: 'waist', w0_m: 5e-4, z0_m: 0 } } }, elements: [], end_m: 1 });
const m = mpe({ standard: 'eu-2006-25', wavelength_m: 532e-9, duration_s: 0.25 });
console.log(JSON.stringify({ w0: c.w0_m, n: p.waists.length, E: m.irradiance_W_m2, caution: m.caution }));`
		);
		const out = JSON.parse((await run(process.execPath, [script], { cwd: join(dir, 'app') })).stdout);
		// Half-symmetric resonator (flat + R = 1 m, L = 0.5 m): w0² = (λ/π)·√(L·(R − L)) (Kogelnik & Li 1966, from memory).
		expectClose(out.w0, Math.sqrt((1064e-9 / Math.PI) * Math.sqrt(0.5 * 0.5)), 1e-12);
		expect(out.n).toBeGreaterThan(0);
		// Directive 2006/25/EC, Annex II, 400–700 nm, 18·t^0.75 J/m² (from memory): E = 18·0.25^0.75/0.25 W/m².
		expectClose(out.E, (18 * 0.25 ** 0.75) / 0.25, 1e-12);
		expect(out.caution).toMatch(/first-pass/i);
		expect(existsSync(join(dir, 'app', 'node_modules', 'beamwright', 'dist', 'types', 'lib', 'api.d.ts'))).toBe(true);
	});
});
