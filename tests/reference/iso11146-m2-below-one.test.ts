/**
 * A caustic fit whose M² comes out below 1 is not a real beam and is reported `physical: false`, with
 * the likely causes, in the engine and the CLI `fit`.
 *
 * Sources:
 * - ISO 11146-1:2005, clause 3: M² = π·d0·Θ/(4λ) ≥ 1, equal to 1 for a TEM00 Gaussian beam; the
 *   embedded-Gaussian caustic d(z)² = d0² + Θ²·(z − z0)² with Θ = 4·M²·λ/(π·d0) (from memory).
 * - ISO 11146-1:2005, clause 9: a measurement plan with about half the planes within one Rayleigh
 *   length of the waist and half beyond two (from memory).
 * - JCGM 100:2008 (GUM), §6.2: expanded uncertainty with coverage factor k = 2 (about 95 %).
 * The synthetic widths are computed here from the closed form, not by the engine.
 */
import { describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { expectClose } from '../helpers';
import { fitCaustic, type PhysicalFit, type UnphysicalFit } from '../../src/lib/optics/iso11146/index';

const lam = 1064e-9;
const isoPlan = [-0.9, -0.5, -0.1, 0.3, 0.8, 2.2, 2.6, 3.1, 3.7, 4.5];

/** Planes at z0 + k·zR on the caustic of a beam with "M²" m2 (any positive value), closed form. */
function planes(d0: number, z0: number, m2: number, ks: number[], scale = (k: number) => 1) {
	const theta = (4 * m2 * lam) / (Math.PI * d0);
	const zR = d0 / theta;
	return ks.map((k, i) => ({ z_m: z0 + k * zR, d_m: Math.sqrt(d0 * d0 + (theta * k * zR) ** 2) * scale(i) }));
}

describe('fitted M² below 1 (ISO 11146-1:2005, clause 3: M² ≥ 1)', () => {
	it('a synthetic ISO plan with M² = 0.8 is physical: false, with the likely causes and the diagnostic figures', () => {
		const f = fitCaustic(planes(0.6e-3, 0.1, 0.8, isoPlan), { wavelength_m: lam }) as UnphysicalFit;
		expect(f.physical).toBe(false);
		expect(f.reason).toMatch(/M² = 0\.800/);
		expect(f.reason).toMatch(/below 1/);
		const causes = f.likelyCauses!.join(' | ');
		expect(causes).toMatch(/wavelength/);
		expect(causes).toMatch(/second-moment/);
		expect(causes).toMatch(/scale/);
		expectClose(f.figures!.m2!, 0.8, 1e-9);
		expectClose(f.figures!.d0_m, 0.6e-3, 1e-9);
	});

	it('M² = 0.999 without noise is below 1 beyond its uncertainty: physical: false', () => {
		const f = fitCaustic(planes(0.6e-3, 0, 0.999, isoPlan), { wavelength_m: lam });
		expect(f.physical).toBe(false);
	});

	it('M² = 1 and 1.2 stay physical with no note', () => {
		for (const m2 of [1, 1.2]) {
			const f = fitCaustic(planes(0.6e-3, 0, m2, isoPlan), { wavelength_m: lam }) as PhysicalFit;
			expect(f.physical).toBe(true);
			expect(f.note).toBeUndefined();
			expectClose(f.m2!, m2, 1e-9);
		}
	});

	it('noisy widths of an M² = 1 beam: below 1 only within 2u is kept physical with a note; further below is not (GUM k = 2)', () => {
		// ±1.5 % alternating errors on the widths of a diffraction-limited beam.
		const f = fitCaustic(planes(0.6e-3, 0, 1, isoPlan, (i) => (i % 2 ? 1.015 : 0.985)), { wavelength_m: lam });
		if (f.physical) {
			if (f.m2! < 1) {
				expect(f.m2! + 2 * f.uncertainty!.m2!).toBeGreaterThanOrEqual(1);
				expect(f.note).toMatch(/within two standard uncertainties/);
			} else expect(f.note).toBeUndefined();
		} else {
			expect(f.figures!.m2! + 2 * f.figureUncertainty!.m2!).toBeLessThan(1);
		}
	});

	it('CLI `fit` prints physical: false and likelyCauses for the M² = 0.8 plan', () => {
		const dir = mkdtempSync(join(tmpdir(), 'bw-m2-'));
		const file = join(dir, 'widths.csv');
		const rows = planes(0.6e-3, 0.1, 0.8, isoPlan).map((p) => `${(p.z_m * 1e3).toFixed(6)},${(p.d_m * 1e6).toFixed(6)}`);
		writeFileSync(file, ['z,d', ...rows].join('\n'));
		const out = JSON.parse(execFileSync('node', ['bin/beamwright.js', 'fit', file, '--wavelength', '1064nm', '--z-unit', 'mm', '--d-unit', 'um'], { encoding: 'utf8' }));
		expect(out.d.physical).toBe(false);
		expect(out.d.likelyCauses.join(' ')).toMatch(/wavelength/);
		expectClose(out.d.figures.m2, 0.8, 1e-5);
	});
});
