import { describe, expect, it } from 'vitest';
import { decodeSetupFragment, encodeSetupFragment, SHARE_PREFIX } from '../../src/lib/document/share';
import { demoSetup } from '../../src/lib/document/demo';

describe('setup links', () => {
	it('round-trips the demo setup through a link fragment', async () => {
		const doc = demoSetup();
		const frag = await encodeSetupFragment(doc);
		expect(frag.startsWith(SHARE_PREFIX)).toBe(true);
		expect(frag).toMatch(/^#setup=[A-Za-z0-9_-]+$/);
		const back = await decodeSetupFragment(frag);
		expect(back.ok && back.doc).toEqual(doc);
	});

	it('keeps text exactly as typed, including units and non-ASCII characters', async () => {
		const doc = demoSetup();
		doc.name = 'Bänk 2 — 0.5 µm test';
		doc.source.x.waist = '0,45 mm';
		const back = await decodeSetupFragment(await encodeSetupFragment(doc));
		expect(back.ok && back.doc.name).toBe('Bänk 2 — 0.5 µm test');
		expect(back.ok && back.doc.source.x.waist).toBe('0,45 mm');
	});

	it('refuses a damaged or cut-short link with a reason', async () => {
		const frag = await encodeSetupFragment(demoSetup());
		const cut = await decodeSetupFragment(frag.slice(0, frag.length - 40));
		expect(cut.ok).toBe(false);
		const junk = await decodeSetupFragment(SHARE_PREFIX + 'not-a-setup');
		expect(junk.ok).toBe(false);
		expect(junk.ok ? '' : junk.reason).toMatch(/damaged|not valid JSON|not a Beamwright setup/);
		expect((await decodeSetupFragment('#other')).ok).toBe(false);
	});

	it('refuses a link whose setup fails validation, naming the field', async () => {
		const doc = demoSetup() as unknown as Record<string, unknown>;
		doc.elements = [{ id: 'x' }];
		const r = await decodeSetupFragment(await encodeSetupFragment(doc as never));
		expect(r.ok).toBe(false);
		expect(r.ok ? '' : r.reason).toMatch(/elements/);
	});
});
