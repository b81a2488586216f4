/**
 * Options of the fit and its tests, shared by every kind of data: the candidate models, the
 * significance level, the chi-square bins, the Anderson–Darling p-value method and its bootstrap,
 * and the confidence level of every interval.
 */
import { DEFAULT_FAMILIES, allFamilies } from '../families/index.js';
import { DEFAULT_BOOTSTRAP_REPLICATES } from '../gof/index.js';
import { DEFAULT_SEED } from '../analyze.js';
import { DEFAULT_CONFIDENCE } from '../workflow/index.js';
import type { OptionSpec } from './spec.js';

export const FITTING_OPTIONS: readonly OptionSpec[] = [
  {
    name: 'families',
    cli: '--families',
    kind: 'choices',
    // Read at use, so a family registered later is a choice too.
    get choices(): readonly string[] {
      return allFamilies().map((f) => f.name);
    },
    itemNoun: 'family',
    unique: true,
    default: DEFAULT_FAMILIES,
    appliesTo: ['all'],
    help: 'the candidate models; return periods add gumbel and gev to the default list',
    group: 'fitting',
  },
  {
    name: 'alpha',
    cli: '--alpha',
    kind: 'number',
    min: 0,
    max: 1,
    minExclusive: true,
    maxExclusive: true,
    default: 0.05,
    appliesTo: ['all'],
    help: 'significance level of the fit tests',
    group: 'tests',
  },
  {
    // Two bins is the least any chi-square can use; the core then asks k - 1 - m >= 1 of each model
    // and at least 5 expected per bin (Cochran 1952), naming the largest k the data allow.
    name: 'bins',
    cli: '--bins',
    kind: 'integer',
    min: 2,
    max: 1_000_000,
    default: null,
    appliesTo: ['complete'],
    help: 'number of equal-probability chi-square bins (default: chosen by rule); refused with the largest k allowed when a bin would expect fewer than 5 values',
    group: 'tests',
  },
  {
    name: 'pMethod',
    cli: '--p-method',
    kind: 'choice',
    choices: ['table', 'bootstrap'],
    default: 'table',
    appliesTo: ['complete', 'censored'],
    help: 'Anderson–Darling p-values: table (published tables, or tables simulated by this project; bootstrap where no table applies) or bootstrap (parametric, refitting every replicate)',
    group: 'tests',
  },
  {
    // At least 19 so that alpha (B + 1) is a whole number at alpha = 0.05, the smallest B for which a
    // Monte Carlo test at 5 % is exact (Davison & Hinkley 1997, section 4.2.5; from memory).
    name: 'replicates',
    cli: '--replicates',
    kind: 'integer',
    min: 19,
    max: 100_000,
    coreName: 'bootstrapReplicates',
    default: DEFAULT_BOOTSTRAP_REPLICATES,
    appliesTo: ['complete', 'censored'],
    help: 'bootstrap replicates B',
    group: 'tests',
  },
  {
    name: 'seed',
    cli: '--seed',
    kind: 'integer',
    min: 0,
    max: Number.MAX_SAFE_INTEGER,
    default: DEFAULT_SEED,
    appliesTo: ['complete', 'censored'],
    help: 'bootstrap seed (fixed by default, so runs repeat exactly)',
    group: 'tests',
  },
  {
    name: 'confidence',
    cli: '--confidence',
    kind: 'number',
    min: 0,
    max: 1,
    minExclusive: true,
    maxExclusive: true,
    default: DEFAULT_CONFIDENCE,
    appliesTo: ['life', 'flood', 'capability'],
    help: 'two-sided level of every interval (B-lives, reliability, return levels, capability indices)',
    group: 'fitting',
  },
];
