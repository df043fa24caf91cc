/**
 * The `safety` section of the setup document: the hazard workspace's inputs as the user typed them
 * (text with units, so nothing is lost while invalid) and the lab inventory CSV. Validated on every
 * read and repaired field by field (`repair.ts`): an unreadable field is reset and its old text kept
 * under `unreadable`; every other field stays as stored.
 */
import * as v from 'valibot';
import { standardChoices } from '$lib/safety/limits/index';
import { viewingCases } from '$lib/safety/exposure';
import { repairSection } from '$lib/document/repair';

const text = (d: string) => v.optional(v.string(), d);

export const SafetySchema = v.object({
	version: v.optional(v.literal(1), 1),
	label: text('Demo laser C (514.5 nm)'),
	standard: v.optional(v.picklist(standardChoices as unknown as [string, ...string[]]), 'stricter'),
	/** 'exit': waist at the exit aperture from diameter and divergence; 'bench': the beam the Bench propagates. */
	beamFrom: v.optional(v.picklist(['exit', 'bench']), 'exit'),
	wavelength: text('514.5 nm'),
	emission: v.optional(v.picklist(['cw', 'pulsed']), 'cw'),
	power: text('5 W'),
	/** Further continuous lines in the same beam, "WAVELENGTH: POWER, …"; empty: one line. Optional, so documents without it read as before. */
	extraLines: text(''),
	pulseEnergy: text('1 mJ'),
	pulseWidth: text('10 ns'),
	repRate: text(''),
	diameter: text('2.83 mm'),
	divergence: text('1.41 mrad'),
	duration: text('0.25 s'),
	viewing: v.optional(v.picklist(viewingCases as unknown as [string, ...string[]]), 'accidental'),
	sourceAngle: text(''),
	opticOn: v.optional(v.boolean(), false),
	opticAperture: text('50 mm'),
	opticMagnification: text('7'),
	opticTransmission: text('0.9'),
	diffuseOn: v.optional(v.boolean(), false),
	reflectance: text('0.9'),
	viewingAngle: text('0 deg'),
	inventoryCsv: text('')
});

export type SafetyDoc = v.InferOutput<typeof SafetySchema>;
export type SafetyKey = keyof SafetyDoc;

export const safetyDefaults: SafetyDoc = v.parse(SafetySchema, {});

/** Read the section, repairing field by field; `problem` names each field that was reset. */
export function readSafety(raw: unknown): { doc: SafetyDoc; problem: string | null } {
	const r = repairSection(SafetySchema as never, raw, safetyDefaults, 'hazard inputs');
	return { doc: r.section as SafetyDoc, problem: r.problem };
}
