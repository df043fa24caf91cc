/**
 * "New" in its two meanings (src/lib/document/fresh.ts): a new whole setup leaves no example data in
 * any workspace; a new bench keeps the other workspaces' sections.
 */
import { describe, it, expect } from 'vitest';
import { demoSetup, validateSetup } from '../../src/lib/document';
import { newBenchOnly, newWholeSetup } from '../../src/lib/document/fresh';
import { compileMatchDoc, defaultMatchSection, readMatchSection } from '../../src/lib/document/match';

describe('New', () => {
	it('a new whole setup is a valid document with empty workspaces', () => {
		const doc = newWholeSetup();
		expect(validateSetup(JSON.parse(JSON.stringify(doc))).ok).toBe(true);
		expect(doc.elements).toEqual([]);
		const { section, problem } = readMatchSection(doc.match);
		expect(problem).toBeNull();
		expect(section.inventory).toEqual([]);
		expect(section.keepOut).toEqual([]);
		expect(section.slots).toEqual([]);
		expect(doc.safety).toMatchObject({ label: '', duration: '' });
		expect(doc.measure).toMatchObject({ widths: '', wavelengthFrom: 'bench' });
		// An empty match section asks for input instead of searching with hidden settings.
		const c = compileMatchDoc(doc);
		expect(c.problem).toBeFalsy();
		expect(c.errors.length).toBeGreaterThan(0);
		for (const kind of ['cavity', 'ring', 'fiber'] as const) {
			const m = readMatchSection(doc.match).section;
			m.target.kind = kind;
			expect(() => compileMatchDoc({ ...doc, match: m as unknown as Record<string, unknown> })).not.toThrow();
		}
	});

	it('a new bench keeps Match, Measure and Hazard', () => {
		const old = { ...demoSetup(), match: defaultMatchSection() as unknown as Record<string, unknown>, safety: { label: 'Demo laser A' }, measure: { widths: 'z,d\n1,2' } };
		const doc = newBenchOnly(old);
		expect(doc.elements).toEqual([]);
		expect(doc.source.wavelength).toBe('632.8 nm');
		expect(doc.match).toEqual(old.match);
		expect(doc.safety).toEqual(old.safety);
		expect(doc.measure).toEqual(old.measure);
		expect(doc.match).not.toBe(old.match);
	});
});
