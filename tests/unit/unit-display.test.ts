/**
 * The unit shown beside a field (src/lib/units/display.ts): a bare number is read in the unit shown
 * and stored with it; a picked unit rewrites the number. Expected values come from the SI prefixes
 * (BIPM, The International System of Units, 9th edition 2019, Table 7: milli 10⁻³, micro 10⁻⁶,
 * nano 10⁻⁹, kilo 10³) and the degree π/180 rad (same brochure, Table 8).
 */
import { describe, it, expect } from 'vitest';
import { expectClose } from '../helpers';
import { parseQuantity, type FieldSpec } from '../../src/lib/units';
import { isBareNumber, kindOfText, numberIn, storedText, textInUnit, unitChoices, unitFactor, unitOfText } from '../../src/lib/units/display';

const waist: FieldSpec = { label: 'Waist radius', kind: 'length', above_si: 0, max_si: 1 };

describe('a bare number is read in the unit shown', () => {
	it('"2.5" with mm shown is stored as "2.5 mm" and reads 2.5 × 10⁻³ m', () => {
		const stored = storedText('2.5', 'mm');
		expect(stored).toBe('2.5 mm');
		const r = parseQuantity(stored, waist);
		expect(r.ok).toBe(true);
		if (r.ok) expectClose(r.value_si, 2.5e-3, 1e-15);
	});
	it('µm, nm, mW and deg read with their SI factors', () => {
		const cases: Array<[string, string, FieldSpec['kind'], number]> = [
			['40', 'µm', 'length', 40e-6],
			['1064', 'nm', 'length', 1064e-9],
			['50', 'mW', 'power', 50e-3],
			['1.5', 'kW', 'power', 1.5e3],
			['45', 'deg', 'angle', Math.PI / 4],
			['10', 'ns', 'time', 10e-9]
		];
		for (const [n, u, kind, si] of cases) {
			const r = parseQuantity(storedText(n, u), { label: 'x', kind });
			expect(r.ok, `${n} ${u}`).toBe(true);
			if (r.ok) expectClose(r.value_si, si, 1e-14, `${n} ${u}`);
		}
	});
	it('a decimal comma and a sign count as a bare number; text with a unit, words and empty text are kept as typed', () => {
		expect(isBareNumber('2,5')).toBe(true);
		expect(isBareNumber(' -3e-2 ')).toBe(true);
		expect(storedText('2,5', 'mm')).toBe('2,5 mm');
		expect(storedText('0.3 m', 'mm')).toBe('0.3 m');
		expect(storedText('flat', 'mm')).toBe('flat');
		expect(storedText('', 'mm')).toBe('');
		expect(storedText('1/2 inch', 'mm')).toBe('1/2 inch');
		expect(storedText('2.5', null)).toBe('2.5');
	});
	it('every unit offered is read by the fast path (no unit engine needed)', () => {
		for (const [kind, list] of Object.entries(unitChoices)) {
			for (const u of list!) {
				expect(unitFactor(u), `${kind}: ${u}`).not.toBeNull();
				const r = parseQuantity(`1 ${u}`, { label: 'x', kind: kind as FieldSpec['kind'] });
				expect(r.ok, `${kind}: 1 ${u}`).toBe(true);
			}
		}
	});
});

describe('picking another unit rewrites the number', () => {
	it('2.5 mm shown bare becomes 2500 in µm, 0.25 in cm and 0.0025 in m', () => {
		expect(textInUnit('2.5 mm', '2.5', 'µm', 'length')).toBe('2500');
		expect(textInUnit('2.5 mm', '2.5', 'cm', 'length')).toBe('0.25');
		expect(textInUnit('2.5 mm', '2.5', 'm', 'length')).toBe('0.0025');
	});
	it('a field showing its own unit keeps a unit written', () => {
		expect(textInUnit('0.3 m', '0.3 m', 'mm', 'length')).toBe('300 mm');
		expect(textInUnit('5 W', '5 W', 'mW', 'power')).toBe('5000 mW');
	});
	it('a value out of the field range is converted all the same; text without a value is not', () => {
		expect(textInUnit('-3 mm', '-3', 'µm', 'length')).toBe('-3000');
		expect(textInUnit('flat', 'flat', 'mm', 'length')).toBeNull();
		expect(textInUnit('', '', 'mm', 'length')).toBeNull();
		expect(textInUnit('5 W', '5', 'mm', 'length')).toBeNull();
	});
	it('numbers keep 12 significant digits and no binary noise', () => {
		expect(numberIn(0.1 + 0.2, 'm')).toBe('0.3');
		expect(numberIn(632.8e-9, 'nm')).toBe('632.8');
	});
});

describe('the unit a stored text is written in', () => {
	it('names the offered unit, with µ or u for micro', () => {
		expect(unitOfText('200 mm', 'length')).toBe('mm');
		expect(unitOfText('3 um', 'length')).toBe('µm');
		expect(unitOfText('3µm', 'length')).toBe('µm');
		expect(unitOfText('2 in', 'length')).toBeNull();
		expect(kindOfText('1064 nm')).toBe('length');
		expect(kindOfText('1.2 mrad')).toBe('angle');
		expect(kindOfText('1.2')).toBeNull();
		expect(kindOfText('99 %')).toBeNull();
	});
});
