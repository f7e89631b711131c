export * from './constants.js';
export * from './numeric.js';
export * from './random.js';
