/**
 * Engine figures: q-propagation steps per second through the engine's own step function, beside a
 * hand-written tight loop doing the same steps inline (the reference, same run), and the same steps
 * through the generic route (mathjs Complex numbers and matrix multiply). Each is measured once to warm
 * up, then 5 times (min / median / max); goals are ratios.
 * One "step" applies one reduced ABCD matrix to q̂: q̂′ = (A·q̂ + B)/(C·q̂ + D).
 */
import { create, all } from 'mathjs';
import { applyMat, propagate } from '../src/lib/optics/train';
import { elementMatrices, freeSpaceMatrix, type Mat2 } from '../src/lib/optics/elements';
import { engineReferenceSpread, ratioRow, refRow, repeat, timed, type Row } from './stats';

function trainMatrices(): Mat2[] {
	// 20 elements with free space between: 40 matrices on one axis.
	const out: Mat2[] = [];
	for (let i = 0; i < 20; i++) {
		out.push(freeSpaceMatrix(0.05 + 0.001 * i));
		out.push(elementMatrices({ kind: 'thinLens', f_m: i % 2 ? 0.2 : -0.15 }).x);
	}
	return out;
}

function plainSteps(ms: Mat2[], reps: number): number {
	// The engine's own step function (the one propagate() uses), Gouy phase included.
	let q = { re: 0.1, im: 0.5 };
	let g = 0;
	for (let r = 0; r < reps; r++) {
		for (let j = 0; j < ms.length; j++) {
			const s = applyMat(ms[j], q);
			q = s.q;
			g += s.dGouy;
		}
		if (q.im > 1e3 || q.im < 1e-9) q = { re: 0.1, im: 0.5 };
	}
	return q.re + g;
}

function mathjsSteps(ms: Mat2[], reps: number): number {
	const math = create(all);
	const mats = ms.map((m) => math.matrix([[m[0], m[1]], [m[2], m[3]]]));
	let q = math.complex(0.1, 0.5);
	for (let r = 0; r < reps; r++) {
		for (const M of mats) {
			// Generic route: the ray-matrix product with the vector (q, 1), then the ratio.
			const v = math.multiply(M, math.matrix([q, math.complex(1, 0)])) as unknown as { get(i: number[]): any };
			q = math.divide(v.get([0]), v.get([1])) as any;
		}
		if ((q as any).im > 1e3 || (q as any).im < 1e-9) q = math.complex(0.1, 0.5);
	}
	return (q as any).re;
}

/** The reference: the same steps written inline over a flat array of matrices (q only, no Gouy phase). */
function inlineSteps(flat: Float64Array, reps: number): number {
	let re = 0.1;
	let im = 0.5;
	const n = flat.length;
	for (let r = 0; r < reps; r++) {
		for (let j = 0; j < n; j += 4) {
			const a = flat[j], b = flat[j + 1], c = flat[j + 2], d = flat[j + 3];
			const nr = a * re + b, ni = a * im;
			const dr = c * re + d, di = c * im;
			const m = dr * dr + di * di;
			re = (nr * dr + ni * di) / m;
			im = (ni * dr - nr * di) / m;
		}
		if (im > 1e3 || im < 1e-9) { re = 0.1; im = 0.5; }
	}
	return re;
}

export async function run(): Promise<Row[]> {
	const ms = trainMatrices();
	const flat = new Float64Array(ms.flatMap((m) => [m[0], m[1], m[2], m[3]]));
	const plainReps = 100_000;
	const steps = plainReps * ms.length;
	const ref = repeat(() => steps / (timed(() => inlineSteps(flat, plainReps)) / 1000));
	const plain = repeat(() => steps / (timed(() => plainSteps(ms, plainReps)) / 1000));
	const mjReps = 200;
	const mj = repeat(() => (mjReps * ms.length) / (timed(() => mathjsSteps(ms, mjReps)) / 1000), 5);

	// Whole-train propagation of a 20-element astigmatic train with apertures (what a drag event recomputes).
	const input = {
		source: { wavelength_m: 1064e-9, index: 1, x: { m2: 1.3, spec: { kind: 'waist' as const, w0_m: 4e-4, z0_m: 0 } }, y: { m2: 1.6, spec: { kind: 'waist' as const, w0_m: 3e-4, z0_m: -0.02 } } },
		elements: Array.from({ length: 20 }, (_, i) => ({
			id: 'e' + i,
			label: 'E' + i,
			z_m: 0.1 + i * 0.08,
			aperture_m: 0.0254,
			spec: i % 4 === 3 ? { kind: 'mirror' as const, r_m: 0.5, angle_rad: 0.15, plane: 'x' as const } : { kind: 'thinLens' as const, f_m: i % 2 ? 0.25 : -0.2 }
		})),
		end_m: 2
	};
	const n = 1000;
	const train = repeat(() => (timed(() => { for (let i = 0; i < n; i++) propagate(input); }) / n) * 1000);
	const engRef = engineReferenceSpread();
	const speedUp = plain.med / mj.med;
	return [
		refRow('hand-written inline q-steps per second', 'steps/s', ref),
		ratioRow('q-propagation steps per second (engine step function)', 'steps/s', plain, 'inline', ref, 0.25, true, 'at most 4× slower than inline'),
		ratioRow('q-propagation steps per second (mathjs Complex + matrix)', 'steps/s', mj, 'inline', ref, null),
		{ figure: 'speed-up of the engine over the generic route (same run)', value: speedUp, unit: '×', goal: '≥ 20', ok: speedUp >= 20 },
		refRow('engine tight loop, 10⁶ three-lens couplings (≈ 20 ms idle)', 'ms', engRef),
		{ ...ratioRow('propagate() of a 20-element astigmatic train with apertures', 'µs', train, 'tight loop', engRef, null, false, 'ratio µs per call / ms of the loop'), ref: { name: 'tight loop', value: engRef.med, unit: 'ms' } }
	];
}
