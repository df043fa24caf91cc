/**
 * Physical constants and small numeric helpers used across the engine.
 * Sources: CODATA 2018 (c exact by SI definition, 2019); π from Math.PI.
 */

/** Speed of light in vacuum, m/s (exact, SI 2019 definition). */
export const speedOfLight_m_s = 299_792_458;

/** Relative difference |a − b| / max(|a|, |b|, tiny). */
export function relDiff(a: number, b: number): number {
	const s = Math.max(Math.abs(a), Math.abs(b), 1e-300);
	return Math.abs(a - b) / s;
}

/** Throw a RangeError in the engine's house style: "<name> must be <rule> — got <value><unit>". */
export function requireThat(ok: boolean, name: string, rule: string, value: unknown, unit = ''): void {
	if (!ok) throw new RangeError(`${name} must be ${rule} — got ${String(value)}${unit ? ' ' + unit : ''}`);
}

export function requirePositive(value: number, name: string, unit = ''): void {
	requireThat(Number.isFinite(value) && value > 0, name, `> 0${unit ? ' ' + unit : ''}`, value, unit);
}

export function requireFinite(value: number, name: string, unit = ''): void {
	requireThat(Number.isFinite(value), name, 'a finite number', value, unit);
}
