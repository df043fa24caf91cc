export * from './types';
export * from './evaluate';
export * from './targets';
export * from './search';
export * from './waistPlacement';
export * from './expander';
export * from './inventory';
