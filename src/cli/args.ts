/**
 * Strict argument reader for the CLI: `--name value`, `--name=value` and positionals (files).
 * Refused, each with exit code 2 and one line naming the option and what it accepts:
 * single-dash options (`-standard`), an option given twice (unless the command declares it
 * repeatable), a second value after an option (`--waist 0.5mm 0.6mm`), more files than the command
 * takes, unknown options, and numbers in any notation other than plain decimal (`--top 0x5`).
 * Bad input becomes a CliInputError, which main() prints as one line on stderr with exit code 2.
 */
import { describeRange, parseQuantity, type FieldSpec } from '../lib/units/parse';

export class CliInputError extends Error {
	constructor(message: string) {
		super(message);
		this.name = 'CliInputError';
	}
}

export interface ParsedArgs {
	positionals: string[];
	/** The last value of each option (true: the option was given without a value). */
	options: Map<string, string | true>;
	/** Every value of each option, in order. */
	all: Map<string, (string | true)[]>;
	/** For each positional, the option whose value it directly follows (null when none). */
	after: (string | null)[];
	/** Problems found with an option, reported (with its accepted range) when the command reads it. */
	problems: Map<string, string>;
	/** Words starting with a single dash that are not negative numbers ("-standard"): refused. */
	singleDash: string[];
}

/** A negative number such as "-0.4m" is a value, not an option. */
const negativeNumber = /^-(\d|\.\d)/;

export function parseArgs(argv: string[]): ParsedArgs {
	const positionals: string[] = [];
	const after: (string | null)[] = [];
	const options = new Map<string, string | true>();
	const all = new Map<string, (string | true)[]>();
	const put = (k: string, v: string | true) => {
		options.set(k, v);
		all.set(k, [...(all.get(k) ?? []), v]);
	};
	let lastValueOf: string | null = null;
	const singleDash: string[] = [];
	for (let i = 0; i < argv.length; i++) {
		const a = argv[i];
		if (a.startsWith('--') && a.length > 2) {
			const eq = a.indexOf('=');
			if (eq > 0) {
				put(a.slice(2, eq), a.slice(eq + 1));
				lastValueOf = a.slice(2, eq);
			} else {
				const next = argv[i + 1];
				if (next !== undefined && !next.startsWith('--') && !(next.startsWith('-') && !negativeNumber.test(next))) {
					put(a.slice(2), next);
					lastValueOf = a.slice(2);
					i++;
				} else {
					put(a.slice(2), true);
					lastValueOf = null;
				}
			}
		} else if (a.startsWith('-') && !negativeNumber.test(a)) {
			singleDash.push(a);
			lastValueOf = null;
		} else {
			positionals.push(a);
			after.push(lastValueOf);
			lastValueOf = null;
		}
	}
	return { positionals, options, all, after, problems: new Map(), singleDash };
}

export interface ArgRules {
	/** How many positionals (files) the command takes, and what one is called in messages. Default 0. */
	files?: { max: number; label: string; example: string };
	/** Options that may be given more than once (read them with `optAll`). */
	repeatable?: string[];
}

/**
 * Refuse options the command does not know (so a typo never silently falls back to a default),
 * options given twice, and values or files beyond what the command takes.
 */
export function allowOnly(args: ParsedArgs, known: string[], rules: ArgRules = {}): void {
	const acceptedOptions = known.length ? known.map((x) => '--' + x).join(', ') : 'none';
	if (args.singleDash.length) {
		const a = args.singleDash[0];
		const name = a.replace(/^-+/, '').split('=')[0];
		const hint = known.includes(name) ? ` — did you mean --${name}?` : '';
		throw new CliInputError(`${a}: options start with two dashes${hint} — accepted: ${acceptedOptions}`);
	}
	for (const k of args.options.keys()) {
		if (!known.includes(k)) throw new CliInputError(`--${k}: unknown option — accepted: ${acceptedOptions}`);
	}
	for (const [k, values] of args.all) {
		if (values.length > 1 && !rules.repeatable?.includes(k))
			args.problems.set(k, `--${k}: give it once — got ${values.length} values (${values.map((v) => (v === true ? '(none)' : `"${v}"`)).join(', ')})`);
	}
	const max = rules.files?.max ?? 0;
	if (args.positionals.length <= max) return;
	if (max === 0) {
		// A stray word right after an option's value is a second value for that option: reported, with
		// the option's accepted range, when the command reads it. Any other bare word is refused now.
		const stray = args.positionals.findIndex((_, j) => args.after[j] === null);
		if (stray >= 0) throw new CliInputError(`argument "${args.positionals[stray]}": this command takes no file or other bare value — options are --name value`);
		args.positionals.forEach((p, j) => {
			const o = args.after[j]!;
			if (!args.problems.has(o)) args.problems.set(o, `--${o}: takes one value — got "${args.options.get(o)}" and then "${p}"`);
		});
		return;
	}
	const f = rules.files!;
	const list = args.positionals.map((p, j) => `"${p}"${args.after[j] ? ` (after --${args.after[j]} ${JSON.stringify(args.options.get(args.after[j]!))}; an option takes one value)` : ''}`);
	throw new CliInputError(`${f.label}: ${f.max === 1 ? 'one file only' : `at most ${f.max} files`} — got ${args.positionals.length}: ${list.join(', ')} — e.g. ${f.example}`);
}

function problemOf(args: ParsedArgs, name: string, accepted: string): void {
	const p = args.problems.get(name);
	if (p) throw new CliInputError(`${p} — accepted: ${accepted}`);
}

export function optString(args: ParsedArgs, name: string, accepted = 'one value'): string | undefined {
	problemOf(args, name, accepted);
	const v = args.options.get(name);
	if (v === true) throw new CliInputError(`--${name}: needs a value — accepted: ${accepted}`);
	return v;
}

export function requireString(args: ParsedArgs, name: string, example: string, accepted = 'one value'): string {
	const v = optString(args, name, accepted);
	if (v === undefined) throw new CliInputError(`--${name}: required — e.g. --${name} ${example}`);
	return v;
}

/** Every value of a repeatable option (declared in `allowOnly`'s rules), in order. */
export function optAll(args: ParsedArgs, name: string, accepted = 'one value each time'): string[] {
	const values = args.all.get(name) ?? [];
	if (values.some((v) => v === true)) throw new CliInputError(`--${name}: needs a value each time — accepted: ${accepted}`);
	return values as string[];
}

/** A unit-aware option's spec: the field spec plus an example inside its range, shown in messages. */
export type OptionSpec = Omit<FieldSpec, 'label'>;

/** "a length > 0 m and ≤ 1 m" */
export function acceptedText(spec: OptionSpec): string {
	// describeRange prints radians unrounded (π/2 as 1.5707963267948966): keep four figures here.
	const range = describeRange({ ...spec, label: '' }).replace(/\d+\.\d{5,}/g, (x) => String(Number(Number(x).toPrecision(4))));
	const kind = spec.kind === 'radiantExposure' ? 'radiant exposure' : spec.kind;
	const what = spec.kind === 'dimensionless' ? 'a plain number' : `${/^[aeiou]/.test(kind) ? 'an' : 'a'} ${kind}`;
	return range ? `${what} ${range}` : what;
}

/** Plain decimal notation at the start of a value: "0.5", "-3", ".2", "1e-3" (not "0x5", "0b1", "Infinity"). */
const decimalStart = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?(?![\dxXbBoO])/;

/** Parse a unit-aware option; the message names the argument and the accepted range. */
export function optQuantity(args: ParsedArgs, name: string, spec: OptionSpec, example?: string): number | undefined {
	const accepted = acceptedText(spec) + (example ? `, e.g. --${name} ${example}` : '');
	const v = optString(args, name, accepted);
	if (v === undefined) return undefined;
	const t = v.trim().replace(/[−–]/g, '-');
	if (!decimalStart.test(t) || /^[-+]?0[xXbBoO]/.test(t)) throw new CliInputError(`--${name}: "${v}" is not a decimal number — accepted: ${accepted}`);
	const r = parseQuantity(v, { ...spec, label: `--${name}` });
	if (!r.ok) {
		if (r.pending) throw new CliInputError(r.message); // main() loads the unit engine and runs again
		throw new CliInputError(`${r.message} — accepted: ${accepted}`);
	}
	return r.value_si;
}

export function requireQuantity(args: ParsedArgs, name: string, spec: OptionSpec, example: string): number {
	const v = optQuantity(args, name, spec, example);
	if (v === undefined) throw new CliInputError(`--${name}: required — accepted: ${acceptedText(spec)}, e.g. --${name} ${example}`);
	return v;
}

/** A whole number from `min` to `max`, in plain decimal digits ("10"; not "1e1", "0x5" or "10.0"). */
export function optInteger(args: ParsedArgs, name: string, min: number, max: number, fallback: number): number {
	const accepted = `a whole number from ${min} to ${max}`;
	const v = optString(args, name, accepted);
	if (v === undefined) return fallback;
	const n = /^\s*\d+\s*$/.test(v) ? Number(v) : NaN;
	if (!(Number.isInteger(n) && n >= min && n <= max)) throw new CliInputError(`--${name}: must be ${accepted} — got "${v}"`);
	return n;
}

export function optChoice<T extends string>(args: ParsedArgs, name: string, choices: readonly T[], fallback: T): T {
	const accepted = `one of ${choices.join(', ')}`;
	const v = optString(args, name, accepted);
	if (v === undefined) return fallback;
	if (!(choices as readonly string[]).includes(v)) throw new CliInputError(`--${name}: "${v}" is not accepted — ${accepted}`);
	return v as T;
}
