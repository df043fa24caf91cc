/**
 * Further laser lines in the hazard workspace: the text "1064 nm: 50 mW, 808 nm: 1 W" read into lines,
 * each error naming the entry and the accepted form; then every line (the main one first) assessed and
 * combined per tissue by the engine (`assessLines`). No physics here.
 */
import { parseQuantity } from '$lib/units/parse';
import { assessLines, type BeamAssessmentInput, type LaserLine, type LinesAssessment } from '$lib/safety';

export const linesAccepted = 'entries WAVELENGTH: POWER separated by commas, e.g. "1064 nm: 50 mW, 808 nm: 1 W" (180 nm–1 mm, power > 0)';

export function readLines(text: string): { ok: true; lines: LaserLine[] } | { ok: false; message: string } {
	const parts = text.split(',').map((p) => p.trim()).filter((p) => p !== '');
	const lines: LaserLine[] = [];
	for (const [i, p] of parts.entries()) {
		const k = p.lastIndexOf(':');
		if (k <= 0) return { ok: false, message: `Further lines, entry ${i + 1} "${p}": not WAVELENGTH: POWER — accepted: ${linesAccepted}` };
		const w = parseQuantity(p.slice(0, k), { label: `Further lines, entry ${i + 1}: wavelength`, kind: 'length', min_si: 180e-9, max_si: 1e-3 });
		if (!w.ok) return { ok: false, message: w.message };
		const pw = parseQuantity(p.slice(k + 1), { label: `Further lines, entry ${i + 1}: power`, kind: 'power', above_si: 0, max_si: 1e15 });
		if (!pw.ok) return { ok: false, message: pw.message };
		lines.push({ wavelength_m: w.value_si, power_W: pw.value_si });
	}
	return { ok: true, lines };
}

/** Null when there are no further lines; otherwise the combined assessment or why there is none. */
export function assessFurtherLines(text: string, input: BeamAssessmentInput | null, continuous: boolean, fromExit: boolean): null | { ok: true; r: LinesAssessment } | { ok: false; message: string } {
	if (!text.trim()) return null;
	if (!continuous || !fromExit) return { ok: false, message: 'Further lines are combined for a continuous beam given at the exit aperture (not for pulsed emission or the Bench beam).' };
	if (!input || input.power_W === undefined) return { ok: false, message: 'Fix the marked inputs to combine the lines.' };
	const read = readLines(text);
	if (!read.ok) return read;
	try {
		const { wavelength_m, power_W, ...common } = input;
		return { ok: true, r: assessLines(common, [{ wavelength_m, power_W }, ...read.lines]) };
	} catch (e) {
		if (e instanceof RangeError) return { ok: false, message: e.message };
		throw e;
	}
}
