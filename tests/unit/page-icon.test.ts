// The page icon: static/favicon.png (the drawing static/favicon.svg rasterised at 32 px), written into
// src/app.html as a data URL. A PNG, not the SVG: an SVG icon is decoded in an SVG document of its own,
// on the page's main thread while the page loads (see the comment in app.html).
import { readFileSync } from 'node:fs';
import { decode } from 'fast-png';
import { describe, expect, it } from 'vitest';

const png = readFileSync('static/favicon.png');
const html = readFileSync('src/app.html', 'utf8');

describe('page icon', () => {
	it('app.html carries static/favicon.png byte for byte, as its only icon', () => {
		const links = [...html.matchAll(/<link rel="icon"[^>]*>/g)].map((m) => m[0]);
		expect(links).toHaveLength(1);
		expect(links[0]).toContain('type="image/png"');
		expect(links[0]).toContain(`href="data:image/png;base64,${png.toString('base64')}"`);
	});

	it('is the drawing at 32 × 32: transparent corners, and both curves where favicon.svg puts them', () => {
		const img = decode(png);
		// Grey and alpha: the drawing is one dark grey.
		expect([img.width, img.height, img.channels]).toEqual([32, 32, 2]);
		const alpha = (x: number, y: number) => img.data[(y * 32 + x) * 2 + 1];
		for (const [x, y] of [[0, 0], [31, 0], [0, 31], [31, 31]]) expect(alpha(x, y)).toBe(0);
		// favicon.svg: quadratic Béziers M2 8 Q16 22 30 8 and M2 24 Q16 10 30 24, stroke 2.5. At t = ½ a
		// quadratic Bézier is at ¼ P0 + ½ P1 + ¼ P2: (16, 15) and (16, 17); the ends are at y = 8 and 24 (x = 2).
		const darkest = (x: number, y0: number, y1: number) => Math.max(...Array.from({ length: y1 - y0 + 1 }, (_, i) => alpha(x, y0 + i)));
		expect(darkest(15, 14, 15)).toBeGreaterThan(200);
		expect(darkest(15, 17, 18)).toBeGreaterThan(200);
		expect(darkest(2, 7, 8)).toBeGreaterThan(100);
		expect(darkest(2, 23, 24)).toBeGreaterThan(100);
		// Between the curves' ends, on the left edge, nothing is drawn.
		expect(darkest(2, 12, 19)).toBe(0);
	});
});
