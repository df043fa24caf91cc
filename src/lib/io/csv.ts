/**
 * The one CSV reader of the app and the CLI (lab inventory, lens shelf, width table, image
 * matrices). The one writer is `csvOut.ts`. Reading goes through papaparse (RFC 4180 quoting); this module adds what every
 * caller needs the same way:
 *
 * - Separator: taken from the first line that is neither blank nor a `#` comment — tab if it has a
 *   tab, else semicolon if it has one, else comma, except that a line of blank-separated values whose
 *   commas sit inside numbers ("0 1080,4") is read as blank-separated.
 * - Decimal comma: accepted in number cells exactly when the separator is not a comma (semicolon,
 *   tab or blanks). With a comma separator, "1,5" in a quoted cell is refused as ambiguous.
 * - Line numbers: every record carries the 1-based line it starts on, so messages can name it.
 * - Quotes: an unterminated or misplaced quote stops the reading with the line where the record
 *   starts — nothing after it is read silently as one giant cell (and nothing is dropped quietly).
 * - Size: a file with more than `maxRecords` lines is refused before it is parsed.
 *
 * Formula escape: the writer (`csvCell` in csvOut.ts) puts a leading apostrophe before cells that a
 * spreadsheet would run as a formula (`needsFormulaEscape`, OWASP "CSV Injection" guidance);
 * `unescapeCell` undoes it on import, so an exported table reads back to the same text.
 */
import Papa from 'papaparse';

export type Separator = ',' | ';' | '\t' | ' ';

export interface CsvRecord {
	/** 1-based line where the record starts. */
	line: number;
	/** 1-based line where it ends (later than `line` when a quoted cell holds a line break). */
	lineEnd?: number;
	cells: string[];
}

export type CsvRead =
	| { ok: true; records: CsvRecord[]; separator: Separator; decimalComma: boolean }
	| { ok: false; line: number; message: string; tooLong?: boolean };

export interface CsvOptions {
	/** Refuse files with more lines than this (default 1,000,000). */
	maxRecords?: number;
	/** What the file is, for messages ("lab inventory", "lens list"). */
	what?: string;
	/** Keep `#` comment lines (default false: they are skipped). */
	keepComments?: boolean;
}

export const DEFAULT_MAX_RECORDS = 1_000_000;

function countLines(s: string, limit: number): number {
	let n = 1;
	for (let i = s.indexOf('\n'); i >= 0; i = s.indexOf('\n', i + 1)) if (++n > limit) return n;
	return n;
}

/** The separator of a (first) line, by the rule in the module comment. */
export function detectSeparator(line: string): Separator {
	if (line.includes('\t')) return '\t';
	if (line.includes(';')) return ';';
	if (!line.includes(',')) return /\S\s+\S/.test(line.trim()) ? ' ' : ',';
	const tokens = line.trim().split(/\s+/);
	if (tokens.length >= 2 && tokens.every((t) => !t.startsWith(',') && !t.endsWith(',') && !t.includes('"'))) {
		// Blank-separated values whose commas are inside the values: decimal commas.
		if (tokens.every((t) => /^[-+]?\d*,?\d*([eE][-+]?\d+)?$/.test(t) || !t.includes(','))) return ' ';
	}
	return ',';
}

/**
 * Read CSV text. Blank records and (unless `keepComments`) lines whose first cell starts with `#` are
 * skipped; a leading byte-order mark is dropped. Never throws.
 */
export function readCsv(text: string, options: CsvOptions = {}): CsvRead {
	const what = options.what ?? 'file';
	const max = options.maxRecords ?? DEFAULT_MAX_RECORDS;
	// One line-end convention for the whole file (files mixing CRLF and LF are common after edits).
	const s = text.replace(/^\uFEFF/, '').replace(/\r\n?/g, '\n');
	const lines = countLines(s, max + 1);
	if (lines > max) return { ok: false, line: max + 1, tooLong: true, message: `${what}: more than ${max.toLocaleString('en')} lines — the limit is ${max.toLocaleString('en')}; split the file` };
	// First meaningful line decides the separator.
	let firstLine = '';
	for (const l of s.split(/\r\n|\r|\n/, 10_000)) {
		const t = l.trim();
		if (t !== '' && !t.startsWith('#')) {
			firstLine = l;
			break;
		}
	}
	const separator = detectSeparator(firstLine);
	const decimalComma = separator !== ',';
	const records: CsvRecord[] = [];
	if (separator === ' ') {
		const ls = s.split(/\r\n|\r|\n/);
		for (let i = 0; i < ls.length; i++) {
			const t = ls[i].trim();
			if (t === '' || (!options.keepComments && t.startsWith('#'))) continue;
			records.push({ line: i + 1, cells: t.split(/\s+/) });
		}
		return { ok: true, records, separator, decimalComma };
	}
	let line = 1;
	let at = 0;
	let failure: { line: number; message: string } | null = null;
	Papa.parse<string[]>(s, {
		delimiter: separator,
		newline: '\n',
		quoteChar: '"',
		skipEmptyLines: false,
		step: (r, parser) => {
			const start = line;
			const end = r.meta.cursor;
			for (let i = s.indexOf('\n', at); i >= 0 && i < end; i = s.indexOf('\n', i + 1)) line++;
			at = end;
			if (r.errors.length) {
				const e = r.errors[0];
				failure = {
					line: start,
					message:
						e.code === 'MissingQuotes'
							? `${what} line ${start}: a quote opens a cell that is never closed — the rest of the file would be read as one cell, so nothing was imported; close the quote (a quote inside a cell is written "")`
							: `${what} line ${start}: a quote is misplaced (${e.message}) — nothing was imported; quote whole cells and write a quote inside a cell as ""`
				};
				parser.abort();
				return;
			}
			const cells = r.data;
			if (cells.length === 1 && cells[0].trim() === '') return;
			if (cells.every((c) => c.trim() === '')) return;
			if (!options.keepComments && cells[0].trimStart().startsWith('#')) return;
			const lineEnd = Math.max(start, s[end - 1] === '\n' ? line - 1 : line);
			records.push(lineEnd > start ? { line: start, lineEnd, cells } : { line: start, cells });
		}
	});
	if (failure) return { ok: false, ...(failure as { line: number; message: string }) };
	return { ok: true, records, separator, decimalComma };
}

export { numberCell, quantityCell, unescapeCell, needsFormulaEscape } from './cells';
