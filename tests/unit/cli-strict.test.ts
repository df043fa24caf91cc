/**
 * The CLI is strict (run in-process through main(), tests/cli.ts): extra values, single-dash options,
 * extra files, repeated options and malformed numbers are refused with exit code 2 and one line that
 * names the option and states what it accepts; every example a message shows is itself accepted;
 * a setup file with a UTF-8 byte-order mark is read as the app reads it (File.text() drops the BOM,
 * WHATWG Encoding Standard, "UTF-8 decode").
 */
import { afterAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../cli';
import { demoSetup } from '../../src/lib/document';

const dir = mkdtempSync(join(tmpdir(), 'bw-strict-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const setup = join(dir, 'setup.json');
writeFileSync(setup, JSON.stringify(demoSetup()));

/** A valid command line for each command (options only; files added where the command takes one). */
const base: Record<string, string[]> = {
	beam: ['beam', '--wavelength', '1064nm', '--waist', '0.5mm'],
	cavity: ['cavity', '--r1', '1m', '--r2', '1m', '--length', '0.5m', '--wavelength', '1064nm'],
	fiber: ['fiber', '--core-radius', '4.1um', '--na', '0.14', '--wavelength', '1550nm'],
	overlap: ['overlap', '--wavelength', '1064nm', '--w1', '0.5mm', '--w2', '0.6mm'],
	mpe: ['mpe', '--standard', 'eu-2006-25', '--wavelength', '532nm', '--duration', '0.25s'],
	hazard: ['hazard', '--standard', 'eu-2006-25', '--wavelength', '514.5nm', '--power', '5W', '--diameter', '2.83mm', '--divergence', '1.41mrad', '--duration', '0.25s', '--reflectance', '0.9'],
	match: ['match', 'static/demo/match-cavity.json', '--top', '2']
};

async function refused(args: string[], option: RegExp) {
	const r = await runCli(...args);
	expect(r.code, `${args.join(' ')} → ${r.stdout.slice(0, 80)}`).toBe(2);
	expect(r.stdout).toBe('');
	const lines = r.stderr.trimEnd().split('\n');
	expect(lines, args.join(' ')).toHaveLength(1);
	expect(lines[0]).toMatch(option);
	return lines[0];
}

describe('strict command lines (issue 15, item 9)', () => {
	it('every base command line used below is accepted', async () => {
		for (const args of Object.values(base)) expect((await runCli(...args)).code, args.join(' ')).toBe(0);
	});

	it('refuses a second value after an option, naming it and its range', async () => {
		const m = await refused([...base.beam.slice(0, 3), '--waist', '0.5mm', '0.6mm'], /^--waist: takes one value/);
		expect(m).toContain('accepted: a length > 0 m and ≤ 1 m');
	});

	it('refuses single-dash options and lists the accepted ones', async () => {
		const m = await refused(['mpe', '-standard', 'eu-2006-25', '--wavelength', '532nm'], /^-standard: options start with two dashes — did you mean --standard\?/);
		expect(m).toContain('accepted: --standard,');
		await refused([...base.beam, '-at', '2m'], /^-at: /);
	});

	it('refuses extra files and bare words', async () => {
		await refused(['propagate', setup, setup], /^setup: one file only — got 2/);
		await refused(['match', setup, 'extra.json'], /^setup: one file only/);
		await refused([...base.beam.slice(0, 1), 'stray.json', ...base.beam.slice(1)], /^argument "stray.json": this command takes no file/);
	});

	it('refuses a repeated option, naming it and its range', async () => {
		const m = await refused([...base.beam, '--waist', '0.6mm'], /^--waist: give it once — got 2 values \("0.5mm", "0.6mm"\)/);
		expect(m).toContain('accepted: a length > 0 m and ≤ 1 m');
		await refused([...base.mpe, '--standard', 'iec-60825-1-2014'], /^--standard: give it once .* accepted: one of /);
	});

	it('refuses numbers that are not plain decimals (hexadecimal, binary, words)', async () => {
		await refused(withOption(base.match, 'top', '0x5'), /^--top: must be a whole number from 1 to 100 — got "0x5"/);
		await refused(withOption(base.match, 'top', '1e1'), /^--top: must be a whole number from 1 to 100/);
		await refused([...base.beam, '--m2', '0x5'], /^--m2: "0x5" is not a decimal number — accepted: a plain number ≥ 1 and ≤ 1000/);
		await refused([...base.beam.slice(0, 3), '--waist', '0b1mm'], /^--waist: "0b1mm" is not a decimal number/);
		await refused([...base.fiber.slice(0, 3), '--na', 'Infinity', '--wavelength', '1550nm'], /^--na: "Infinity" is not a decimal number/);
	});

	it('every example a message shows is accepted by that option', async () => {
		// Bad values for every quantity option of every command; each message's "e.g. --name value" is
		// then tried on the same command line and must be accepted.
		const options: Record<string, string[]> = {
			beam: ['wavelength', 'waist', 'm2', 'index', 'at'],
			cavity: ['r1', 'r2', 'length', 'wavelength'],
			fiber: ['core-radius', 'na', 'wavelength'],
			overlap: ['wavelength', 'w1', 'w2', 'separation'],
			mpe: ['wavelength', 'duration', 'source-angle'],
			hazard: ['wavelength', 'power', 'diameter', 'divergence', 'duration', 'source-angle', 'reflectance', 'viewing-angle'],
			match: ['top']
		};
		let checked = 0;
		for (const [cmd, names] of Object.entries(options)) {
			for (const name of names) {
				for (const bad of ['0x5', '-1e9', 'abc', '']) {
					const args = withOption(base[cmd], name, bad);
					const r = await runCli(...args);
					expect(r.code, args.join(' ')).toBe(2);
					expect(r.stderr, args.join(' ')).toContain(`--${name}`);
					for (const m of r.stderr.matchAll(/e\.g\. --([\w-]+) (\S+)/g)) {
						const ok = await runCli(...withOption(base[cmd], m[1], m[2]));
						expect(ok.code, `${cmd}: example --${m[1]} ${m[2]} from "${r.stderr.trim()}" → ${ok.stderr}`).toBe(0);
						checked++;
					}
				}
			}
		}
		expect(checked).toBeGreaterThan(30);
	});

	it('a setup file with a UTF-8 byte-order mark reads as the app reads it (the BOM is dropped)', async () => {
		const withBom = join(dir, 'bom.json');
		writeFileSync(withBom, '\uFEFF' + JSON.stringify(demoSetup()));
		const a = await runCli('propagate', setup);
		const b = await runCli('propagate', withBom);
		expect(b.code, b.stderr).toBe(0);
		expect(b.stdout).toBe(a.stdout);
		// The same bytes through the browser's decoder (File.text() decodes UTF-8 and drops the BOM).
		expect(await new Blob(['\uFEFF{}']).text()).toBe('{}');
	});
});

/** The command line with `--name value` set (replacing the option's value where the base has it). */
function withOption(args: string[], name: string, value: string): string[] {
	const i = args.indexOf(`--${name}`);
	if (i >= 0) return [...args.slice(0, i + 1), value, ...args.slice(i + 2)];
	return [...args, `--${name}`, value];
}
