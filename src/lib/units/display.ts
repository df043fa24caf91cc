/**
 * The unit shown beside a field: which units a quantity may be shown in, how a bare number typed in
 * the field is read (in the unit shown), and how a value is rewritten when the user picks another unit.
 *
 * The setup document keeps the text the user typed; a bare number is stored with the unit that was
 * shown beside it ("2.5" with mm shown → "2.5 mm"), so the document never depends on a display choice
 * and reads back to the same SI value anywhere (the app, the CLI, a shared link). Everything here is
 * plain text handling on top of `parse.ts`; the fast path reads every unit offered.
 */
import { fastParse, normaliseUnitText, parseQuantity, type QuantityKind } from './parse';

/** The units offered for each kind, largest first; kinds not listed get no unit picker. */
export const unitChoices: Partial<Record<QuantityKind, readonly string[]>> = {
	length: ['m', 'cm', 'mm', 'µm', 'nm'],
	time: ['s', 'ms', 'µs', 'ns', 'ps', 'fs'],
	power: ['kW', 'W', 'mW', 'µW'],
	energy: ['J', 'mJ', 'µJ', 'nJ'],
	frequency: ['GHz', 'MHz', 'kHz', 'Hz'],
	angle: ['rad', 'mrad', 'µrad', 'deg']
};

/** The unit shown when the text carries none: the lab's everyday unit for the kind. */
export const everydayUnit: Partial<Record<QuantityKind, string>> = { length: 'mm', time: 's', power: 'W', energy: 'J', frequency: 'Hz', angle: 'mrad' };

const bareRe = /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i;
const numUnitRe = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?)\s*(\S+)$/i;

/** True when the text is a number with no unit ("2.5", "-3e-2", "2,5"). */
export function isBareNumber(text: string): boolean {
	return bareRe.test(normaliseUnitText(text));
}

/** SI units per one of the given unit ("mm" → 0.001, "deg" → π/180); null when the fast path cannot read it. */
export function unitFactor(unit: string): number | null {
	const f = fastParse(normaliseUnitText('1 ' + unit));
	return f ? f.value_si : null;
}

/** The offered unit that `unit` spells (µ or u for micro), or null. */
function offered(kind: QuantityKind, unit: string): string | null {
	const n = normaliseUnitText(unit);
	return unitChoices[kind]?.find((u) => normaliseUnitText(u) === n) ?? null;
}

/** The kind of a text that is a number with one of the offered units ("200 mm" → length), else null. */
export function kindOfText(text: string): QuantityKind | null {
	const m = numUnitRe.exec(normaliseUnitText(text));
	if (!m) return null;
	const f = fastParse(`${m[1]} ${m[2]}`);
	return f && offered(f.kind, m[2]) ? f.kind : null;
}

/** The offered unit a text is written in ("2.5 mm" → "mm", "3 um" → "µm"), else null. */
export function unitOfText(text: string, kind: QuantityKind): string | null {
	const m = numUnitRe.exec(normaliseUnitText(text));
	return m ? offered(kind, m[2]) : null;
}

/**
 * The text to store for what the user typed: a bare number gets the unit shown beside it, anything
 * else (a number with its own unit, an expression, "flat", an empty field) is kept exactly.
 * Example: storedText('2.5', 'mm') → '2.5 mm'; storedText('0.3 m', 'mm') → '0.3 m'.
 */
export function storedText(typed: string, shownUnit: string | null): string {
	if (!shownUnit || !isBareNumber(typed)) return typed;
	return `${typed.trim()} ${shownUnit}`;
}

/** A value in SI written as a plain number in `unit` (12 significant digits, no trailing noise). */
export function numberIn(value_si: number, unit: string): string | null {
	const f = unitFactor(unit);
	if (f === null || !Number.isFinite(value_si)) return null;
	return String(+(value_si / f).toPrecision(12));
}

/**
 * The field's text after the user picks another unit: the value the stored text holds, rewritten in
 * the new unit — as a bare number when the field showed a bare number, else with the unit written.
 * Returns null when the stored text has no value to convert (empty, not a number, another kind); the
 * field then keeps its text. The range of the field is not checked here (a value out of range is
 * converted all the same, so its message follows it).
 * Example: textInUnit('2.5 mm', '2.5', 'µm', 'length') → '2500'.
 */
export function textInUnit(stored: string, shown: string, unit: string, kind: QuantityKind): string | null {
	const r = parseQuantity(stored, { label: 'value', kind });
	if (!r.ok) return null;
	const n = numberIn(r.value_si, unit);
	if (n === null) return null;
	return isBareNumber(shown) ? n : `${n} ${unit}`;
}
