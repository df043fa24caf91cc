/**
 * Lens inventory as CSV, our own columns (a header line is required, order free, case ignored):
 *   lens      — a label, e.g. "P-100 #2"
 *   f_mm      — focal length in millimetres (negative for a diverging lens)
 *   dia_mm    — clear diameter in millimetres (empty: not limiting)
 *   qty       — how many are on the shelf (empty: 1)
 * Lines starting with # are comments. Errors name the line and the column.
 */
import type { StockLens } from './types';

function cells(line: string): string[] {
	const out: string[] = [];
	let cur = '';
	let quoted = false;
	for (let i = 0; i < line.length; i++) {
		const ch = line[i];
		if (quoted) {
			if (ch === '"' && line[i + 1] === '"') {
				cur += '"';
				i++;
			} else if (ch === '"') quoted = false;
			else cur += ch;
		} else if (ch === '"') quoted = true;
		else if (ch === ',') {
			out.push(cur.trim());
			cur = '';
		} else cur += ch;
	}
	out.push(cur.trim());
	return out;
}

/**
 * Read a lens CSV. On failure `message` is the first problem (with a count of the others) and
 * `messages` lists every bad line, each naming its line number and column.
 */
export function parseLensCsv(text: string): { ok: true; lenses: StockLens[] } | { ok: false; message: string; messages: string[] } {
	const fail = (messages: string[]) => ({ ok: false as const, message: messages[0] + (messages.length > 1 ? ` (and ${messages.length - 1} more line${messages.length > 2 ? 's' : ''})` : ''), messages });
	const lines = text.split(/\r?\n/).map((l, i) => ({ l, n: i + 1 })).filter(({ l }) => l.trim() !== '' && !l.trim().startsWith('#'));
	if (lines.length === 0) return fail(['lens list: empty — expected a header "lens,f_mm,dia_mm,qty" and one line per lens']);
	const head = cells(lines[0].l).map((h) => h.toLowerCase());
	const col = (name: string) => head.indexOf(name);
	if (col('f_mm') < 0) return fail([`lens list line ${lines[0].n}: the header needs a "f_mm" column (columns: lens, f_mm, dia_mm, qty)`]);
	const lenses: StockLens[] = [];
	const messages: string[] = [];
	for (const { l, n } of lines.slice(1)) {
		const c = cells(l);
		const get = (name: string) => (col(name) >= 0 ? (c[col(name)] ?? '') : '');
		const fText = get('f_mm');
		const f = fText === '' ? NaN : Number(fText);
		const lineErrors: string[] = [];
		if (!Number.isFinite(f) || f === 0 || Math.abs(f) > 1e5) lineErrors.push(`f_mm must be a non-zero number of millimetres up to ±100000 — got "${fText}"`);
		const dText = get('dia_mm');
		const d = dText === '' ? null : Number(dText);
		if (d !== null && !(Number.isFinite(d) && d > 0 && d <= 1000)) lineErrors.push(`dia_mm must be > 0 and ≤ 1000 mm or empty — got "${dText}"`);
		const qText = get('qty');
		const q = qText === '' ? 1 : Number(qText);
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
	const q = (s: string) => (/[",]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);
	return ['lens,f_mm,dia_mm,qty', ...lenses.map((l) => `${q(l.label)},${+(l.f_m * 1000).toPrecision(10)},${l.diameter_m === null ? '' : +(l.diameter_m * 1000).toPrecision(10)},${l.count}`)].join('\n') + '\n';
}

/**
 * The demo shelf of the Larkspur Street teaching lab (invented): labels are the lab's own drawer codes.
 */
export function demoShelf(): StockLens[] {
	const row = (label: string, f_mm: number, dia_mm: number, count: number): StockLens => ({ label, f_m: f_mm / 1000, diameter_m: dia_mm / 1000, count });
	return [
		row('LS drawer A1 (−50)', -50, 12.7, 2),
		row('LS drawer A2 (−75)', -75, 25.4, 1),
		row('LS drawer A3 (−100)', -100, 25.4, 1),
		row('LS drawer B1 (+40)', 40, 12.7, 2),
		row('LS drawer B2 (+50)', 50, 25.4, 2),
		row('LS drawer B3 (+75)', 75, 25.4, 1),
		row('LS drawer B4 (+100)', 100, 25.4, 3),
		row('LS drawer B5 (+125)', 125, 25.4, 1),
		row('LS drawer B6 (+150)', 150, 25.4, 2),
		row('LS drawer C1 (+200)', 200, 25.4, 2),
		row('LS drawer C2 (+250)', 250, 25.4, 1),
		row('LS drawer C3 (+300)', 300, 25.4, 1),
		row('LS drawer C4 (+400)', 400, 50.8, 1),
		row('LS drawer C5 (+500)', 500, 50.8, 1),
		row('LS drawer C6 (+750)', 750, 50.8, 1),
		row('LS drawer C7 (+1000)', 1000, 50.8, 1)
	];
}
