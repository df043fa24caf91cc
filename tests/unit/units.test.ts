import { describe, it, expect, beforeAll } from 'vitest';
import { expectClose } from '../helpers';
import { axisPrefix, fastParse, formatNumber, formatPercent, formatSI, loadUnitEngine, parseQuantity, parseQuantityOrThrow, unitEngineReady, type FieldSpec } from '../../src/lib/units';

// This file checks the mathjs route too, so it loads mathjs (other test files do not pay for it).
beforeAll(() => loadUnitEngine());

const waist: FieldSpec = { label: 'Waist radius', kind: 'length', above_si: 0, max_si: 1 };
const m2: FieldSpec = { label: 'M²', kind: 'dimensionless', min_si: 1, max_si: 1000 };

function ok(text: string, spec: FieldSpec): number {
	const r = parseQuantity(text, spec);
	if (!r.ok) throw new Error(`expected "${text}" to parse, got: ${r.message}`);
	return r.value_si;
}
function refused(text: string | null | undefined, spec: FieldSpec): string {
	const r = parseQuantity(text, spec);
	if (r.ok) throw new Error(`expected "${text}" to be refused, got ${r.value_si}`);
	expect(r.pending).toBeFalsy();
	return r.message;
}

describe('parseQuantity', () => {
	it('reads a number with an SI-prefixed unit into SI', () => {
		expectClose(ok('0.5 mm', waist), 5e-4, 1e-15);
		expectClose(ok('0.5mm', waist), 5e-4, 1e-15);
		expectClose(ok('1064 nm', { label: 'Wavelength', kind: 'length', min_si: 100e-9, max_si: 1e-3 }), 1064e-9, 1e-15);
		expectClose(ok('10 kHz', { label: 'Rate', kind: 'frequency' }), 1e4, 1e-15);
		expectClose(ok('1.2 mrad', { label: 'Angle', kind: 'angle' }), 1.2e-3, 1e-15);
		expectClose(ok('45 deg', { label: 'Angle', kind: 'angle' }), Math.PI / 4, 1e-15);
		expectClose(ok('45°', { label: 'Angle', kind: 'angle' }), Math.PI / 4, 1e-15);
	});

	it('reads "µm" and "μm" (micro sign and Greek mu) as micrometres', () => {
		expectClose(ok('250 µm', waist), 250e-6, 1e-15);
		expectClose(ok('250 μm', waist), 250e-6, 1e-15);
		expectClose(ok('250 um', waist), 250e-6, 1e-15);
	});

	it('reads pasted typography: unicode minus, decimal comma, ×10^', () => {
		expectClose(ok('−3 mm', { label: 'Position', kind: 'length' }), -3e-3, 1e-15);
		expectClose(ok('0,5 mm', waist), 5e-4, 1e-15);
		expectClose(ok('5×10^-4 m', waist), 5e-4, 1e-15);
	});

	it('reads other units through mathjs (loaded in beforeAll above)', () => {
		expect(unitEngineReady()).toBe(true);
		expectClose(ok('0.02 inch', waist), 0.02 * 0.0254, 1e-12);
		expectClose(ok('2 mW/cm^2', { label: 'Irradiance', kind: 'irradiance' }), 20, 1e-12);
		expectClose(ok('3 min', { label: 'Exposure', kind: 'time' }), 180, 1e-12);
	});

	it('takes a plain number for a dimensionless field and refuses a unit there', () => {
		expect(ok('1.3', m2)).toBe(1.3);
		expect(refused('1.3 mm', m2)).toMatch(/M² takes a plain number, no unit/);
	});

	it('uses the default unit for a bare number when the field has one, and refuses it otherwise', () => {
		expectClose(ok('0.5', { ...waist, defaultUnit: 'mm' }), 5e-4, 1e-15);
		expect(refused('0.5', waist)).toMatch(/Waist radius needs a unit/);
	});

	it('reads a bare 0 as zero in any unit, and still applies the range', () => {
		expect(ok('0', { label: 'Position', kind: 'length' })).toBe(0);
		expect(refused('0', waist)).toMatch(/Waist radius must be > 0 m/);
	});

	it('refuses empty input, naming the field and giving an example', () => {
		for (const t of ['', '   ', null, undefined]) expect(refused(t, waist)).toMatch(/Waist radius is empty — enter a value such as "0.5 mm"/);
	});

	it('refuses NaN, words and garbage with a message, never a NaN value', () => {
		for (const t of ['NaN', 'abc', 'mm', '1.2.3 mm', '--5 mm', 'Infinity m']) {
			expect(refused(t, waist)).toMatch(/Waist radius/);
		}
	});

	it('refuses the wrong unit, naming the expected kind', () => {
		expect(refused('5 s', waist)).toMatch(/Waist radius: "5 s" has the wrong unit — expected a length/);
		expect(refused('5 W', waist)).toMatch(/wrong unit/);
		expect(refused('2 mW/cm^2', waist)).toMatch(/wrong unit/);
	});

	it('refuses values outside the range, stating the accepted range', () => {
		expect(refused('0 mm', waist)).toMatch(/Waist radius must be > 0 m and ≤ 1 m — got 0 m/);
		expect(refused('-0.5 mm', waist)).toMatch(/must be > 0 m and ≤ 1 m — got −500 µm/);
		expect(refused('2 m', waist)).toMatch(/≤ 1 m/);
		expect(refused('0.9', m2)).toMatch(/M² must be ≥ 1 and ≤ 1000 — got 0.9/);
	});

	it('refuses huge numbers that overflow to Infinity, and huge finite values by range', () => {
		expect(refused('1e400 m', waist)).toMatch(/Waist radius must be a finite number/);
		expect(refused('1e400', m2)).toMatch(/finite number/);
		expect(refused('1e300 m', waist)).toMatch(/≤ 1 m/);
	});

	it('parseQuantityOrThrow throws a RangeError with the same message', () => {
		expect(() => parseQuantityOrThrow('5 s', waist)).toThrow(RangeError);
		expect(() => parseQuantityOrThrow('5 s', waist)).toThrow(/wrong unit/);
		expect(parseQuantityOrThrow('1 mm', waist)).toBe(1e-3);
	});
});

describe('fastParse agrees with mathjs for every prefix × unit', () => {
	const prefixes = ['', 'f', 'p', 'n', 'u', 'm', 'c', 'k', 'M', 'G', 'T'];
	const units = ['m', 's', 'W', 'J', 'Hz', 'rad'];
	const si: Record<string, string> = { m: 'm', s: 's', W: 'W', J: 'J', Hz: 'Hz', rad: 'rad' };

	it('for "3.7 <prefix><unit>", "-0.25<prefix><unit>" and "1.5e-3 <prefix><unit>"', async () => {
		const { unit } = await import('mathjs');
		let compared = 0;
		for (const p of prefixes) {
			for (const u of units) {
				for (const num of ['3.7', '-0.25', '1.5e-3', '12']) {
					for (const sep of [' ', '']) {
						const text = `${num}${sep}${p}${u}`;
						const fast = fastParse(text);
						if (p === 'c' && u !== 'm') {
							// The fast path keeps centi- for centimetres only; the rest goes to mathjs.
							expect(fast, text).toBeNull();
							continue;
						}
						expect(fast, text).not.toBeNull();
						expectClose(fast!.value_si, unit(`${num} ${p}${u}`).toNumber(si[u]), 1e-15, text);
						compared++;
					}
				}
			}
		}
		expect(compared).toBe((prefixes.length * units.length - (units.length - 1)) * 8);
	});

	it('for degrees', async () => {
		const { unit } = await import('mathjs');
		for (const num of ['45', '3.7', '-12.5', '0.001', '90']) {
			expectClose(fastParse(`${num} deg`)!.value_si, unit(`${num} deg`).toNumber('rad'), 1e-15, num);
			expectClose(fastParse(`${num}°`)!.value_si, unit(`${num} deg`).toNumber('rad'), 1e-15, num);
		}
	});

	it('and parseQuantity gives the same number by either route ("3.7 km" fast, "3.7 kilometer" via mathjs)', () => {
		const spec: FieldSpec = { label: 'L', kind: 'length' };
		expect(fastParse('3.7 kilometer')).toBeNull();
		expectClose(ok('3.7 km', spec), ok('3.7 kilometer', spec), 1e-15);
		expectClose(ok('0.5 mm', spec), ok('0.5 millimeter', spec), 1e-15);
		expectClose(ok('1064 nm', spec), ok('1064 nanometer', spec), 1e-15);
	});

	it('returns null for forms it does not read', () => {
		for (const t of ['5 min', '1 inch', '2 mW/cm^2', 'abc', '5', '5 kg', '5 cs']) expect(fastParse(t), t).toBeNull();
	});
});

describe('formatSI', () => {
	it('prints SI prefixes with 4 significant figures by default', () => {
		expect(formatSI(5e-4, 'm')).toBe('500 µm');
		expect(formatSI(0.0712, 'm', 3)).toBe('71.2 mm');
		expect(formatSI(1064e-9, 'm')).toBe('1.064 µm');
		expect(formatSI(1.2411475, 'm')).toBe('1.241 m');
		expect(formatSI(0, 'm')).toBe('0 m');
		expect(formatSI(-5e-4, 'm')).toBe('−500 µm');
	});

	it('never prints NaN, Infinity or undefined, whatever the value', () => {
		const values = [NaN, Infinity, -Infinity, 0, -0, 1e-30, -1e-30, 1e30, -1e30, Number.MIN_VALUE, Number.MAX_VALUE, 0.99999, 999.99, 1e-15, 1e15, 5e-324, -7.5e-17];
		for (const v of values) {
			for (const unit of ['m', 'W', 'rad', '', '%', '°']) {
				for (const sig of [1, 3, 4, 6]) {
					const s = formatSI(v, unit, sig);
					expect(s, `${v} ${unit}`).not.toMatch(/NaN|Infinity|undefined/);
					expect(s.length).toBeGreaterThan(0);
				}
			}
			expect(formatNumber(v)).not.toMatch(/NaN|Infinity|undefined/);
			expect(formatPercent(v)).not.toMatch(/NaN|Infinity|undefined/);
		}
		expect(formatSI(NaN, 'm')).toBe('— m');
		expect(formatSI(Infinity, 'm')).toBe('∞ m');
	});

	it('uses the typographic minus for every minus sign, including exponents', () => {
		expect(formatNumber(-1.5e-5)).toBe('−1.5×10^−5');
		expect(formatNumber(2.5e-7)).toBe('2.5×10^−7');
		expect(formatSI(-1e-20, 'm')).not.toMatch(/-/);
	});

	it('axisPrefix picks one prefix for an axis and a defined answer for degenerate input', () => {
		expect(axisPrefix(0.0042, 'm')).toEqual({ factor: 1e-3, unit: 'mm' });
		expect(axisPrefix(0, 'm')).toEqual({ factor: 1, unit: 'm' });
		expect(axisPrefix(NaN, 'm')).toEqual({ factor: 1, unit: 'm' });
	});
});
