/**
 * Measurement-plan check after ISO 11146-1:2005, clause 9 (from memory): at least ten planes, about
 * half of them within one Rayleigh length of the waist and about half beyond two Rayleigh lengths.
 *
 * Our reading of "about half": each of the two zones holds at least 40 % of the planes and at least
 * four planes. Planes between one and two Rayleigh lengths count towards the total only.
 * Where the plan falls short, the check proposes the fewest extra planes that satisfy the rule, at
 * concrete z positions spread to keep clear of the planes already measured.
 */

export interface PlanSuggestion {
	zone: 'near' | 'far';
	/** How many planes to add in [from_m, to_m]. */
	count: number;
	from_m: number;
	to_m: number;
	/** Proposed positions, m, in increasing order. */
	at_m: number[];
}

export interface PlanCheck {
	ok: boolean;
	rule: string;
	planes: number;
	/** Planes with |z − z0| ≤ zR. */
	near: number;
	/** Planes with |z − z0| ≥ 2·zR. */
	far: number;
	/** Planes with zR < |z − z0| < 2·zR. */
	between: number;
	/** Plain sentences, one per shortcoming or caution. */
	findings: string[];
	add: PlanSuggestion[];
}

export const planRule =
	'ISO 11146-1: at least 10 planes, about half within one Rayleigh length of the waist and about half beyond two (here: each zone ≥ 40 % of the planes and ≥ 4)';

/** Smallest plane count a zone needs when the plan has n planes in all. */
function zoneNeed(n: number): number {
	return Math.max(4, Math.ceil(0.4 * n - 1e-9));
}

/** Pick `count` positions on [lo, hi] that keep as far as possible from `taken` and from each other. */
function spread(lo: number, hi: number, count: number, taken: number[]): number[] {
	const grid = 60;
	const chosen: number[] = [];
	const all = [...taken];
	const scale = Math.max(hi - lo, 1e-300);
	for (let k = 0; k < count; k++) {
		let best = lo;
		let bestGap = -1;
		for (let g = 0; g <= grid; g++) {
			const z = lo + ((hi - lo) * g) / grid;
			let gap = Infinity;
			for (const t of all) gap = Math.min(gap, Math.abs(z - t));
			// Prefer interior points a little when gaps tie, so ends are not crowded.
			const score = (gap === Infinity ? scale : gap) - 1e-9 * Math.abs(g - grid / 2);
			if (score > bestGap) {
				bestGap = score;
				best = z;
			}
		}
		chosen.push(best);
		all.push(best);
	}
	return chosen.sort((a, b) => a - b);
}

/**
 * Check the planes z_m against the fitted waist (z0_m, zR_m) and say where to add planes.
 * Units: m. Zones: near |z − z0| ≤ zR, far |z − z0| ≥ 2·zR.
 * Example: z0 = 0, zR = 0.1 m, planes at −0.05, 0, 0.05, 0.25, 0.3 m → near 3, far 2, not ok;
 * it proposes 2 planes in [−0.1, 0.1] m and 3 beyond 0.2 m (ten planes, five in each zone ≥ 4 and ≥ 40 %).
 * Source: ISO 11146-1:2005, clause 9 (from memory); the 40 % reading of "about half" is ours.
 */
export function checkPlan(z_m: readonly number[], waist: { z0_m: number; zR_m: number }): PlanCheck {
	const { z0_m: z0, zR_m: zR } = waist;
	if (!Number.isFinite(z0)) throw new RangeError(`waist location must be a finite number of metres — got ${z0}`);
	if (!(Number.isFinite(zR) && zR > 0)) throw new RangeError(`Rayleigh length must be > 0 m — got ${zR} m`);
	let near = 0, far = 0, below = 0, above = 0;
	for (const z of z_m) {
		const s = Math.abs(z - z0);
		if (s <= zR) near++;
		else if (s >= 2 * zR) far++;
		if (z < z0 - zR) below++;
		if (z > z0 + zR) above++;
	}
	const n = z_m.length;
	const between = n - near - far;

	// Fewest additions (then the most balanced) that satisfy the rule.
	let best: [number, number] = [0, 0];
	let bestCost = Infinity;
	for (let an = 0; an <= 40; an++) {
		for (let af = 0; af <= 40; af++) {
			const total = n + an + af;
			const need = zoneNeed(total);
			if (total < 10 || near + an < need || far + af < need) continue;
			const cost = (an + af) * 1000 + Math.abs(near + an - (far + af));
			if (cost < bestCost) {
				bestCost = cost;
				best = [an, af];
			}
		}
	}
	const [addNear, addFar] = best;
	const findings: string[] = [];
	if (n < 10) findings.push(`only ${n} plane${n === 1 ? '' : 's'}; the standard asks for at least 10`);
	const need = zoneNeed(n);
	if (near < need) findings.push(`${near} plane${near === 1 ? '' : 's'} within one Rayleigh length of the waist (${fmt(z0 - zR)} to ${fmt(z0 + zR)} m); about half are needed`);
	if (far < need) findings.push(`${far} plane${far === 1 ? '' : 's'} beyond two Rayleigh lengths (z ≤ ${fmt(z0 - 2 * zR)} m or z ≥ ${fmt(z0 + 2 * zR)} m); about half are needed`);
	// A loop, not Math.min(...z_m): spreading ~10⁵ values overflows the call stack.
	let zMin = Infinity;
	let zMax = -Infinity;
	for (const z of z_m) {
		if (z < zMin) zMin = z;
		if (z > zMax) zMax = z;
	}
	if (n > 0 && (z0 < zMin || z0 > zMax)) findings.push(`the fitted waist (${fmt(z0)} m) lies outside the measured range ${fmt(zMin)} to ${fmt(zMax)} m, so it is extrapolated`);

	const add: PlanSuggestion[] = [];
	// Proposed positions keep a margin inside each zone (0.9·zR, 2.2·zR), so that a plane does not
	// change zone when the next fit moves z0 or zR a little.
	if (addNear > 0) {
		add.push({ zone: 'near', count: addNear, from_m: z0 - zR, to_m: z0 + zR, at_m: spread(z0 - 0.9 * zR, z0 + 0.9 * zR, addNear, [...z_m]) });
	}
	if (addFar > 0) {
		// Far field on the side(s) already measured beyond the waist; both sides if neither or both.
		const sides: Array<'below' | 'above'> = above > 0 && below === 0 ? ['above'] : below > 0 && above === 0 ? ['below'] : ['above', 'below'];
		const counts = sides.length === 2 ? [Math.ceil(addFar / 2), Math.floor(addFar / 2)] : [addFar];
		sides.forEach((side, k) => {
			if (counts[k] === 0) return;
			const [lo, hi] = side === 'above' ? [z0 + 2 * zR, z0 + 4 * zR] : [z0 - 4 * zR, z0 - 2 * zR];
			const [plo, phi] = side === 'above' ? [z0 + 2.2 * zR, hi] : [lo, z0 - 2.2 * zR];
			add.push({ zone: 'far', count: counts[k], from_m: lo, to_m: hi, at_m: spread(plo, phi, counts[k], [...z_m]) });
		});
	}
	return { ok: addNear === 0 && addFar === 0, rule: planRule, planes: n, near, far, between, findings, add };
}

function fmt(v: number): string {
	return Number(v.toPrecision(4)).toString();
}
