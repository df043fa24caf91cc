/**
 * The whole-lab table: a CSV of the lab's lasers in, limit, NOHD and OD per laser out, and the table
 * back out as CSV. Column names are our own and documented in `inventoryColumns`; a cell may carry
 * its unit ("2.83 mm"), a bare number takes the column's default unit. Bad rows are reported with
 * their line number and the reason; good rows are still assessed.
 *
 * This file sits at the edge (user text → SI) and so uses src/lib/units for parsing; the limit and
 * hazard code it calls stays free of it.
 */
import { parseQuantity, type QuantityKind } from '../units/parse';
import { quantityCell, readCsv, unescapeCell } from '../io/csv';
import { rowsCsv } from '../io/csvOut';
import { assessBeam, type BeamAssessment, type BeamAssessmentInput } from './assess';
import { caution } from './cautions';
import { viewingCases, type ViewingCase } from './exposure';
import type { StandardChoice } from './limits/index';

export interface InventoryColumn {
	name: string;
	required: boolean;
	kind: QuantityKind | 'text' | 'viewing';
	defaultUnit?: string;
	doc: string;
}

/** The import columns (header names are matched without regard to case or surrounding spaces). */
export const inventoryColumns: readonly InventoryColumn[] = [
	{ name: 'name', required: true, kind: 'text', doc: 'Label of the laser, free text.' },
	{ name: 'wavelength', required: true, kind: 'length', defaultUnit: 'nm', doc: 'Emission wavelength; bare numbers in nm.' },
	{ name: 'power', required: false, kind: 'power', defaultUnit: 'W', doc: 'Continuous-wave output power; bare numbers in W. Leave empty for pulsed lasers.' },
	{ name: 'pulse_energy', required: false, kind: 'energy', defaultUnit: 'J', doc: 'Energy per pulse; bare numbers in J.' },
	{ name: 'pulse_width', required: false, kind: 'time', defaultUnit: 's', doc: 'Pulse duration; bare numbers in s.' },
	{ name: 'rep_rate', required: false, kind: 'frequency', defaultUnit: 'Hz', doc: 'Pulse repetition rate; bare numbers in Hz. Empty with a pulse energy: a single pulse.' },
	{ name: 'beam_diameter', required: true, kind: 'length', defaultUnit: 'mm', doc: '1/e² beam diameter at the exit aperture (where the waist is); bare numbers in mm.' },
	{ name: 'divergence', required: true, kind: 'angle', defaultUnit: 'mrad', doc: '1/e² full-angle divergence; bare numbers in mrad.' },
	{ name: 'exposure', required: false, kind: 'time', defaultUnit: 's', doc: 'Exposure duration; empty for the default of the viewing case.' },
	{ name: 'viewing', required: false, kind: 'viewing', doc: `Viewing case for the default duration: ${viewingCases.join(', ')} (default accidental).` },
	{ name: 'source_angle', required: false, kind: 'angle', defaultUnit: 'mrad', doc: 'Apparent source angle α; empty for a beam (point source).' },
	{ name: 'room', required: false, kind: 'text', doc: 'Where the laser is, free text.' },
	{ name: 'note', required: false, kind: 'text', doc: 'Free text carried to the output.' }
];

export interface InventoryIssue {
	line: number;
	message: string;
}

export interface InventoryLaser {
	line: number;
	name: string;
	room: string;
	note: string;
	input: Omit<BeamAssessmentInput, 'standard'>;
	/** Import column name → cell text as given (for an export that reads back the same). */
	cells: Record<string, string>;
}

/**
 * Split CSV text into records (RFC 4180 quoting, CRLF or LF), each with the line it starts on, through
 * the app's one CSV reader (`src/lib/io/csv.ts`). Throws a RangeError naming the line of a broken quote.
 */
export function splitCsv(text: string): Array<{ line: number; cells: string[] }> {
	const r = readCsv(text, { keepComments: true, what: 'CSV' });
	if (!r.ok) throw new RangeError(r.message);
	return r.records.map(({ line, cells }) => ({ line, cells }));
}

/** Most lasers one inventory file may hold; a longer file is refused before it is read. */
export const MAX_INVENTORY_ROWS = 10_000;

/** A data row that could not be read, kept with its text so an export carries it unchanged. */
export interface RejectedRow {
	line: number;
	/** Last line of the row when a quoted cell ran over several lines. */
	lineEnd?: number;
	name: string;
	message: string;
	/** Import column name → cell text as given. */
	cells: Record<string, string>;
}

/** Result of reading an inventory file. `refused` is set when the file as a whole cannot be used. */
export interface InventoryRead {
	lasers: InventoryLaser[];
	issues: InventoryIssue[];
	pending: boolean;
	/** Data rows that could not be read, with their text. */
	rejected: RejectedRow[];
	/** Why the whole file was refused (broken quote, too many lines, header unusable, no laser read). */
	refused: string | null;
}

/**
 * Parse an inventory CSV. The first non-comment record is the header; lines starting with # are
 * comments. Unknown columns and bad cells are reported by line; a bad row is left out of `lasers`
 * (and kept in `rejected` with its text). Columns of our own export that are results (limit, NOHD…)
 * are recognised and skipped, so an exported table reads back to the same inventory. With a
 * semicolon or tab separator a decimal comma is read ("2,83 mm"). A broken quote stops the reading
 * with its line (`refused`); so does a file over `MAX_INVENTORY_ROWS` lines.
 * `pending` is true when a cell used a unit the fast parser does not know and mathjs had not loaded
 * yet (browser): parse again once `loadUnitEngine()` resolves. Node callers await it first.
 */
export function parseInventoryCsv(text: string): InventoryRead {
	const issues: InventoryIssue[] = [];
	const rejected: RejectedRow[] = [];
	let pending = false;
	const refuse = (line: number, message: string): InventoryRead => {
		issues.push({ line, message });
		return { lasers: [], issues, pending, rejected, refused: `line ${line}: ${message}` };
	};
	const tooMany = `more than ${MAX_INVENTORY_ROWS.toLocaleString('en')} lasers — the limit is ${MAX_INVENTORY_ROWS.toLocaleString('en')} rows; split the list`;
	const read = readCsv(text, { what: 'lab inventory', maxRecords: MAX_INVENTORY_ROWS + 1000 });
	if (!read.ok) return refuse(read.tooLong ? 1 : read.line, read.tooLong ? tooMany : read.message);
	const { records, decimalComma } = read;
	if (records.length === 0) return refuse(1, 'the file is empty — expected a header line naming the columns');
	if (records.length - 1 > MAX_INVENTORY_ROWS) return refuse(records[0].line, tooMany);
	const header = records[0];
	const names = header.cells.map((c) => unescapeCell(c).trim().toLowerCase());
	const index = new Map<string, number>();
	names.forEach((n, i) => {
		const known = inventoryColumns.some((c) => c.name === n);
		if (!known) {
			if (!resultColumns.some((r) => r.toLowerCase() === n)) issues.push({ line: header.line, message: `column "${header.cells[i].trim()}" is not one we read — accepted: ${inventoryColumns.map((c) => c.name).join(', ')}` });
		} else if (index.has(n)) issues.push({ line: header.line, message: `column "${n}" appears twice — the first is used` });
		else index.set(n, i);
	});
	const missing = inventoryColumns.filter((c) => c.required && !index.has(c.name));
	if (missing.length) return refuse(header.line, `required column${missing.length > 1 ? 's' : ''} missing: ${missing.map((c) => c.name).join(', ')}`);
	const lasers: InventoryLaser[] = [];
	for (const rec of records.slice(1)) {
		const cell = (name: string) => {
			const i = index.get(name);
			return i === undefined ? '' : unescapeCell(rec.cells[i] ?? '').trim();
		};
		const cells: Record<string, string> = {};
		for (const c of inventoryColumns) cells[c.name] = cell(c.name);
		const errs: string[] = [];
		// A quoted cell that runs over several lines would hide the lasers on them: only a note may.
		if (rec.lineEnd) {
			const broken = inventoryColumns.filter((c) => c.name !== 'note' && /[\r\n]/.test(cells[c.name] ?? ''));
			const unknown = rec.cells.some((c, i) => ![...index.values(), index.get('note')].includes(i) && /[\r\n]/.test(c));
			if (broken.length || unknown)
				errs.push(`a quoted cell${broken.length ? ` in ${broken.map((c) => c.name).join(', ')}` : ''} runs over lines ${rec.line}–${rec.lineEnd}; close the quote on its line (only note may hold a line break)`);
		}
		const qty = (col: InventoryColumn): number | undefined => {
			const text = cell(col.name);
			if (text === '') {
				if (col.required) errs.push(`${col.name} is empty`);
				return undefined;
			}
			const r = parseQuantity(quantityCell(text, decimalComma), { label: col.name, kind: col.kind as QuantityKind, defaultUnit: col.defaultUnit, ...columnRanges[col.name] });
			if (!r.ok) {
				if (r.pending) pending = true;
				errs.push(r.message);
				return undefined;
			}
			return r.value_si;
		};
		const name = cell('name');
		if (name === '') errs.push('name is empty');
		const v: Record<string, number | undefined> = {};
		for (const c of inventoryColumns) if (c.kind !== 'text' && c.kind !== 'viewing') v[c.name] = qty(c);
		const viewingText = cell('viewing').toLowerCase();
		if (viewingText && !(viewingCases as readonly string[]).includes(viewingText)) errs.push(`viewing "${viewingText}" is not accepted — one of ${viewingCases.join(', ')}`);
		if (v.power === undefined && v.pulse_energy === undefined && cell('power') === '' && cell('pulse_energy') === '') errs.push('give power (CW) or pulse_energy with pulse_width');
		if (v.power !== undefined && (v.pulse_energy !== undefined || v.pulse_width !== undefined || v.rep_rate !== undefined)) errs.push('give either power (CW) or pulse_energy/pulse_width/rep_rate, not both');
		if (v.pulse_energy !== undefined && v.pulse_width === undefined && cell('pulse_width') === '') errs.push('pulse_energy needs pulse_width');
		if (errs.length) {
			const message = `${name || 'row'}: ${errs.join('; ')}`;
			issues.push({ line: rec.line, message });
			rejected.push({ line: rec.line, ...(rec.lineEnd ? { lineEnd: rec.lineEnd } : {}), name, message, cells });
			continue;
		}
		lasers.push({
			line: rec.line,
			name,
			room: cell('room'),
			note: cell('note'),
			cells,
			input: {
				wavelength_m: v.wavelength!,
				power_W: v.power,
				pulseEnergy_J: v.pulse_energy,
				pulseWidth_s: v.pulse_width,
				repetitionRate_Hz: v.rep_rate,
				diameter_m: v.beam_diameter!,
				fullDivergence_rad: v.divergence!,
				duration_s: v.exposure,
				viewing: (viewingText || 'accidental') as ViewingCase,
				alpha_rad: v.source_angle
			}
		});
	}
	const refused = lasers.length === 0 ? (records.length === 1 ? 'no laser below the header' : 'no row could be read — see the lines listed') : null;
	if (records.length === 1) issues.push({ line: header.line, message: 'no laser below the header' });
	return { lasers, issues, pending, rejected, refused };
}

/**
 * Stated ranges of the safety inputs (SI): beyond them a cell is refused with the range, so that no
 * absurd value reaches the limits or the NOHD. The same ranges as the hazard form and `beamwright hazard`.
 */
export const columnRanges: Record<string, { min_si?: number; max_si?: number; above_si?: number }> = {
	wavelength: { min_si: 100e-9, max_si: 1e-3 },
	power: { above_si: 0, max_si: 1e15 },
	pulse_energy: { above_si: 0, max_si: 1e9 },
	pulse_width: { min_si: 1e-13, max_si: 3e4 },
	rep_rate: { above_si: 0, max_si: 1e15 },
	beam_diameter: { above_si: 0, max_si: 10 },
	divergence: { above_si: 0, max_si: Math.PI },
	exposure: { min_si: 1e-13, max_si: 3e4 },
	source_angle: { min_si: 0, max_si: Math.PI }
};

export type InventoryRow =
	| { line: number; name: string; room: string; note: string; cells?: Record<string, string>; ok: true; result: BeamAssessment }
	| { line: number; name: string; room: string; note: string; cells?: Record<string, string>; ok: false; message: string };

export interface InventoryTable {
	standard: StandardChoice;
	rows: InventoryRow[];
	/** Lines refused at import (header problems and bad cells), with the reason. */
	issues: InventoryIssue[];
	/** Data rows that could not be read (kept for the export). */
	rejected: RejectedRow[];
	/** Why the whole file was refused, or null. */
	refused: string | null;
	/** Some cells wait for the unit engine (see parseInventoryCsv). */
	pending: boolean;
	caution: string;
}

/** Import and assess a whole-lab CSV against one edition (or the stricter of both). */
export function assessInventory(text: string, standard: StandardChoice = 'stricter'): InventoryTable {
	const { lasers, issues, pending, rejected, refused } = parseInventoryCsv(text);
	const rows: InventoryRow[] = lasers.map((l) => {
		const base = { line: l.line, name: l.name, room: l.room, note: l.note, cells: l.cells };
		try {
			return { ...base, ok: true as const, result: assessBeam({ ...l.input, standard }) };
		} catch (e) {
			if (!(e instanceof RangeError)) throw e;
			return { ...base, ok: false as const, message: e.message };
		}
	});
	for (const r of rows) if (!r.ok) issues.push({ line: r.line, message: `${r.name}: ${r.message}` });
	issues.sort((a, b) => a.line - b.line);
	return { standard, rows, issues, pending, rejected, refused, caution };
}

/** Result columns of the exported table (our own names; SI or the unit in the name); skipped on import. */
export const resultColumns = [
	'line', 'wavelength_nm', 'emission', 'exposure_s', 'exposure_basis', 'standard', 'limit_W_m2', 'limit_J_m2', 'limit_rule',
	'limiting_aperture_mm', 'nohd_formula_m', 'nohd_beam_m', 'hazard_distance_m', 'od_required', 'od_whole', 'status', 'provenance', 'limit_source', 'caution'
] as const;

/**
 * Columns of the exported table: the results, then every import column with the cell text as it was
 * read, so that importing the export gives back the same inventory (the result columns are skipped).
 */
export const exportColumns = [
	'line', 'name', 'room', 'wavelength_nm', 'emission', 'exposure_s', 'exposure_basis', 'standard', 'limit_W_m2', 'limit_J_m2', 'limit_rule',
	'limiting_aperture_mm', 'nohd_formula_m', 'nohd_beam_m', 'hazard_distance_m', 'od_required', 'od_whole', 'status', 'note', 'provenance', 'limit_source',
	'wavelength', 'power', 'pulse_energy', 'pulse_width', 'rep_rate', 'beam_diameter', 'divergence', 'exposure', 'viewing', 'source_angle', 'caution'
] as const;

/**
 * The table as CSV; every row carries the caution, refused rows their reason in `status`. Rows that
 * could not be read at import come along (in line order) with their text, so nothing is lost. Cells
 * that a spreadsheet would run as a formula are escaped (see `src/lib/io/csvOut.ts`).
 */
export function inventoryToCsv(table: InventoryTable): string {
	type Cells = Partial<Record<(typeof exportColumns)[number], string | number>>;
	const out: Array<{ line: number; cells: Cells }> = [];
	for (const r of table.rows) {
		const a = r.ok ? r.result : null;
		const given = r.cells ?? {};
		const cells: Cells = {
			...given,
			line: r.line,
			name: r.name,
			room: r.room,
			wavelength_nm: a ? a.wavelength_m * 1e9 : '',
			emission: a ? a.emission : '',
			exposure_s: a ? a.exposure.duration_s : '',
			exposure_basis: a ? a.exposure.basis : '',
			standard: a ? a.standard : '',
			limit_W_m2: a ? a.mpe_W_m2 : '',
			limit_J_m2: a ? a.mpe_J_m2 : '',
			limit_rule: a ? a.rule : '',
			limiting_aperture_mm: a ? a.limitingAperture_m * 1e3 : '',
			nohd_formula_m: a ? a.nohdFormula_m : '',
			nohd_beam_m: a ? a.nohd_m : '',
			hazard_distance_m: a ? a.hazardDistance_m : '',
			od_required: a ? a.odRequired : '',
			od_whole: a ? a.odWhole : '',
			status: r.ok ? 'ok' : `refused: ${r.message}`,
			note: r.note,
			provenance: a ? `${a.provenance}: ${a.provenanceLine}` : '',
			limit_source: a ? a.limitSource : '',
			caution: table.caution
		};
		out.push({ line: r.line, cells });
	}
	for (const x of table.rejected ?? []) out.push({ line: x.line, cells: { ...x.cells, line: x.line, status: `refused: ${x.message}`, caution: table.caution } });
	out.sort((p, q) => p.line - q.line);
	// Numbers with 6 significant digits: the lab table is read by people as well as re-imported.
	return rowsCsv([exportColumns, ...out.map((o) => exportColumns.map((c) => o.cells[c] ?? ''))], 6);
}
