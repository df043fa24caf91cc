/**
 * Unit-aware parsing at the edge of the engine. Text such as "0.5 mm", "1064 nm", "10 kHz"
 * becomes a plain SI number; the engine never sees a unit string.
 *
 * mathjs (its Unit type) is the authority for unit algebra ("2 mW/cm^2", "1 inch", "3 min").
 * It weighs ~70 kB gzip, so the browser loads it lazily; the everyday form "number + SI prefix +
 * base unit" is read by a small fast path that a test checks against mathjs for every prefix and
 * unit. Until mathjs has loaded, other forms report `pending` and are re-read once it arrives.
 * Validators return a result object with a message instead of throwing (DEVELOPERS.md, "Errors").
 */
import { formatSI } from './format';

type MathUnit = {
	units: unknown[];
	value: number | null;
	equalBase(o: MathUnit): boolean;
	toNumber(unit: string): number;
};
type UnitFn = { (text: string): MathUnit; (value: number, unit: string): MathUnit };
let mathUnit: UnitFn | null = null;
let loading: Promise<void> | null = null;
const listeners = new Set<() => void>();

/** Load mathjs's unit engine (idempotent). Node entry points await this before parsing. */
export function loadUnitEngine(): Promise<void> {
	loading ??= import('mathjs').then(({ create, unitDependencies }) => {
		const m = create({ unitDependencies });
		mathUnit = m.unit as unknown as UnitFn;
		for (const l of listeners) l();
	});
	return loading;
}

let needed = false;
/** True when some text could not be read without mathjs (a parse came back `pending`). */
export function unitEngineWasNeeded(): boolean {
	return needed;
}

/** True once mathjs has loaded. */
export function unitEngineReady(): boolean {
	return mathUnit !== null;
}

/** Call `fn` when the unit engine finishes loading (UI re-validates then). Returns an unsubscribe. */
export function onUnitEngineReady(fn: () => void): () => void {
	listeners.add(fn);
	return () => listeners.delete(fn);
}

/** SI prefixes of the fast path. */
const prefixExponent: Record<string, number> = { f: -15, p: -12, n: -9, u: -6, m: -3, c: -2, k: 3, M: 6, G: 9, T: 12 };
/** Base units of the fast path, with their kind. */
const fastUnits: Record<string, QuantityKind> = { m: 'length', s: 'time', W: 'power', J: 'energy', Hz: 'frequency', rad: 'angle' };
const fastRe = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?)\s*([fpnumckMGT]?)(m|s|W|J|Hz|rad)$/;
const degRe = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?)\s*(?:deg|°)$/;

/**
 * Read "number [prefix]unit" without mathjs. Returns null when the text is not of that form.
 * Example: fastParse('0.5 mm') → { value_si: 5e-4, kind: 'length' }.
 */
export function fastParse(t: string): { value_si: number; kind: QuantityKind } | null {
	const d = degRe.exec(t);
	if (d) return { value_si: (Number(d[1]) * Math.PI) / 180, kind: 'angle' };
	const m = fastRe.exec(t);
	if (!m) return null;
	const [, num, prefix, unit] = m;
	if (prefix === 'c' && unit !== 'm') return null;
	const e = prefix ? prefixExponent[prefix] : 0;
	// Dividing by an exact power of ten keeps 0.5 mm = 5e-4 m exact to the last bit where possible.
	const value = e >= 0 ? Number(num) * 10 ** e : Number(num) / 10 ** -e;
	return { value_si: value, kind: fastUnits[unit] };
}

/** Physical kinds a field can hold, each with the SI unit its value is returned in. */
export const quantityKinds = {
	length: { si: 'm', example: '0.5 mm' },
	time: { si: 's', example: '0.25 s' },
	power: { si: 'W', example: '5 mW' },
	energy: { si: 'J', example: '2 mJ' },
	frequency: { si: 'Hz', example: '10 kHz' },
	angle: { si: 'rad', example: '1.2 mrad' },
	irradiance: { si: 'W/m^2', example: '25 W/m^2' },
	radiantExposure: { si: 'J/m^2', example: '10 J/m^2' },
	dimensionless: { si: '', example: '1.3' }
} as const;

export type QuantityKind = keyof typeof quantityKinds;

export interface FieldSpec {
	/** Name shown to the user in messages, e.g. "Waist radius". */
	label: string;
	kind: QuantityKind;
	/** Inclusive lower bound in SI (omit for none). */
	min_si?: number;
	/** Exclusive lower bound in SI: value must be strictly greater. */
	above_si?: number;
	/** Inclusive upper bound in SI. */
	max_si?: number;
	/** Unit assumed when the text is a bare number (e.g. 'mm'); without it a bare number is refused for dimensional kinds. */
	defaultUnit?: string;
}

export type ParseResult = { ok: true; value_si: number } | { ok: false; message: string; pending?: boolean };

const baseUnits: Partial<Record<QuantityKind, MathUnit>> = {};
function baseOf(kind: QuantityKind, unit: UnitFn): MathUnit | null {
	const si = quantityKinds[kind].si;
	if (!si) return null;
	return (baseUnits[kind] ??= unit(si));
}
const defaultUnitFactor = (u: string) => {
	const f = fastParse('1 ' + u);
	return f ? f.value_si : null;
};

/** Normalise typography users paste: µ/μ → u, unicode minus, comma decimal, "×10^" and spaces. */
export function normaliseUnitText(text: string): string {
	return text
		.trim()
		.replace(/[µμ]/g, 'u')
		.replace(/[−–]/g, '-')
		.replace(/(\d),(\d)/g, '$1.$2')
		.replace(/\s*[×x]\s*10\^?\s*(-?\d+)/g, 'e$1')
		.replace(/²/g, '^2')
		.replace(/Ω/g, 'ohm');
}

/** Human range text such as "> 0 m and ≤ 1 km" for messages. */
export function describeRange(spec: FieldSpec): string {
	const unit = quantityKinds[spec.kind].si;
	const f = (x: number) => (unit && unit !== 'rad' ? formatSI(x, unit) : `${x}${unit ? ' ' + unit : ''}`);
	const parts: string[] = [];
	if (spec.above_si !== undefined) parts.push(`> ${f(spec.above_si)}`);
	if (spec.min_si !== undefined) parts.push(`≥ ${f(spec.min_si)}`);
	if (spec.max_si !== undefined) parts.push(`≤ ${f(spec.max_si)}`);
	return parts.join(' and ');
}

function rangeMessage(spec: FieldSpec, value: number): string | null {
	const bad =
		(spec.above_si !== undefined && !(value > spec.above_si)) ||
		(spec.min_si !== undefined && !(value >= spec.min_si)) ||
		(spec.max_si !== undefined && !(value <= spec.max_si));
	if (!bad) return null;
	const unit = quantityKinds[spec.kind].si;
	const got = unit && unit !== 'rad' ? formatSI(value, unit) : `${value}${unit ? ' ' + unit : ''}`;
	return `${spec.label} must be ${describeRange(spec)} — got ${got}`;
}

/**
 * Parse text into an SI number for the field described by `spec`.
 * Example: parseQuantity('0.5 mm', { label: 'Waist radius', kind: 'length', above_si: 0 }) → { ok: true, value_si: 5e-4 }.
 */
export function parseQuantity(text: string | undefined | null, spec: FieldSpec): ParseResult {
	const raw = (text ?? '').trim();
	const example = quantityKinds[spec.kind].example;
	if (raw === '') return { ok: false, message: `${spec.label} is empty — enter a value such as "${example}"` };
	const t = normaliseUnitText(raw);
	let value: number;
	const fast = fastParse(t);
	if (/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t)) {
		const n = Number(t);
		if (spec.kind === 'dimensionless') value = n;
		// Zero is zero in every unit: "--at 0" or a "0" position needs no unit (the range check still applies).
		else if (n === 0) value = 0;
		else if (spec.defaultUnit && defaultUnitFactor(spec.defaultUnit) !== null) value = n * defaultUnitFactor(spec.defaultUnit)!;
		else return { ok: false, message: `${spec.label} needs a unit — e.g. "${example}"` };
	} else if (fast) {
		if (fast.kind !== spec.kind) {
			if (spec.kind === 'dimensionless') return { ok: false, message: `${spec.label} takes a plain number, no unit — got "${raw}"` };
			return { ok: false, message: `${spec.label}: "${raw}" has the wrong unit — expected a ${spec.kind} such as "${example}"` };
		}
		value = fast.value_si;
	} else {
		const unit = mathUnit;
		if (!unit) {
			needed = true;
			void loadUnitEngine();
			return { ok: false, pending: true, message: `${spec.label}: reading the unit of "${raw}"…` };
		}
		let u: MathUnit;
		try {
			u = unit(t);
		} catch {
			return { ok: false, message: `${spec.label}: "${raw}" is not a number with a unit — e.g. "${example}"` };
		}
		const base = baseOf(spec.kind, unit);
		if (base === null) {
			if (u.units.length === 0 && typeof u.value === 'number') value = u.value;
			else return { ok: false, message: `${spec.label} takes a plain number, no unit — got "${raw}"` };
		} else {
			if (!u.equalBase(base)) {
				return { ok: false, message: `${spec.label}: "${raw}" has the wrong unit — expected a ${spec.kind} such as "${example}"` };
			}
			if (u.value === null) return { ok: false, message: `${spec.label}: "${raw}" has no number — e.g. "${example}"` };
			value = u.toNumber(quantityKinds[spec.kind].si);
		}
	}
	if (!Number.isFinite(value)) return { ok: false, message: `${spec.label} must be a finite number — got "${raw}"` };
	const msg = rangeMessage(spec, value);
	if (msg) return { ok: false, message: msg };
	return { ok: true, value_si: value };
}

/** Throwing variant for the CLI and document loaders: RangeError with the same message. */
export function parseQuantityOrThrow(text: string | undefined | null, spec: FieldSpec): number {
	const r = parseQuantity(text, spec);
	if (!r.ok) throw new RangeError(r.message);
	return r.value_si;
}
