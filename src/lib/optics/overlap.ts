/**
 * Power coupling between two Gaussian beams at a common plane (mode overlap), one transverse axis at
 * a time; for simple astigmatism the total is η = ηx·ηy.
 *
 * Each axis field is E ∝ exp(−a·(x − x0)² + i·k·θ·x) with a = 1/w² + i·k/(2R), k = 2πn/λ0. In terms of the
 * reduced q̂ (u = 1/q̂ = n/R − i·M²λ0/(π·w²)): a = (π/λ0)·(−Im u / M² + i·Re u). The normalised overlap
 * |∫E1·E2*|² / (∫|E1|²·∫|E2|²) in closed form is
 *   η = 2·sqrt(Re a1·Re a2)/|A| · exp(2·Re(B²/(4A) − conj(a2)·x0²)),  A = a1 + conj(a2),  B = 2·conj(a2)·x0 − i·k·θ
 * (W. B. Joyce, B. C. DeLoach, "Alignment of Gaussian beams", Appl. Opt. 23, 4187 (1984), the 1-D
 * factors of eq. 9 generalised to complex a). Without offset and tilt, for circular beams
 * η = ηx·ηy = 4/((w1/w2 + w2/w1)² + (π·w1·w2/λ)²·(1/R1 − 1/R2)²) (Kogelnik 1964; Joyce & DeLoach 1984, eq. 11).
 *
 * For M² > 1 the embedded Gaussian is overlapped (an upper estimate of the real coupling).
 */
import { requirePositive, requireThat } from './constants';
import type { QHat } from './beam';

export interface AxisBeamQ {
	q: QHat;
	m2?: number;
}

function aOf(q: QHat, m2: number, wavelength_m: number): [number, number] {
	const den = q.re * q.re + q.im * q.im;
	const uRe = q.re / den;
	const uIm = -q.im / den;
	const s = Math.PI / wavelength_m;
	return [(-s * uIm) / m2, s * uRe];
}

/**
 * Coupling of two beams on one axis at a common plane, from their reduced q̂ (same medium index n).
 * offset_m: lateral displacement of beam 2; tilt_rad: angle of beam 2 (in the medium).
 * Example: two waists of 0.5 mm at the same plane → 1; waists 0.5 mm and 0.6 mm → 0.98361 (per axis).
 */
export function axisCoupling(b1: AxisBeamQ, b2: AxisBeamQ, wavelength_m: number, offset_m = 0, tilt_rad = 0, index = 1): number {
	requirePositive(wavelength_m, 'wavelength', 'm');
	requireThat(b1.q.im > 0 && b2.q.im > 0, 'Im q̂ of both beams', '> 0 m (a confined Gaussian beam)', `${b1.q.im} m and ${b2.q.im}`, 'm');
	const [a1r, a1i] = aOf(b1.q, b1.m2 ?? 1, wavelength_m);
	const [a2r, a2i] = aOf(b2.q, b2.m2 ?? 1, wavelength_m);
	// A = a1 + conj(a2)
	const Ar = a1r + a2r;
	const Ai = a1i - a2i;
	const absA = Math.hypot(Ar, Ai);
	const base = (2 * Math.sqrt(a1r * a2r)) / absA;
	if (offset_m === 0 && tilt_rad === 0) return base;
	const k = (2 * Math.PI * index) / wavelength_m;
	// B = 2·conj(a2)·x0 − i·k·θ
	const Br = 2 * a2r * offset_m;
	const Bi = -2 * a2i * offset_m - k * tilt_rad;
	// B² / (4A)
	const B2r = Br * Br - Bi * Bi;
	const B2i = 2 * Br * Bi;
	const den = 4 * (Ar * Ar + Ai * Ai);
	const qr = (B2r * Ar + B2i * Ai) / den;
	const expo = 2 * (qr - a2r * offset_m * offset_m);
	return base * Math.exp(expo);
}

/** Total coupling ηx·ηy of two simply astigmatic beams at a common plane. */
export function coupling(x1: AxisBeamQ, y1: AxisBeamQ, x2: AxisBeamQ, y2: AxisBeamQ, wavelength_m: number): { x: number; y: number; total: number } {
	const x = axisCoupling(x1, x2, wavelength_m);
	const y = axisCoupling(y1, y2, wavelength_m);
	return { x, y, total: x * y };
}

/**
 * Two aligned, round TEM00 beams with waists w1, w2 a distance d apart along the axis:
 * η = 4/((w1/w2 + w2/w1)² + (λ·d/(π·w1·w2))²) (Joyce & DeLoach 1984, eq. 11 with 1/R from the waist separation).
 * Example: w1 = 0.5 mm, w2 = 0.6 mm, d = 10 cm, λ = 1064 nm → η = 0.96451.
 */
export function waistCoupling(w1_m: number, w2_m: number, separation_m: number, wavelength_m: number): number {
	requirePositive(w1_m, 'first waist radius', 'm');
	requirePositive(w2_m, 'second waist radius', 'm');
	requireThat(Number.isFinite(separation_m), 'waist separation', 'a finite distance', separation_m, 'm');
	requirePositive(wavelength_m, 'wavelength', 'm');
	const r = w1_m / w2_m + w2_m / w1_m;
	const s = (wavelength_m * separation_m) / (Math.PI * w1_m * w2_m);
	return 4 / (r * r + s * s);
}

/**
 * Lateral offset and tilt of beam 2 that each alone cost `loss` of the coupling (relative, e.g. 0.01 for
 * 1 %) on one axis. From the Gaussian factors of axisCoupling: η(x0) = η0·exp(−c·x0²) with
 * c = 2·Re(a1·conj(a2)/A), η(θ) = η0·exp(−k²·Re(1/A)·θ²/2).
 */
export function alignmentTolerance(b1: AxisBeamQ, b2: AxisBeamQ, wavelength_m: number, loss = 0.01, index = 1): { offset_m: number; tilt_rad: number } {
	requireThat(loss > 0 && loss < 1, 'allowed loss', '> 0 and < 1', loss);
	const [a1r, a1i] = aOf(b1.q, b1.m2 ?? 1, wavelength_m);
	const [a2r, a2i] = aOf(b2.q, b2.m2 ?? 1, wavelength_m);
	const Ar = a1r + a2r;
	const Ai = a1i - a2i;
	const absA2 = Ar * Ar + Ai * Ai;
	// a1·conj(a2)
	const pr = a1r * a2r + a1i * a2i;
	const pi = a1i * a2r - a1r * a2i;
	const cOff = (2 * (pr * Ar + pi * Ai)) / absA2;
	const k = (2 * Math.PI * index) / wavelength_m;
	const cTilt = (k * k * (Ar / absA2)) / 2;
	const l = -Math.log(1 - loss);
	return { offset_m: Math.sqrt(l / cOff), tilt_rad: Math.sqrt(l / cTilt) };
}
