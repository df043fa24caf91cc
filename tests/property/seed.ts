/**
 * One fixed seed for every property test, printed so that a failure can be replayed:
 * `BW_PROPERTY_SEED=<n> npx vitest run tests/property` (fast-check also prints the seed and the
 * shrunk counterexample of a failure). Change the seed only on purpose, never per run.
 */
import fc from 'fast-check';

export const propertySeed = Number(process.env.BW_PROPERTY_SEED ?? 20261202);
fc.configureGlobal({ seed: propertySeed });
console.log(`property tests: fast-check seed ${propertySeed} (replay: BW_PROPERTY_SEED=${propertySeed})`);
