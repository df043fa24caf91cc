/**
 * From measured planes to fitted axes: one diameter column ('d') or two ('x', 'y'), each fitted with
 * fitCaustic and checked against the measurement plan. Planes from images come in through
 * planesFromImages, which takes the second-moment widths along the image axes.
 */
import { fitCaustic, type CausticFit, type FitOptions } from './fit';
import { checkPlan, type PlanCheck } from './plan';
import type { BeamMoments } from './moments';

export type AxisName = 'd' | 'x' | 'y';

/** One measured plane: z and one diameter [d] or two [dx, dy], m. */
export interface MeasuredPlane {
	z_m: number;
	d_m: number[];
	/** Where the plane came from (line number or image name), for messages. */
	label?: string;
}

export interface AxisResult {
	fit: CausticFit;
	/** null when the fit is not physical (the zones cannot be placed). */
	plan: PlanCheck | null;
}

export interface WidthsResult {
	columns: 'd' | 'xy';
	axes: Partial<Record<AxisName, AxisResult>>;
}

/**
 * Fit every axis of the planes and check each axis's plan.
 * Units: m. Example: ten planes of a beam with d0 = 1 mm at z0 = 0.2 m, M² = 1.3, λ = 1064 nm
 * (one column) → axes.d.fit.m2 = 1.3 and axes.d.plan.ok when five planes lie within ±0.568 m of
 * the waist and five beyond 1.136 m.
 * Source: ISO 11146-1:2005, clause 9 (from memory), through fitCaustic and checkPlan.
 */
export function fitWidths(planes: readonly MeasuredPlane[], columns: 'd' | 'xy', options: FitOptions = {}): WidthsResult {
	const names: AxisName[] = columns === 'd' ? ['d'] : ['x', 'y'];
	planes.forEach((p, i) => {
		if (p.d_m.length !== names.length) {
			throw new RangeError(`plane ${p.label ?? i + 1} must have ${names.length} diameter${names.length === 1 ? '' : 's'} — got ${p.d_m.length}`);
		}
	});
	const axes: Partial<Record<AxisName, AxisResult>> = {};
	names.forEach((name, k) => {
		const fit = fitCaustic(
			planes.map((p) => ({ z_m: p.z_m, d_m: p.d_m[k] })),
			options
		);
		const plan = fit.physical ? checkPlan(planes.map((p) => p.z_m), fit) : null;
		axes[name] = { fit, plan };
	});
	return { columns, axes };
}

/**
 * Planes for the fit from analysed images at known z: d_m = [d_x, d_y] along the image axes
 * (ISO 11146-1 fits a simple astigmatic beam along fixed axes; DEVELOPERS.md: x and y independent).
 * Returns the planes and cautions: a clearly elliptical beam whose axes are turned more than 10° from
 * the image axes does not fit that model (rotate the camera, or the beam is generally astigmatic).
 * Example: images at z = 0.1 and 0.2 m with widths 400/380 µm and 520/500 µm →
 * [{ z_m: 0.1, d_m: [4e-4, 3.8e-4] }, { z_m: 0.2, d_m: [5.2e-4, 5e-4] }].
 */
export function planesFromImages(images: ReadonlyArray<{ z_m: number; moments: BeamMoments; label?: string }>): { planes: MeasuredPlane[]; cautions: string[] } {
	const cautions: string[] = [];
	const planes = images.map((im, i) => {
		if (!Number.isFinite(im.z_m)) throw new RangeError(`image ${im.label ?? i + 1}: z must be a finite number of metres — got ${im.z_m}`);
		const m = im.moments;
		const tilt = Math.abs(m.orientation_rad) * (180 / Math.PI);
		if (!m.circular && tilt > 10) {
			cautions.push(`image ${im.label ?? i + 1}: the elliptical beam's axes are turned ${tilt.toFixed(0)}° from the image axes; x and y widths then mix both axes`);
		}
		return { z_m: im.z_m, d_m: [m.dx_m, m.dy_m], label: im.label };
	});
	return { planes, cautions };
}
