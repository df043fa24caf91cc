/**
 * Lens inventory as CSV, our own columns (a header line is required, order free, case ignored):
 *   lens      — a label, e.g. "P-100 #2"
 *   f_mm      — focal length in millimetres (negative for a diverging lens)
 *   dia_mm    — clear diameter in millimetres (empty: not limiting)
 *   qty       — how many are on the shelf (empty: 1)
 * Lines starting with # are comments. Errors name the line and the column. Read by the app's one CSV
 * reader (src/lib/io/csv.ts): with semicolon or tab separators a decimal comma is accepted.
 */
import type { StockLens } from './types';
import { numberCell, readCsv, unescapeCell } from '../../io/csv';
import { rowsCsv } from '../../io/csvOut';

/** Most lenses one list may hold (lines); a longer list is refused before it is read. */
export const MAX_LENS_ROWS = 2000;

/**
 * Read a lens CSV. On failure `message` is the first problem (with a count of the others) and
 * `messages` lists every bad line, each naming its line number and column.
 */
export function parseLensCsv(text: string): { ok: true; lenses: StockLens[] } | { ok: false; message: string; messages: string[] } {
	const fail = (messages: string[]) => ({ ok: false as const, message: messages[0] + (messages.length > 1 ? ` (and ${messages.length - 1} more line${messages.length > 2 ? 's' : ''})` : ''), messages });
	const read = readCsv(text, { what: 'lens list', maxRecords: MAX_LENS_ROWS });
	if (!read.ok) return fail([read.message]);
	const { records, decimalComma } = read;
	if (records.length === 0) return fail(['lens list: empty — expected a header "lens,f_mm,dia_mm,qty" and one line per lens']);
	const head = records[0].cells.map((h) => unescapeCell(h).trim().toLowerCase());
	const col = (name: string) => head.indexOf(name);
	if (col('f_mm') < 0) return fail([`lens list line ${records[0].line}: the header needs a "f_mm" column (columns: lens, f_mm, dia_mm, qty)`]);
	const lenses: StockLens[] = [];
	const messages: string[] = [];
	const num = (t: string) => numberCell(t, decimalComma) ?? NaN;
	for (const { cells: c, line: n } of records.slice(1)) {
		const get = (name: string) => (col(name) >= 0 ? unescapeCell(c[col(name)] ?? '').trim() : '');
		const fText = get('f_mm');
		const f = fText === '' ? NaN : num(fText);
		const lineErrors: string[] = [];
		if (!Number.isFinite(f) || f === 0 || Math.abs(f) > 1e5) lineErrors.push(`f_mm must be a non-zero number of millimetres up to ±100000 — got "${fText}"`);
		const dText = get('dia_mm');
		const d = dText === '' ? null : num(dText);
		if (d !== null && !(Number.isFinite(d) && d > 0 && d <= 1000)) lineErrors.push(`dia_mm must be > 0 and ≤ 1000 mm or empty — got "${dText}"`);
		const qText = get('qty');
		const q = qText === '' ? 1 : num(qText);
		if (!(Number.isInteger(q) && q >= 0 && q <= 1000)) lineErrors.push(`qty must be a whole number from 0 to 1000 — got "${qText}"`);
		if (lineErrors.length) {
			messages.push(`lens list line ${n}: ${lineErrors.join('; ')}`);
			continue;
		}
		lenses.push({ label: get('lens') || `f ${f} mm`, f_m: f / 1000, diameter_m: d === null ? null : d / 1000, count: q });
	}
	if (messages.length) return fail(messages);
	if (lenses.length === 0) return fail(['lens list: no lenses below the header']);
	return { ok: true, lenses };
}

export function lensCsv(lenses: StockLens[]): string {
	return rowsCsv([['lens', 'f_mm', 'dia_mm', 'qty'], ...lenses.map((l) => [l.label, l.f_m * 1000, l.diameter_m === null ? null : l.diameter_m * 1000, l.count])], 10);
}

/**
 * The demo shelf of the invented "Demo lab": labels are the lab's own drawer codes.
 */
export function demoShelf(): StockLens[] {
	const row = (label: string, f_mm: number, dia_mm: number, count: number): StockLens => ({ label, f_m: f_mm / 1000, diameter_m: dia_mm / 1000, count });
	return [
		row('Shelf lens A1 (−50)', -50, 12.7, 2),
		row('Shelf lens A2 (−75)', -75, 25.4, 1),
		row('Shelf lens A3 (−100)', -100, 25.4, 1),
		row('Shelf lens B1 (+40)', 40, 12.7, 2),
		row('Shelf lens B2 (+50)', 50, 25.4, 2),
		row('Shelf lens B3 (+75)', 75, 25.4, 1),
		row('Shelf lens B4 (+100)', 100, 25.4, 3),
		row('Shelf lens B5 (+125)', 125, 25.4, 1),
		row('Shelf lens B6 (+150)', 150, 25.4, 2),
		row('Shelf lens C1 (+200)', 200, 25.4, 2),
		row('Shelf lens C2 (+250)', 250, 25.4, 1),
		row('Shelf lens C3 (+300)', 300, 25.4, 1),
		row('Shelf lens C4 (+400)', 400, 50.8, 1),
		row('Shelf lens C5 (+500)', 500, 50.8, 1),
		row('Shelf lens C6 (+750)', 750, 50.8, 1),
		row('Shelf lens C7 (+1000)', 1000, 50.8, 1)
	];
}
