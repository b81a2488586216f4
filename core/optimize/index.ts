/**
 * core/optimize: a maximiser for smooth log-likelihoods of a few parameters, numerical
 * derivatives, observed information and profile-likelihood intervals.
 */
export { maximize, type MaximizeOptions, type MaximizeResult, type StopReason } from './maximize.js';
export { numericalGradient, numericalHessian, type Objective } from './derivatives.js';
export { observedInformation, type ObservedInformation } from './information.js';
export { profileInterval, profileLogLikelihood, chiSquare1Quantile, type ProfileInterval, type ProfileOptions } from './profile.js';
export { nelderMead, type SimplexResult } from './nelder-mead.js';
export { brentRoot, type RootResult } from './root.js';
export { cholesky, choleskySolve, inverseSpd } from './linalg.js';
export { IDENTITY, LOG, above, affine, below, between, toFreeVector, fromFreeVector, type Transform } from './transforms.js';
