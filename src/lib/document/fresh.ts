/**
 * "New", in its two meanings: a new bench only (source, train and plot range empty; the Match,
 * Measure and Hazard sections kept), or a new whole setup (every workspace empty: no example shelf,
 * no keep-out zone, no example laser name or exposure duration, no measured widths).
 */
import { emptySetup } from './demo';
import { emptyMatchSection } from './sectionDefaults';
import type { SetupDoc } from './schema';

/** Every workspace empty. */
export function newWholeSetup(): SetupDoc {
	return {
		...emptySetup(),
		match: emptyMatchSection() as unknown as Record<string, unknown>,
		// Hazard: no laser name; the exposure duration follows the viewing case until the user types one.
		safety: { version: 1, label: '', duration: '', inventoryCsv: '' },
		// Measure: no widths; the wavelength follows the bench laser (empty: follow).
		measure: { widths: '', zUnit: 'mm', dUnit: 'um', wavelength: '', wavelengthFrom: 'bench', weighting: 'relative', zOffset: '0 mm', pixel: '5.5 um' }
	};
}

/** A new bench (source, elements, plot range, name) keeping the other workspaces' sections. */
export function newBenchOnly(doc: SetupDoc): SetupDoc {
	const fresh = emptySetup();
	const out: SetupDoc = { ...fresh };
	for (const key of ['match', 'safety', 'measure'] as const) if (doc[key] !== undefined) out[key] = structuredClone(doc[key]);
	return out;
}
