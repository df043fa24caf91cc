/**
 * The one CSV writer of the app and the CLI. Every cell of every export goes through `csvCell`:
 *
 * - Numbers: plain decimal/exponent form with `digits` significant digits (default 9, enough to
 *   round-trip the value); NaN and ±Infinity become an empty cell, never "NaN" or "Infinity".
 * - Formula injection: a text cell starting with = + - @ (or a tab / carriage return) gets a leading
 *   apostrophe (OWASP "CSV Injection" guidance); plain numbers such as "-50" are left as they are.
 *   The reader (`unescapeCell` in cells.ts) drops the apostrophe again, so exports re-import unchanged.
 * - Quoting: a cell holding a separator (comma, semicolon, tab), a quote or a line break is quoted
 *   as RFC 4180 says, with inner quotes doubled.
 *
 * Two table shapes use it: `toCsv(CsvTable)` writes a commented header (lines starting with "#")
 * naming the file, the setup, the date and every column with its unit, then one header row and the
 * data rows (CRLF line ends); `rowsCsv(rows)` writes bare rows (header row included by the caller,
 * LF line ends) for the lists the app also reads back (lens shelf, lab table).
 */
import { needsFormulaEscape } from './cells';

export type CsvValue = string | number | null | undefined;

export interface CsvColumn {
	/** Column name in the header row, with its unit in the name, e.g. "z_mm". */
	name: string;
	/** What the column holds, for the commented header, e.g. "position along the beam axis, mm". */
	about: string;
}

export interface CsvTable {
	/** What this file is, e.g. "Beam along the train". */
	title: string;
	/** The setup's name (written as a header line). */
	setup?: string;
	/** Extra header lines (without the leading "#"). */
	notes?: string[];
	columns: CsvColumn[];
	rows: ReadonlyArray<ReadonlyArray<number | string | null>>;
	/** When the export was made; defaults to now. */
	date?: Date;
}

/** Significant digits of a number cell unless the caller asks for others: enough to round-trip. */
export const CSV_DIGITS = 9;

/** One number cell: `digits` significant digits, empty for non-finite values. */
export function csvNumber(v: number, digits = CSV_DIGITS): string {
	if (!Number.isFinite(v)) return '';
	return String(+v.toPrecision(digits));
}

/**
 * One CSV cell (the rule in the module comment): numbers via `csvNumber`, null/undefined empty,
 * formula-like text escaped with a leading apostrophe, quoted where it holds a separator, quote or
 * line break.
 */
export function csvCell(v: CsvValue, digits = CSV_DIGITS): string {
	let s = typeof v === 'number' ? csvNumber(v, digits) : (v ?? '');
	if (needsFormulaEscape(s)) s = "'" + s;
	return /[",;\n\r\t]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** Bare rows of cells → CSV text (comma separator, LF line ends, trailing newline). */
export function rowsCsv(rows: ReadonlyArray<ReadonlyArray<CsvValue>>, digits = CSV_DIGITS): string {
	return rows.map((r) => r.map((c) => csvCell(c, digits)).join(',')).join('\n') + '\n';
}

function headerLine(s: string): string {
	// Header lines are comments; keep them on one line.
	return '# ' + s.replace(/[\r\n]+/g, ' ');
}

export function toCsv(t: CsvTable): string {
	const lines: string[] = [];
	lines.push(headerLine(`Beamwright — ${t.title}`));
	if (t.setup !== undefined) lines.push(headerLine(`Setup: ${t.setup}`));
	lines.push(headerLine(`Exported: ${(t.date ?? new Date()).toISOString()}`));
	for (const n of t.notes ?? []) lines.push(headerLine(n));
	lines.push(headerLine('Columns:'));
	for (const c of t.columns) lines.push(headerLine(`  ${c.name}: ${c.about}`));
	lines.push(t.columns.map((c) => csvCell(c.name)).join(','));
	for (const r of t.rows) lines.push(r.map((v) => csvCell(v)).join(','));
	return lines.join('\r\n') + '\r\n';
}

/** A file name from a setup name and what the file holds: "Demo-bench-A.beam.csv". */
export function fileStem(setupName: string, what: string): string {
	const safe = setupName.replace(/[^\w.-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'setup';
	return `${safe}.${what}`;
}
