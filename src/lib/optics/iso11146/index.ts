/**
 * Beam quality per ISO 11146: caustic fit d²(z) = a + b·z + c·z² with uncertainties, measurement-plan
 * check, second-moment (D4σ) widths of beam images, and the bridge to the bench's source.
 */
export * from './fit';
export * from './plan';
export * from './caustic';
export * from './image';
export * from './background';
export * from './moments';
export * from './widths';
export * from './toSource';
export * from './synthetic';
export { fitQuadratic, type QuadraticFit } from './lsq';
export * from './knifeEdge';
