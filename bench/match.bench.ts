// Figures of issue "Match and expand": two- and three-lens matches from a 50-lens inventory on a 1 m rail.
import { searchMatches, waistTarget, type StockLens, type MatchProblem } from '../src/lib/optics/solve';

function inventory50(): StockLens[] {
	const out: StockLens[] = [];
	for (let i = 0; i < 50; i++) {
		// 10 diverging (−25 … −250 mm) and 40 converging (25 … 1000 mm, roughly log-spaced) lenses.
		const f_mm = i < 10 ? -25 * (i + 1) : Math.round(25 * Math.pow(40, (i - 10) / 39));
		out.push({ label: `bench lens ${i + 1}`, f_m: f_mm / 1000, diameter_m: 0.0254, count: 1 });
	}
	return out;
}

export function problem(lensCount: number): MatchProblem {
	const lam = 1064e-9;
	const zr = (w: number) => (Math.PI * w * w) / lam;
	return {
		input: { wavelength_m: lam, x: { q: { re: 0.05, im: zr(0.4e-3) }, m2: 1 }, y: { q: { re: 0.05, im: zr(0.4e-3) }, m2: 1 } },
		target: waistTarget(60e-6, 60e-6, 1.0, lam),
		inventory: inventory50(),
		constraints: { rail: { from_m: 0.05, to_m: 0.95 }, slots: [], keepOut: [], minSpacing_m: 0.02, lensCounts: [lensCount] }
	};
}

function time(n: number) {
	const t0 = performance.now();
	const r = searchMatches(problem(n));
	return { ms: performance.now() - t0, best: r[0]?.efficiency ?? 0 };
}

export async function run() {
	time(2); // warm-up
	// Median of five runs: a single ~0.1 s run is at the mercy of the scheduler on a shared 2-core machine.
	const runs = Array.from({ length: 5 }, () => time(2)).sort((a, b) => a.ms - b.ms);
	const two = runs[2];
	const three = time(3);
	return [
		{ figure: 'two-lens match, 50 lenses, 1 m rail (median of 5)', value: two.ms, unit: 'ms', goal: '≤ 100 ms', ok: two.ms <= 100 },
		{ figure: 'two-lens match, best efficiency', value: two.best, unit: '', goal: 'report' },
		{ figure: 'three-lens match, 50 lenses, 1 m rail (time)', value: three.ms / 1000, unit: 's', goal: '≤ 3 s', ok: three.ms <= 3000 },
		{ figure: 'three-lens match, best efficiency', value: three.best, unit: '', goal: 'report' }
	];
}
