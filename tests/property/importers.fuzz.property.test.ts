/**
 * Fuzzing the importers (fast-check, fixed seed printed below): mutated setup documents through the
 * store's import and every section reader, mutated CSVs through the lab inventory, lens list and width
 * table readers. Properties:
 * - no exception escapes (the table readers may refuse with a RangeError that carries a message);
 * - a refused import keeps the current work exactly;
 * - nothing accepted silently changes meaning: an accepted setup holds only values the file held, a
 *   section field that had to be reset is named; in a CSV every line is accepted unchanged or reported —
 *   lines the mutation did not touch keep exactly their original values unless a reported row ran
 *   over them or the whole file was refused with a reason.
 * (Behaviour of the app's importers; no physics here.)
 */
import { beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { SetupStore } from '../../src/lib/document/store.svelte';
import { compileSetup, demoSetup } from '../../src/lib/document';
import { compileMatchDoc, defaultMatchSection, readMatchSection } from '../../src/lib/document/match';
import { readSafety, safetyDefaults } from '../../src/routes/hazard/safetyDoc';
import { parseInventoryCsv } from '../../src/lib/safety/inventory';
import { demoShelf, lensCsv, parseLensCsv } from '../../src/lib/optics/solve/inventory';
import { parseWidthTable } from '../../src/lib/io/widthTable';
import { loadUnitEngine } from '../../src/lib/units/parse';

const SEED = 15_2026;
const RUNS = 1000;
console.log(`importer fuzz: seeds ${SEED} and ${SEED + 1}, ${RUNS} setup documents, ${RUNS} lab CSVs, ${RUNS / 4} lens lists, ${RUNS / 4} width tables`);

beforeAll(() => loadUnitEngine());

// ── Mutations ───────────────────────────────────────────────────────────────────────────────────
const nasty = fc.constantFrom('"', ',', ';', '\n', '\r\n', '\t', '#', '=', '-', '@', "'", '\\', '{', '}', '[', ']', ':', '\uFEFF', '\u0000', 'é', '1e400', 'NaN', '-0', ' ', '""', '0x5');
const textMutation = fc.oneof(
	fc.record({ op: fc.constant('insert' as const), at: fc.nat(), s: fc.oneof(nasty, fc.string({ maxLength: 4 })) }),
	fc.record({ op: fc.constant('delete' as const), at: fc.nat(), n: fc.integer({ min: 1, max: 6 }) }),
	fc.record({ op: fc.constant('replace' as const), at: fc.nat(), s: nasty })
);
type TextMutation = typeof textMutation extends fc.Arbitrary<infer T> ? T : never;
function mutateText(t: string, m: TextMutation): string {
	const at = t.length === 0 ? 0 : m.at % (t.length + 1);
	if (m.op === 'insert') return t.slice(0, at) + m.s + t.slice(at);
	if (m.op === 'delete') return t.slice(0, at) + t.slice(at + m.n);
	return t.slice(0, at) + m.s + t.slice(at + 1);
}

const jsonValue = fc.oneof(fc.string({ maxLength: 6 }), fc.double(), fc.integer(), fc.boolean(), fc.constant(null), fc.constant([]), fc.constant({}), fc.constantFrom('1 mm', '5 W', 'flat', 'ring', 'stricter', 'waist'));
const pathMutation = fc.record({ pick: fc.nat(), value: jsonValue, del: fc.boolean() });

function leaves(x: unknown, path: string[] = [], out: string[][] = []): string[][] {
	if (x !== null && typeof x === 'object') {
		out.push(path);
		for (const [k, v] of Object.entries(x)) leaves(v, [...path, k], out);
	} else out.push(path);
	return out;
}
function setPath(root: Record<string, unknown>, path: string[], value: unknown, del: boolean): void {
	if (path.length === 0) return;
	let o = root as Record<string, unknown>;
	for (const k of path.slice(0, -1)) o = o[k] as Record<string, unknown>;
	if (del) delete o[path[path.length - 1]];
	else o[path[path.length - 1]] = value;
}

/** Every leaf of `doc` is present at the same path in `input` with the same value. */
function heldBy(doc: unknown, input: unknown, path = ''): string | null {
	if (doc !== null && typeof doc === 'object') {
		if (input === null || typeof input !== 'object' || Array.isArray(doc) !== Array.isArray(input)) return path || '(root)';
		for (const [k, v] of Object.entries(doc)) {
			const r = heldBy(v, (input as Record<string, unknown>)[k], `${path}.${k}`);
			if (r) return r;
		}
		return null;
	}
	return Object.is(doc, input) ? null : path;
}

function fullDoc() {
	const d = demoSetup() as ReturnType<typeof demoSetup> & Record<string, unknown>;
	d.match = defaultMatchSection() as unknown as Record<string, unknown>;
	d.safety = { ...safetyDefaults, inventoryCsv: 'name,wavelength,power,beam_diameter,divergence\nDemo laser A (1064 nm),1064 nm,1 W,2 mm,1 mrad\n' };
	d.measure = { widths: 'z,d\n0,500\n10,520\n', zUnit: 'mm', dUnit: 'um', wavelength: '1064 nm', weighting: 'relative', zOffset: '0 mm', pixel: '5.5 um' };
	return d;
}

/** Section leaves that a reader changed although the stored value was present: each must be named. */
function silentlyChanged(read: Record<string, unknown>, raw: unknown): string | null {
	if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) return null; // whole section reset: named separately
	for (const p of leaves(read)) {
		if (p[0] === 'unreadable' || p.length === 0) continue;
		let a: unknown = read;
		let b: unknown = raw;
		for (const k of p) {
			a = (a as Record<string, unknown>)?.[k];
			b = b !== null && typeof b === 'object' ? (b as Record<string, unknown>)[k] : undefined;
		}
		if (b === undefined || (a !== null && typeof a === 'object')) continue;
		if (!Object.is(a, b) && String(a) !== String(b)) return p.join('.');
	}
	return null;
}

describe('setup documents', () => {
	for (const half of [0, 1])
	it(`${RUNS / 2} mutated documents (part ${half + 1} of 2): no exception, refused ones keep the work, accepted ones hold only what the file said`, () => {
		const base = fullDoc();
		const baseText = JSON.stringify(base, null, 1);
		const store = new SetupStore(null);
		store.update((d) => (d.name = 'current work'));
		fc.assert(
			fc.property(fc.array(textMutation, { maxLength: 3 }), fc.array(pathMutation, { maxLength: 3 }), fc.boolean(), (texts, paths, structural) => {
				let text: string;
				if (structural) {
					const obj = JSON.parse(baseText);
					for (const m of paths) {
						const all = leaves(obj);
						setPath(obj, all[m.pick % all.length], m.value, m.del);
					}
					text = JSON.stringify(obj);
				} else text = texts.reduce(mutateText, baseText);
				const before = store.exportJson();
				const r = store.importJson(text);
				if (!r.ok) {
					expect(r.reason.length).toBeGreaterThan(0);
					expect(store.exportJson()).toBe(before);
					return;
				}
				const input = JSON.parse(text.replace(/^\uFEFF/, ''));
				expect(heldBy(JSON.parse(store.exportJson()), input)).toBeNull();
				// Every reader runs without throwing, and names any field it had to reset.
				const doc = store.doc;
				void compileSetup(doc);
				void store.outcome;
				const m = readMatchSection(doc.match);
				if (m.problem === null) expect(silentlyChanged(m.section as unknown as Record<string, unknown>, doc.match)).toBeNull();
				void compileMatchDoc(doc);
				const s = readSafety(doc.safety);
				if (s.problem === null) expect(silentlyChanged(s.doc as unknown as Record<string, unknown>, doc.safety)).toBeNull();
				store.undo();
			}),
			{ seed: SEED + half, numRuns: RUNS / 2 }
		);
	});
});

describe('CSV importers', () => {
	const demoLab = readFileSync('static/demo/hazard-lab-lasers.csv', 'utf8');

	for (const half of [0, 1])
	it(`${RUNS / 2} mutated lab CSVs (part ${half + 1} of 2): every line accepted unchanged or reported, never dropped silently`, () => {
		const original = parseInventoryCsv(demoLab);
		expect(original.lasers.length).toBe(8);
		const lines = demoLab.split('\n');
		const byLine = new Map(original.lasers.map((l) => [l.line, l]));
		const dataLines = [...byLine.keys()];
		fc.assert(
			fc.property(fc.nat(), fc.array(textMutation, { minLength: 1, maxLength: 3 }), (pick, muts) => {
				const k = dataLines[pick % dataLines.length]; // 1-based line that gets mutated
				const mutatedLine = muts.reduce(mutateText, lines[k - 1]);
				const text = [...lines.slice(0, k - 1), mutatedLine, ...lines.slice(k)].join('\n');
				const shift = mutatedLine.split(/\r\n|\r|\n/).length - 1;
				const r = parseInventoryCsv(text);
				if (r.refused) {
					expect(r.issues.length).toBeGreaterThan(0);
					return;
				}
				const spans = [...r.rejected.map((x) => [x.line, x.lineEnd ?? x.line]), ...r.lasers.map((l) => [l.line, l.line])];
				for (const [j, orig] of byLine) {
					if (j === k) continue;
					const p = j < k ? j : j + shift;
					const got = r.lasers.find((l) => l.line === p);
					if (got) {
						expect(got.input).toEqual(orig.input);
						expect(got.name).toBe(orig.name);
						continue;
					}
					// Not accepted: a reported row must cover that line.
					const covered = r.rejected.some((x) => x.line <= p && p <= (x.lineEnd ?? x.line));
					expect(covered, `line ${p} (${orig.name}) vanished silently; rows: ${JSON.stringify(spans)}`).toBe(true);
				}
			}),
			{ seed: SEED + half, numRuns: RUNS / 2 }
		);
	});

	it(`${RUNS / 4} mutated lens lists: no exception; accepted lenses are finite and whole in number, a refused list names its lines`, () => {
		const text0 = lensCsv(demoShelf());
		fc.assert(
			fc.property(fc.array(textMutation, { minLength: 1, maxLength: 3 }), (muts) => {
				const text = muts.reduce(mutateText, text0);
				const r = parseLensCsv(text);
				if (!r.ok) {
					expect(r.messages.length).toBeGreaterThan(0);
					for (const m of r.messages) expect(m).toMatch(/^lens list/);
					return;
				}
				for (const l of r.lenses) {
					expect(Number.isFinite(l.f_m) && l.f_m !== 0).toBe(true);
					expect(Number.isInteger(l.count)).toBe(true);
				}
			}),
			{ seed: SEED, numRuns: RUNS / 4 }
		);
	});

	it(`${RUNS / 4} mutated width tables: rows or flags for every data line, or a RangeError with a message`, () => {
		const text0 = readFileSync('static/demo/measure-widths.csv', 'utf8');
		fc.assert(
			fc.property(fc.array(textMutation, { minLength: 1, maxLength: 3 }), (muts) => {
				const text = muts.reduce(mutateText, text0);
				let t;
				try {
					t = parseWidthTable(text);
				} catch (e) {
					expect(e).toBeInstanceOf(RangeError);
					expect((e as Error).message.length).toBeGreaterThan(10);
					return;
				}
				for (const r of t.rows) {
					expect(Number.isFinite(r.z_m)).toBe(true);
					for (const d of r.d_m) expect(d > 0 && Number.isFinite(d)).toBe(true);
				}
				const seen = new Set([...t.rows.map((r) => r.line), ...t.flags.map((f) => f.line)]);
				expect(seen.size).toBe(t.rows.length + t.flags.length);
			}),
			{ seed: SEED, numRuns: RUNS / 4 }
		);
	});
});
