/**
 * Shared shapes of the matching solvers. Positions z are along the bench axis (m), the same coordinate
 * as the bench's elements; the rail is in air (index 1). The input beam is given by its reduced q̂ at
 * z = 0 per axis (its M² kept for the embedded-Gaussian model); the target is a TEM00 mode given by its
 * q at a plane z_m (all lenses must sit upstream of that plane).
 */
import type { QHat } from '../beam';

export interface InputBeam {
	wavelength_m: number;
	x: { q: QHat; m2: number };
	y: { q: QHat; m2: number };
}

export interface TargetMode {
	/** Plane at which the target q is given; lenses must lie before it. */
	z_m: number;
	x: QHat;
	y: QHat;
	/** What the target is, for read-outs ("waist", "cavity", "fibre"). */
	what: string;
}

export interface StockLens {
	label: string;
	f_m: number;
	/** Clear diameter, m; null when not limiting. */
	diameter_m: number | null;
	count: number;
}

export interface Interval {
	from_m: number;
	to_m: number;
}

export interface MatchConstraints {
	rail: Interval;
	/** Allowed range of lens i (in beam order); missing entries use the rail. */
	slots: Interval[];
	keepOut: Interval[];
	minSpacing_m: number;
	lensCounts: number[];
}

export interface LensPlacement {
	label: string;
	f_m: number;
	z_m: number;
	diameter_m: number | null;
	/** Efficiency lost (absolute, 0–1) for ±1 mm of this lens's position, the worse side. */
	positionLoss: number;
	/** Efficiency lost for ±1 % of this lens's focal length, the worse side. */
	focalLoss: number;
	/** Smallest shift of this lens alone (either way) that costs 1 % of the efficiency (relative), m. */
	shiftFor1pct_m: number;
}

/** Misalignment of the target (e.g. a fibre face) that alone costs 1 % of the efficiency (relative). */
export interface TargetTolerance {
	/** Lateral offset, m (the tighter axis). */
	offset_m: number;
	/** Tilt, rad (the tighter axis). */
	tilt_rad: number;
	/** Axial shift of the target plane, m (the tighter side and axis), and the same in Rayleigh ranges of the target mode. */
	axial_m: number;
	axial_zR: number;
}

export interface MatchSolution {
	lenses: LensPlacement[];
	/** Mode coupling with the target, x, y and total (aperture losses excluded). */
	couplingX: number;
	couplingY: number;
	/** Fraction passing the lens clear apertures. */
	transmitted: number;
	/** couplingX·couplingY·transmitted: the embedded-Gaussian coupling (the figure that ranks and places). */
	efficiency: number;
	/** Fraction of the input power in its fundamental mode, 2/(1+M²x)·2/(1+M²y) (Gaussian Schell model; 1 for M² = 1). */
	fundamentalFraction: number;
	/** Expected power coupled from the fundamental mode into the target: efficiency × fundamentalFraction. */
	fundamentalModePower: number;
	/** Target misalignments that each cost 1 % (relative). */
	targetTolerance: TargetTolerance;
	/** Sum of all position and focal losses: the smaller, the more forgiving the setup. */
	sensitivity: number;
	/** First lens to target plane, m. */
	length_m: number;
}
