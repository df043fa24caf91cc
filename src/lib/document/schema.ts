/**
 * The setup document: one versioned JSON document that holds a whole setup. Fields keep the text the
 * user typed (with units), so nothing entered is lost even while it is invalid; `compile.ts` turns it
 * into engine input. Autosave, undo, file export/import and the CLI all read and write this shape.
 *
 * Sections owned by other workspaces (`match`, `safety`, `measure`) are validated by their own modules;
 * here they are only required to be objects when present.
 */
import * as v from 'valibot';
import { elementKinds } from './elementKinds';

export const FORMAT = 'beamwright-setup';
/** Most elements a setup may hold (a lab bench has tens); more is refused with this limit. */
export const MAX_ELEMENTS = 1000;
/** Largest setup text read (characters): files, autosave, share links. */
export const MAX_SETUP_CHARS = 20_000_000;
export const CURRENT_VERSION = 2;

/**
 * Migrations: `MIGRATIONS[k]` turns a version-k document into version k+1. Each new field or changed
 * meaning gets a step here, so a file saved by an earlier Beamwright opens unchanged in meaning, and a
 * file from a later one is refused (rather than read with its new fields silently dropped).
 */
const MIGRATIONS: Record<number, (doc: Record<string, unknown>) => Record<string, unknown>> = {
	/**
	 * Version 2 adds optional fields inside the workspace sections: `match.lab` (the cavity lab),
	 * `match.target.substrate`, `measure.knife`, `measure.wavelengthFrom` and `safety.extraLines`.
	 * A version-1 document has none of them; each reads as its default (no cavity lab, no substrate,
	 * no knife-edge table, wavelength following the bench, a single laser line), so only the number changes.
	 */
	1: (doc) => ({ ...doc, version: 2 })
};

/** Bring an older document up to CURRENT_VERSION, one step at a time. */
function migrate(obj: Record<string, unknown>): { ok: true; doc: Record<string, unknown> } | { ok: false; reason: string } {
	let doc = obj;
	while ((doc.version as number) < CURRENT_VERSION) {
		const step = MIGRATIONS[doc.version as number];
		if (!step) return { ok: false, reason: `setup version ${doc.version} is not one this Beamwright can read (versions 1–${CURRENT_VERSION})` };
		doc = step(doc);
	}
	return { ok: true, doc };
}

const text = v.string();

export const AxisSourceSchema = v.object({
	m2: text,
	kind: v.picklist(['waist', 'divergence', 'twoDiameters']),
	waist: text,
	waistAt: text,
	diameter: text,
	at: text,
	fullDivergence: text,
	converging: v.boolean(),
	d1: text,
	z1: text,
	d2: text,
	z2: text
});

export const SourceSchema = v.object({
	label: text,
	wavelength: text,
	index: text,
	/** false: y is the same as x (a round beam); x's fields are used for both. */
	astigmatic: v.boolean(),
	x: AxisSourceSchema,
	y: AxisSourceSchema
});

export const ElementDocSchema = v.object({
	id: v.pipe(v.string(), v.minLength(1)),
	kind: v.picklist(elementKinds.map((k) => k.kind) as [string, ...string[]]),
	label: text,
	at: text,
	/** Clear-aperture diameter, '' for none. */
	aperture: text,
	params: v.record(v.string(), v.string())
});

export const SetupSchema = v.object({
	format: v.literal(FORMAT),
	version: v.literal(CURRENT_VERSION),
	name: text,
	notes: text,
	source: SourceSchema,
	elements: v.array(ElementDocSchema),
	view: v.object({ end: text }),
	match: v.optional(v.record(v.string(), v.unknown())),
	safety: v.optional(v.record(v.string(), v.unknown())),
	measure: v.optional(v.record(v.string(), v.unknown()))
});

export type AxisSourceDoc = v.InferOutput<typeof AxisSourceSchema>;
export type SourceDoc = v.InferOutput<typeof SourceSchema>;
export type ElementDoc = v.InferOutput<typeof ElementDocSchema>;
export type SetupDoc = v.InferOutput<typeof SetupSchema>;

/**
 * Validate an unknown value (parsed JSON) as a setup document, migrating older versions first.
 * Returns the document or a reason that names the offending path.
 */
export function validateSetup(value: unknown): { ok: true; doc: SetupDoc } | { ok: false; reason: string } {
	if (typeof value !== 'object' || value === null) return { ok: false, reason: 'not a JSON object' };
	const obj = value as Record<string, unknown>;
	if (obj.format !== FORMAT) return { ok: false, reason: `not a Beamwright setup (field "format" must be "${FORMAT}")` };
	if (typeof obj.version !== 'number') return { ok: false, reason: 'field "version" is missing' };
	if (obj.version > CURRENT_VERSION) return { ok: false, reason: `setup version ${obj.version} is newer than this Beamwright understands (${CURRENT_VERSION})` };
	const migrated = migrate(obj);
	return migrated.ok ? validateCurrent(migrated.doc) : migrated;
}

function validateCurrent(obj: Record<string, unknown>): { ok: true; doc: SetupDoc } | { ok: false; reason: string } {
	if (Array.isArray(obj.elements) && obj.elements.length > MAX_ELEMENTS)
		return { ok: false, reason: `elements: ${obj.elements.length} elements — a setup holds at most ${MAX_ELEMENTS}` };
	// A list where a table of named values belongs would be read as an empty table: refuse it.
	for (const key of ['match', 'safety', 'measure'] as const) if (Array.isArray(obj[key])) return { ok: false, reason: `${key}: must be an object — got a list` };
	if (Array.isArray(obj.elements))
		for (let i = 0; i < obj.elements.length; i++) {
			const p = (obj.elements[i] as { params?: unknown } | null)?.params;
			if (Array.isArray(p)) return { ok: false, reason: `elements.${i}.params: must be an object — got a list` };
		}
	const r = v.safeParse(SetupSchema, obj);
	if (!r.success) {
		const issue = r.issues[0];
		const path = v.getDotPath(issue) ?? '(document)';
		return { ok: false, reason: `${path}: ${issue.message}` };
	}
	const ids = new Set<string>();
	for (const e of r.output.elements) {
		if (ids.has(e.id)) return { ok: false, reason: `elements: the id "${e.id}" is used twice` };
		ids.add(e.id);
	}
	return { ok: true, doc: r.output };
}

/** Parse JSON text as a setup document; never throws. */
export function parseSetupJson(json: string): { ok: true; doc: SetupDoc } | { ok: false; reason: string } {
	if (typeof json !== 'string') return { ok: false, reason: 'not text' };
	if (json.length > MAX_SETUP_CHARS)
		return { ok: false, reason: `the setup is ${(json.length / 1e6).toFixed(1)} million characters — at most ${MAX_SETUP_CHARS / 1e6} million are read` };
	let value: unknown;
	try {
		value = JSON.parse(json.replace(/^\uFEFF/, ''));
	} catch (e) {
		return { ok: false, reason: `not valid JSON (${(e as Error).message})` };
	}
	return validateSetup(value);
}
