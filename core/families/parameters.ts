/**
 * Parameter validation shared by the family files: every `make` reads its parameters by role
 * through these helpers, so a missing, non-finite or out-of-bounds value always raises the same
 * ParameterError naming the family and the parameter.
 */
import { ParameterError } from '../errors.js';
import type { ParameterBound, Parameters } from './types.js';

/** Read one parameter by role and check it against its bound (open unless `lowerInclusive`). */
export function readParameter(family: string, parameters: Parameters, name: string, bound: ParameterBound): number {
  const value = parameters[name];
  if (typeof value !== 'number') {
    throw new ParameterError(family, name, Number.NaN, 'missing; a number is required');
  }
  if (!Number.isFinite(value)) throw new ParameterError(family, name, value, 'must be a finite number');
  const lowerOk = bound.lowerInclusive ? value >= bound.lower : value > bound.lower;
  if (!lowerOk) {
    throw new ParameterError(family, name, value, `must be ${bound.lowerInclusive ? '≥' : '>'} ${String(bound.lower)}`);
  }
  if (!(value < bound.upper)) throw new ParameterError(family, name, value, `must be < ${String(bound.upper)}`);
  return value;
}

/** The bound of a scale, rate, standard deviation or shape: (0, ∞). */
export const POSITIVE: ParameterBound = Object.freeze({ lower: 0, upper: Number.POSITIVE_INFINITY });
/** The bound of a location on the real line: (-∞, ∞) (finite values only). */
export const REAL: ParameterBound = Object.freeze({ lower: Number.NEGATIVE_INFINITY, upper: Number.POSITIVE_INFINITY });
