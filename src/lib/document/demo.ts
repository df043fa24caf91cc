/**
 * The demo setup loaded on first visit: bench 2 of "Demo lab", an invented lab with an invented
 * 1064 nm laser ("Demo laser A (1064 nm)", slightly astigmatic). All names and numbers are made up for
 * the demonstration; none describe a real lab or product.
 */
import { CURRENT_VERSION, FORMAT, type AxisSourceDoc, type ElementDoc, type SetupDoc } from './schema';
import { defaultParams } from './elementKinds';
import type { ElementKind } from '../optics/elements';

export function blankAxis(over: Partial<AxisSourceDoc> = {}): AxisSourceDoc {
	return {
		m2: '1',
		kind: 'waist',
		waist: '0.5 mm',
		waistAt: '0 mm',
		diameter: '1 mm',
		at: '0 mm',
		fullDivergence: '1.5 mrad',
		converging: false,
		d1: '1 mm',
		z1: '0 mm',
		d2: '1.5 mm',
		z2: '1 m',
		...over
	};
}

export function makeElement(kind: ElementKind, id: string, label: string, at: string, params: Record<string, string> = {}, aperture = ''): ElementDoc {
	return { id, kind, label, at, aperture, params: { ...defaultParams(kind), ...params } };
}

export function demoSetup(): SetupDoc {
	return {
		format: FORMAT,
		version: CURRENT_VERSION,
		name: 'Demo lab, bench 2 — expand and refocus Demo laser A',
		notes: 'Invented demo: Demo laser A (1064 nm) of an invented teaching lab, expanded 2× and refocused after a tilted concave mirror.',
		source: {
			label: 'Demo laser A (1064 nm)',
			wavelength: '1064 nm',
			index: '1',
			astigmatic: true,
			x: blankAxis({ m2: '1.3', waist: '0.45 mm', waistAt: '-40 mm' }),
			y: blankAxis({ m2: '1.6', waist: '0.40 mm', waistAt: '-10 mm' })
		},
		elements: [
			makeElement('thinLens', 'e1', 'L1', '250 mm', { f: '-50 mm' }, '12.7 mm'),
			makeElement('thinLens', 'e2', 'L2', '300 mm', { f: '100 mm' }, '25.4 mm'),
			makeElement('foldMirror', 'e3', 'M1', '650 mm', { angle: '45 deg', plane: 'x' }, '25.4 mm'),
			makeElement('mirror', 'e4', 'M2', '900 mm', { r: '500 mm', angle: '10 deg', plane: 'x' }, '25.4 mm')
		],
		view: { end: '1.4 m' }
	};
}

/** An empty setup (a round beam, no elements). */
export function emptySetup(): SetupDoc {
	return {
		format: FORMAT,
		version: CURRENT_VERSION,
		name: 'New setup',
		notes: '',
		source: { label: 'Laser', wavelength: '632.8 nm', index: '1', astigmatic: false, x: blankAxis(), y: blankAxis() },
		elements: [],
		// Empty: the plot runs past the last element to the last real waist (plotRange.ts).
		view: { end: '' }
	};
}
