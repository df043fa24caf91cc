/**
 * Measurement-plan check. Rule: ISO 11146-1:2005, clause 9 (from memory): at least 10 planes, about
 * half within one Rayleigh length of the waist, about half beyond two. "About half" is read as
 * ≥ 40 % of the planes and ≥ 4 per zone (our reading).
 */
import { describe, expect, it } from 'vitest';
import { checkPlan } from '../../src/lib/optics/iso11146/index';

const waist = { z0_m: 0, zR_m: 0.1 };

describe('checkPlan', () => {
	it('accepts ten planes, five within zR and five beyond 2zR', () => {
		const p = checkPlan([-0.09, -0.05, 0, 0.04, 0.08, -0.3, -0.25, 0.22, 0.3, 0.4], waist);
		expect(p.ok).toBe(true);
		expect([p.near, p.far, p.between]).toEqual([5, 5, 0]);
		expect(p.add).toEqual([]);
		expect(p.findings).toEqual([]);
	});

	it('proposes the docblock example: 2 planes in [−zR, zR] and 3 beyond 2zR on the measured side', () => {
		const p = checkPlan([-0.05, 0, 0.05, 0.25, 0.3], waist);
		expect(p.ok).toBe(false);
		expect([p.near, p.far]).toEqual([3, 2]);
		const near = p.add.find((s) => s.zone === 'near')!;
		const far = p.add.filter((s) => s.zone === 'far');
		expect(near.count).toBe(2);
		expect(far).toHaveLength(1);
		expect(far[0].count).toBe(3);
		expect(far[0].from_m).toBeCloseTo(0.2, 12);
		for (const z of near.at_m) expect(Math.abs(z)).toBeLessThanOrEqual(0.1 + 1e-12);
		for (const z of far[0].at_m) expect(z).toBeGreaterThanOrEqual(0.2 - 1e-12);
		expect(p.findings.join(' ')).toMatch(/only 5 planes; the standard asks for at least 10/);
	});

	it('a plan completed with the proposed planes passes', () => {
		const z = [-0.05, 0, 0.05, 0.25, 0.3];
		const p = checkPlan(z, waist);
		const all = [...z, ...p.add.flatMap((s) => s.at_m)];
		expect(checkPlan(all, waist).ok).toBe(true);
	});

	it('proposed positions keep clear of planes already measured', () => {
		const z = [0, 0.3, 0.35, 0.4, 0.45, 0.5];
		const p = checkPlan(z, waist);
		for (const s of p.add) for (const a of s.at_m) for (const b of z) expect(Math.abs(a - b)).toBeGreaterThan(0.005);
	});

	it('splits far-field planes over both sides when both were measured', () => {
		const p = checkPlan([-0.05, 0, 0.05, -0.3, 0.3, -0.02, 0.02, 0.08], waist);
		const sides = p.add.filter((s) => s.zone === 'far').map((s) => Math.sign(s.from_m));
		expect(sides.sort()).toEqual([-1, 1]);
	});

	it('notes a waist outside the measured range', () => {
		const p = checkPlan([0.3, 0.35, 0.4, 0.45, 0.5], waist);
		expect(p.findings.join(' ')).toMatch(/lies outside the measured range/);
	});

	it('counts planes between zR and 2zR towards the total only', () => {
		const p = checkPlan([0.15, -0.15, 0.12], waist);
		expect([p.near, p.far, p.between]).toEqual([0, 0, 3]);
	});

	it('throws for a Rayleigh length ≤ 0 or a non-finite waist location', () => {
		expect(() => checkPlan([0], { z0_m: 0, zR_m: 0 })).toThrow(/Rayleigh length must be > 0 m — got 0 m/);
		expect(() => checkPlan([0], { z0_m: NaN, zR_m: 1 })).toThrow(/waist location must be a finite/);
	});
});
