/**
 * Export a plot drawn in the page as a standalone SVG or PNG file: the computed styles (theme colours,
 * dash patterns, fonts) are written onto each element of a copy, so the file looks like the screen
 * without the page's style sheet, and a header band carries the plot's title, the setup's name and the
 * date. Interactive attributes (tabindex, pointer targets) are dropped from the copy.
 */
const STYLE_PROPS = [
	'fill',
	'fill-opacity',
	'stroke',
	'stroke-width',
	'stroke-dasharray',
	'stroke-opacity',
	'stroke-linejoin',
	'paint-order',
	'opacity',
	'font-size',
	'font-weight',
	'font-family',
	'text-anchor',
	'visibility',
	'display'
] as const;

export interface PlotHeader {
	/** What the plot shows, e.g. "Beam along the train". */
	title: string;
	/** The setup's name. */
	setup: string;
	/** Export date; defaults to now. */
	date?: Date;
	/** Lines printed under the plot (e.g. the safety caution, which must travel with a hazard plot). */
	footer?: readonly string[];
}

function esc(s: string): string {
	return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

/** The plot as a standalone SVG document (string) with a header band; returns its size too. */
export function standaloneSvg(svg: SVGSVGElement, header: PlotHeader): { text: string; width: number; height: number } {
	const box = svg.getBoundingClientRect();
	const width = Math.ceil(box.width);
	const plotH = Math.ceil(box.height);
	const band = 44;
	const footer = header.footer ?? [];
	const height = plotH + band + 8 + footer.length * 16;
	const copy = svg.cloneNode(true) as SVGSVGElement;
	const src = [svg, ...Array.from(svg.querySelectorAll('*'))];
	const dst = [copy, ...Array.from(copy.querySelectorAll('*'))];
	for (let i = 0; i < src.length; i++) {
		const cs = getComputedStyle(src[i]);
		const el = dst[i];
		const style: string[] = [];
		for (const p of STYLE_PROPS) {
			const v = cs.getPropertyValue(p);
			if (v) style.push(`${p}:${v}`);
		}
		el.setAttribute('style', style.join(';'));
		// A theme variable in a presentation attribute means nothing outside the page; the style holds its value.
		for (const a of ['fill', 'stroke', 'color']) if (el.getAttribute(a)?.includes('var(')) el.removeAttribute(a);
		el.removeAttribute('class');
		el.removeAttribute('tabindex');
		el.removeAttribute('role');
	}
	const root = getComputedStyle(svg);
	const bg = getComputedStyle(document.body).backgroundColor || '#ffffff';
	const fg = root.color || '#000000';
	const font = root.fontFamily;
	const date = (header.date ?? new Date()).toISOString().slice(0, 16).replace('T', ' ') + ' UTC';
	const inner = copy.innerHTML;
	const viewBox = svg.getAttribute('viewBox');
	const text =
		`<?xml version="1.0" encoding="UTF-8"?>\n` +
		`<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="${esc(font)}">` +
		`<rect width="100%" height="100%" fill="${esc(bg)}"/>` +
		`<text x="12" y="20" font-size="15" font-weight="700" fill="${esc(fg)}">${esc(header.title)} — ${esc(header.setup)}</text>` +
		`<text x="12" y="37" font-size="12" fill="${esc(fg)}">Beamwright · exported ${esc(date)}</text>` +
		// A drawing scaled by its viewBox keeps that scaling in the file (nested svg at the drawn size).
		(viewBox
			? `<svg x="0" y="${band}" width="${width}" height="${plotH}" viewBox="${esc(viewBox)}" preserveAspectRatio="${esc(svg.getAttribute('preserveAspectRatio') ?? 'xMidYMid meet')}" overflow="visible">${inner}</svg>`
			: `<g transform="translate(0,${band})">${inner}</g>`) +
		footer.map((line, i) => `<text x="12" y="${band + plotH + 18 + i * 16}" font-size="12" fill="${esc(fg)}">${esc(line)}</text>`).join('') +
		`</svg>`;
	return { text, width, height };
}

/** Render a standalone SVG text to a PNG blob at `scale` device pixels per CSS pixel. */
export async function svgToPng(text: string, width: number, height: number, scale = 2): Promise<Blob> {
	const url = URL.createObjectURL(new Blob([text], { type: 'image/svg+xml' }));
	try {
		const img = new Image();
		img.decoding = 'sync';
		await new Promise<void>((resolve, reject) => {
			img.onload = () => resolve();
			img.onerror = () => reject(new Error('the plot could not be drawn as an image'));
			img.src = url;
		});
		const canvas = document.createElement('canvas');
		canvas.width = Math.round(width * scale);
		canvas.height = Math.round(height * scale);
		const ctx = canvas.getContext('2d')!;
		ctx.scale(scale, scale);
		ctx.drawImage(img, 0, 0, width, height);
		return await new Promise<Blob>((resolve, reject) => canvas.toBlob((b) => (b ? resolve(b) : reject(new Error('PNG encoding failed'))), 'image/png'));
	} finally {
		URL.revokeObjectURL(url);
	}
}
