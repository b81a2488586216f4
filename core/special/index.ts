/**
 * Special functions: the one public entry of core/special. One concept per file; each file names
 * its algorithm and published source.
 */
export { erf, erfc, erfcx } from './erf.js';
export { normalCdf, normalLogCdf, normalLogCdfSfAt, normalLogPdf, normalLogSf, normalPdf, normalPdfOverCdf, normalSf } from './normal.js';
export { normalIsf, normalLogIsf, normalLogQuantile, normalQuantile } from './normal-quantile.js';
export { lnGamma, lnGamma1p, lnGammaStirlingCorrection } from './gamma-function.js';
export { digamma, trigamma } from './polygamma.js';
export { gammaP, gammaQ, logGammaDensity, logGammaP, logGammaQ } from './incomplete-gamma.js';
export { gammaPInv, gammaPInvLog, gammaQInv, gammaQInvLog } from './incomplete-gamma-inverse.js';
export { chiSquareCdf, chiSquareIsf, chiSquareLogCdf, chiSquareLogSf, chiSquareSf } from './chi-square.js';
export { log1mexp, log1pexp, log1pmx, logAddExp, logSumExp } from './log-exp.js';
export { BracketError, findRoot, newtonBracketed } from './roots.js';
export type { RootOptions, RootResult, ValueAndDerivative } from './roots.js';
