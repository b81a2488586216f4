/**
 * Several failure modes (competing risks, series system of independent modes): each unit fails by
 * the first of its modes. With independent modes the likelihood factorises into one right-censored
 * likelihood per mode in which the failures of every other mode are suspensions at their failure
 * times (Meeker & Escobar 1998, "Statistical Methods for Reliability Data", §15.2-15.4; Lawless
 * 2003, §9.1; David & Moeschberger 1978 [from memory]). So each mode is fitted on its own
 * (fit.ts), and the system reliability is the product of the modes' reliabilities:
 *   R_sys(t) = Π_m R_m(t),   system B-life: the t with ln R_sys(t) = ln(1 - p) (Brent on ln t).
 * Per mode the candidate families are ranked by AICc (n = all units) and the best is used for the
 * system, unless a family is fixed. Mode B-lives carry likelihood-ratio (or Fisher) bounds
 * (bounds.ts); the system B-life carries likelihood-ratio (or Fisher) bounds over every mode's
 * parameters (competing-modes-bounds.ts); the system reliability at a time is a point estimate.
 * Interval rows with a mode (analyzeIntervalModes): a unit found failed by mode m in (L, R] is, for
 * every other mode, known to have been free of it at L and nothing more; so for the other modes it
 * is a suspension at L (an exact failure: at its time; one failed before the first inspection: at 0,
 * no information). Censoring at L is independent of the other mode's life when the modes and the
 * inspection times are independent, so each mode's fit is the interval likelihood of
 * interval-likelihood.ts on its own rows (exact) with the other modes' failures suspended there; it
 * drops the information that the unit outlived the other mode between L and its failure, so the
 * other modes' estimates lose a little precision but not their consistency (the exact joint
 * likelihood, ∫_L^R f_m(t) Π_{k≠m} S_k(t) dt, does not factorise; Meeker & Escobar 1998, §15.5,
 * and Lawless 2003, §9.2 [from memory], for the interval-censored competing-risks likelihood).
 */
import { InputError } from '../errors.js';
import { getFamily, type Distribution } from '../families/index.js';
import { informationCriteria, rankCandidates } from '../rank.js';
import { findRoot } from '../special/index.js';
import { systemBLife, type FittedMode } from './competing-modes-bounds.js';
import { bLife, reliabilityAt, type BLife, type BoundMethod, type LikelihoodSource, type ReliabilityAt } from './bounds.js';
import { prepareLifeData } from './data.js';
import { fitCensored, type CensoredFitOutcome, type CensoredFitSuccess } from './fit.js';
import { censoringKind, prepareIntervalLifeData, type IntervalLifeInput } from './interval-likelihood-data.js';
import { fitInterval } from './interval-likelihood-fit.js';
import { intervalLogLikelihoodOf } from './interval-likelihood.js';
import { LIFE_FAMILIES, lifeModel, type LifeFamilyName } from './models.js';

export interface ModeInput {
  readonly times: Float64Array | readonly number[];
  readonly failed: Uint8Array | readonly number[];
  /** The failure mode of each failed unit (ignored for suspensions). */
  readonly modes: readonly (string | null)[];
}

export interface ModeOptions {
  readonly families?: readonly LifeFamilyName[];
  /** Use this family for every mode instead of each mode's best by AICc. */
  readonly family?: LifeFamilyName;
  readonly bLifePercents?: readonly number[];
  readonly reliabilityTimes?: readonly number[];
  readonly confidence?: number;
  readonly boundMethod?: BoundMethod;
}

export interface ModeCandidate {
  readonly family: LifeFamilyName;
  readonly parameters: Readonly<Record<string, number>>;
  readonly logLikelihood: number;
  readonly estimatedParameters: number;
  readonly aicc: number;
  readonly rank: number;
  readonly deltaAicc: number;
}

export interface ModeResult {
  readonly mode: string;
  readonly failures: number;
  /** Units counted as suspensions for this mode (other modes' failures and the survivors). */
  readonly suspensions: number;
  /** The family used for the system and for the B-lives below. */
  readonly family: LifeFamilyName | null;
  readonly parameters: Readonly<Record<string, number>> | null;
  readonly candidates: readonly ModeCandidate[];
  readonly notFitted: readonly { readonly family: LifeFamilyName; readonly reason: string }[];
  readonly bLives: readonly BLife[];
  readonly reliability: readonly ReliabilityAt[];
}

export interface SystemResult {
  /** System B-lives with two-sided bounds (competing-modes-bounds.ts: likelihood ratio or Fisher matrix, as the modes'). */
  readonly bLives: readonly BLife[];
  readonly reliability: readonly { readonly time: number; readonly estimate: number }[];
  /** Curve for the page: time grid with each mode's and the system's reliability. */
  readonly curve: { readonly time: readonly number[]; readonly modes: readonly (readonly number[])[]; readonly system: readonly number[] };
  readonly method: string;
}

export interface CompetingModesReport {
  readonly n: number;
  readonly modes: readonly ModeResult[];
  /** null when some mode could not be fitted. */
  readonly system: SystemResult | null;
  readonly cautions: readonly string[];
  readonly method: string;
  readonly source: string;
}

/** The ln of the system reliability: Σ ln R_m(t). */
function logSystemSf(dists: readonly Distribution[], t: number): number {
  let s = 0;
  for (const d of dists) s += d.logSf(t);
  return s;
}

/** The t with R_sys(t) = 1 - p (p in (0, 1)), by Brent on ln t. */
export function systemQuantile(dists: readonly Distribution[], p: number): number {
  const target = Math.log1p(-p);
  // Bracket: the system fails no later than its earliest mode's quantile, and no earlier than the quantile of R_m = (1 - p)^{1/m}.
  const lo0 = Math.min(...dists.map((d) => d.quantile(-Math.expm1(target / dists.length))));
  const hi0 = Math.min(...dists.map((d) => d.quantile(p)));
  const g = (u: number) => logSystemSf(dists, Math.exp(u)) - target;
  let lo = Math.log(Math.max(lo0, Number.MIN_VALUE)) - 1e-9;
  let hi = Math.log(hi0) + 1e-9;
  let guard = 0;
  while (g(lo) < 0 && guard++ < 60) lo -= 1;
  while (g(hi) > 0 && guard++ < 120) hi += 1;
  return Math.exp(findRoot(g, lo, hi, { relTol: 1e-13 }).root);
}

/** One mode's data as the fits and bounds need it. */
interface ModeData {
  readonly n: number;
  readonly failures: number;
  readonly suspensions: number;
  readonly fit: (family: LifeFamilyName) => CensoredFitOutcome;
  readonly source: LikelihoodSource;
}

/** The sorted distinct modes of the failed rows; every failed row must name one. */
function modeLabels(modes: readonly (string | null)[], failed: (i: number) => boolean, what: (i: number) => string, row: (i: number) => number): string[] {
  const labels: string[] = [];
  for (let i = 0; i < modes.length; i++) {
    if (!failed(i)) continue;
    const m = modes[i];
    if (m === null || m === undefined || m.trim() === '') {
      throw new InputError(`${what(i)} failed but has no failure mode: give every failed unit a mode.`, { row: row(i) }, 'bad-input');
    }
    if (!labels.includes(m)) labels.push(m);
  }
  if (labels.length === 0) throw new InputError('No failed unit has a mode: there is nothing to separate.', {}, 'too-few-values');
  return labels.sort();
}

export function analyzeModes(input: ModeInput, opts: ModeOptions = {}): CompetingModesReport {
  const n = input.times.length;
  if (input.modes.length !== n) throw new InputError(`The mode column has ${input.modes.length} entries but there are ${n} units.`, {}, 'bad-input');
  const labels = modeLabels(input.modes, (i) => !!input.failed[i], (i) => `Unit #${i + 1}`, (i) => i + 1);
  let lo = Number.POSITIVE_INFINITY;
  let hi = 0;
  for (let i = 0; i < n; i++) {
    lo = Math.min(lo, input.times[i] as number);
    hi = Math.max(hi, input.times[i] as number);
  }
  const modeData = (mode: string): ModeData => {
    const failed = new Uint8Array(n);
    for (let i = 0; i < n; i++) failed[i] = input.failed[i] && input.modes[i] === mode ? 1 : 0;
    const data = prepareLifeData({ times: input.times, failed });
    return { n: data.n, failures: data.failures, suspensions: data.suspensions, fit: (f) => fitCensored(f, data), source: data };
  };
  return modesReport(n, labels, modeData, [lo, hi], opts, 'each mode fitted by censored maximum likelihood with the other modes\' failures as suspensions; system reliability = product of the mode reliabilities');
}

export interface IntervalModeInput {
  readonly interval: IntervalLifeInput;
  /** The failure mode of each row (ignored for suspensions, end = ∞). */
  readonly modes: readonly (string | null)[];
}

/** Modes on interval rows: each mode's rows exact, the other modes' failures suspended at their start (see above). */
export function analyzeIntervalModes(input: IntervalModeInput, opts: ModeOptions = {}): CompetingModesReport {
  const rows = input.interval;
  const m = rows.start.length;
  if (input.modes.length !== m) throw new InputError(`The mode column has ${input.modes.length} entries but there are ${m} rows.`, {}, 'bad-input');
  const all = prepareIntervalLifeData(rows); // validates every row once, naming its line
  const lower = (i: number) => (Number.isNaN(rows.start[i] as number) ? 0 : (rows.start[i] as number));
  const upper = (i: number) => (Number.isNaN(rows.end[i] as number) ? Number.POSITIVE_INFINITY : (rows.end[i] as number));
  const count = (i: number) => (rows.counts ? (rows.counts[i] as number) : 1);
  const failedRow = (i: number) => count(i) > 0 && censoringKind(lower(i), upper(i)) !== 'right';
  const labels = modeLabels(input.modes, failedRow, (i) => `Row ${rows.lines?.[i] ?? i + 1}`, (i) => rows.lines?.[i] ?? i + 1);
  const modeData = (mode: string): ModeData => {
    const start: number[] = [];
    const end: number[] = [];
    const counts: number[] = [];
    let failures = 0;
    for (let i = 0; i < m; i++) {
      const own = !failedRow(i) || input.modes[i] === mode;
      if (own && failedRow(i)) failures += count(i);
      // Another mode's failure before the first inspection: suspended at 0, no information (left out, still counted in n).
      if ((!own && lower(i) === 0) || count(i) === 0) continue;
      start.push(lower(i));
      end.push(own ? upper(i) : Number.POSITIVE_INFINITY);
      counts.push(count(i));
    }
    const data = prepareIntervalLifeData({ start, end, counts }, { trusted: true });
    return { n: all.n, failures, suspensions: all.n - failures, fit: (f) => fitInterval(f, data), source: { logLikelihoodOf: (f) => intervalLogLikelihoodOf(f, data) } };
  };
  return modesReport(
    all.n,
    labels,
    modeData,
    [all.minTime, all.maxTime],
    opts,
    "each mode fitted by maximum likelihood on the interval rows (exact, left-, interval- and right-censored), a unit failed by another mode suspended at the last inspection it was seen running (its start); system reliability = product of the mode reliabilities",
  );
}

function modesReport(n: number, labels: readonly string[], modeData: (mode: string) => ModeData, range: readonly [number, number], opts: ModeOptions, method: string): CompetingModesReport {
  const confidence = opts.confidence ?? 0.9;
  const percents = opts.bLifePercents ?? [10];
  const times = opts.reliabilityTimes ?? [];
  const families = opts.family ? [opts.family] : (opts.families ?? LIFE_FAMILIES);
  const cautions: string[] = [];
  const chosen: FittedMode[] = [];
  const modes: ModeResult[] = labels.map((mode) => {
    const data = modeData(mode);
    const fits: CensoredFitSuccess[] = [];
    const notFitted: { family: LifeFamilyName; reason: string }[] = [];
    for (const f of families) {
      const r = data.fit(f);
      if (r.ok && r.converged) fits.push(r);
      else notFitted.push({ family: f, reason: r.ok ? 'the fit did not converge (no maximum found; not ranked)' : r.reason });
    }
    const ranked = rankCandidates(
      fits.map((f) => {
        const k = lifeModel(f.family).names.length;
        const aicc = data.n - k - 1 > 0 ? informationCriteria(f.logLikelihood, k, data.n).aicc : Number.POSITIVE_INFINITY;
        return { family: f.family, parameters: f.parameters, logLikelihood: f.logLikelihood, estimatedParameters: k, aicc, fit: f };
      }),
    );
    const best = ranked[0]?.fit ?? null;
    if (best) chosen.push({ fit: best, source: data.source });
    if (data.failures < 10) cautions.push(`Mode ${mode} has only ${data.failures} failure${data.failures === 1 ? '' : 's'}: its model and B-lives are uncertain (fewer than 10 failures; common practice, no source).`);
    return {
      mode,
      failures: data.failures,
      suspensions: data.suspensions,
      family: best?.family ?? null,
      parameters: best?.parameters ?? null,
      candidates: ranked.map(({ fit: _f, ...c }) => c),
      notFitted,
      bLives: best ? percents.map((p) => bLife(best, data.source, p, confidence, opts.boundMethod)) : [],
      reliability: best ? times.map((t) => reliabilityAt(best, data.source, t, confidence, opts.boundMethod)) : [],
    };
  });
  let system: SystemResult | null = null;
  if (chosen.length === labels.length) {
    const dists = chosen.map((m) => getFamily(m.fit.family).make(m.fit.parameters));
    const [lo, hi] = range;
    const grid: number[] = [];
    for (let k = 0; k < 60; k++) grid.push(Math.exp(Math.log(lo / 2) + ((Math.log(hi * 1.5) - Math.log(lo / 2)) * k) / 59));
    system = {
      bLives: percents.map((percent) => systemBLife(chosen, percent, confidence, opts.boundMethod)),
      reliability: times.map((time) => ({ time, estimate: Math.exp(logSystemSf(dists, time)) })),
      curve: { time: grid, modes: dists.map((d) => grid.map((t) => d.sf(t))), system: grid.map((t) => Math.exp(logSystemSf(dists, t))) },
      method: `product of the mode reliabilities (independent modes in series); system B-life by Brent root of ln R_sys(t) = ln(1 - p) on ln t, its bounds ${opts.boundMethod === 'fisher-matrix' ? 'by the Fisher matrix (each mode’s observed information, delta method on ln t_p)' : 'by the likelihood ratio (profile likelihood over every mode’s parameters)'}; system reliability at a time a point estimate`,
    };
  } else {
    cautions.push('Some mode could not be fitted, so no system reliability is given.');
  }
  cautions.push(
    'The modes are treated as independent and every failure as correctly assigned to its mode; a wrongly classified failure, or modes that share a cause, bias every number here.',
    'The system B-life bounds rest on large-sample likelihood theory and on every mode’s model being right; the system reliability at a time is a point estimate. Where a safety or maintenance decision rests on them, use the lower bounds, follow the governing codes and standards, and have the analysis reviewed under licensed practice.',
  );
  return {
    n,
    modes,
    system,
    cautions,
    method,
    source: 'Meeker & Escobar 1998, Statistical Methods for Reliability Data, §15.2-15.4; Lawless 2003, §9.1',
  };
}
