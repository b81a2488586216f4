/**
 * The words of the complete-sample report: the summary's mean and standard deviation, the
 * warnings, and the methods with their published sources.
 */
import type { FamilyName } from './families/index.js';
import { formatNumber } from './gof/index.js';
import { RANKING_RULE } from './rank.js';
import type { AnalysisPlan } from './analyze.js';
import { AUTO_SWITCH, CHI_SQUARE_BAND_MAX_WORK, CHI_SQUARE_BOOTSTRAP_BELOW_N, CHI_SQUARE_MONTE_CARLO_BAND } from './analyze-decisions.js';
import type { CandidateReport, MethodNote, NotApplicableReport, PMethod } from './report.js';
import type { Sample } from './sample.js';

/**
 * Mean and n - 1 standard deviation for the summary. The sample's own sums overflow near 1e308 and
 * the squared deviations underflow near 1e-300; then both are recomputed on the values divided by
 * the largest |x| (a power of two, so the division is exact), which keeps every intermediate
 * in range (common practice, no source).
 */
export function meanAndSd(sample: Sample): { mean: number; sd: number } {
  const n = sample.n;
  const mean = sample.mean;
  const sd = Math.sqrt(sample.sumSqDev / (n - 1));
  if (Number.isFinite(mean) && Number.isFinite(sd) && (sd > 0 || sample.distinct === 1)) return { mean, sd };
  const big = Math.max(Math.abs(sample.min), Math.abs(sample.max));
  const s = Math.pow(2, Math.min(1023, Math.floor(Math.log2(big)))); // log2 of the largest double rounds to 1024
  const xs = sample.sorted;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += (xs[i] as number) / s;
  const m = sum / n;
  let ss = 0;
  for (let i = 0; i < n; i++) {
    const d = (xs[i] as number) / s - m;
    ss += d * d;
  }
  return { mean: m * s, sd: Math.sqrt(ss / (n - 1)) * s };
}

export function warningsFor(plan: AnalysisPlan, candidates: readonly CandidateReport[], notApplicable: readonly NotApplicableReport[]): string[] {
  const w: string[] = [];
  const { n, distinct } = plan.sample;
  if (distinct < n / 2) {
    w.push(
      `Many tied values: only ${distinct} distinct among ${n}. The data look rounded or discrete; the tests assume continuous data, so their p-values are too small. Record more digits if you can.`,
    );
  }
  if (n < 20) {
    w.push(`Small sample (n = ${n}): the goodness-of-fit tests have little power, so "not rejected" says little, and the ranking is uncertain.`);
  }
  for (const c of candidates) {
    if (!c.chiSquare.computable) w.push(`${c.label}: chi-square test not computed. ${c.chiSquare.reason}`);
    if (c.andersonDarling.pValueIs !== 'estimate') {
      w.push(`${c.label}: the Anderson–Darling table gives only a bound (p ${c.andersonDarling.pValueIs === 'upper-bound' ? '<' : '>'} ${formatNumber(c.andersonDarling.pValue)}); use the bootstrap method for an estimate.`);
    }
    if (!c.fit.converged) w.push(`${c.label}: the maximum-likelihood solver did not converge; treat its numbers with caution.`);
    const failedB = c.andersonDarling.failedReplicates ?? 0;
    if (failedB > 0) {
      w.push(
        `${c.label}: ${failedB} of ${c.andersonDarling.replicates ?? 0} bootstrap replicates could not be refitted; they were counted as exceeding the observed A², so the Anderson–Darling p-value is conservative (it can only be too large).`,
      );
    }
  }
  for (const c of plan.candidates) for (const fw of c.fit.warnings ?? []) w.push(`${c.family.label}: ${fw}`);
  for (const c of plan.candidates) {
    if (c.bootstrapReason?.startsWith(AUTO_SWITCH)) w.push(`${c.family.label}: Anderson–Darling p-value by bootstrap, not the table: ${c.bootstrapReason.slice(AUTO_SWITCH.length)}.`);
  }
  if (candidates.length > 0 && candidates.every((c) => c.rejectedBy.length > 0)) {
    w.push(`Every candidate is rejected at α = ${formatNumber(plan.options.alpha)}: none of these models describes the data well; the ranking only says which is least bad.`);
  }
  for (const na of notApplicable) w.push(`${na.family}: ${na.kind === 'no-interior-maximum' ? 'not ranked or tested' : 'not applicable'}. ${na.reason}`);
  return w;
}

export function methodsFor(plan: AnalysisPlan, candidates: readonly CandidateReport[]): MethodNote[] {
  const notes: MethodNote[] = [
    {
      topic: 'fitting',
      description: 'Maximum likelihood for each family (closed forms where they exist, else Newton on the likelihood equation inside a bracket), solved to relative 1e-10.',
      source: 'Standard maximum-likelihood estimation (common practice).',
    },
    {
      topic: 'chi-square bins',
      description:
        'Equiprobable bins under each fitted model (edges at the fitted quantiles j/k, outer edges at the support bounds, counting [lower, upper)); k = round(2·n^(2/5)), capped so each bin expects at least 5, raised to m + 2 so the degrees of freedom are at least 1; or the user\'s k if it keeps 5 per bin.',
      source: "Moore (1986), ch. 3 of D'Agostino & Stephens (eds.), Goodness-of-Fit Techniques; Cochran (1952) Ann. Math. Stat. 23:315-345 and (1954) Biometrics 10:417-451.",
    },
    {
      topic: 'chi-square p-value',
      description: `X² = Σ(O - E)²/E with k - 1 - m degrees of freedom (pValue) and k - 1 (pValueUpper); the true null distribution lies between them for large n because the parameters were estimated from the raw data. Where that bracket comes within ${CHI_SQUARE_MONTE_CARLO_BAND} Monte Carlo standard errors √(α(1 - α)/B) of α (so that the bootstrap's own decision would still be random; past B·n = ${CHI_SQUARE_BAND_MAX_WORK.toExponential(0).replace('e+', '·10^')} sampled values only where it straddles α), or n < ${CHI_SQUARE_BOOTSTRAP_BELOW_N} (where k - 1 - m rejects too often), the decision uses a parametric-bootstrap p-value instead: samples drawn from the fitted model, each refitted on its raw values and X²* computed on equiprobable bins of its own fit, p = (1 + #{X²* > X²} + ½·#{X²* = X²})/(B + 1) (mid-p: X² is discrete), unrefittable replicates counted as exceeding.`,
      source: 'Chernoff & Lehmann (1954), Ann. Math. Stat. 25:579-586; NIST/SEMATECH e-Handbook §1.3.5.15; parametric bootstrap: Davison & Hinkley (1997), Bootstrap Methods, §4.2 [from memory].',
    },
    {
      topic: 'Anderson–Darling statistic',
      description: 'A² = -n - (1/n) Σ (2i - 1)[ln F(x_(i)) + ln S(x_(n+1-i))] at the maximum-likelihood fit, from log-cdf and log-survival values.',
      source: "Anderson & Darling (1954), JASA 49:765-769; D'Agostino & Stephens (1986), ch. 4.",
    },
  ];
  const seen = new Set<string>();
  for (const c of candidates) {
    const ad = c.andersonDarling;
    const key = `${ad.method}:${c.family}`;
    if (seen.has(key)) continue;
    seen.add(key);
    notes.push({
      topic: `Anderson–Darling p-value, ${c.label}`,
      description: ad.methodDetail,
      source: adSource(c.family, ad.method),
    });
  }
  notes.push({ topic: 'ranking', description: RANKING_RULE, source: 'Akaike (1974); Hurvich & Tsai (1989), Biometrika 76:297-307; Schwarz (1978), Ann. Stat. 6:461-464.' });
  return notes;
}

function adSource(family: FamilyName, method: PMethod): string {
  if (method === 'bootstrap') return 'Stute, González Manteiga & Presedo Quindimil (1993), Test 2:113-124 [from memory].';
  switch (family) {
    case 'normal':
    case 'lognormal':
      return "D'Agostino & Stephens (1986), Goodness-of-Fit Techniques, Table 4.9.";
    case 'exponential':
      return "D'Agostino & Stephens (1986), Goodness-of-Fit Techniques, ch. 4 (exponential case).";
    case 'weibull':
    case 'gumbel':
      return 'Stephens (1977), Biometrika 64:583-588 (extreme-value case).';
    case 'gamma':
      return "Plumbline's simulated grid (scripts/simulate-ad-tables.ts), checked at shape 1 against D'Agostino & Stephens (1986) Table 4.21 [from memory].";
    default:
      return '';
  }
}
