export * from './constants';
export * from './beam';
export * from './elements';
export * from './source';
export * from './aperture';
export * from './train';
export * from './caustic';
