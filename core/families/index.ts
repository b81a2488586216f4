/**
 * The family registry: the one public entry of core/families.
 */
import { InputError } from '../errors.js';
import type { Family, FamilyName } from './types.js';
import { exponential } from './exponential.js';
import { gamma } from './gamma.js';
import { fitGev, gev, GEV_SHAPE_GUARD } from './gev.js';
import { gumbel } from './gumbel.js';
import { lognormal } from './lognormal.js';
import { normal } from './normal.js';
import { weibull } from './weibull.js';
import { weibull3 } from './weibull3.js';
import { lognormal3 } from './lognormal3.js';
import { pearson3 } from './pearson3.js';
import { logpearson3 } from './logpearson3.js';
import { genpareto } from './genpareto.js';
import { genlogistic } from './genlogistic.js';

export type * from './types.js';
export { exponential, gamma, lognormal, normal, weibull };
// Extreme-value families for annual maxima (flood frequency); not in DEFAULT_FAMILIES.
export { fitGev, gev, GEV_SHAPE_GUARD, gumbel };
// Threshold families (three-parameter Weibull and lognormal); not in DEFAULT_FAMILIES.
export { weibull3, lognormal3 };
// Pearson type III and log-Pearson type III (flood frequency, Bulletin 17C); not in DEFAULT_FAMILIES.
export { pearson3, logpearson3 };
export { NORMAL_SKEW, Pearson3Distribution } from './pearson3.js';
// Generalized Pareto and generalized logistic (peaks over a threshold, L-moment families); not in DEFAULT_FAMILIES.
export { genpareto, genlogistic };
export type { GevFit, GevFitOptions } from './gev.js';

const registry = new Map<FamilyName, Family>();

/** Register a family (the five built-in families are registered below, on first import). */
export function registerFamily(f: Family): void {
  registry.set(f.name, f);
}

export function getFamily(name: FamilyName): Family {
  const f = registry.get(name);
  if (!f) {
    const known = [...registry.keys()].join(', ');
    throw new InputError(`Unknown family "${String(name)}"; known families: ${known}.`, { value: String(name) }, 'bad-option');
  }
  return f;
}

export function allFamilies(): Family[] {
  return [...registry.values()];
}

// In the order of DEFAULT_FAMILIES, so that allFamilies() lists them in that order.
registerFamily(normal);
registerFamily(lognormal);
registerFamily(gamma);
registerFamily(weibull);
registerFamily(exponential);
registerFamily(gumbel);
registerFamily(gev);
// Threshold (three-parameter) families; not in DEFAULT_FAMILIES.
registerFamily(weibull3);
registerFamily(lognormal3);
registerFamily(pearson3);
registerFamily(logpearson3);
registerFamily(genpareto);
registerFamily(genlogistic);

/** The default candidate set for a complete sample. */
export const DEFAULT_FAMILIES: readonly FamilyName[] = ['normal', 'lognormal', 'gamma', 'weibull', 'exponential'];

/** The extreme-value candidate set for annual-maximum series. */
export const EXTREME_VALUE_FAMILIES: readonly FamilyName[] = ['gumbel', 'gev'];
