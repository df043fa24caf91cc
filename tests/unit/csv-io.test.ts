/**
 * The one CSV reader and writer (src/lib/io/csv.ts) and every CSV that goes through it: the lab
 * inventory, the lens shelf, the width table and image matrices. Quoting follows RFC 4180 (Shafranovich,
 * "Common Format and MIME Type for CSV Files", 2005); formula escaping follows the OWASP "CSV Injection"
 * page (cells starting with = + - @ tab CR get a leading apostrophe). Decimal comma with semicolon or
 * blank separators: common practice in European lab software exports.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { detectSeparator, numberCell, readCsv } from '../../src/lib/io/csv';
import { csvCell } from '../../src/lib/io/csvOut';
import { assessInventory, inventoryToCsv, parseInventoryCsv, MAX_INVENTORY_ROWS } from '../../src/lib/safety/inventory';
import { lensCsv, parseLensCsv } from '../../src/lib/optics/solve/inventory';
import { parseWidthTable } from '../../src/lib/io/widthTable';
import { parseMatrixCsv } from '../../src/lib/io/beamImage';
import { loadUnitEngine } from '../../src/lib/units/parse';

beforeAll(() => loadUnitEngine());

const demoLab = readFileSync('static/demo/hazard-lab-lasers.csv', 'utf8');

describe('readCsv', () => {
	it('numbers records by the line they start on, across quoted line breaks and mixed line ends', () => {
		const r = readCsv('a,b\r\n"x, y","say ""hi"""\n"two\nlines",z\n\n# note\nlast,1');
		expect(r.ok && r.records).toEqual([
			{ line: 1, cells: ['a', 'b'] },
			{ line: 2, cells: ['x, y', 'say "hi"'] },
			{ line: 3, lineEnd: 4, cells: ['two\nlines', 'z'] },
			{ line: 7, cells: ['last', '1'] }
		]);
	});
	it('stops at an unterminated quote and names the line where it opens', () => {
		const r = readCsv('a,b\n1,2\n"3,4\n5,6\n7,8\n', { what: 'test file' });
		expect(r.ok).toBe(false);
		if (!r.ok) {
			expect(r.line).toBe(3);
			expect(r.message).toMatch(/^test file line 3: a quote opens a cell that is never closed/);
		}
	});
	it('decides the separator from the first line, and the decimal comma with it', () => {
		expect(detectSeparator('z;d')).toBe(';');
		expect(detectSeparator('z\td')).toBe('\t');
		expect(detectSeparator('z,d')).toBe(',');
		expect(detectSeparator('z, d')).toBe(',');
		expect(detectSeparator('0 1080,4')).toBe(' ');
		expect(detectSeparator('z d')).toBe(' ');
		expect(numberCell('1080,4', true)).toBe(1080.4);
		expect(numberCell('1080,4', false)).toBeNull();
		expect(numberCell('1.080,4', true)).toBeNull();
		expect(numberCell('0x5', true)).toBeNull();
	});
	it('refuses a file longer than the limit before parsing it', () => {
		const big = 'a,b\n' + '1,2\n'.repeat(2000);
		const r = readCsv(big, { maxRecords: 1000, what: 'x' });
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.message).toMatch(/more than 1,000 lines — the limit is 1,000/);
	});
});

describe('exports are safe to open in a spreadsheet (OWASP CSV Injection)', () => {
	it('escapes cells starting with = + - @ and leaves plain numbers alone', () => {
		expect(csvCell('=HYPERLINK("http://x","y")')).toBe(`"'=HYPERLINK(""http://x"",""y"")"`);
		expect(csvCell('+1+2')).toBe("'+1+2");
		expect(csvCell('-2+3')).toBe("'-2+3");
		expect(csvCell('@SUM(A1)')).toBe("'@SUM(A1)");
		expect(csvCell('-50')).toBe('-50');
		expect(csvCell(-50)).toBe('-50');
		expect(csvCell('plain')).toBe('plain');
	});
	it('the lab table export escapes a formula-like name and reads back to the same name', () => {
		const text = 'name,wavelength,power,beam_diameter,divergence,note\n=cmd|calc,532 nm,1 mW,1 mm,1 mrad,@risky\n';
		const csv = inventoryToCsv(assessInventory(text, 'stricter'));
		const body = csv.split('\n')[1];
		expect(body.startsWith("2,'=cmd|calc,")).toBe(true);
		expect(body).toContain(",'@risky,");
		const back = parseInventoryCsv(csv);
		expect(back.lasers[0].name).toBe('=cmd|calc');
		expect(back.lasers[0].note).toBe('@risky');
	});
	it('the lens list export escapes labels and keeps negative focal lengths as numbers', () => {
		const csv = lensCsv([{ label: '-Shelf lens 4', f_m: -0.05, diameter_m: 0.0254, count: 2 }]);
		expect(csv).toBe("lens,f_mm,dia_mm,qty\n'-Shelf lens 4,-50,25.4,2\n");
		const back = parseLensCsv(csv);
		expect(back.ok && back.lenses[0]).toEqual({ label: '-Shelf lens 4', f_m: -0.05, diameter_m: 0.0254, count: 2 });
	});
});

describe('lab inventory', () => {
	it('an unbalanced quote is reported with its line and nothing is half-imported (was: 1 of 8 lasers, no issue)', () => {
		// Open a quote at the start of line 4 and never close it.
		const lines = demoLab.split('\n');
		lines[3] = '"' + lines[3];
		const broken = lines.join('\n');
		const r = parseInventoryCsv(broken);
		expect(r.lasers).toEqual([]);
		expect(r.refused).toMatch(/line 4: .*quote/);
		expect(r.issues[0].line).toBe(4);
	});
	it('the exported table imports back to the same inventory (every laser, every input)', () => {
		const withBad = demoLab + 'Broken row,green,1 mW,,,,1 mm,1 mrad,,,Room X,kept\n';
		const first = parseInventoryCsv(withBad);
		expect(first.lasers.length).toBe(8);
		const csv = inventoryToCsv(assessInventory(withBad, 'stricter'));
		const again = parseInventoryCsv(csv);
		expect(again.refused).toBeNull();
		expect(again.issues.map((i) => i.message)).toEqual(first.issues.map((i) => i.message));
		expect(again.lasers.map((l) => [l.name, l.room, l.note, l.input])).toEqual(first.lasers.map((l) => [l.name, l.room, l.note, l.input]));
		expect(again.rejected.map((x) => x.cells)).toEqual(first.rejected.map((x) => x.cells));
	});
	it('a file without the required columns is refused as a whole (the caller keeps the old list)', () => {
		const r = parseInventoryCsv('line,name,room,status\n1,A,B,ok\n');
		expect(r.lasers).toEqual([]);
		expect(r.refused).toMatch(/required columns missing: wavelength, beam_diameter, divergence/);
	});
	it('semicolons with decimal commas read the same numbers as commas with points', () => {
		const a = parseInventoryCsv('name,wavelength,power,beam_diameter,divergence\nA,514.5 nm,0.5 W,2.83 mm,1.41\n');
		const b = parseInventoryCsv('name;wavelength;power;beam_diameter;divergence\nA;514,5 nm;0,5 W;2,83 mm;1,41\n');
		expect(b.issues).toEqual([]);
		expect(b.lasers[0].input).toEqual(a.lasers[0].input);
	});
	it('states ranges for safety inputs (power, divergence, diameter) and refuses beyond them', () => {
		const r = parseInventoryCsv('name,wavelength,power,beam_diameter,divergence\nA,532 nm,1e30 W,1 mm,1 mrad\nB,532 nm,1 W,1 mm,10 rad\nC,532 nm,1 W,100 m,1 mrad\n');
		expect(r.lasers).toEqual([]);
		expect(r.issues.map((i) => i.line)).toEqual([2, 3, 4]);
		for (const i of r.issues) expect(i.message).toMatch(/must be/);
	});
	it('a million-row inventory is refused at once with the limit', () => {
		const big = 'name,wavelength,power,beam_diameter,divergence\n' + 'A,532 nm,1 mW,1 mm,1 mrad\n'.repeat(1_000_000);
		const t0 = performance.now();
		const r = parseInventoryCsv(big);
		expect(performance.now() - t0).toBeLessThan(5000);
		expect(r.refused).toMatch(new RegExp(`the limit is ${MAX_INVENTORY_ROWS.toLocaleString('en')}`));
	});
});

describe('lens list, width table and matrices read decimal commas the same way', () => {
	it('lens list with semicolons and decimal commas', () => {
		const r = parseLensCsv('lens;f_mm;dia_mm;qty\nShelf lens 4;-50,5;25,4;2\n');
		expect(r.ok && r.lenses[0]).toEqual({ label: 'Shelf lens 4', f_m: -0.0505, diameter_m: 0.0254, count: 2 });
	});
	it('a lens list with an unbalanced quote names the line', () => {
		const r = parseLensCsv('lens,f_mm\n"A,50\nB,100\n');
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.message).toMatch(/lens list line 2: a quote/);
	});
	it('width table with blanks and decimal commas reads 1080,4 as one number (was: two cells)', () => {
		const t = parseWidthTable('0 1080,4\n10 990,5\n20 1001,25\n');
		expect(t.flags).toEqual([]);
		expect(t.rows.map((r) => r.d_m[0])).toEqual([1080.4e-6, 990.5e-6, 1001.25e-6]);
	});
	it('width table with commas refuses a quoted decimal comma and says why', () => {
		const t = parseWidthTable('z,d\n0,"1080,4"\n10,990\n');
		expect(t.flags[0].problem).toMatch(/decimal comma needs semicolon, tab or blank separators/);
	});
	it('image matrix with semicolons and decimal commas', () => {
		const m = parseMatrixCsv('0;1,5\n2,25;3\n');
		expect(Array.from(m.data)).toEqual([0, 1.5, 2.25, 3]);
	});
});
