/**
 * The bench plot's automatic end ("Plot to" left empty): past the last element to the last real
 * waist, or — when the beam leaving the last element diverges — three Rayleigh ranges past it, so a
 * focus just beyond a round number is never cut off. Also lists the waists that lie beyond an end the
 * user typed, so the waist table can still show them.
 */
import { propagate, type Propagation, type TrainInput, type Waist } from '../optics/train';

/** How far past the last real waist the automatic plot runs, as a fraction of its distance from the last element. */
const PAST_WAIST = 0.2;

/** The automatic plot end for this train, m (never beyond the "Plot to" field's own limit). */
export function autoPlotEnd(input: TrainInput): number {
	const p = propagate({ ...input, end_m: Number.MIN_VALUE });
	const last = p.elements[p.elements.length - 1];
	const exit_m = last ? last.z_m + last.length_m : p.start_m;
	const seg = p.segments.length - 1;
	let end = exit_m;
	let diverging = true;
	for (const w of p.waists) {
		if (w.segment !== seg || w.z_m <= exit_m) continue;
		diverging = false;
		end = Math.max(end, w.z_m + PAST_WAIST * (w.z_m - exit_m));
	}
	if (diverging) {
		const zR = Math.max(...p.waists.filter((w) => w.segment === seg).map((w) => w.zR_m));
		end = exit_m + 3 * zR;
	}
	if (!(end > exit_m)) end = exit_m + 0.05 * Math.max(exit_m - p.start_m, 1e-3);
	// The "Plot to" field accepts up to 10 km (compile.ts endField).
	return Math.min(Math.max(end, Number.MIN_VALUE), 1e4);
}

/** Waists of the beam leaving the last element that lie past the plotted end (kept, never dropped). */
export function waistsBeyondPlot(p: Propagation): Waist[] {
	const seg = p.segments.length - 1;
	return p.waists.filter((w) => w.segment === seg && w.virtual && w.z_m > p.end_m && p.segments[seg].insideId === null);
}
