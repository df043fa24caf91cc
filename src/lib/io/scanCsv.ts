/**
 * The Scan page's mode table as CSV (see csvOut.ts for the layout): the transverse modes of the cavity
 * that the injected beam excites, with their power, peak height and place in the scan.
 */
import { toCsv } from './csvOut';

export interface ModeRow {
	m: number;
	n: number;
	/** Fraction of the input power in this mode (0…1). */
	power: number;
	/** Peak height in the scan, % of the input power. */
	peak_percent: number;
	/** Position in the scan, folded into one free spectral range, Hz. */
	f_Hz: number;
}

export function modeTableCsv(rows: readonly ModeRow[], setup: string, notes: string[] = [], date?: Date): string {
	return toCsv({
		title: 'Scan: mode content of the injected beam',
		setup,
		date,
		notes,
		columns: [
			{ name: 'mode', about: 'transverse mode TEMmn' },
			{ name: 'm', about: 'mode index on x' },
			{ name: 'n', about: 'mode index on y' },
			{ name: 'power_percent', about: 'share of the input power in this mode, %' },
			{ name: 'peak_height_percent', about: 'transmitted peak height in the scan, % of the input power' },
			{ name: 'position_Hz', about: 'position of the peak in the scan (frequency offset within one free spectral range), Hz' }
		],
		rows: rows.map((r) => [`TEM${r.m}${r.n}`, r.m, r.n, r.power * 100, r.peak_percent, r.f_Hz])
	});
}
