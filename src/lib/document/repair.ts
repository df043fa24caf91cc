/**
 * Field-by-field repair of a workspace's section of the setup document (match, measure, safety).
 *
 * A stored section with one unreadable field (a wrong type, a value outside a pick-list) must not cost
 * the rest of the section: only that field is reset — to its default, or to the section default's
 * value — and the field's old text is kept in the section under `unreadable` (path → text), so it is
 * still in the autosave and in a saved file. Fields that were already reset earlier stay listed there
 * until the user clears them. Wrong-typed text fields (a number or a boolean where text belongs) are
 * read as their text, which keeps their meaning, and are listed too.
 */
import * as v from 'valibot';

/** A field that was reset: its path inside the section and the text it held. */
export interface FieldReset {
	path: string;
	text: string;
}

/** The key under which a section keeps the text of fields that had to be reset. */
export const UNREADABLE_KEY = 'unreadable';

type AnySchema = v.GenericSchema & {
	type: string;
	wrapped?: AnySchema;
	entries?: Record<string, AnySchema>;
	item?: AnySchema;
	options?: unknown[];
	literal?: unknown;
};

const isPlainObject = (x: unknown): x is Record<string, unknown> => typeof x === 'object' && x !== null && !Array.isArray(x);
const join = (path: string, key: string | number) => (path === '' ? String(key) : `${path}.${key}`);
const textOf = (x: unknown): string => (typeof x === 'string' ? x : (JSON.stringify(x) ?? String(x)));

/** A value that the schema accepts, used when a field has no default of its own. */
function blank(schema: AnySchema): unknown {
	switch (schema.type) {
		case 'optional':
		case 'nullish':
			return v.getDefault(schema as never) ?? blank(schema.wrapped!);
		case 'string':
			return '';
		case 'boolean':
			return false;
		case 'number':
			return 0;
		case 'picklist':
			return schema.options![0];
		case 'literal':
			return schema.literal;
		case 'array':
			return [];
		case 'record':
			return {};
		case 'object': {
			const out: Record<string, unknown> = {};
			for (const [k, s] of Object.entries(schema.entries!)) out[k] = blank(s);
			return out;
		}
		default:
			return undefined;
	}
}

function repairValue(schema: AnySchema, value: unknown, fallback: unknown, path: string, resets: FieldReset[]): unknown {
	const r = v.safeParse(schema, value);
	if (r.success) return r.output;
	if (schema.type === 'optional' || schema.type === 'nullish') {
		const def = v.getDefault(schema as never);
		if (value === undefined) return def ?? fallback;
		return repairValue(schema.wrapped!, value, fallback ?? def, path, resets);
	}
	if (schema.type === 'object' && isPlainObject(value)) {
		const out: Record<string, unknown> = {};
		const fb = isPlainObject(fallback) ? fallback : {};
		for (const [k, s] of Object.entries(schema.entries!)) out[k] = repairValue(s, value[k], fb[k], join(path, k), resets);
		return out;
	}
	if (schema.type === 'array' && Array.isArray(value)) {
		const out: unknown[] = [];
		value.forEach((item, i) => {
			const fb = Array.isArray(fallback) && fallback[i] !== undefined ? fallback[i] : blank(schema.item!);
			if (fb === undefined || (!isPlainObject(item) && schema.item!.type === 'object')) {
				resets.push({ path: join(path, i), text: textOf(item) });
				return;
			}
			out.push(repairValue(schema.item!, item, fb, join(path, i), resets));
		});
		return out;
	}
	if (schema.type === 'string' && (typeof value === 'number' || typeof value === 'boolean')) {
		resets.push({ path, text: String(value) });
		return String(value);
	}
	resets.push({ path, text: textOf(value) });
	return fallback !== undefined && v.safeParse(schema, fallback).success ? fallback : blank(schema);
}

/**
 * Read a stored section against its schema, repairing field by field. `defaults` gives the value of
 * a reset field that has no default in the schema. Returns the section (with `unreadable` when any
 * field's text had to be kept), the fields reset in this read, and a message for the user or null.
 */
export function repairSection<T extends object>(
	schema: v.GenericSchema<unknown, T>,
	raw: unknown,
	defaults: T,
	what: string
): { section: T; resets: FieldReset[]; problem: string | null } {
	if (raw === undefined || raw === null) return { section: defaults, resets: [], problem: null };
	const resets: FieldReset[] = [];
	let section: T;
	if (!isPlainObject(raw)) {
		resets.push({ path: '(whole section)', text: textOf(raw) });
		section = defaults;
	} else {
		section = repairValue(schema as unknown as AnySchema, raw, defaults, '', resets) as T;
		if (!v.safeParse(schema, section).success) {
			resets.push({ path: '(whole section)', text: JSON.stringify(raw) });
			section = defaults;
		}
	}
	const earlier = isPlainObject(raw) && isPlainObject(raw[UNREADABLE_KEY]) ? (raw[UNREADABLE_KEY] as Record<string, unknown>) : {};
	const kept: Record<string, string> = {};
	for (const [k, t] of Object.entries(earlier)) kept[k] = textOf(t);
	for (const r of resets) if (!r.path.startsWith(UNREADABLE_KEY)) kept[r.path] = r.text;
	const list = Object.entries(kept);
	if (list.length) section = { ...section, [UNREADABLE_KEY]: kept };
	const short = (t: string) => (t.length > 40 ? t.slice(0, 40) + '…' : t);
	const problem = list.length
		? `${list.length === 1 ? 'One saved field' : `${list.length} saved fields`} of the ${what} could not be read as stored and ${list.length === 1 ? 'was' : 'were'} reset: ${list
				.map(([p, t]) => `${p} (was ${short(t)})`)
				.join('; ')}. Everything else is as you left it; the old text is kept in the setup (${UNREADABLE_KEY}).`
		: null;
	return { section, resets, problem };
}
