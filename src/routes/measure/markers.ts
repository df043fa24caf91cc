/** Marker shapes of the Measure plots: ○ for x (or a single diameter), □ for y. SVG path about (0, 0). */
export function markerPath(axis: string, r = 4.5): string {
	if (axis === 'y') return `M${-r},${-r}h${2 * r}v${2 * r}h${-2 * r}Z`;
	return `M${-r},0a${r},${r} 0 1,0 ${2 * r},0a${r},${r} 0 1,0 ${-2 * r},0`;
}
