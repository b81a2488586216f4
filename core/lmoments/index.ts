/** L-moments: the one public entry of core/lmoments (sample L-moments, fits by L-moments, the ratio diagram, the kappa). */
export { sampleLMoments } from './sample-lmoments.js';
export type { SampleLMoments } from './sample-lmoments.js';
export { fitByLMoments, gevT3, LMOMENT_FAMILIES, pearson3AlphaFromT3 } from './family-fits.js';
export type { LMomentFamily, LMomentFit, LMomentInput } from './family-fits.js';
export { gevRatios, gloT4, gpaT4, pe3T4, ratioDiagram } from './ratio-diagram.js';
export type { RatioDiagram, RatioPoint } from './ratio-diagram.js';
export { fitKappa, kappaFromShapes, kappaG, kappaLMoments, kappaQuantile, kappaRatios, logisticT4 } from './kappa.js';
export type { KappaFit, KappaParameters } from './kappa.js';
