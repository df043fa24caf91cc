/**
 * The cavity lab's document layer and its CLI commands (`spectrum`, `diagnose`), run in-process.
 * Physics checks live in tests/reference/cavity-spectrum.test.ts and mode-content.test.ts; here the
 * wiring: the bench beam into the match target, a lens moved on the bench found again from its peaks,
 * and the CLI's JSON keys and refusals (exit code 2, one line).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { demoSetup, makeElement } from '../../src/lib/document/demo';
import { compileMatchDoc, defaultMatchSection, MATCH_ID_PREFIX, readMatchSection } from '../../src/lib/document/match';
import { compileLab, diagnoseLab, parsePeaksCsv, readPeaks, defaultLab } from '../../src/lib/document/cavityLab';
import { validateSetup } from '../../src/lib/document/schema';
import { expectClose } from '../helpers';
import { runCli } from '../cli';

function labDoc(shift = '0 mm') {
	const doc = demoSetup();
	const match = defaultMatchSection();
	match.lab.perturb.lensId = `${MATCH_ID_PREFIX}2`;
	match.lab.perturb.lensShift = shift;
	doc.match = match as unknown as Record<string, unknown>;
	doc.elements = [makeElement('thinLens', `${MATCH_ID_PREFIX}1`, 'ML1', '205 mm', { f: '300 mm' }), makeElement('thinLens', `${MATCH_ID_PREFIX}2`, 'ML2', '680.4 mm', { f: '200 mm' })];
	return doc;
}

describe('cavity lab in the setup document', () => {
	it('older match sections without "lab" still validate and get the defaults', () => {
		const raw = JSON.parse(readFileSync('static/demo/match-cavity.json', 'utf8'));
		expect(raw.match.lab).toBeUndefined();
		expect(validateSetup(raw).ok).toBe(true);
		expect(readMatchSection(raw.match).section.lab).toEqual(defaultLab());
	});
	it('a lens moved by 4 mm on the bench: its predicted peaks lead back to a 4 mm move of that lens (one of the two candidates)', () => {
		const moved = labDoc('4 mm');
		const r = compileLab(moved, compileMatchDoc(moved));
		expect(r.errors).toEqual([]);
		const c = r.content!;
		const h = (m: number, n: number) => c.x.fractions[m] * c.y.fractions[n];
		const peaks = { p00: h(0, 0), p10: h(1, 0), p01: h(0, 1), p20: h(2, 0), p02: h(0, 2), p11: h(1, 1), noise: 0.001 };
		// Diagnose against the bench as placed (the lens back where it was).
		const placed = labDoc('0 mm');
		const rp = compileLab(placed, compileMatchDoc(placed));
		const d = diagnoseLab(placed, rp, peaks);
		const ml2 = d.lensMoves.find((l) => l.id === `${MATCH_ID_PREFIX}2`)!;
		const cands = [ml2.moveA_m, ml2.moveB_m].filter((v): v is number => v !== null);
		expect(cands.some((v) => Math.abs(v - -0.004) < 2e-4)).toBe(true);
	});
	it('the predicted scan is worked out when first read, once, and hasScan says whether there is one', async () => {
		const doc = labDoc();
		const r = compileLab(doc, compileMatchDoc(doc));
		expect(r.hasScan).toBe(true);
		const { predictedScan } = await import('../../src/lib/optics/scan');
		const s = r.spectrum!;
		const direct = predictedScan(s, r.content!.modes, { reflectivity1: r.reflectivity!.r1, reflectivity2: r.reflectivity!.r2, roundTripLoss: r.reflectivity!.loss }, 1, { from_Hz: -0.05 * s.fsr_Hz, to_Hz: 1.05 * s.fsr_Hz, points: 3001, minPeak: 1e-4 });
		expect(r.scan).toEqual(direct);
		expect(r.scan).toBe(r.scan); // the same object on every read
		expect(Object.keys(JSON.parse(JSON.stringify(r)).scan.transmitted_W)).toHaveLength(3001); // written out like any other field
		const refused = labDoc();
		(refused.match as { lab: { reflectivity1: string } }).lab.reflectivity1 = '100 %';
		const rr = compileLab(refused, compileMatchDoc(refused));
		expect(rr.hasScan).toBe(false);
		expect(rr.scan).toBeNull();
	});
	it('a perturbation of the input mirror’s reflectivity to 100 % is refused, naming the field', () => {
		const doc = labDoc();
		(doc.match as { lab: { reflectivity1: string } }).lab.reflectivity1 = '100 %';
		const r = compileLab(doc, compileMatchDoc(doc));
		expect(r.fieldErrors['reflectivity1']).toMatch(/must be ≥ 0 and < 1/);
		expect(r.spectrum).toBeNull();
	});
	it('peak form: empty required heights name the peak; a trace CSV is assigned to modes by frequency', () => {
		const lab = defaultLab();
		const r = readPeaks(lab);
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.fieldErrors['peaks.p00']).toMatch(/TEM00 peak is empty/);
		const doc = labDoc();
		const rep = compileLab(doc, compileMatchDoc(doc));
		const s = rep.spectrum!;
		// Synthetic trace: TEM00 of height 1 at 5 MHz, a first-order line of 0.1 one transverse spacing later.
		const rows = ['detuning_Hz,power'];
		for (let i = 0; i <= 4000; i++) {
			const f = -0.05 * s.fsr_Hz + (i / 4000) * 0.6 * s.fsr_Hz;
			const line = (f0: number, a: number) => a / (1 + ((2 * (f - f0)) / s.linewidth_Hz) ** 2);
			rows.push(`${f},${line(5e6, 1) + line(5e6 + s.transverseSpacing_Hz.x, 0.1)}`);
		}
		const p = parsePeaksCsv(rows.join('\n'), s);
		expect(p.ok).toBe(true);
		if (p.ok) {
			expectClose(p.peaks.p00, 1, 0.02);
			expectClose(p.peaks.p10, 0.1, 0.05);
		}
	});
});

/** The CLI in this process (the same main() as bin/beamwright.js). */
const cli = (args: string[]) => runCli(...args);

describe('CLI spectrum and diagnose', () => {
	let dir = '';
	beforeAll(() => {
		dir = mkdtempSync(join(tmpdir(), 'bw-cavity-'));
		const doc = JSON.parse(readFileSync('static/demo/match-cavity.json', 'utf8'));
		doc.match.target.r2 = '100 mm';
		writeFileSync(join(dir, 'unstable.json'), JSON.stringify(doc));
		doc.match.target.r2 = '500 mm';
		doc.match.lab = { reflectivity2: '1' };
		writeFileSync(join(dir, 'r1.json'), JSON.stringify(doc));
		writeFileSync(join(dir, 'toomuch.csv'), 'peak,height\n00,0.9\n10,0.05\n01,0.05\n20,0.01\n02,0.01\nsum,0.9\n');
	});
	afterAll(() => rmSync(dir, { recursive: true, force: true }));

	it('spectrum prints the named keys; the demo cavity (flat + 500 mm, 250 mm) has FSR = c/2L and spacing FSR/4 (Kogelnik & Li 1966, eq. 66)', async () => {
		const r = await cli(['spectrum', 'static/demo/match-cavity.json']);
		expect(r.code).toBe(0);
		const j = JSON.parse(r.stdout);
		for (const k of ['fsr_Hz', 'gouy_rad', 'transverseSpacing_Hz', 'finesse', 'linewidth_Hz', 'modes']) expect(j).toHaveProperty(k);
		expectClose(j.fsr_Hz, 299792458 / 0.5, 1e-12);
		expectClose(j.transverseSpacing_Hz.x, j.fsr_Hz / 4, 1e-9);
		expect(Object.keys(j.modes[0])).toEqual(expect.arrayContaining(['m', 'n', 'frequency_Hz', 'power']));
	});
	it('refuses an unstable cavity, a reflectivity of 1, and peaks adding up to more than their sum: exit 2, one line', async () => {
		const runs: { r: { code: number; stdout: string; stderr: string }; re: RegExp }[] = [];
		for (const [args, re] of [
			[['spectrum', join(dir, 'unstable.json')], /no stable mode/],
			[['spectrum', join(dir, 'r1.json')], /reflectivity must be ≥ 0 and < 1/],
			[['diagnose', 'static/demo/match-cavity.json', '--peaks', join(dir, 'toomuch.csv')], /no more in total than the sum/]
		] as const) {
			runs.push({ r: await cli([...args]), re });
		}
		for (const { r, re } of runs) {
			expect(r.code).toBe(2);
			expect(r.stderr.trim().split('\n')).toHaveLength(1);
			expect(r.stderr).toMatch(re);
		}
	});
	it('diagnose prints the estimate and the corrections for the demo peaks', async () => {
		const r = await cli(['diagnose', 'static/demo/match-cavity.json', '--peaks', 'static/demo/cavity-peaks.csv']);
		expect(r.code).toBe(0);
		const j = JSON.parse(r.stdout);
		expect(j.estimate.x.misalignment.value).toBeGreaterThan(0);
		expect(j.corrections).toHaveProperty('lensMoves');
		expect(j.ambiguity).toMatch(/sign/);
	});
});
