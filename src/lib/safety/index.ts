/**
 * Laser safety engine: exposure limits per standard edition, pulse rules, hazard distances, eyewear
 * OD and the whole-lab table. Pure TypeScript, SI units; every result carries the caution.
 */
export * from './cautions';
export * from './limits/index';
export * from './exposure';
export * from './aperture';
export * from './hazard';
export * from './propagated';
export * from './assess';
export * from './inventory';
export * from './lines';
