/**
 * One bad field must not wipe a section: the hazard, match and measure sections are repaired field by
 * field, the bad field's text is kept under `unreadable`, and the message names the field.
 * (Behaviour of the app's document; no physics here.)
 */
import { describe, expect, it } from 'vitest';
import { readSafety, safetyDefaults } from '../../src/routes/hazard/safetyDoc';
import { HazardState } from '../../src/routes/hazard/hazard.svelte';
import { MeasureState } from '../../src/routes/measure/measure.svelte';
import { compileMatchDoc, defaultMatchSection, readMatchSection } from '../../src/lib/document/match';
import { SetupStore } from '../../src/lib/document/store.svelte';
import { emptySetup } from '../../src/lib/document';

const labCsv = 'name,wavelength,power,beam_diameter,divergence\nDemo laser A (1064 nm),1064 nm,1 W,2 mm,1 mrad\n';

describe('hazard section', () => {
	it('an unreadable standard resets only itself; the lab CSV and every other field survive the first edit and a reload', () => {
		const store = new SetupStore(null);
		store.update((d) => (d.safety = { standard: 'no-such-edition', power: '7 W', inventoryCsv: labCsv, diameter: 5 }));
		const hz = new HazardState(store);
		expect(hz.s.standard).toBe(safetyDefaults.standard);
		expect(hz.s.power).toBe('7 W');
		expect(hz.s.inventoryCsv).toBe(labCsv);
		expect(hz.s.diameter).toBe('5');
		expect(hz.read.problem).toMatch(/standard \(was no-such-edition\)/);
		// The first edit writes the repaired section: nothing else is lost, the bad text is kept.
		hz.set('label', 'Demo laser A');
		const saved = JSON.parse(JSON.stringify(store.doc.safety));
		expect(saved.inventoryCsv).toBe(labCsv);
		expect(saved.power).toBe('7 W');
		expect(saved.unreadable.standard).toBe('no-such-edition');
		const again = readSafety(saved);
		expect(again.doc.inventoryCsv).toBe(labCsv);
		expect(again.problem).toMatch(/standard \(was no-such-edition\)/);
	});
	it('a section that is not an object at all is kept as text and the defaults are used', () => {
		const r = readSafety('garbage');
		expect(r.doc.standard).toBe(safetyDefaults.standard);
		expect(r.problem).toMatch(/whole section.*garbage/);
	});
});

describe('match section', () => {
	it('a bad rank choice and a number where text belongs do not cost the shelf', () => {
		const raw = JSON.parse(JSON.stringify(defaultMatchSection()));
		raw.inventory.push({ label: 'Shelf lens 4', focal: 75, diameter: '25 mm', count: '1' });
		raw.rankBy = 'fastest';
		const { section, problem } = readMatchSection(raw);
		expect(section.inventory.length).toBe(defaultMatchSection().inventory.length + 1);
		expect(section.inventory.at(-1)!.focal).toBe('75');
		expect(section.rankBy).toBe('robust');
		expect(problem).toMatch(/rankBy \(was fastest\)/);
		expect((section as unknown as { unreadable: Record<string, string> }).unreadable.rankBy).toBe('fastest');
		// Until the user edits, the search names the field instead of running on a silent default.
		const c = compileMatchDoc({ ...emptySetup(), match: raw });
		expect(c.fieldErrors['rankBy']).toMatch(/match\.rankBy: the stored value fastest could not be read/);
	});
});

describe('measure section', () => {
	it('an unknown unit resets only the unit; the pasted widths stay', () => {
		const store = new SetupStore(null);
		store.update((d) => (d.measure = { widths: 'z,d\n0,500\n10,520\n', zUnit: 'furlong', dUnit: 'um', wavelength: '633 nm' }));
		const m = new MeasureState(store);
		expect(m.doc.widths).toBe('z,d\n0,500\n10,520\n');
		expect(m.doc.zUnit).toBe('mm');
		expect(m.doc.wavelength).toBe('633 nm');
		expect(m.read.problem).toMatch(/zUnit \(was furlong\)/);
		m.set('pixel', '4 um');
		const saved = JSON.parse(JSON.stringify(store.doc.measure));
		expect(saved.widths).toBe('z,d\n0,500\n10,520\n');
		expect(saved.unreadable.zUnit).toBe('furlong');
	});
});
