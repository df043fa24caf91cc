/**
 * SVG path data of a sampled curve, drawn at 0.1 px: "M x,y L x,y …". Inside a run of points at the same
 * (rounded) height only the run's first and last point are written: the points between lie on the
 * straight segment joining them, so the curve drawn is the same, dashes included. A cavity scan is
 * mostly flat baseline between narrow lines, so its 3001 points become far fewer, and the page's HTML,
 * its parsing and its drawing shrink with them.
 * `x` and `y` map sample i (0 … n−1) to pixels (the plot's scales).
 */
export function polylinePath(n: number, x: (i: number) => number, y: (i: number) => number): string {
	const r1 = (v: number) => Math.round(v * 10) / 10;
	const parts: string[] = [];
	let height = NaN;
	let held = ''; // the latest point of a flat run, written when the run ends
	for (let i = 0; i < n; i++) {
		const px = r1(x(i));
		const py = r1(y(i));
		if (i > 0 && py === height) {
			held = 'L' + px + ',' + py;
			continue;
		}
		if (held) parts.push(held);
		held = '';
		parts.push((i ? 'L' : 'M') + px + ',' + py);
		height = py;
	}
	if (held) parts.push(held);
	return parts.join('');
}
