/**
 * The settings a user makes for one source, as typed (text, so a half-typed value is kept and
 * its problem shown) and keyed by the request field name each becomes (server/API.md). Pure.
 *
 * `DEFAULT_SETTINGS` is what every new source starts from; `demoSettings` is a demo's own settings
 * (server/demo.ts DEMO_SETTINGS fields) laid over the defaults. The settings belong to the source
 * they were made for: state.ts replaces them whenever the source changes.
 */
import { optionNamed } from '../../core/index.js';
import { FAMILY_CHOICES } from './families.js';

/** An option's default from the core's table (core/options) as the page's text; '' when off. */
function tableDefault(name: string, fallback: string): string {
  const d = optionNamed(name)?.default;
  if (d === undefined) return fallback;
  if (d === null) return '';
  return Array.isArray(d) ? d.join(', ') : String(d);
}

export type PMethodChoice = 'table' | 'bootstrap';
export type BoundChoice = 'likelihood-ratio' | 'fisher-matrix';
export type PlottingChoice = 'weibull' | 'gringorten' | 'cunnane';

/** Column roles: a 1-based column index, or 0 for none. */
export interface Roles {
  readonly statusColumn: number;
  readonly subgroupColumn: number;
  readonly orderColumn: number;
}

export interface Settings extends Roles {
  readonly families: readonly string[];
  readonly alpha: string;
  /** '' is automatic. */
  readonly bins: string;
  readonly pMethod: PMethodChoice;
  readonly replicates: string;
  /** '' leaves the seed to the server (it reports the one it used). */
  readonly seed: string;
  readonly confidence: string;
  readonly bLifePercents: string;
  readonly reliabilityTimes: string;
  readonly boundMethod: BoundChoice;
  readonly returnPeriods: string;
  readonly designLife: string;
  readonly plottingPosition: PlottingChoice;
  readonly lsl: string;
  readonly usl: string;
  readonly target: string;
}

/**
 * The settings every source starts from: the core option table's defaults (core/options), except
 * the seed, left empty so the server uses (and reports) its own, and the B10 life a life test is
 * usually rated by (common practice, no source).
 */
export const DEFAULT_SETTINGS: Settings = Object.freeze({
  families: FAMILY_CHOICES.filter((f) => f.byDefault).map((f) => f.name as string),
  alpha: tableDefault('alpha', '0.05'),
  bins: tableDefault('bins', ''),
  pMethod: 'table',
  replicates: tableDefault('replicates', '999'),
  seed: '',
  confidence: tableDefault('confidence', '0.9'),
  bLifePercents: '10',
  reliabilityTimes: '',
  boundMethod: 'likelihood-ratio',
  returnPeriods: '',
  designLife: '',
  plottingPosition: 'weibull',
  lsl: '',
  usl: '',
  target: '',
  statusColumn: 0,
  subgroupColumn: 0,
  orderColumn: 0,
});

const list = (v: unknown): string | undefined => (Array.isArray(v) ? v.join(', ') : undefined);
const num = (v: unknown): string | undefined => (typeof v === 'number' && Number.isFinite(v) ? String(v) : undefined);

/**
 * A demo's fields laid over the defaults. Column roles arrive as header names and become indices
 * through `columnIndex` (0 when the file has no such column).
 */
export function demoSettings(fields: Readonly<Record<string, unknown>>, columnIndex: (name: string) => number): Settings {
  const role = (v: unknown): number => (typeof v === 'string' ? columnIndex(v) : typeof v === 'number' && Number.isInteger(v) && v > 0 ? v : 0);
  const d = DEFAULT_SETTINGS;
  const choice = <T extends string>(v: unknown, allowed: readonly T[], fallback: T): T => (typeof v === 'string' && (allowed as readonly string[]).includes(v) ? (v as T) : fallback);
  return {
    families: Array.isArray(fields['families']) ? (fields['families'] as unknown[]).filter((x): x is string => typeof x === 'string') : d.families,
    alpha: num(fields['alpha']) ?? d.alpha,
    bins: num(fields['bins']) ?? d.bins,
    pMethod: choice(fields['pMethod'], ['table', 'bootstrap'] as const, d.pMethod),
    replicates: num(fields['replicates']) ?? d.replicates,
    seed: num(fields['seed']) ?? d.seed,
    confidence: num(fields['confidence']) ?? d.confidence,
    bLifePercents: list(fields['bLifePercents']) ?? d.bLifePercents,
    reliabilityTimes: list(fields['reliabilityTimes']) ?? d.reliabilityTimes,
    boundMethod: choice(fields['boundMethod'], ['likelihood-ratio', 'fisher-matrix'] as const, d.boundMethod),
    returnPeriods: list(fields['returnPeriods']) ?? d.returnPeriods,
    designLife: num(fields['designLife']) ?? d.designLife,
    plottingPosition: choice(fields['plottingPosition'], ['weibull', 'gringorten', 'cunnane'] as const, d.plottingPosition),
    lsl: num(fields['lsl']) ?? d.lsl,
    usl: num(fields['usl']) ?? d.usl,
    target: num(fields['target']) ?? d.target,
    statusColumn: role(fields['statusColumn']),
    subgroupColumn: role(fields['subgroupColumn']),
    orderColumn: role(fields['orderColumn']),
  };
}
