export * from './mask-types';
export { validateMask, limitLevelDb } from './validate-mask';
export { evaluateMask } from './evaluate-mask';
export { deriveMaskFromGolden, type DeriveMaskOptions, type DerivedMask } from './derive-mask';
