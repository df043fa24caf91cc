/** The `safety` section of the setup document: defaults, round trip, and refusal of a bad section. */
import { describe, expect, it } from 'vitest';
import { readSafety, safetyDefaults } from '../../src/routes/hazard/safetyDoc';

describe('readSafety', () => {
	it('gives the defaults (the invented lab reference beam) when the section is absent', () => {
		const r = readSafety(undefined);
		expect(r.problem).toBeNull();
		expect(r.doc).toMatchObject({ wavelength: '514.5 nm', power: '5 W', diameter: '2.83 mm', divergence: '1.41 mrad', duration: '0.25 s', standard: 'stricter' });
	});
	it('keeps what the user typed, even when it is not a valid quantity', () => {
		const r = readSafety({ ...safetyDefaults, power: '5 W W' });
		expect(r.problem).toBeNull();
		expect(r.doc.power).toBe('5 W W');
	});
	it('fills missing keys from the defaults (older documents)', () => {
		expect(readSafety({ wavelength: '1064 nm' }).doc).toMatchObject({ wavelength: '1064 nm', power: '5 W' });
	});
	it('resets only a field with a wrong value, keeps its text and says where', () => {
		const r = readSafety({ ...safetyDefaults, standard: 'ansi' });
		expect(r.problem).toMatch(/standard/);
		expect(r.doc).toEqual({ ...safetyDefaults, unreadable: { standard: 'ansi' } });
	});
});
