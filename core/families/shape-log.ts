/**
 * The shape-generalised logarithm of the threshold families: ln(1 + s·z)/s, which tends to z as the
 * shape s → 0 (taken as z below |s| = 1e-12, where log1p(s·z)/s already equals z to rounding).
 * Shared by the generalized Pareto (−ln S) and the generalized logistic (its reduced variate).
 */
export const SMALL_SHAPE = 1e-12;

export function shapeLog(z: number, shape: number): number {
  return Math.abs(shape) < SMALL_SHAPE ? z : Math.log1p(shape * z) / shape;
}
