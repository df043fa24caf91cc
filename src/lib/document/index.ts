export * from './schema';
export * from './compile';
export * from './elementKinds';
export * from './demo';
