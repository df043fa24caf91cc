/**
 * Defaults of the Match and Scan sections that a new setup needs, apart from the Match model itself:
 * the Bench's "New whole setup" uses them, and its first view should not load the search, the cavity
 * model and the CSV reader to get a few empty strings. match.ts and cavityLab.ts re-export them.
 */
import * as v from 'valibot';
import type { MatchSection } from './match';

const text = v.string();

export const LabSchema = v.object({
	/** Power reflectivity of the input mirror (mirror 1) and the output mirror: "0.99" or "99 %". */
	reflectivity1: v.optional(text, '99 %'),
	reflectivity2: v.optional(text, '99 %'),
	/** Round-trip loss besides the two mirrors' transmissions. */
	loss: v.optional(text, '0 %'),
	/** Two steering mirrors before the cavity: bench positions, angle of incidence, mount angle per knob turn. */
	steer1At: v.optional(text, '100 mm'),
	steer2At: v.optional(text, '300 mm'),
	steerAngle: v.optional(text, '45°'),
	anglePerTurn: v.optional(text, '8 mrad'),
	/** The perturbation tried on the bench: offsets and tilts at the cavity waist, and a lens moved along the rail. */
	perturb: v.optional(
		v.object({ offsetX: text, offsetY: text, tiltX: text, tiltY: text, lensId: text, lensShift: text }),
		{ offsetX: '0 µm', offsetY: '0 µm', tiltX: '0 mrad', tiltY: '0 mrad', lensId: '', lensShift: '0 mm' }
	),
	/** Peak heights read off a transmitted scan (any one unit), '' for not entered. */
	peaks: v.optional(v.object({ p00: text, p10: text, p01: text, p20: text, p02: text, p11: text, sum: text, noise: text }), {
		p00: '',
		p10: '',
		p01: '',
		p20: '',
		p02: '',
		p11: '',
		sum: '',
		noise: '1 %'
	})
});
export type LabSection = v.InferOutput<typeof LabSchema>;

export function defaultLab(): LabSection {
	return v.parse(LabSchema, {});
}

/** No substrate lens (thickness left empty); fused silica and a flat back face once a thickness is typed. */
export function defaultSubstrate(): { thickness: string; n: string; rBack: string } {
	return { thickness: '', n: '1.45', rBack: 'flat' };
}

/**
 * An empty section for a new setup: no target values, no lenses on the shelf, no keep-out zones, no
 * lens ranges — nothing from the example constrains a search unseen.
 */
export function emptyMatchSection(): MatchSection {
	return {
		input: { from: 'source' },
		target: { kind: 'waist', at: '', wx: '', wy: '', r1: '', r2: '', length: '', lensF: '', lensAt: '', substrate: defaultSubstrate(), ring: { type: 'ring', mirrors: [], input: 0 }, fiberBy: 'mfd', mfd: '', coreRadius: '', na: '' },
		inventory: [],
		rail: { from: '', to: '' },
		slots: [],
		keepOut: [],
		minSpacing: '0 mm',
		lensCounts: [1, 2],
		rankBy: 'robust',
		expander: { magMin: '', magMax: '', lens1At: '', waistAfter: '' },
		lab: defaultLab()
	};
}
