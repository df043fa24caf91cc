/**
 * Formatting at the edge: SI prefixes and sensible significant figures. Never returns "NaN",
 * "Infinity" or "undefined": non-finite input is rendered as an explicit word.
 */

const prefixes: Array<[number, string]> = [
	[1e12, 'T'],
	[1e9, 'G'],
	[1e6, 'M'],
	[1e3, 'k'],
	[1, ''],
	[1e-3, 'm'],
	[1e-6, 'µ'],
	[1e-9, 'n'],
	[1e-12, 'p'],
	[1e-15, 'f']
];

/** Round to `sig` significant figures and drop trailing zeros beyond them: 0.0012345, 3 → "0.00123". */
export function formatNumber(value: number, sig = 4): string {
	if (Number.isNaN(value)) return '—';
	if (value === Infinity) return '∞';
	if (value === -Infinity) return '−∞';
	if (value === 0) return '0';
	const abs = Math.abs(value);
	if (abs >= 1e6 || abs < 1e-4) {
		const [m, e] = value.toExponential(sig - 1).split('e');
		return `${Number(m)}×10^${Number(e)}`.replace(/-/g, '−');
	}
	const s = Number(value.toPrecision(sig)).toString();
	return s.replace('-', '−');
}

/**
 * Format an SI value with a prefix: formatSI(5e-4, 'm') → "500 µm"; formatSI(0.0712, 'm', 3) → "71.2 mm".
 * Units that should not carry prefixes (e.g. '' or '%') are printed plainly.
 */
export function formatSI(value_si: number, unit: string, sig = 4): string {
	if (!Number.isFinite(value_si)) return formatNumber(value_si, sig) + (unit ? ' ' + unit : '');
	if (unit === '' || unit === '%' || unit === '°') return formatNumber(value_si, sig) + (unit ? (unit === '°' ? '°' : ' ' + unit) : '');
	const abs = Math.abs(value_si);
	if (abs === 0) return `0 ${unit}`;
	let chosen = prefixes[prefixes.length - 1];
	for (const p of prefixes) {
		if (abs >= p[0] * 0.99995) {
			chosen = p;
			break;
		}
	}
	const scaled = value_si / chosen[0];
	return `${formatNumber(scaled, sig)} ${chosen[1]}${unit}`;
}

/** Length with the unit restricted to a lab-friendly set (km is odd on a bench, nm for wavelengths is fine). */
export function formatLength(value_m: number, sig = 4): string {
	return formatSI(value_m, 'm', sig);
}

/** Percent with `sig` significant figures: 0.98765 → "98.77 %". */
export function formatPercent(fraction: number, sig = 4): string {
	if (!Number.isFinite(fraction)) return formatNumber(fraction, sig) + ' %';
	return `${formatNumber(fraction * 100, sig)} %`;
}

/**
 * Pick one SI prefix for a whole plot axis from its largest magnitude: axisPrefix(0.0042, 'm') →
 * { factor: 1e-3, unit: 'mm' }; tick values are then divided by `factor`.
 */
export function axisPrefix(maxAbs_si: number, unit: string): { factor: number; unit: string } {
	if (!(maxAbs_si > 0) || !Number.isFinite(maxAbs_si)) return { factor: 1, unit };
	for (const [f, p] of prefixes) {
		if (maxAbs_si >= f * 0.99995) return { factor: f, unit: p + unit };
	}
	const last = prefixes[prefixes.length - 1];
	return { factor: last[0], unit: last[1] + unit };
}

/**
 * A value and its standard uncertainty with the same digits and unit: formatWithUncertainty(0.15010,
 * 0.00005, 'm') → "150.10 ± 0.05 mm". The prefix follows the value; the uncertainty keeps two significant
 * digits when its leading three digits are 100–354 and one otherwise, and the value is rounded to the
 * same decimal place (the rounding rule of the Particle Data Group's Review of Particle Physics,
 * introduction — from memory; GUM, JCGM 100:2008, §7.2.6 asks for at most two significant digits).
 * Without a usable uncertainty the value is printed to 4 significant figures; below a millionth of
 * the value, the uncertainty is given as a bound ("1.2 ± <1×10^−7").
 */
export function formatWithUncertainty(value_si: number, u_si: number | null | undefined, unit: string): string {
	const p = unit && unit !== '%' && unit !== '°' ? axisPrefix(Math.abs(value_si), unit) : { factor: 1, unit };
	const tail = p.unit ? (p.unit === '°' ? '°' : ` ${p.unit}`) : '';
	const v = value_si / p.factor;
	const u = u_si === null || u_si === undefined ? NaN : Math.abs(u_si) / p.factor;
	if (!Number.isFinite(v) || !(u > 0) || !Number.isFinite(u) || u > 1e6 * Math.max(Math.abs(v), 1e-300)) return `${formatNumber(v, 4)}${tail}`;
	// Exact or nearly exact data: a bound keeps the line short ("1.2 ± <1×10^−6").
	if (u < 1e-6 * Math.abs(v)) return `${formatNumber(v, 6)} ± <${formatNumber(10 ** Math.ceil(Math.log10(u)), 1)}${tail}`;
	const e = Math.floor(Math.log10(u));
	const lead = Math.floor(u / 10 ** (e - 2) + 1e-9);
	const digits = lead <= 354 ? 2 : 1;
	// A carry (0.0996 → 0.10) can only happen with one digit, and gives leading digits 100, which keep
	// two digits: the decimal place stays the same.
	const place = e - digits + 1;
	const ur = Math.round(u / 10 ** place) * 10 ** place;
	const dec = Math.max(0, -place);
	const vr = Math.round(v / 10 ** place) * 10 ** place;
	const fix = (x: number) => x.toFixed(dec).replace('-', '−');
	return `${fix(vr)} ± ${fix(ur)}${tail}`;
}
