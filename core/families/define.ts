/**
 * The parts every family file would otherwise repeat: `make` (read each parameter by role through
 * readParameter, in the order of the bounds, then build the distribution), `applicable` (the shared
 * checkApplicable for the family's support) and the frozen `Family` object itself.
 *
 * Only per-call work lives here; the per-value loops (fits, logCdfSfInto, random draws) stay in the
 * family files, since a shared helper would call a closure once per element.
 */
import type { Sample } from '../sample.js';
import { checkApplicable } from './applicability.js';
import { readParameter } from './parameters.js';
import type { Distribution, Family, FamilyName, NotApplicable, ParameterBound, Parameters } from './types.js';

type Bounds = Readonly<Record<string, ParameterBound>>;
/** Validated parameter values by role. */
export type ParameterValues<B extends Bounds> = { readonly [K in keyof B]: number };

export interface FamilyShape<B extends Bounds> {
  readonly name: FamilyName;
  /** Display name, e.g. "Weibull". */
  readonly label: string;
  /** Bounds by role, in display order (also the order `make` checks them). */
  readonly bounds: B;
  readonly support: 'real' | 'positive';
  /** Build the distribution from parameters that passed their bounds. */
  readonly build: (values: ParameterValues<B>) => Distribution;
}

export interface FamilyBasics {
  make(parameters: Parameters): Distribution;
  applicable(sample: Sample): NotApplicable | null;
  /** The frozen Family; `applicable` defaults to the shared check above. */
  family(parts: Pick<Family, 'fit' | 'random'> & Partial<Pick<Family, 'applicable'>>): Family;
}

export function familyBasics<B extends Bounds>(shape: FamilyShape<B>): FamilyBasics {
  const names = Object.freeze(Object.keys(shape.bounds));
  const make = (parameters: Parameters): Distribution => {
    const values: Record<string, number> = {};
    for (const name of names) values[name] = readParameter(shape.name, parameters, name, shape.bounds[name] as ParameterBound);
    return shape.build(values as ParameterValues<B>);
  };
  const applicable = (sample: Sample): NotApplicable | null => checkApplicable(shape.name, shape.label, sample, shape.support);
  return {
    make,
    applicable,
    family: (parts) =>
      Object.freeze({
        name: shape.name,
        label: shape.label,
        parameterNames: names,
        parameterBounds: shape.bounds,
        estimatedParameters: names.length,
        make,
        applicable: parts.applicable ?? applicable,
        fit: parts.fit,
        random: parts.random,
      }),
  };
}
