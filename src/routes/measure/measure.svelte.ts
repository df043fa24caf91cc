/**
 * State of the Measure workspace. Inputs live in the setup document's `measure` section (text as the
 * user typed it, so autosave and undo cover them); everything else is derived by calling the engine.
 * Images are not kept in the document: they stay in this tab, and their widths enter the table as rows.
 */
import * as v from 'valibot';
import { parseQuantity } from '$lib/units/parse';
import { formatNumber, formatSI } from '$lib/units/format';
import { parseWidthTable, type WidthTable } from '$lib/io/widthTable';
import {
	fitWidths,
	sampleCaustic,
	toBenchSource,
	type AxisName,
	type MeasuredSource,
	type PhysicalFit,
	type WidthsResult
} from '$lib/optics/iso11146/index';
import type { SetupStore } from '$lib/document/store.svelte';
import { repairSection } from '$lib/document/repair';

/** Length units offered for z and diameters, metres per unit. */
export const lengthUnits = [
	{ key: 'um', label: 'µm', m: 1e-6 },
	{ key: 'mm', label: 'mm', m: 1e-3 },
	{ key: 'cm', label: 'cm', m: 1e-2 },
	{ key: 'm', label: 'm', m: 1 },
	{ key: 'in', label: 'inch', m: 0.0254 }
] as const;
type UnitKey = (typeof lengthUnits)[number]['key'];
const unitKeys = lengthUnits.map((u) => u.key) as [UnitKey, ...UnitKey[]];

export const MeasureSchema = v.object({
	widths: v.string(),
	zUnit: v.picklist(unitKeys),
	dUnit: v.picklist(unitKeys),
	wavelength: v.string(),
	/** 'bench': the wavelength is the bench laser's (live); 'typed': the text in `wavelength`. */
	wavelengthFrom: v.picklist(['bench', 'typed']),
	weighting: v.picklist(['relative', 'plain']),
	/** Where the measurement's z = 0 lies on the bench axis. */
	zOffset: v.string(),
	pixel: v.string(),
	/** Knife-edge or slit scans typed or pasted by the user (text kept as entered). */
	knife: v.optional(
		v.array(
			v.object({
				axis: v.picklist(['x', 'y']),
				kind: v.picklist(['knife', 'slit']),
				z: v.string(),
				xUnit: v.picklist(unitKeys),
				scan: v.string()
			})
		),
		[]
	)
});
export type MeasureDoc = v.InferOutput<typeof MeasureSchema>;

export function defaultMeasure(): MeasureDoc {
	return { widths: '', zUnit: 'mm', dUnit: 'um', wavelength: '', wavelengthFrom: 'bench', weighting: 'relative', zOffset: '0 mm', pixel: '5.5 um', knife: [] };
}

export const fields = {
	wavelength: { label: 'Wavelength (vacuum)', kind: 'length', min_si: 100e-9, max_si: 1e-3 },
	zOffset: { label: 'Measurement z = 0 on the bench axis', kind: 'length', min_si: -1e3, max_si: 1e3 },
	pixel: { label: 'Pixel pitch', kind: 'length', above_si: 0, max_si: 1e-3 },
	imageZ: { label: 'z of this image', kind: 'length', min_si: -1e3, max_si: 1e3 }
} as const;

export const unitMetres = (key: UnitKey) => lengthUnits.find((u) => u.key === key)!.m;

type Outcome<T> = { ok: true; value: T } | { ok: false; message: string } | null;

export interface AxisPlot {
	name: AxisName;
	/** Measured planes. */
	z_m: number[];
	d_m: number[];
	residual_m: number[];
	/** Fitted caustic samples (empty when the fit is not physical). */
	fitZ_m: Float64Array;
	fitD_m: Float64Array;
	fit: PhysicalFit | null;
}

export class MeasureState {
	#store: SetupStore;

	constructor(store: SetupStore) {
		this.#store = store;
	}

	/** The section as stored, or the defaults when absent or unreadable. */
	read = $derived.by((): { doc: MeasureDoc; problem: string | null } => {
		const raw = this.#store.doc.measure;
		if (raw === undefined) return { doc: defaultMeasure(), problem: null };
		// A section saved before the wavelength could follow the bench keeps the wavelength it typed.
		const from = (raw as Record<string, unknown>).wavelengthFrom ?? ((raw as Record<string, unknown>).wavelength ? 'typed' : 'bench');
		// Field by field: one unreadable field is reset (its text kept under `unreadable`), the rest stays.
		const r = repairSection(MeasureSchema as never, { ...defaultMeasure(), ...raw, wavelengthFrom: from }, defaultMeasure(), 'Measure inputs');
		return { doc: r.section as MeasureDoc, problem: r.problem };
	});
	get doc(): MeasureDoc {
		return this.read.doc;
	}

	/** Change one input; typing in one field is one undo step, a one-off action (`oneStep`) its own. */
	set<K extends keyof MeasureDoc>(key: K, value: MeasureDoc[K], oneStep = false): void {
		const next = { ...this.doc, [key]: value };
		this.#store.update(
			(d) => {
				d.measure = next;
			},
			oneStep ? undefined : `measure.${key}`
		);
	}

	/** The bench laser's wavelength as typed on the Bench, and parsed. */
	benchWavelengthText = $derived.by(() => this.#store.doc.source.wavelength);
	benchWavelength = $derived.by(() => {
		void this.#store.unitsVersion;
		return parseQuantity(this.benchWavelengthText, fields.wavelength);
	});
	/** True while the wavelength follows the bench laser (until the user types another). */
	followsBench = $derived(this.doc.wavelengthFrom === 'bench');
	/** The wavelength text in use: the bench laser's while following, else what the user typed. */
	wavelengthText = $derived(this.followsBench ? this.benchWavelengthText : this.doc.wavelength);
	wavelength = $derived.by(() => {
		void this.#store.unitsVersion;
		return parseQuantity(this.wavelengthText, fields.wavelength);
	});
	/** Set when a typed wavelength differs from the bench laser's (both valid). */
	differsFromBench = $derived.by(() => {
		const w = this.wavelength;
		const b = this.benchWavelength;
		if (this.followsBench || !w.ok || !b.ok) return false;
		return Math.abs(w.value_si - b.value_si) > 1e-9 * b.value_si;
	});

	/** Type a wavelength of one's own (stops following the bench). */
	setWavelength(text: string): void {
		const next = { ...this.doc, wavelength: text, wavelengthFrom: 'typed' as const };
		this.#store.update((d) => {
			d.measure = next;
		}, 'measure.wavelength');
	}
	/** Follow the bench laser's wavelength again. */
	followBench(): void {
		const next = { ...this.doc, wavelength: '', wavelengthFrom: 'bench' as const };
		this.#store.update((d) => {
			d.measure = next;
		});
	}
	zOffset = $derived.by(() => {
		void this.#store.unitsVersion;
		return parseQuantity(this.doc.zOffset, fields.zOffset);
	});
	pixel = $derived.by(() => {
		void this.#store.unitsVersion;
		return parseQuantity(this.doc.pixel, fields.pixel);
	});

	table: Outcome<WidthTable> = $derived.by(() => {
		void this.#store.unitsVersion;
		const text = this.doc.widths;
		if (text.trim() === '') return null;
		try {
			return {
				ok: true,
				value: parseWidthTable(text, {
					zUnit_m: unitMetres(this.doc.zUnit),
					dUnit_m: unitMetres(this.doc.dUnit),
					resolveUnit: (u) => {
						const r = parseQuantity(`1 ${u}`, { label: 'unit', kind: 'length', above_si: 0 });
						return r.ok ? r.value_si : null;
					}
				})
			};
		} catch (e) {
			return { ok: false, message: (e as Error).message };
		}
	});

	result: Outcome<WidthsResult> = $derived.by(() => {
		const t = this.table;
		if (!t || !t.ok) return null;
		const distinct = new Set(t.value.rows.map((r) => r.z_m)).size;
		if (distinct < 3) return { ok: false, message: `A fit needs at least 3 planes at different z — ${distinct} usable so far.` };
		const w = this.wavelength;
		try {
			return {
				ok: true,
				value: fitWidths(t.value.rows, t.value.columns, { wavelength_m: w.ok ? w.value_si : undefined, weighting: this.doc.weighting })
			};
		} catch (e) {
			return { ok: false, message: (e as Error).message };
		}
	});

	/** Per axis: measured points, residuals and the fitted caustic, ready for the plot. */
	plot: AxisPlot[] = $derived.by(() => {
		const r = this.result;
		if (!r || !r.ok) return [];
		const out: AxisPlot[] = [];
		for (const [name, axis] of Object.entries(r.value.axes) as Array<[AxisName, NonNullable<WidthsResult['axes'][AxisName]>]>) {
			const f = axis.fit;
			const rows = this.table && this.table.ok ? this.table.value.rows : [];
			const k = name === 'y' ? 1 : 0;
			const z = rows.map((p) => p.z_m);
			const d = rows.map((p) => p.d_m[k]);
			if (!f.physical) {
				out.push({ name, z_m: z, d_m: d, residual_m: [], fitZ_m: new Float64Array(0), fitD_m: new Float64Array(0), fit: null });
				continue;
			}
			// Loops, not Math.min(...z): spreading ~10⁵ planes overflows the call stack.
			let lo = f.z0_m;
			let hi = f.z0_m;
			for (const zi of z) {
				if (zi < lo) lo = zi;
				if (zi > hi) hi = zi;
			}
			const pad = 0.04 * (hi - lo || 1e-3);
			const s = sampleCaustic(f, lo - pad, hi + pad, 240);
			out.push({ name, z_m: z, d_m: d, residual_m: f.residuals.map((q) => q.residual_m), fitZ_m: s.z_m, fitD_m: s.d_m, fit: f });
		}
		return out;
	});

	source: Outcome<MeasuredSource> = $derived.by(() => {
		const r = this.result;
		if (!r || !r.ok) return null;
		const w = this.wavelength;
		if (!w.ok) return { ok: false, message: w.message };
		const off = this.zOffset;
		if (!off.ok) return { ok: false, message: off.message };
		try {
			return { ok: true, value: toBenchSource(r.value, w.value_si, { zOffset_m: off.value_si }) };
		} catch (e) {
			return { ok: false, message: (e as Error).message };
		}
	});

	/**
	 * The wavelength the current fit was made at, when it is not the bench laser's: sending the fit to
	 * the bench then changes the bench wavelength, which the page asks about first.
	 */
	get wavelengthChange(): { fit: string; bench: string } | null {
		if (!this.differsFromBench) return null;
		return { fit: this.wavelengthText, bench: this.benchWavelengthText };
	}

	/**
	 * Make the fitted beam the bench's source (text fields keep units), at the wavelength the fit was
	 * made at. When that differs from the bench laser's, nothing changes unless `changeWavelength`.
	 * Returns an error message or null.
	 */
	sendToBench(changeWavelength = false): string | null {
		const s = this.source;
		if (!s) return 'Enter measured widths first.';
		if (!s.ok) return s.message;
		if (this.wavelengthChange && !changeWavelength) return `The fit was made at ${this.wavelengthText}; the bench laser is ${this.benchWavelengthText}. Confirm the change of the bench wavelength first.`;
		const fitWavelength = this.wavelengthText;
		const src = s.value.source;
		const text = (m: number) => formatSI(m, 'm', 5);
		const axis = (a: typeof src.x) => ({
			m2: formatNumber(a.m2, 4),
			waist: a.spec.kind === 'waist' ? text(a.spec.w0_m) : '',
			waistAt: a.spec.kind === 'waist' ? text(a.spec.z0_m) : ''
		});
		const x = axis(src.x);
		const y = axis(src.y);
		const columns = this.result && this.result.ok ? this.result.value.columns : 'd';
		this.#store.update((d) => {
			d.source.label = 'Measured beam (Measure workspace)';
			d.source.wavelength = fitWavelength;
			d.source.index = '1';
			d.source.astigmatic = columns === 'xy';
			d.source.x = { ...d.source.x, kind: 'waist', ...x };
			d.source.y = { ...d.source.y, kind: 'waist', ...y };
		});
		return null;
	}

	/**
	 * Append knife-edge widths: scans at the same z for x and y make one plane z, dx, dy; when every
	 * scan is of one axis and the table is empty or has one diameter column, rows z, d. Returns an
	 * error message or null.
	 */
	addKnifePlanes(scans: Array<{ z_m: number; axis: 'x' | 'y'; d_m: number }>): string | null {
		if (scans.length === 0) return 'No fitted scan with a valid z to add.';
		const t = this.table;
		const axes = new Set(scans.map((s) => s.axis));
		const oneAxis = axes.size === 1;
		const tableCols = t && t.ok ? t.value.columns : null;
		if (oneAxis && tableCols !== 'xy') {
			const zu = t && t.ok ? t.value.zUnit_m : unitMetres(this.doc.zUnit);
			const du = t && t.ok ? t.value.dUnit_m : unitMetres(this.doc.dUnit);
			const num = (x: number) => Number(x.toPrecision(6)).toString();
			const lines = scans.map((s) => `${num(s.z_m / zu)},${num(s.d_m / du)}`);
			const base = this.doc.widths.trimEnd();
			this.set('widths', (base === '' ? 'z,d\n' : base + '\n') + lines.join('\n') + '\n', true);
			return null;
		}
		const byZ = new Map<number, { x?: number; y?: number }>();
		for (const s of scans) {
			const e = byZ.get(s.z_m) ?? {};
			if (e[s.axis] !== undefined) return `Two ${s.axis} scans at the same z (${formatSI(s.z_m, 'm', 4)}): keep one.`;
			e[s.axis] = s.d_m;
			byZ.set(s.z_m, e);
		}
		const lonely = [...byZ.entries()].filter(([, e]) => e.x === undefined || e.y === undefined).map(([z]) => formatSI(z, 'm', 4));
		if (lonely.length) return `A table with dx and dy needs an x and a y scan at each z; missing a partner at z = ${lonely.join(', ')}.`;
		return this.addPlanes([...byZ.entries()].map(([z_m, e]) => ({ z_m, dx_m: e.x!, dy_m: e.y! })));
	}

	/**
	 * Append image widths to the table as rows z, dx, dy in the table's units; starts a table with a
	 * header when it is empty. Returns an error message or null.
	 */
	addPlanes(planes: Array<{ z_m: number; dx_m: number; dy_m: number }>): string | null {
		if (planes.length === 0) return 'No analysed image with a valid z to add.';
		const t = this.table;
		if (t && t.ok && t.value.columns === 'd') return 'The table has one diameter column; image widths need the columns z, dx, dy. Clear the table or change its header.';
		const zu = t && t.ok ? t.value.zUnit_m : unitMetres(this.doc.zUnit);
		const du = t && t.ok ? t.value.dUnit_m : unitMetres(this.doc.dUnit);
		const num = (x: number) => Number(x.toPrecision(6)).toString();
		const lines = planes.map((p) => `${num(p.z_m / zu)},${num(p.dx_m / du)},${num(p.dy_m / du)}`);
		const base = this.doc.widths.trimEnd();
		this.set('widths', (base === '' ? 'z,dx,dy\n' : base + '\n') + lines.join('\n') + '\n', true);
		return null;
	}
}
