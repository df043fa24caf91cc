/**
 * Unit-aware parsing at the edge of the engine. Text such as "0.5 mm", "1064 nm", "10 kHz"
 * becomes a plain SI number; the engine never sees a unit string.
 *
 * mathjs (Unit type only, via its factory so the bundle stays small) does the unit algebra.
 * Validators return a result object with a message instead of throwing (STYLE.md rule 5).
 */
import { create, unitDependencies } from 'mathjs';

const math = create({ unitDependencies });

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

export type ParseResult = { ok: true; value_si: number } | { ok: false; message: string };

const baseUnits: Partial<Record<QuantityKind, ReturnType<typeof math.unit>>> = {};
function baseOf(kind: QuantityKind) {
	const si = quantityKinds[kind].si;
	if (!si) return null;
	return (baseUnits[kind] ??= math.unit(si));
}

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
	const u = unit ? ` ${unit}` : '';
	const parts: string[] = [];
	if (spec.above_si !== undefined) parts.push(`> ${spec.above_si}${u}`);
	if (spec.min_si !== undefined) parts.push(`≥ ${spec.min_si}${u}`);
	if (spec.max_si !== undefined) parts.push(`≤ ${spec.max_si}${u}`);
	return parts.join(' and ');
}

function rangeMessage(spec: FieldSpec, value: number): string | null {
	const bad =
		(spec.above_si !== undefined && !(value > spec.above_si)) ||
		(spec.min_si !== undefined && !(value >= spec.min_si)) ||
		(spec.max_si !== undefined && !(value <= spec.max_si));
	if (!bad) return null;
	const unit = quantityKinds[spec.kind].si;
	return `${spec.label} must be ${describeRange(spec)} — got ${value}${unit ? ' ' + unit : ''}`;
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
	if (/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t)) {
		const n = Number(t);
		if (spec.kind === 'dimensionless') value = n;
		else if (spec.defaultUnit) {
			value = math.unit(n, spec.defaultUnit).toNumber(quantityKinds[spec.kind].si);
		} else {
			return { ok: false, message: `${spec.label} needs a unit — e.g. "${example}"` };
		}
	} else {
		let u;
		try {
			u = math.unit(t);
		} catch {
			return { ok: false, message: `${spec.label}: "${raw}" is not a number with a unit — e.g. "${example}"` };
		}
		const base = baseOf(spec.kind);
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
