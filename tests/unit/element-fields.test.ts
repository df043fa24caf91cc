/**
 * Every numeric field of the source (each form, both axes) and of every element kind refuses each kind of bad text with a message at that field's
 * path, and the text stays in the document as typed (the browser suite checks that the page shows these
 * messages; here every field × every bad value is covered without a browser). Behaviour of the app's own
 * input rules; no physics here.
 */
import { describe, expect, it } from 'vitest';
import { compileSetup, demoSetup, makeElement, type SetupDoc } from '../../src/lib/document';
import { elementKinds } from '../../src/lib/document/elementKinds';

const bad = ['', 'abc', '5 kg', '1e400 m', 'NaN'];

describe('element fields refuse bad input', () => {
	for (const k of elementKinds) {
		const fields = ['at', 'aperture', ...k.params.filter((p) => p.type !== 'choice').map((p) => p.key)];
		it(`${k.kind}: ${fields.join(', ')}`, () => {
			for (const field of fields)
				for (const text of bad) {
					// A blank clear aperture means "no aperture": the one blank that is valid.
					if (field === 'aperture' && text === '') continue;
					const doc = demoSetup();
					const el = makeElement(k.kind, 'probe', 'P1', '150 mm');
					if (field === 'at') el.at = text;
					else if (field === 'aperture') el.aperture = text;
					else el.params[field] = text;
					doc.elements = [el];
					const c = compileSetup(doc);
					const where = `${k.kind}.${field} = "${text}"`;
					expect(c.ok, where).toBe(false);
					if (c.ok) continue;
					const path = `elements.probe.${field}`;
					const e = c.errors.find((x) => x.path === path);
					expect(e, `${where}: no message at ${path} (got ${c.errors.map((x) => x.path).join(', ')})`).toBeDefined();
					expect(e!.message, where).toMatch(/^P1\b|P1 /);
					expect(e!.message, where).not.toMatch(/undefined|NaN(?!")|Infinity/);
					// The text is kept as typed.
					expect(field === 'at' ? el.at : field === 'aperture' ? el.aperture : el.params[field]).toBe(text);
				}
		});
	}
});

describe('source fields refuse bad input', () => {
	const forms = { waist: ['waist', 'waistAt'], divergence: ['diameter', 'at', 'fullDivergence'], twoDiameters: ['d1', 'z1', 'd2', 'z2'] } as const;
	for (const [form, own] of Object.entries(forms)) {
		it(`${form} form: wavelength, index, and m2, ${own.join(', ')} on x and y`, () => {
			const paths = ['wavelength', 'index', ...['x', 'y'].flatMap((a) => ['m2', ...own].map((f) => `${a}.${f}`))];
			for (const path of paths)
				for (const text of bad) {
					const doc: SetupDoc = demoSetup();
					doc.source.astigmatic = true;
					doc.source.x.kind = doc.source.y.kind = form as SetupDoc['source']['x']['kind'];
					const [a, f] = path.split('.');
					if (f) (doc.source[a as 'x' | 'y'] as unknown as Record<string, string>)[f] = text;
					else (doc.source as unknown as Record<string, string>)[a] = text;
					const c = compileSetup(doc);
					const where = `source.${path} = "${text}"`;
					expect(c.ok, where).toBe(false);
					if (c.ok) continue;
					const e = c.errors.find((x) => x.path === `source.${path}`);
					expect(e, `${where}: got ${c.errors.map((x) => x.path).join(', ')}`).toBeDefined();
					expect(e!.message.length, where).toBeGreaterThan(10);
					expect(e!.message, where).not.toMatch(/undefined|NaN(?!")|Infinity/);
				}
		});
	}
});
