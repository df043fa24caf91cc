import { expect } from 'vitest';

/**
 * The one relative-tolerance assertion used by engine checks.
 * expectClose(actual, expected, 1e-9) passes when |actual − expected| ≤ relTol·|expected| (or ≤ relTol when expected is 0).
 */
export function expectClose(actual: number, expected: number, relTol = 1e-9, what = ''): void {
	const scale = expected === 0 ? 1 : Math.abs(expected);
	const err = Math.abs(actual - expected) / scale;
	if (!(err <= relTol)) {
		expect.fail(`${what ? what + ': ' : ''}expected ${expected}, got ${actual} (relative error ${err.toExponential(2)} > ${relTol})`);
	}
}
