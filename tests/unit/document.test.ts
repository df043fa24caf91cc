import { describe, it, expect } from 'vitest';
import { compileSetup, demoSetup, emptySetup, makeElement, parseSetupJson, validateSetup, type SetupDoc } from '../../src/lib/document';
import { propagate } from '../../src/lib/optics';

const clone = (d: SetupDoc): SetupDoc => JSON.parse(JSON.stringify(d));

describe('validateSetup', () => {
	it('accepts the demo setup and the empty setup, and a JSON round trip of them', () => {
		for (const doc of [demoSetup(), emptySetup()]) {
			const r = validateSetup(doc);
			expect(r.ok).toBe(true);
			const j = parseSetupJson(JSON.stringify(doc));
			expect(j.ok && j.doc).toEqual(doc);
		}
	});

	it('refuses values that are not setup documents', () => {
		expect(validateSetup(null)).toEqual({ ok: false, reason: 'not a JSON object' });
		expect(validateSetup(42)).toEqual({ ok: false, reason: 'not a JSON object' });
		const r = validateSetup({ format: 'something-else', version: 1 });
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.reason).toMatch(/"format" must be "beamwright-setup"/);
	});

	it('refuses a missing or newer version', () => {
		const d = clone(demoSetup()) as unknown as Record<string, unknown>;
		delete d.version;
		const r1 = validateSetup(d);
		expect(!r1.ok && r1.reason).toMatch(/"version" is missing/);
		const r2 = validateSetup({ ...demoSetup(), version: 99 });
		expect(!r2.ok && r2.reason).toMatch(/setup version 99 is newer/);
	});

	it('opens a version-1 file as version 2 with every field kept, and refuses versions it has no step for', () => {
		// A version-1 file (before the cavity lab, substrate, knife-edge table, wavelength origin and extra lines).
		const v1 = { ...clone(demoSetup()), version: 1 } as unknown as Record<string, unknown>;
		delete v1.match;
		delete v1.measure;
		const r = validateSetup(v1);
		expect(r.ok).toBe(true);
		if (r.ok) {
			expect(r.doc.version).toBe(2);
			expect(r.doc.source).toEqual(demoSetup().source);
			expect(r.doc.elements).toEqual(demoSetup().elements);
			expect(r.doc.name).toBe(demoSetup().name);
		}
		const r0 = validateSetup({ ...demoSetup(), version: 0 });
		expect(!r0.ok && r0.reason).toMatch(/setup version 0 is not one this Beamwright can read \(versions 1–2\)/);
		const r3 = validateSetup({ ...demoSetup(), version: 3 });
		expect(!r3.ok && r3.reason).toMatch(/setup version 3 is newer than this Beamwright understands \(2\)/);
	});

	it('names the path of a wrongly typed field', () => {
		const d = clone(demoSetup()) as unknown as { source: { x: { waist: unknown } } };
		d.source.x.waist = 0.5;
		const r = validateSetup(d);
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.reason).toMatch(/^source\.x\.waist: /);
	});

	it('names the path of a bad element kind and of a missing field', () => {
		const d = clone(demoSetup()) as unknown as { elements: Array<Record<string, unknown>> };
		d.elements[1].kind = 'flux-capacitor';
		const r = validateSetup(d);
		expect(!r.ok && r.reason).toMatch(/^elements\.1\.kind: /);
		const e = clone(demoSetup()) as unknown as { view?: unknown };
		delete e.view;
		const r2 = validateSetup(e);
		expect(!r2.ok && r2.reason).toMatch(/^view: /);
	});

	it('refuses duplicate element ids', () => {
		const d = clone(demoSetup());
		d.elements[1].id = d.elements[0].id;
		const r = validateSetup(d);
		expect(!r.ok && r.reason).toMatch(/the id "e1" is used twice/);
	});

	it('parseSetupJson refuses text that is not JSON, without throwing', () => {
		const r = parseSetupJson('{ not json');
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.reason).toMatch(/^not valid JSON/);
	});
});

describe('compileSetup', () => {
	it('compiles the demo into engine input in SI units that propagates', () => {
		const c = compileSetup(demoSetup());
		expect(c.ok).toBe(true);
		if (!c.ok) return;
		expect(c.input.source.wavelength_m).toBeCloseTo(1064e-9, 20);
		expect(c.input.source.x.m2).toBe(1.3);
		expect(c.input.source.y.spec).toEqual({ kind: 'waist', w0_m: 0.4e-3, z0_m: -10e-3 });
		expect(c.input.elements.map((e) => [e.id, e.z_m, e.aperture_m])).toEqual([
			['e1', 0.25, 12.7e-3],
			['e2', 0.3, 25.4e-3],
			['e3', 0.65, 25.4e-3],
			['e4', 0.9, 25.4e-3]
		]);
		expect(c.input.elements[3].spec).toEqual({ kind: 'mirror', r_m: 0.5, angle_rad: (10 * Math.PI) / 180, plane: 'x' });
		expect(c.input.end_m).toBe(1.4);
		const p = propagate(c.input);
		expect(p.elements).toHaveLength(4);
		expect(p.waists.some((w) => !w.virtual)).toBe(true);
	});

	it('collects every field error with its path, not just the first', () => {
		const d = clone(demoSetup());
		d.source.wavelength = '';
		d.source.x.waist = '-1 mm';
		d.source.y.m2 = '0.5';
		d.elements[0].params.f = '0 mm';
		d.elements[1].at = '3 s';
		d.elements[2].aperture = 'wide';
		d.view.end = 'NaN';
		const c = compileSetup(d);
		expect(c.ok).toBe(false);
		if (c.ok) return;
		const paths = c.errors.map((e) => e.path);
		expect(paths).toEqual(
			expect.arrayContaining(['source.wavelength', 'source.x.waist', 'source.y.m2', 'elements.e1.f', 'elements.e2.at', 'elements.e3.aperture', 'view.end'])
		);
		const byPath = Object.fromEntries(c.errors.map((e) => [e.path, e.message]));
		expect(byPath['source.wavelength']).toMatch(/Wavelength is empty/);
		expect(byPath['source.x.waist']).toMatch(/Waist radius must be > 0 m/);
		expect(byPath['elements.e1.f']).toMatch(/^L1: Focal length must be non-zero/);
		expect(byPath['elements.e2.at']).toMatch(/L2 position: "3 s" has the wrong unit/);
	});

	it('ignores the y axis fields of a round (non-astigmatic) source', () => {
		const d = emptySetup();
		d.source.y.waist = 'garbage';
		const c = compileSetup(d);
		expect(c.ok).toBe(true);
		if (c.ok) expect(c.input.source.y).toBe(c.input.source.x);
	});

	it('reads "flat" as an infinite radius and refuses a zero radius', () => {
		const d = emptySetup();
		d.elements.push(makeElement('interface', 'g', 'Glass', '100 mm', { r: 'flat', n: '1.5' }));
		const c = compileSetup(d);
		expect(c.ok && c.input.elements[0].spec).toEqual({ kind: 'interface', indexAfter: 1.5, r_m: Infinity });
		d.elements[0].params.r = '0 mm';
		const c2 = compileSetup(d);
		expect(!c2.ok && c2.errors[0].path).toBe('elements.g.r');
	});
});
