export * from './parse';
export * from './format';
