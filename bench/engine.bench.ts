/**
 * Engine figures: q-propagation steps per second with plain numbers, and the same steps through the
 * generic route (mathjs Complex numbers and matrix multiply), for the ratio.
 * One "step" applies one reduced ABCD matrix to q̂: q̂′ = (A·q̂ + B)/(C·q̂ + D).
 */
import { create, all } from 'mathjs';
import { applyMat, propagate } from '../src/lib/optics/train';
import { elementMatrices, freeSpaceMatrix, mul, type Mat2 } from '../src/lib/optics/elements';

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

function time(fn: () => void): number {
	const t0 = performance.now();
	fn();
	return (performance.now() - t0) / 1000;
}

export async function run() {
	const ms = trainMatrices();
	// Warm up both routes.
	plainSteps(ms, 2000);
	mathjsSteps(ms, 20);
	const plainReps = 250_000;
	const tPlain = time(() => plainSteps(ms, plainReps));
	const plainRate = (plainReps * ms.length) / tPlain;
	const mjReps = 400;
	const tMj = time(() => mathjsSteps(ms, mjReps));
	const mjRate = (mjReps * ms.length) / tMj;

	// Whole-train propagation of a 20-element astigmatic train (what a drag event recomputes).
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
	for (let i = 0; i < 200; i++) propagate(input);
	const n = 5000;
	const tTrain = time(() => {
		for (let i = 0; i < n; i++) propagate(input);
	});
	return [
		{ figure: 'q-propagation steps per second (plain numbers)', value: plainRate, unit: 'steps/s', goal: '≥ 1e7', ok: plainRate >= 1e7 },
		{ figure: 'q-propagation steps per second (mathjs Complex + matrix)', value: mjRate, unit: 'steps/s', goal: 'reference' },
		{ figure: 'speed-up over the generic route', value: plainRate / mjRate, unit: '×', goal: '≥ 20', ok: plainRate / mjRate >= 20 },
		{ figure: 'propagate() of a 20-element astigmatic train', value: (tTrain / n) * 1e6, unit: 'µs', goal: 'part of the 8 ms drag budget' }
	];
}
