/**
 * Bounded inputs: documented limits on elements, setup size, share links, images and table rows are
 * refused with a message naming the limit, and long inputs never overflow the call stack.
 * The caustic used for 130,000 planes is d(z)² = d0²·(1 + ((z − z0)/zR)²) (ISO 11146-1:2005 eq. 1,
 * from memory); the PNG header layout is that of the PNG specification (W3C PNG 2nd ed. 2003, §11.2.2 IHDR).
 */
import { describe, expect, it } from 'vitest';
import { encode } from 'fast-png';
import { deflateRawSync } from 'node:zlib';
import { demoSetup, MAX_ELEMENTS, parseSetupJson, validateSetup } from '../../src/lib/document';
import { decodeSetupFragment, MAX_SHARE_CHARS, SHARE_PREFIX } from '../../src/lib/document/share';
import { decodeBeamImage, MAX_IMAGE_PIXELS, pngDeclaredSize } from '../../src/lib/io/beamImage';
import { fitWidths } from '../../src/lib/optics/iso11146/index';

function base64Url(bytes: Uint8Array): string {
	return Buffer.from(bytes).toString('base64').replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
}

describe('setup documents', () => {
	it('100,000 elements are refused with the limit (not validated one by one)', () => {
		const doc = demoSetup();
		const el = doc.elements[0];
		const many = { ...doc, elements: Array.from({ length: 100_000 }, (_, i) => ({ ...el, id: 'e' + i })) };
		const r = validateSetup(many);
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.reason).toBe(`elements: 100000 elements — a setup holds at most ${MAX_ELEMENTS}`);
	});
	it('a setup file with a byte-order mark reads like one without', () => {
		const text = JSON.stringify(demoSetup());
		expect(parseSetupJson('\uFEFF' + text)).toEqual(parseSetupJson(text));
	});
});

describe('share links', () => {
	it('a link longer than the limit is refused before it is unpacked', async () => {
		const r = await decodeSetupFragment(SHARE_PREFIX + 'A'.repeat(MAX_SHARE_CHARS + 1));
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.reason).toMatch(/links up to 4 million are read/);
	});
	it('a small link that unpacks to gigabytes is stopped at the setup size limit', async () => {
		const packed = new Uint8Array(deflateRawSync(Buffer.alloc(24_000_000)));
		expect(packed.length).toBeLessThan(MAX_SHARE_CHARS);
		const r = await decodeSetupFragment(SHARE_PREFIX + base64Url(packed));
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.reason).toMatch(/unpacks to more than 20 MB/);
	});
});

describe('images', () => {
	it('a PNG declaring 60000 × 60000 is refused from its header, before decoding', () => {
		const png = encode({ width: 8, height: 8, data: new Uint8Array(64), channels: 1, depth: 8 });
		const view = new DataView(png.buffer, png.byteOffset, png.byteLength);
		view.setUint32(16, 60000);
		view.setUint32(20, 60000);
		expect(pngDeclaredSize(png)).toEqual({ width: 60000, height: 60000 });
		expect(() => decodeBeamImage(png)).toThrow(/at most 16384 pixels a side and 64 MP \(8192 × 8192\) — this one declares 60000 × 60000/);
	});
	it('the limit is 8192 × 8192 pixels', () => {
		expect(MAX_IMAGE_PIXELS).toBe(8192 * 8192);
		const png = encode({ width: 8, height: 8, data: new Uint8Array(64), channels: 1, depth: 8 });
		const view = new DataView(png.buffer, png.byteOffset, png.byteLength);
		view.setUint32(16, 8193);
		view.setUint32(20, 8192);
		expect(() => decodeBeamImage(png)).toThrow(/declares 8193 × 8192/);
	});
});

describe('long tables', () => {
	it('a caustic fit over 130,000 planes runs (no Math.min(...z) stack overflow)', () => {
		const d0 = 1e-3;
		const zR = 0.5;
		const planes = Array.from({ length: 130_000 }, (_, i) => {
			const z = -2 + (4 * i) / 129_999;
			return { z_m: z, d_m: [d0 * Math.sqrt(1 + (z / zR) ** 2)] };
		});
		const r = fitWidths(planes, 'd', { wavelength_m: 1064e-9 });
		const f = r.axes.d!.fit;
		expect(f.physical).toBe(true);
		if (f.physical) expect(Math.abs(f.d0_m - d0) / d0).toBeLessThan(1e-6);
		expect(r.axes.d!.plan).toBeTruthy();
	});
});
