// Shared helpers of `npm run bench` (not a bench file itself: it does not end in `.bench.ts`).
// Every figure is measured REPS times after a warm-up and printed as min / median / max, beside a
// reference measured in the same run; the goal is a ratio to that reference, so the verdict does not
// flip when other processes load the machine (both sides slow down together).

/** Repetitions after the warm-up. */
export const REPS = 5;

export type Spread = { min: number; med: number; max: number };

/** One printed row. `ratio` and `ref` appear when the figure has a reference. */
export type Row = {
	figure: string;
	unit: string;
	/** The median (or the single value when there is no spread). */
	value: number;
	min?: number;
	max?: number;
	/** Name and median of the reference measured in the same run. */
	ref?: { name: string; value: number; unit?: string };
	ratio?: number;
	goal: string;
	ok?: boolean;
	/**
	 * Where the ratio may lie given the samples' spread (medianRatioInterval): when the goal falls inside,
	 * the verdict is within the noise of this run and another run may well give the other one.
	 */
	interval?: { lo: number; hi: number; level: number };
	/** The goal's ratio, when the row has one (to tell whether it lies inside `interval`). */
	goalRatio?: number;
};

export function spread(xs: number[]): Spread {
	const s = [...xs].sort((a, b) => a - b);
	const n = s.length;
	return { min: s[0], med: n % 2 ? s[(n - 1) >> 1] : (s[n / 2 - 1] + s[n / 2]) / 2, max: s[n - 1] };
}

/** Median of a sample (the mean of the middle two when it has an even count). */
export function median(xs: number[]): number {
	return spread(xs).med;
}

/**
 * Percentile bootstrap interval of median(xs) / median(ref): both samples are drawn again with
 * replacement `reps` times and the central `level` of the resampled ratios kept (Efron and Tibshirani,
 * An Introduction to the Bootstrap, 1993, ch. 13, the percentile interval). Drawn with a fixed-seed
 * generator (mulberry32), so one run's samples always give the same interval.
 */
export function medianRatioInterval(xs: number[], ref: number[], level = 0.9, reps = 2000): { lo: number; hi: number; level: number } {
	if (xs.length === 0 || ref.length === 0) throw new Error('medianRatioInterval: both samples need at least one value');
	let seed = 0x9e3779b9;
	const rand = () => {
		seed = (seed + 0x6d2b79f5) | 0;
		let t = seed;
		t = Math.imul(t ^ (t >>> 15), t | 1);
		t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
		return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
	};
	const draw = (v: number[]) => {
		const out = new Array<number>(v.length);
		for (let i = 0; i < v.length; i++) out[i] = v[Math.floor(rand() * v.length)];
		return out;
	};
	const ratios: number[] = [];
	for (let r = 0; r < reps; r++) ratios.push(median(draw(xs)) / median(draw(ref)));
	ratios.sort((a, b) => a - b);
	const at = (p: number) => ratios[Math.min(reps - 1, Math.max(0, Math.round(p * (reps - 1))))];
	return { lo: at((1 - level) / 2), hi: at((1 + level) / 2), level };
}

/** Percentile (nearest rank) of a sample. */
export function percentile(xs: number[], p: number): number {
	const s = [...xs].sort((a, b) => a - b);
	return s[Math.min(s.length - 1, Math.max(0, Math.ceil((p / 100) * s.length) - 1))];
}

/** Runs `fn` once to warm up, then `reps` times; `fn` returns its own measurement (ms, a rate…). */
export function repeat(fn: () => number, reps = REPS): Spread {
	fn();
	const v: number[] = [];
	for (let i = 0; i < reps; i++) v.push(fn());
	return spread(v);
}

export async function repeatAsync(fn: () => Promise<number>, reps = REPS): Promise<Spread> {
	await fn();
	const v: number[] = [];
	for (let i = 0; i < reps; i++) v.push(await fn());
	return spread(v);
}

/** Wall time of `fn` in ms. */
export function timed(fn: () => unknown): number {
	const t0 = performance.now();
	fn();
	return performance.now() - t0;
}

/**
 * A row judged as a ratio: figure / reference ≤ goalRatio (or ≥ when `atLeast`, for rates).
 * The absolute figure is printed only beside its reference.
 */
export function ratioRow(figure: string, unit: string, s: Spread, refName: string, ref: Spread, goalRatio: number | null, atLeast = false, note = '', interval?: Row['interval']): Row {
	const ratio = s.med / ref.med;
	const goal = goalRatio === null ? `report${note ? '; ' + note : ''}` : `${atLeast ? '≥' : '≤'} ${goalRatio}× ${refName}${note ? '; ' + note : ''}`;
	return {
		figure,
		unit,
		value: s.med,
		min: s.min,
		max: s.max,
		ref: { name: refName, value: ref.med },
		ratio,
		goal,
		ok: goalRatio === null ? undefined : atLeast ? ratio >= goalRatio : ratio <= goalRatio,
		...(interval ? { interval } : {}),
		...(goalRatio === null ? {} : { goalRatio })
	};
}

/** The printed verdict of a row: meets / misses, and whether its goal lies within the run's noise. */
export function verdictText(r: Row): string {
	if (r.ok === undefined) return '';
	const base = r.ok ? 'meets goal' : 'MISSES goal';
	const iv = r.interval;
	if (!iv || r.goalRatio === undefined) return `  [${base}]`;
	const range = `${fmtRatio(iv.lo)}–${fmtRatio(iv.hi)}×`;
	const within = iv.lo <= r.goalRatio && r.goalRatio <= iv.hi;
	return within ? `  [${base}, within this run's noise: ${Math.round(iv.level * 100)} % interval ${range}]` : `  [${base}; ${Math.round(iv.level * 100)} % interval ${range}]`;
}

function fmtRatio(x: number): string {
	return x >= 10 ? x.toFixed(1) : x.toFixed(2);
}

/** The reference itself, printed first. */
export function refRow(figure: string, unit: string, s: Spread): Row {
	return { figure: `reference: ${figure}`, unit, value: s.med, min: s.min, max: s.max, goal: 'reference (same run)' };
}

/**
 * The engine reference: a hand-written tight loop of 10⁶ evaluations of a round three-lens coupling
 * (q through three thin lenses in plain numbers, then the overlap with a target waist); no objects, no
 * calls. About 20 ms on an idle 2-core machine, so a goal of "k × reference" is about k·20 ms idle.
 * Returns its wall time in ms.
 */
export function engineReference(): number {
	const lam = 1064e-9;
	const im0 = (Math.PI * 0.4e-3 * 0.4e-3) / lam;
	const tIm = (Math.PI * 60e-6 * 60e-6) / lam;
	const inv = [1 / 0.1, 1 / 0.2, 1 / 0.05];
	const t0 = performance.now();
	let acc = 0;
	for (let k = 0; k < 1e6; k++) {
		let re = 0.05;
		let im = im0;
		let prev = 0;
		for (let i = 0; i < 3; i++) {
			const z = 0.1 + 0.25 * i + (k % 97) * 1e-4;
			re += z - prev;
			prev = z;
			const d = re * re + im * im;
			const ur = re / d - inv[i];
			const ui = -im / d;
			const d2 = ur * ur + ui * ui;
			re = ur / d2;
			im = -ui / d2;
		}
		re += 1 - prev;
		const d = re * re + im * im;
		const a1r = im / d;
		const a1i = re / d;
		const a2r = 1 / tIm;
		acc += (4 * a1r * a2r) / ((a1r + a2r) ** 2 + a1i * a1i);
	}
	if (!(acc > 0)) throw new Error('engine reference loop went wrong');
	return performance.now() - t0;
}

/** Median etc. of the engine reference in this run (measured once per bench file, after a warm-up). */
export function engineReferenceSpread(): Spread {
	return repeat(engineReference);
}

/**
 * The image reference: a hand-written tight loop over every pixel summing the first and second moments
 * (one pass; no background, no integration area, no iteration). Returns a width-like number so the loop
 * cannot be optimised away.
 */
export function momentLoop(data: Uint16Array | Uint8Array, W: number, H: number): number {
	let s = 0, sx = 0, sy = 0, sxx = 0, syy = 0, sxy = 0;
	for (let y = 0; y < H; y++) {
		const row = y * W;
		for (let x = 0; x < W; x++) {
			const v = data[row + x];
			s += v;
			sx += v * x;
			sy += v * y;
			sxx += v * x * x;
			syy += v * y * y;
			sxy += v * x * y;
		}
	}
	const cx = sx / s, cy = sy / s;
	return sxx / s - cx * cx + (syy / s - cy * cy) + (sxy / s - cx * cy);
}
