/**
 * Waveform analyses of the back-EMF spin test: harmonics, Ke, unbalance and phase sequence of the
 * line-to-line voltages, and the resolver offset measured against them. Sources are named on
 * each function.
 */
export { analyzeBackEmf, HIGHEST_HARMONIC } from './back-emf.js';
export type { BackEmfAnalysis, BackEmfInput, PerLine } from './back-emf.js';
export { resolverOffset } from './resolver-offset.js';
export type { ResolverOffset, ResolverOffsetInput } from './resolver-offset.js';
export { wrapDegrees180, wrapDegrees360 } from './angles.js';
export type { Samples } from './validate.js';
