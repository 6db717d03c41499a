/**
 * The engineering core in one import: waveform, electrical, SPC and yield analyses and the
 * verdict rule. Every module here is pure; each function names its method and published source.
 */
export * from './waveform/index.js';
export * from './electrical/index.js';
export * from './spc/index.js';
export * from './yield/index.js';
export * from './verdict.js';
