/** Flood-frequency options (annual maxima): return periods, design life, plotting positions. */
import type { OptionSpec } from './spec.js';

export const FLOOD_OPTIONS: readonly OptionSpec[] = [
  {
    name: 'returnPeriods',
    cli: '--return-periods',
    kind: 'numbers',
    unit: 'years',
    min: 1,
    minExclusive: true,
    unique: true,
    default: null,
    appliesTo: ['flood'],
    help: 'return periods, e.g. 2,10,100; turns on the flood section and adds gumbel and gev to the default models',
    group: 'flood',
  },
  {
    name: 'designLife',
    cli: '--design-life',
    kind: 'number',
    unit: 'years',
    min: 0,
    max: 1_000_000,
    minExclusive: true,
    default: null,
    appliesTo: ['flood'],
    help: 'the chance of at least one exceedance of each return level within this many years',
    group: 'flood',
  },
  {
    name: 'plottingPosition',
    cli: '--plotting-position',
    kind: 'choice',
    choices: ['weibull', 'gringorten', 'cunnane'],
    default: 'weibull',
    appliesTo: ['flood'],
    help: 'positions on the return-period plot: weibull i/(n+1), gringorten or cunnane',
    group: 'flood',
  },
];
