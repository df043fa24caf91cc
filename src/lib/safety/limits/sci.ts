/** Numbers as the standards print them: 1.8·10⁻⁵, 5·10⁻³, 10¹²; plain between 0.01 and 10⁴. */
const superscript: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };

export function sci(x: number): string {
	if (x === 0 || (Math.abs(x) >= 0.01 && Math.abs(x) < 1e4)) return String(+x.toPrecision(6));
	const [m, e] = x.toExponential().split('e');
	const mant = +Number(m).toPrecision(6);
	const exp = String(Number(e)).replace(/./g, (c) => superscript[c] ?? c);
	return `${mant === 1 ? '' : `${mant}·`}10${exp}`;
}
