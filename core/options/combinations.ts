/**
 * Which options go together, declared once as data and checked alike by the CLI and the API:
 *   needs      the option is meaningless without one of `anyOf`
 *   conflicts  the option cannot be given with any of `with`
 *   ordered    `lower` must be below `upper`
 *   differ     the two must not hold the same value
 * An option counts as given when its value is not null and, for a true/false option, not false.
 * On the API a column option also counts as given when its data array (`jsonData`) is sent.
 */
import { onSurface, optionNamed } from './table.js';
import type { OptionSpec, OptionSurface, OptionValue } from './spec.js';

export type OptionCombination =
  | { readonly kind: 'needs'; readonly option: string; readonly anyOf: readonly string[]; readonly why?: string }
  | { readonly kind: 'conflicts'; readonly option: string; readonly with: readonly string[]; readonly why: string }
  | { readonly kind: 'ordered'; readonly lower: string; readonly upper: string }
  | { readonly kind: 'differ'; readonly a: string; readonly b: string };

const LIFE = 'life data with a status column or interval columns';

export const OPTION_COMBINATIONS: readonly OptionCombination[] = [
  { kind: 'needs', option: 'bLifePercents', anyOf: ['statusColumn', 'intervalColumns'], why: LIFE },
  { kind: 'needs', option: 'reliabilityTimes', anyOf: ['statusColumn', 'intervalColumns'], why: LIFE },
  { kind: 'needs', option: 'boundMethod', anyOf: ['statusColumn', 'intervalColumns'], why: LIFE },
  { kind: 'needs', option: 'lifePlotPositions', anyOf: ['statusColumn'], why: LIFE },
  { kind: 'needs', option: 'designLife', anyOf: ['returnPeriods'], why: 'the chance of exceeding each return level within the design life' },
  { kind: 'needs', option: 'plottingPosition', anyOf: ['returnPeriods'], why: 'it places the points of the return-period plot' },
  { kind: 'needs', option: 'regionalSkew', anyOf: ['regionalSkewMse'], why: 'the regional skew and its mean square error go together: the weighting needs both' },
  { kind: 'needs', option: 'regionalSkewMse', anyOf: ['regionalSkew'], why: 'the regional skew and its mean square error go together: the weighting needs both' },
  { kind: 'needs', option: 'threshold', anyOf: ['dateColumn'], why: 'peaks over a threshold need the date of each value' },
  { kind: 'needs', option: 'dateColumn', anyOf: ['threshold'], why: 'a dated series is analysed as peaks over a threshold' },
  { kind: 'needs', option: 'minSeparation', anyOf: ['threshold'], why: 'it separates the events of peaks over a threshold' },
  {
    kind: 'conflicts',
    option: 'threshold',
    with: ['statusColumn', 'intervalColumns', 'grouped', 'lsl', 'usl', 'subgroupColumn', 'orderColumn', 'trend'],
    why: 'peaks over a threshold take a dated series of flows alone',
  },
  { kind: 'needs', option: 'target', anyOf: ['lsl', 'usl'] },
  { kind: 'needs', option: 'subgroupColumn', anyOf: ['lsl', 'usl'], why: 'it gives the within-subgroup sigma for Cp and Cpk' },
  { kind: 'needs', option: 'withinMethod', anyOf: ['lsl', 'usl'], why: 'it chooses the within-subgroup sigma for Cp and Cpk' },
  { kind: 'ordered', lower: 'lsl', upper: 'usl' },
  {
    kind: 'conflicts',
    option: 'trend',
    with: ['orderColumn'],
    why: 'the trend check uses the row order; with an order column the order comes from that column (give one of them)',
  },
  {
    kind: 'conflicts',
    option: 'statusColumn',
    with: ['returnPeriods', 'lsl', 'usl', 'subgroupColumn', 'orderColumn', 'trend'],
    why: 'these need a complete sample',
  },
  { kind: 'needs', option: 'lowerColumn', anyOf: ['grouped'] },
  { kind: 'needs', option: 'upperColumn', anyOf: ['grouped'] },
  { kind: 'needs', option: 'countColumn', anyOf: ['intervalColumns', 'grouped'] },
  { kind: 'needs', option: 'inspectionTimesColumn', anyOf: ['intervalColumns'], why: 'inspection times go with interval rows' },
  { kind: 'needs', option: 'modeColumn', anyOf: ['statusColumn', 'intervalColumns'], why: 'failure modes need times with a status column, or interval rows' },
  { kind: 'needs', option: 'planTime', anyOf: ['planReliability'], why: 'part of a test plan' },
  { kind: 'needs', option: 'planConfidence', anyOf: ['planReliability'], why: 'part of a test plan' },
  { kind: 'needs', option: 'planFailures', anyOf: ['planReliability'], why: 'part of a test plan' },
  { kind: 'needs', option: 'planReliability', anyOf: ['planTime'], why: 'the time at which the reliability is to be shown' },
  { kind: 'needs', option: 'planReliability', anyOf: ['assumedShape'], why: 'the Weibull shape the plan assumes' },
  {
    kind: 'conflicts',
    option: 'intervalColumns',
    with: ['statusColumn', 'grouped', 'returnPeriods', 'lsl', 'usl', 'subgroupColumn', 'orderColumn', 'trend'],
    why: 'interval rows are life data of their own kind (give the interval columns or a status column, not both)',
  },
  {
    kind: 'conflicts',
    option: 'grouped',
    with: ['column', 'statusColumn', 'returnPeriods', 'subgroupColumn', 'orderColumn', 'trend'],
    why: 'grouped counts have no individual values',
  },
  { kind: 'needs', option: 'maxPoints', anyOf: ['evidence'] },
  { kind: 'needs', option: 'regional', anyOf: ['by'], why: 'the sites of a region are the series of a long table' },
  { kind: 'conflicts', option: 'regional', with: ['shard'], why: 'a region is analysed from all of its sites at once, not shard by shard' },
  { kind: 'needs', option: 'gridPoints', anyOf: ['evidence'] },
  { kind: 'needs', option: 'bandAlpha', anyOf: ['evidence'] },
  { kind: 'differ', a: 'delimiter', b: 'decimal' },
];

export type CombinationCheck = { readonly ok: true } | { readonly ok: false; readonly message: string; readonly field: string };

/** How an option is named on a surface: its flag, or its quoted JSON field. */
export function shownName(spec: OptionSpec, surface: OptionSurface): string {
  if (surface === 'cli') return spec.cli;
  const field = spec.jsonParent === undefined ? spec.name : `${spec.jsonParent}.${spec.name}`;
  return spec.jsonData !== undefined && onSurface(spec, 'api') ? `"${field}" (or "${spec.jsonData}")` : `"${spec.jsonData ?? field}"`;
}

function names(rule: OptionCombination): string[] {
  switch (rule.kind) {
    case 'needs':
      return [rule.option, ...rule.anyOf];
    case 'conflicts':
      return [rule.option, ...rule.with];
    case 'ordered':
      return [rule.lower, rule.upper];
    case 'differ':
      return [rule.a, rule.b];
  }
}

function specOf(name: string): OptionSpec {
  const s = optionNamed(name);
  if (s === undefined) throw new Error(`combination rule names an unknown option "${name}"`);
  return s;
}

/** Whether a rule can be checked on a surface: every option it names exists there (or, on the API, arrives as data). */
function existsOn(n: string, surface: OptionSurface): boolean {
  const s = specOf(n);
  return onSurface(s, surface) || (surface === 'api' && s.jsonData !== undefined);
}

/** A rule applies on a surface when its options exist there; a 'needs' rule when its option and at least one of `anyOf` do. */
export function ruleApplies(rule: OptionCombination, surface: OptionSurface): boolean {
  if (rule.kind === 'needs') return existsOn(rule.option, surface) && rule.anyOf.some((n) => existsOn(n, surface));
  return names(rule).every((n) => existsOn(n, surface));
}

/** Whether an option counts as given (see the file comment). */
export function isGiven(spec: OptionSpec, value: OptionValue | undefined): boolean {
  if (value === undefined || value === null) return false;
  if (spec.kind === 'boolean') return value !== spec.default && value !== false;
  return true;
}

/**
 * Check the combination rules on the options given (by name; on the API a column option given as
 * its data array is passed under its own name with any non-null value). The first broken rule is
 * reported, in table order.
 */
export function checkCombinations(given: ReadonlyMap<string, OptionValue>, surface: OptionSurface, rules: readonly OptionCombination[] = OPTION_COMBINATIONS): CombinationCheck {
  const has = (n: string): boolean => isGiven(specOf(n), given.get(n));
  const show = (n: string): string => shownName(specOf(n), surface);
  for (const rule of rules) {
    if (!ruleApplies(rule, surface)) continue;
    if (rule.kind === 'needs') {
      if (has(rule.option) && !rule.anyOf.some(has)) {
        // On the API a needed true/false option is shown with its value ("evidence": true).
        const needed = rule.anyOf.filter((n) => existsOn(n, surface)).map((n) => (surface === 'api' && specOf(n).kind === 'boolean' ? `${show(n)}: true` : show(n))).join(' or ');
        return { ok: false, message: `${show(rule.option)} needs ${needed}${rule.why ? ` (${rule.why})` : ''}`, field: rule.option };
      }
    } else if (rule.kind === 'conflicts') {
      const clash = rule.with.filter(has);
      if (has(rule.option) && clash.length > 0) {
        return { ok: false, message: `${show(rule.option)} cannot be combined with ${clash.map(show).join(', ')} (${rule.why})`, field: rule.option };
      }
    } else if (rule.kind === 'ordered') {
      const lo = given.get(rule.lower);
      const hi = given.get(rule.upper);
      if (typeof lo === 'number' && typeof hi === 'number' && !(lo < hi)) {
        return { ok: false, message: `${show(rule.lower)} (${lo}) must be below ${show(rule.upper)} (${hi})`, field: rule.lower };
      }
    } else {
      const a = given.get(rule.a);
      const b = given.get(rule.b);
      if (isGiven(specOf(rule.a), a) && isGiven(specOf(rule.b), b) && a === b) {
        return { ok: false, message: `${show(rule.a)} and ${show(rule.b)} cannot be the same character (${JSON.stringify(a)})`, field: rule.a };
      }
    }
  }
  return { ok: true };
}
