import { describe, expect, it } from 'vitest';
import { expectClose } from '../helpers';
import { parseWidthTable } from '../../src/lib/io/widthTable';

const mm = 1e-3, um = 1e-6;

describe('parseWidthTable', () => {
	it('reads z and d in the default units (mm, µm)', () => {
		const t = parseWidthTable('z,d\n0,500\n10,520\n20,610\n');
		expect(t.columns).toBe('d');
		expect(t.rows.map((r) => r.line)).toEqual([2, 3, 4]);
		expectClose(t.rows[1].z_m, 10 * mm, 1e-12);
		expectClose(t.rows[1].d_m[0], 520 * um, 1e-12);
		expect(t.flags).toEqual([]);
	});

	it('reads z, dx, dy in the units the caller names', () => {
		const t = parseWidthTable('Z\tDX\tDY\n0.1\t0.5\t0.6\n0.2\t0.55\t0.62', { zUnit_m: 1, dUnit_m: mm });
		expect(t.columns).toBe('xy');
		expect(t.rows[1].z_m).toBe(0.2);
		expectClose(t.rows[1].d_m[1], 0.62 * mm, 1e-12);
	});

	it('flags each problem row by its line number and never drops it silently', () => {
		const text = ['# bench 2', 'z,d', '0,500', '10,-3', '20,abc', '30,0', '10,520', '40,', '50', '', '60,700', '0,510'].join('\n');
		const t = parseWidthTable(text);
		expect(t.rows.map((r) => r.line)).toEqual([3, 7, 11]);
		const byLine = Object.fromEntries(t.flags.map((f) => [f.line, f.problem]));
		expect(byLine[4]).toBe('d must be > 0 — got -3');
		expect(byLine[5]).toBe('d "abc" is not a number');
		expect(byLine[6]).toBe('d must be > 0 — got 0');
		expect(byLine[8]).toBe('d is empty');
		expect(byLine[9]).toBe('expected z and d, found 1 value');
		expect(byLine[12]).toMatch(/^z = 0 repeats line 3/);
		// Every data line is accounted for: rows + flags = data lines.
		expect(t.rows.length + t.flags.length).toBe(9);
	});

	it('accepts semicolons with decimal commas, and units in the header through the caller’s resolver', () => {
		const resolveUnit = (u: string) => ({ mm: 1e-3, um: 1e-6, m: 1 })[u] ?? null;
		const t = parseWidthTable('z (m);dx [mm];dy [mm]\n0,25;0,41;0,39\n0,30;0,44;0,40', { resolveUnit });
		expectClose(t.rows[0].z_m, 0.25, 1e-12);
		expectClose(t.rows[1].d_m[0], 0.44e-3, 1e-12);
		expect(t.zUnit_m).toBe(1);
		expect(t.notes.join(' ')).toMatch(/taken from the header/);
	});

	it('refuses a header unit that contradicts the unit the caller set, and an unknown one', () => {
		const resolveUnit = (u: string) => ({ mm: 1e-3, m: 1 })[u] ?? null;
		expect(() => parseWidthTable('z (m),d\n1,2', { zUnit_m: 1e-3, resolveUnit })).toThrow(/gives z in m but the z unit was set/);
		expect(() => parseWidthTable('z (furlong),d\n1,2', { resolveUnit })).toThrow(/"furlong" is not a length unit/);
	});

	it('reads a table without header by its number of values and says so', () => {
		const t = parseWidthTable('0 500 480\n10 520 490\n20 600 560');
		expect(t.columns).toBe('xy');
		expect(t.notes[0]).toMatch(/no header/);
		expect(t.rows).toHaveLength(3);
	});

	it('ignores (and reports) extra columns', () => {
		const t = parseWidthTable('z,d,comment\n0,500,first\n10,510,second');
		expect(t.rows).toHaveLength(2);
		expect(t.notes.join(' ')).toMatch(/"comment" .* ignored/);
	});

	it('throws for a header without z and d (or dx and dy), and for an empty table', () => {
		expect(() => parseWidthTable('pos,width\n1,2')).toThrow(/header must name the columns z and d, or z, dx and dy/);
		expect(() => parseWidthTable('z,dx\n1,2')).toThrow(/header must name the columns/);
		expect(() => parseWidthTable('# only a comment\n\n')).toThrow(/at least one data line/);
		expect(() => parseWidthTable('z,d\n')).toThrow(/at least one data line below the header/);
		expect(() => parseWidthTable('z,d\n1,2', { zUnit_m: -1 })).toThrow(/z unit must be > 0 m per unit — got -1/);
	});
});
