/**
 * Value ± uncertainty share digits and unit. Worked examples apply the rounding rule stated in
 * src/lib/units/format.ts (Particle Data Group convention, from memory): two significant digits for an
 * uncertainty whose leading digits are 100–354, one otherwise; the value to the same decimal place.
 */
import { describe, expect, it } from 'vitest';
import { formatWithUncertainty } from '../../src/lib/units/format';

describe('formatWithUncertainty', () => {
	it('rounds the value to the uncertainty’s last digit, in one unit', () => {
		expect(formatWithUncertainty(0.1501, 0.00005, 'm')).toBe('150.10 ± 0.05 mm');
		expect(formatWithUncertainty(418.73e-6, 1.62e-6, 'm')).toBe('418.7 ± 1.6 µm');
		expect(formatWithUncertainty(1.2344, 0.0123, '')).toBe('1.234 ± 0.012');
		expect(formatWithUncertainty(1.2345, 0.0456, '')).toBe('1.23 ± 0.05');
		expect(formatWithUncertainty(2.5e-3, 0.0996e-3, 'rad')).toBe('2.50 ± 0.10 mrad');
		expect(formatWithUncertainty(-0.0123, 0.0004, 'm')).toBe('−12.3 ± 0.4 mm');
	});
	it('without a usable uncertainty prints the value alone, never NaN or Infinity', () => {
		expect(formatWithUncertainty(0.1501, null, 'm')).toBe('150.1 mm');
		expect(formatWithUncertainty(0.1501, 0, 'm')).toBe('150.1 mm');
		expect(formatWithUncertainty(0.1501, NaN, 'm')).toBe('150.1 mm');
		expect(formatWithUncertainty(0.1501, Infinity, 'm')).not.toMatch(/NaN|Infinity/);
		expect(formatWithUncertainty(1.2, 3e-10, '')).toBe('1.2 ± <1×10^−9');
	});
});
