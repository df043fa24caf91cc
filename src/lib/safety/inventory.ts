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
}

/** Split CSV text into records (RFC 4180 quoting, CRLF or LF), each with the line it starts on. */
export function splitCsv(text: string): Array<{ line: number; cells: string[] }> {
	const out: Array<{ line: number; cells: string[] }> = [];
	const s = text.replace(/^\uFEFF/, '');
	let line = 1;
	let start = 1;
	let cells: string[] = [];
	let cell = '';
	let quoted = false;
	let any = false;
	for (let i = 0; i < s.length; i++) {
		const c = s[i];
		if (quoted) {
			if (c === '"') {
				if (s[i + 1] === '"') {
					cell += '"';
					i++;
				} else quoted = false;
			} else {
				if (c === '\n') line++;
				cell += c;
			}
			continue;
		}
		if (c === '"') {
			quoted = true;
			any = true;
		} else if (c === ',') {
			cells.push(cell);
			cell = '';
			any = true;
		} else if (c === '\n' || c === '\r') {
			if (c === '\r' && s[i + 1] === '\n') i++;
			cells.push(cell);
			if (any || cells.some((x) => x.trim() !== '')) out.push({ line: start, cells });
			cells = [];
			cell = '';
			any = false;
			line++;
			start = line;
		} else {
			cell += c;
			if (c.trim() !== '') any = true;
		}
	}
	cells.push(cell);
	if (any || cells.some((x) => x.trim() !== '')) out.push({ line: start, cells });
	return out;
}

/**
 * Parse an inventory CSV. The first non-comment record is the header; lines starting with # are
 * comments. Unknown columns and bad cells are reported by line; a bad row is left out of `lasers`.
 * `pending` is true when a cell used a unit the fast parser does not know and mathjs had not loaded
 * yet (browser): parse again once `loadUnitEngine()` resolves. Node callers await it first.
 */
export function parseInventoryCsv(text: string): { lasers: InventoryLaser[]; issues: InventoryIssue[]; pending: boolean } {
	const records = splitCsv(text).filter((r) => !(r.cells[0] ?? '').trimStart().startsWith('#'));
	const issues: InventoryIssue[] = [];
	let pending = false;
	if (records.length === 0) return { lasers: [], issues: [{ line: 1, message: 'the file is empty — expected a header line naming the columns' }], pending };
	const header = records[0];
	const names = header.cells.map((c) => c.trim().toLowerCase());
	const index = new Map<string, number>();
	names.forEach((n, i) => {
		const known = inventoryColumns.some((c) => c.name === n);
		if (!known) issues.push({ line: header.line, message: `column "${header.cells[i].trim()}" is not one we read — accepted: ${inventoryColumns.map((c) => c.name).join(', ')}` });
		else if (index.has(n)) issues.push({ line: header.line, message: `column "${n}" appears twice — the first is used` });
		else index.set(n, i);
	});
	const missing = inventoryColumns.filter((c) => c.required && !index.has(c.name));
	if (missing.length) {
		issues.push({ line: header.line, message: `required column${missing.length > 1 ? 's' : ''} missing: ${missing.map((c) => c.name).join(', ')}` });
		return { lasers: [], issues, pending };
	}
	const lasers: InventoryLaser[] = [];
	for (const rec of records.slice(1)) {
		const cell = (name: string) => {
			const i = index.get(name);
			return i === undefined ? '' : (rec.cells[i] ?? '').trim();
		};
		const errs: string[] = [];
		const qty = (col: InventoryColumn): number | undefined => {
			const text = cell(col.name);
			if (text === '') {
				if (col.required) errs.push(`${col.name} is empty`);
				return undefined;
			}
			const r = parseQuantity(text, { label: col.name, kind: col.kind as QuantityKind, defaultUnit: col.defaultUnit });
			if (!r.ok) {
				if (r.pending) pending = true;
				errs.push(r.message);
				return undefined;
			}
			return r.value_si;
		};
		const col = (n: string) => inventoryColumns.find((c) => c.name === n)!;
		const name = cell('name');
		if (name === '') errs.push('name is empty');
		const v: Record<string, number | undefined> = {};
		for (const c of inventoryColumns) if (c.kind !== 'text' && c.kind !== 'viewing') v[c.name] = qty(col(c.name));
		const viewingText = cell('viewing').toLowerCase();
		if (viewingText && !(viewingCases as readonly string[]).includes(viewingText)) errs.push(`viewing "${viewingText}" is not accepted — one of ${viewingCases.join(', ')}`);
		if (v.power === undefined && v.pulse_energy === undefined && cell('power') === '' && cell('pulse_energy') === '') errs.push('give power (CW) or pulse_energy with pulse_width');
		if (v.power !== undefined && (v.pulse_energy !== undefined || v.pulse_width !== undefined || v.rep_rate !== undefined)) errs.push('give either power (CW) or pulse_energy/pulse_width/rep_rate, not both');
		if (v.pulse_energy !== undefined && v.pulse_width === undefined && cell('pulse_width') === '') errs.push('pulse_energy needs pulse_width');
		if (errs.length) {
			issues.push({ line: rec.line, message: `${name || 'row'}: ${errs.join('; ')}` });
			continue;
		}
		lasers.push({
			line: rec.line,
			name,
			room: cell('room'),
			note: cell('note'),
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
	return { lasers, issues, pending };
}

export type InventoryRow =
	| { line: number; name: string; room: string; note: string; ok: true; result: BeamAssessment }
	| { line: number; name: string; room: string; note: string; ok: false; message: string };

export interface InventoryTable {
	standard: StandardChoice;
	rows: InventoryRow[];
	/** Lines refused at import (header problems and bad cells), with the reason. */
	issues: InventoryIssue[];
	/** Some cells wait for the unit engine (see parseInventoryCsv). */
	pending: boolean;
	caution: string;
}

/** Import and assess a whole-lab CSV against one edition (or the stricter of both). */
export function assessInventory(text: string, standard: StandardChoice = 'stricter'): InventoryTable {
	const { lasers, issues, pending } = parseInventoryCsv(text);
	const rows: InventoryRow[] = lasers.map((l) => {
		const base = { line: l.line, name: l.name, room: l.room, note: l.note };
		try {
			return { ...base, ok: true as const, result: assessBeam({ ...l.input, standard }) };
		} catch (e) {
			if (!(e instanceof RangeError)) throw e;
			return { ...base, ok: false as const, message: e.message };
		}
	});
	for (const r of rows) if (!r.ok) issues.push({ line: r.line, message: `${r.name}: ${r.message}` });
	issues.sort((a, b) => a.line - b.line);
	return { standard, rows, issues, pending, caution };
}

/** Columns of the exported table (our own names; SI or the unit in the name). */
export const exportColumns = [
	'line', 'name', 'room', 'wavelength_nm', 'emission', 'exposure_s', 'exposure_basis', 'standard', 'limit_W_m2', 'limit_J_m2', 'limit_rule',
	'limiting_aperture_mm', 'nohd_formula_m', 'nohd_beam_m', 'hazard_distance_m', 'od_required', 'od_whole', 'status', 'note', 'provenance', 'limit_source', 'caution'
] as const;

function csvCell(v: string | number): string {
	const s = typeof v === 'number' ? (Number.isFinite(v) ? String(+v.toPrecision(6)) : '') : v;
	return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** The table as CSV; every row carries the caution, refused rows their reason in `status`. */
export function inventoryToCsv(table: InventoryTable): string {
	const lines = [exportColumns.join(',')];
	for (const r of table.rows) {
		const a = r.ok ? r.result : null;
		const cells: Record<(typeof exportColumns)[number], string | number> = {
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
		lines.push(exportColumns.map((c) => csvCell(cells[c])).join(','));
	}
	return lines.join('\n') + '\n';
}
