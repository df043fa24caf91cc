/**
 * Whole-lab CSV import and export: our own column names, units in cells or by column default,
 * quoting (RFC 4180), bad rows flagged by line while good rows are still assessed.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { expectClose } from '../helpers';
import { loadUnitEngine } from '../../src/lib/units/parse';
import { assessInventory, caution, exportColumns, inventoryColumns, inventoryToCsv, parseInventoryCsv, splitCsv } from '../../src/lib/safety';

beforeAll(() => loadUnitEngine());

const header = 'name,wavelength,power,pulse_energy,pulse_width,rep_rate,beam_diameter,divergence,exposure,room,note';

describe('splitCsv', () => {
	it('keeps quoted commas, doubled quotes and line breaks inside quotes, and numbers records by starting line', () => {
		const r = splitCsv('a,b\r\n"x, y","say ""hi"""\n"two\nlines",z\n\n');
		expect(r).toEqual([
			{ line: 1, cells: ['a', 'b'] },
			{ line: 2, cells: ['x, y', 'say "hi"'] },
			{ line: 3, cells: ['two\nlines', 'z'] }
		]);
	});
	it('ignores a byte-order mark and a missing final newline', () => {
		expect(splitCsv('\uFEFFa,b')).toEqual([{ line: 1, cells: ['a', 'b'] }]);
	});
});

describe('parseInventoryCsv', () => {
	it('reads units from cells and default units from bare numbers (nm, W, mm, mrad)', () => {
		const { lasers, issues } = parseInventoryCsv(`${header}\nA,532,0.005,,,,1.2,1.1,,R1,n\nB,1.064 um,5 mW,,,,2 mm,0.8 mrad,10 s,,`);
		expect(issues).toEqual([]);
		expectClose(lasers[0].input.wavelength_m, 532e-9);
		expectClose(lasers[0].input.power_W!, 5e-3);
		expectClose(lasers[0].input.diameter_m, 1.2e-3);
		expectClose(lasers[0].input.fullDivergence_rad, 1.1e-3);
		expectClose(lasers[1].input.wavelength_m, 1064e-9);
		expect(lasers[1].input.duration_s).toBe(10);
		expect(lasers.map((l) => l.line)).toEqual([2, 3]);
	});
	it('matches headers without regard to case or spaces, skips # comments', () => {
		const { lasers, issues } = parseInventoryCsv(`# lab list\n Name , WAVELENGTH,Power,Beam_Diameter,Divergence\nA,633 nm,1 mW,1 mm,1 mrad`);
		expect(issues).toEqual([]);
		expect(lasers[0].line).toBe(3);
	});
	it('flags bad rows by line with the reason and keeps the good ones', () => {
		const text = [header, 'Good,532 nm,1 mW,,,,1 mm,1 mrad,,,', 'NoUnit,532 nm,1 mW,,,,1 mm,1 mrad,,,', 'Bad,green,1 mW,,,,1 mm,1 mrad,,,', 'Both,532 nm,1 mW,1 mJ,10 ns,,1 mm,1 mrad,,,', ',532 nm,,,,,1 mm,1 mrad,,,'].join('\n');
		const { lasers, issues } = parseInventoryCsv(text);
		expect(lasers.map((l) => l.name)).toEqual(['Good', 'NoUnit']);
		expect(issues.map((i) => i.line)).toEqual([4, 5, 6]);
		expect(issues[0].message).toMatch(/wavelength: "green" is not a number with a unit/);
		expect(issues[1].message).toMatch(/not both/);
		expect(issues[2].message).toMatch(/name is empty.*give power/);
	});
	it('names an unknown column and the accepted ones; a missing required column stops the import', () => {
		const a = parseInventoryCsv('name,wavelength,powr,beam_diameter,divergence\nA,532 nm,1 mW,1 mm,1 mrad');
		expect(a.issues[0]).toMatchObject({ line: 1 });
		expect(a.issues[0].message).toMatch(/column "powr" is not one we read — accepted: name, wavelength, power/);
		const b = parseInventoryCsv('name,wavelength,power\nA,532 nm,1 mW');
		expect(b.lasers).toEqual([]);
		expect(b.issues[0].message).toMatch(/required columns missing: beam_diameter, divergence/);
	});
	it('documents every column it reads', () => {
		for (const c of inventoryColumns) expect(c.doc.length).toBeGreaterThan(10);
	});
});

describe('assessInventory and inventoryToCsv', () => {
	const text = `${header}\nTeal,514.5 nm,5 W,,,,2.83 mm,1.41 mrad,0.25 s,B12,"enclosed, main bench"\nFar,150 nm,1 W,,,,1 mm,1 mrad,,,`;
	const table = assessInventory(text, 'eu-2006-25');
	it('assesses each good row: limit, both NOHDs, OD', () => {
		const r = table.rows[0];
		expect(r.ok).toBe(true);
		if (!r.ok) return;
		expectClose(r.result.mpe_W_m2, (18 * 0.25 ** 0.75) / 0.25, 1e-12);
		expect(r.result.nohd_m).toBeGreaterThan(400);
		expect(r.result.odWhole).toBe(4);
	});
	it('a row the engine refuses is reported with its line, not dropped silently', () => {
		expect(table.rows[1]).toMatchObject({ line: 3, ok: false });
		expect(table.issues.find((i) => i.line === 3)!.message).toMatch(/wavelength must be within 180 nm–1 mm — got 150 nm/);
	});
	it('exports our own columns, one line per laser, with the caution on every row', () => {
		const csv = inventoryToCsv(table);
		const rows = splitCsv(csv);
		expect(rows[0].cells).toEqual([...exportColumns]);
		expect(rows.length).toBe(3);
		const col = (n: string) => rows[0].cells.indexOf(n);
		expect(rows[1].cells[col('name')]).toBe('Teal');
		expect(rows[1].cells[col('note')]).toBe('enclosed, main bench');
		expect(rows[1].cells[col('od_whole')]).toBe('4');
		expect(rows[2].cells[col('status')]).toMatch(/^refused: wavelength must be within/);
		for (const r of rows.slice(1)) expect(r.cells[col('caution')]).toBe(caution);
	});
	it('the export reads back through the CSV splitter with the same numbers', () => {
		const rows = splitCsv(inventoryToCsv(table));
		const i = rows[0].cells.indexOf('limit_W_m2');
		expectClose(Number(rows[1].cells[i]), (18 * 0.25 ** 0.75) / 0.25, 1e-5);
	});
});
