/**
 * Writing plain CSV files: a commented header (lines starting with "#") that names the file, the
 * setup, the date and every column with its unit, then one header row and the data rows.
 * Numbers are written in plain decimal/exponent form with enough digits to round-trip the value
 * (`+v.toPrecision(9)`), never NaN or Infinity (such cells are left empty and said so in the header).
 *
 * Text cells go through `csvCell`, the one place that guards against spreadsheet formula injection:
 * a text cell starting with = + - @ (or a tab / carriage return) gets a leading apostrophe, common
 * practice from the OWASP "CSV Injection" guidance — the app's one escaper, `csvCell` in csv.ts.
 */
import { csvCell as sharedCell } from './csv';

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

/** One text cell, escaped for CSV and guarded against formula injection. */
export function csvCell(v: string): string {
	return sharedCell(v);
}

/** One number cell: round-trip digits, empty for non-finite values. */
export function csvNumber(v: number): string {
	if (!Number.isFinite(v)) return '';
	return String(+v.toPrecision(9));
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
	for (const r of t.rows) lines.push(r.map((v) => (v === null ? '' : typeof v === 'number' ? csvNumber(v) : csvCell(v))).join(','));
	return lines.join('\r\n') + '\r\n';
}

/** A file name from a setup name and what the file holds: "Demo-bench-A.beam.csv". */
export function fileStem(setupName: string, what: string): string {
	const safe = setupName.replace(/[^\w.-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'setup';
	return `${safe}.${what}`;
}
