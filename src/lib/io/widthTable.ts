/**
 * Read a table of measured beam diameters along z (pasted text or a CSV file) into SI rows.
 *
 * Layout: a header naming the columns `z` and `d` (one diameter), or `z`, `dx` and `dy`; names are
 * case-insensitive and may carry a unit in brackets, e.g. `z (mm)`, `dx [um]`. Other columns are
 * ignored and reported. Separators: comma, semicolon, tab or spaces; with semicolon, tab or space
 * separators a decimal comma is accepted (the app's one CSV reader, `csv.ts`, decides this the same way
 * for every CSV). Blank lines and lines starting with `#` are skipped. At most `MAX_WIDTH_ROWS` lines.
 * Without a header, two numbers per line mean z, d and three mean z, dx, dy.
 *
 * Every data line is either a row or a flag naming its line number and the problem (not a number,
 * diameter ≤ 0, missing value, z repeated); flagged lines never reach the fit and are never dropped
 * silently.
 *
 * No units library here: the caller passes metres per unit (`zUnit_m`, `dUnit_m`) and, if it wants
 * header units honoured, a `resolveUnit` function (the app and CLI use src/lib/units at the edge).
 */

export type WidthColumns = 'd' | 'xy';

export interface WidthRow {
	/** 1-based line number in the pasted text or file. */
	line: number;
	z_m: number;
	/** [d] for one diameter column, [dx, dy] for two; second-moment diameters, m. */
	d_m: number[];
}

export interface RowFlag {
	line: number;
	/** The line as given (trimmed). */
	text: string;
	problem: string;
}

export interface WidthTable {
	columns: WidthColumns;
	rows: WidthRow[];
	flags: RowFlag[];
	/** Non-fatal remarks: ignored columns, assumed layout, units taken from the header. */
	notes: string[];
	/** Metres per unit actually used for z and for diameters. */
	zUnit_m: number;
	dUnit_m: number;
}

export interface WidthTableOptions {
	/** Metres per z unit; default 1e-3 (mm). */
	zUnit_m?: number;
	/** Metres per diameter unit; default 1e-6 (µm). */
	dUnit_m?: number;
	/** Turns a unit written in the header, e.g. "mm", into metres per unit; null when unknown. */
	resolveUnit?: (unit: string) => number | null;
	/** Layout to assume when there is no header; default: by the number of values on a line. */
	columns?: WidthColumns;
}

import { numberCell, readCsv, unescapeCell } from './csv';

/** Most lines a width table may have; a longer one is refused before it is read. */
export const MAX_WIDTH_ROWS = 100_000;

const headerRe = /^(z|d|dx|dy)\s*(?:[([]\s*([^)\]]*?)\s*[)\]])?$/i;

function cleanCell(c: string): string {
	return unescapeCell(c).trim().replace(/^"(.*)"$/, '$1').trim();
}

function checkScale(v: number | undefined, name: string): void {
	if (v !== undefined && !(Number.isFinite(v) && v > 0)) throw new RangeError(`${name} must be > 0 m per unit — got ${v}`);
}

/**
 * Parse a width table. Throws RangeError only for a table that cannot be read at all (no data lines,
 * a header without z and d / dx, dy, a unit that cannot be resolved); row problems become flags.
 * Example: "z,d\n0,500\n10,-3\n10,520\n0,510" with defaults (mm, µm) → rows from line 2
 * (z 0 m, d 5e-4 m) and line 4 (z 0.01 m, d 5.2e-4 m); flags for line 3 ("d must be > 0 — got -3")
 * and line 5 ("z = 0 repeats line 2 …").
 */
export function parseWidthTable(text: string, options: WidthTableOptions = {}): WidthTable {
	checkScale(options.zUnit_m, 'z unit');
	checkScale(options.dUnit_m, 'diameter unit');
	const read = readCsv(text, { what: 'width table', maxRecords: MAX_WIDTH_ROWS });
	if (!read.ok) throw new RangeError(read.message);
	const { records, decimalComma } = read;
	const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\r|\n/);
	const notes: string[] = [];
	if (records.length === 0) throw new RangeError('width table must have a header (z, d or z, dx, dy) and at least one data line — got no data');
	const first = records[0].line - 1;
	const isNumber = (c: string) => numberCell(c, decimalComma) !== null;
	const headCells = records[0].cells.map(cleanCell);
	const headerLike = headCells.some((c) => !isNumber(c));
	let columns: WidthColumns;
	let zCol = 0;
	let dCols: number[];
	let zUnit_m = options.zUnit_m ?? 1e-3;
	let dUnit_m = options.dUnit_m ?? 1e-6;
	let start = 0;

	if (headerLike) {
		start = 1;
		const found = new Map<string, { col: number; unit?: string }>();
		headCells.forEach((c, col) => {
			const m = headerRe.exec(c);
			if (m) found.set(m[1].toLowerCase(), { col, unit: m[2] || undefined });
			else notes.push(`column "${c}" is not z, d, dx or dy and was ignored`);
		});
		const z = found.get('z');
		const d = found.get('d');
		const dx = found.get('dx');
		const dy = found.get('dy');
		if (!z || !(d || (dx && dy)) || (d && (dx || dy))) {
			throw new RangeError(`width table header must name the columns z and d, or z, dx and dy — got "${lines[first].trim()}"`);
		}
		columns = d ? 'd' : 'xy';
		zCol = z.col;
		dCols = d ? [d.col] : [dx!.col, dy!.col];
		const dUnits = (d ? [d] : [dx!, dy!]).map((e) => e.unit);
		if (dUnits[0] !== dUnits[1] && columns === 'xy') {
			throw new RangeError(`width table header must give dx and dy the same unit — got "${dUnits[0] ?? 'none'}" and "${dUnits[1] ?? 'none'}"`);
		}
		const fromHeader = (unit: string | undefined, given: number | undefined, what: string): number | undefined => {
			if (unit === undefined) return undefined;
			const v = options.resolveUnit?.(unit) ?? null;
			if (v === null || !(v > 0)) throw new RangeError(`width table header: "${unit}" is not a length unit for ${what} — use e.g. mm, um, m`);
			if (given !== undefined && Math.abs(v - given) > 1e-12 * v) {
				throw new RangeError(`width table header gives ${what} in ${unit} but the ${what} unit was set to ${given} m — remove one of them`);
			}
			notes.push(`${what} unit "${unit}" taken from the header`);
			return v;
		};
		zUnit_m = fromHeader(z.unit, options.zUnit_m, 'z') ?? zUnit_m;
		dUnit_m = fromHeader(dUnits[0], options.dUnit_m, 'diameter') ?? dUnit_m;
	} else {
		const nCells = headCells.length;
		columns = options.columns ?? (nCells >= 3 ? 'xy' : 'd');
		dCols = columns === 'd' ? [1] : [1, 2];
		notes.push(`no header: read as ${columns === 'd' ? 'z, d' : 'z, dx, dy'}`);
	}

	const names = columns === 'd' ? ['d'] : ['dx', 'dy'];
	const rows: WidthRow[] = [];
	const flags: RowFlag[] = [];
	const seenZ = new Map<number, number>();
	const need = Math.max(zCol, ...dCols) + 1;
	for (let r = start; r < records.length; r++) {
		const line = records[r].line;
		const t = (lines[line - 1] ?? '').trim();
		const cells = records[r].cells.map(cleanCell);
		const flag = (problem: string) => flags.push({ line, text: t, problem });
		if (cells.length < need) {
			flag(`expected ${columns === 'd' ? 'z and d' : 'z, dx and dy'}, found ${cells.length} value${cells.length === 1 ? '' : 's'}`);
			continue;
		}
		const read = (col: number, name: string): number | string => {
			if (cells[col] === '') return `${name} is empty`;
			const v = numberCell(cells[col], decimalComma);
			if (v === null) return `${name} "${cells[col]}" is not a number${!decimalComma && cells[col].includes(',') ? ' (a decimal comma needs semicolon, tab or blank separators)' : ''}`;
			if (!Number.isFinite(v)) return `${name} "${cells[col]}" is out of range`;
			return v;
		};
		const z = read(zCol, 'z');
		const ds = dCols.map((c, k) => read(c, names[k]));
		const problems = [z, ...ds].filter((v): v is string => typeof v === 'string');
		ds.forEach((v, k) => {
			if (typeof v === 'number' && !(v > 0)) problems.push(`${names[k]} must be > 0 — got ${v}`);
		});
		if (problems.length) {
			flag(problems.join('; '));
			continue;
		}
		const z_m = (z as number) * zUnit_m;
		const prev = seenZ.get(z_m);
		if (prev !== undefined) {
			flag(`z = ${z} repeats line ${prev}; measure each plane once (or average the repeats into one line)`);
			continue;
		}
		seenZ.set(z_m, line);
		rows.push({ line, z_m, d_m: (ds as number[]).map((v) => v * dUnit_m) });
	}
	if (rows.length === 0 && flags.length === 0) {
		throw new RangeError('width table must have at least one data line below the header — got none');
	}
	return { columns, rows, flags, notes, zUnit_m, dUnit_m };
}
