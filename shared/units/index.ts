export * from './levels';
export * from './weighting';
export * from './bands';
export * from './acoustics';
