/**
 * Beamwright command line: `npx beamwright <command> [options]`.
 * JSON on stdout; exit 0 on success; bad input → exit 2 and one line on stderr naming the argument.
 * Each command lives in ./commands/<name>.ts and exports `run(args): Promise<unknown>` (the JSON result,
 * or a string to print as-is) plus a one-line `summary`.
 */
import { CliInputError } from './args';
import { loadUnitEngine, unitEngineReady, unitEngineWasNeeded } from '../lib/units/parse';

type Command = { summary: string; usage: string; run: (argv: string[]) => Promise<unknown> };

const registry: Record<string, () => Promise<Command>> = {
	beam: () => import('./commands/beam'),
	propagate: () => import('./commands/propagate'),
	fit: () => import('./commands/fit'),
	moments: () => import('./commands/moments'),
	cavity: () => import('./commands/cavity'),
	fiber: () => import('./commands/fiber'),
	overlap: () => import('./commands/overlap'),
	mpe: () => import('./commands/mpe'),
	hazard: () => import('./commands/hazard'),
	match: () => import('./commands/match'),
	spectrum: () => import('./commands/spectrum'),
	diagnose: () => import('./commands/diagnose'),
	knife: () => import('./commands/knife')
};

function help(): string {
	return [
		'Beamwright — Gaussian beams, matching, beam quality and first-pass laser hazard estimates.',
		'Usage: npx beamwright <command> [options]   (JSON on stdout)',
		'Commands: ' + Object.keys(registry).join(', '),
		'Run `npx beamwright <command> --help` for a command’s options.'
	].join('\n');
}

/** Where main() writes: the process's stdout and stderr, or (in tests) strings. */
export interface CliOutput {
	out(text: string): void;
	err(text: string): void;
}
const processOutput: CliOutput = { out: (t) => void process.stdout.write(t), err: (t) => void process.stderr.write(t) };

/** Run one command line; returns the exit code (0 success, 2 bad input, 1 internal error). */
export async function main(argv: string[], io: CliOutput = processOutput): Promise<number> {
	const [name, ...rest] = argv;
	if (!name || name === '--help' || name === 'help') {
		io.out(help() + '\n');
		return name ? 0 : 2;
	}
	const load = registry[name];
	if (!load) {
		io.err(`command: "${name}" is not a Beamwright command — one of ${Object.keys(registry).join(', ')}\n`);
		return 2;
	}
	const cmd = await load();
	if (rest.includes('--help')) {
		io.out(`${cmd.summary}\nUsage: ${cmd.usage}\n`);
		return 0;
	}
	try {
		// Most input ("0.5mm", "1064 nm") is read without mathjs, which takes a second to load; when some
		// text needed it (compound units, inches…), load it and run the command again from the start.
		let out: unknown;
		try {
			out = await cmd.run(rest);
		} catch (e) {
			if (unitEngineReady() || !unitEngineWasNeeded()) throw e;
		}
		if (!unitEngineReady() && unitEngineWasNeeded()) {
			await loadUnitEngine();
			out = await cmd.run(rest);
		}
		io.out(typeof out === 'string' ? out : JSON.stringify(out, null, 2) + '\n');
		return 0;
	} catch (e) {
		if (e instanceof CliInputError || e instanceof RangeError) {
			io.err(e.message.split('\n')[0] + '\n');
			return 2;
		}
		io.err(`internal error: ${(e as Error).message}\n`);
		return 1;
	}
}
