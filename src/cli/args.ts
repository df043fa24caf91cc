/**
 * Minimal argument reader for the CLI: `--name value`, `--name=value`, bare flags and positionals.
 * Bad input becomes a CliInputError, which main() prints as one line on stderr with exit code 2.
 */
import { parseQuantity, type FieldSpec } from '../lib/units/parse';

export class CliInputError extends Error {
	constructor(message: string) {
		super(message);
		this.name = 'CliInputError';
	}
}

export interface ParsedArgs {
	positionals: string[];
	options: Map<string, string | true>;
}

export function parseArgs(argv: string[]): ParsedArgs {
	const positionals: string[] = [];
	const options = new Map<string, string | true>();
	for (let i = 0; i < argv.length; i++) {
		const a = argv[i];
		if (a.startsWith('--')) {
			const eq = a.indexOf('=');
			if (eq > 0) options.set(a.slice(2, eq), a.slice(eq + 1));
			else {
				const next = argv[i + 1];
				if (next !== undefined && !next.startsWith('--')) {
					options.set(a.slice(2), next);
					i++;
				} else options.set(a.slice(2), true);
			}
		} else positionals.push(a);
	}
	return { positionals, options };
}

/** Refuse options the command does not know, so a typo never silently falls back to a default. */
export function allowOnly(args: ParsedArgs, known: string[]): void {
	for (const k of args.options.keys()) {
		if (!known.includes(k)) throw new CliInputError(`--${k}: unknown option — accepted: ${known.map((x) => '--' + x).join(', ')}`);
	}
}

export function optString(args: ParsedArgs, name: string): string | undefined {
	const v = args.options.get(name);
	if (v === true) throw new CliInputError(`--${name}: needs a value`);
	return v;
}

export function requireString(args: ParsedArgs, name: string, example: string): string {
	const v = optString(args, name);
	if (v === undefined) throw new CliInputError(`--${name}: required — e.g. --${name} ${example}`);
	return v;
}

/** Parse a unit-aware option; the message names the argument and the accepted range. */
export function optQuantity(args: ParsedArgs, name: string, spec: Omit<FieldSpec, 'label'>): number | undefined {
	const v = optString(args, name);
	if (v === undefined) return undefined;
	const r = parseQuantity(v, { ...spec, label: `--${name}` });
	if (!r.ok) throw new CliInputError(r.message);
	return r.value_si;
}

export function requireQuantity(args: ParsedArgs, name: string, spec: Omit<FieldSpec, 'label'>, example: string): number {
	const v = optQuantity(args, name, spec);
	if (v === undefined) throw new CliInputError(`--${name}: required — e.g. --${name} ${example}`);
	return v;
}

export function optChoice<T extends string>(args: ParsedArgs, name: string, choices: readonly T[], fallback: T): T {
	const v = optString(args, name);
	if (v === undefined) return fallback;
	if (!(choices as readonly string[]).includes(v)) throw new CliInputError(`--${name}: "${v}" is not accepted — one of ${choices.join(', ')}`);
	return v as T;
}
