/**
 * Read a knife-edge or slit scan (pasted text or a CSV file): blade position x and the power P passed.
 *
 * Layout: a header naming the columns `x` and `P`, each optionally with a unit in brackets —
 * `x (mm), P (mW)`, `x [um]; P [uW]`. Without a header, two numbers per line are read as x, P.
 * Separators: comma, semicolon, tab or spaces; with semicolon, tab or space separators a decimal comma
 * is accepted. Blank lines and lines starting with `#` are skipped; a UTF-8 byte-order mark is ignored.
 * Every data line becomes a point or a flag naming its line number and the problem; nothing is dropped
 * silently.
 *
 * Units: the caller passes metres per x unit and watts per power unit (defaults mm and W) and, to honour
 * units written in the header, `resolveUnit(unit, kind)` returning the SI factor or null.
 */
import type { ScanPoint } from '../optics/iso11146/knifeEdge';

export interface ScanTable {
	points: ScanPoint[];
	flags: { line: number; text: string; problem: string }[];
	notes: string[];
	x_m_per_unit: number;
	P_W_per_unit: number;
}

export interface ScanTableOptions {
	xUnit_m?: number;
	pUnit_W?: number;
	resolveUnit?: (unit: string, kind: 'length' | 'power') => number | null;
}

/** Largest scan accepted: far more points than any hand or motorised scan needs. */
export const MAX_SCAN_LINES = 100_000;

const numberRe = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;
const headerRe = /^(x|p)\s*(?:[([]\s*([^)\]]*?)\s*[)\]])?$/i;

function splitter(line: string): (s: string) => string[] {
	if (line.includes('\t')) return (s) => s.split('\t');
	if (line.includes(';')) return (s) => s.split(';');
	if (line.includes(',')) return (s) => s.split(',');
	return (s) => s.trim().split(/\s+/);
}

const clean = (c: string) => c.trim().replace(/^"(.*)"$/, '$1').trim();

/**
 * Parse a scan table. Throws RangeError when it cannot be read at all (no data, header without x and P,
 * unknown unit, too many lines); line problems become flags.
 * Example: "x (mm),P (mW)\n0,0.1\n0.1,0.5" → points (0 m, 1e-4 W) and (1e-4 m, 5e-4 W).
 */
export function parseScanTable(text: string, options: ScanTableOptions = {}): ScanTable {
	const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\r|\n/);
	if (lines.length > MAX_SCAN_LINES + 1) throw new RangeError(`scan table must have at most ${MAX_SCAN_LINES} lines — got ${lines.length}`);
	const first = lines.findIndex((l) => l.trim() !== '' && !l.trim().startsWith('#'));
	if (first < 0) throw new RangeError('scan table must have a header (x, P) and data lines — got no data');
	const split = splitter(lines[first]);
	const head = split(lines[first]).map(clean);
	const headerLike = head.some((c) => !numberRe.test(c.replace(',', '.')));
	let xCol = 0;
	let pCol = 1;
	let x_m_per_unit = options.xUnit_m ?? 1e-3;
	let P_W_per_unit = options.pUnit_W ?? 1;
	const notes: string[] = [];
	let start = first;
	if (headerLike) {
		start = first + 1;
		const found = new Map<string, { col: number; unit?: string }>();
		head.forEach((c, col) => {
			const m = headerRe.exec(c);
			if (m) found.set(m[1].toLowerCase(), { col, unit: m[2] || undefined });
			else notes.push(`column "${c}" is not x or P and was ignored`);
		});
		const x = found.get('x');
		const p = found.get('p');
		if (!x || !p) throw new RangeError(`scan table header must name the columns x and P (e.g. "x (mm), P (mW)") — got "${lines[first].trim()}"`);
		xCol = x.col;
		pCol = p.col;
		const unitOf = (unit: string | undefined, kind: 'length' | 'power'): number | undefined => {
			if (unit === undefined) return undefined;
			const v = options.resolveUnit?.(unit, kind) ?? null;
			if (v === null || !(v > 0)) throw new RangeError(`scan table header: "${unit}" is not a ${kind} unit — use e.g. ${kind === 'length' ? 'mm, um' : 'W, mW, uW'}`);
			notes.push(`${kind === 'length' ? 'x' : 'P'} unit "${unit}" taken from the header`);
			return v;
		};
		x_m_per_unit = unitOf(x.unit, 'length') ?? x_m_per_unit;
		P_W_per_unit = unitOf(p.unit, 'power') ?? P_W_per_unit;
	} else notes.push('no header: read as x, P');
	const decimalComma = !lines[first].includes(',') || lines[first].includes(';') || lines[first].includes('\t');
	const points: ScanPoint[] = [];
	const flags: ScanTable['flags'] = [];
	const seen = new Map<number, number>();
	for (let i = start; i < lines.length; i++) {
		const t = lines[i].trim();
		if (t === '' || t.startsWith('#')) continue;
		const cells = split(lines[i]).map(clean);
		const flag = (problem: string) => flags.push({ line: i + 1, text: t.slice(0, 200), problem });
		if (cells.length <= Math.max(xCol, pCol)) {
			flag(`expected x and P, found ${cells.length} value${cells.length === 1 ? '' : 's'}`);
			continue;
		}
		const read = (col: number, name: string): number | string => {
			const raw = decimalComma ? cells[col].replace(',', '.') : cells[col];
			if (raw === '') return `${name} is empty`;
			if (!numberRe.test(raw)) return `${name} "${cells[col].slice(0, 40)}" is not a number`;
			return Number(raw);
		};
		const x = read(xCol, 'x');
		const P = read(pCol, 'P');
		const problems = [x, P].filter((v): v is string => typeof v === 'string');
		if (problems.length) {
			flag(problems.join('; '));
			continue;
		}
		const x_m = (x as number) * x_m_per_unit;
		const prev = seen.get(x_m);
		if (prev !== undefined) {
			flag(`x = ${x} repeats line ${prev}; give each blade position once`);
			continue;
		}
		seen.set(x_m, i + 1);
		points.push({ x_m, P_W: (P as number) * P_W_per_unit });
	}
	if (points.length === 0 && flags.length === 0) throw new RangeError('scan table must have at least one data line below the header — got none');
	return { points, flags, notes, x_m_per_unit, P_W_per_unit };
}
