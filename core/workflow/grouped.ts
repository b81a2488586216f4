/**
 * Grouped counts as a dataset report: core/grouped's grouped-data maximum likelihood and Pearson
 * chi-square on the given classes (merged to ≥ 5 expected, k - 1 - m exact here), ranked by AICc
 * with n = the total count, in the issue-2 frame. Anderson–Darling is not offered (the reason is
 * stated in every candidate and in the section).
 */
import { PLUMBLINE_VERSION, resolveOptions } from '../analyze.js';
import { ppmOutOfSpec } from '../capability/index.js';
import { InputError } from '../errors.js';
import { DEFAULT_FAMILIES, getFamily } from '../families/index.js';
import { formatNumber } from '../gof/index.js';
import { analyzeGrouped, classMidpoints, GROUPED_AD_NOTE, prepareGrouped, type GroupedClass } from '../grouped/index.js';
import { RANKING_RULE, informationCriteria, rankCandidates } from '../rank.js';
import type { MethodNote, NotApplicableReport } from '../report.js';
import type { WorkflowSettings } from './options.js';
import { sensitivityRows } from './sensitivity.js';
import type { DatasetOptions, GroupedCandidateReport, GroupedDatasetReport } from './types.js';

export const GROUPED_DOF_RULE =
  'Pearson chi-square on the given classes, adjacent classes merged left to right until each expects at least 5 (the model refitted on the merged cells); degrees of freedom k - 1 - m, which is the exact large-sample rule here because the m parameters are maximum-likelihood estimates from these same grouped counts (Cramér 1946 §30.3; Cochran 1952). The Chernoff–Lehmann bracket applies only to parameters estimated from ungrouped values.';

function groupedVerdict(rank: number, deltaAicc: number, rejected: boolean, computable: boolean, alpha: number): string {
  const place = rank === 1 ? 'Best by AICc' : `Ranked ${rank} by AICc, ${formatNumber(deltaAicc)} above the best`;
  const fit = !computable
    ? 'the chi-square test on the classes could not be computed (Anderson–Darling is not offered for grouped data)'
    : rejected
      ? `rejected at α = ${formatNumber(alpha)} by the chi-square test on the classes: the counts are unlikely under this model`
      : `not rejected at α = ${formatNumber(alpha)} by the chi-square test on the classes (Anderson–Darling is not offered for grouped data)`;
  return `${place}; ${fit}.`;
}

function summaryOf(rows: readonly GroupedClass[], mids: Float64Array, total: number): GroupedDatasetReport['summary'] {
  let s = 0;
  for (let j = 0; j < rows.length; j++) s += (rows[j] as GroupedClass).count * (mids[j] as number);
  const mean = s / total;
  let ss = 0;
  for (let j = 0; j < rows.length; j++) ss += (rows[j] as GroupedClass).count * ((mids[j] as number) - mean) ** 2;
  const first = rows[0] as GroupedClass;
  const last = rows[rows.length - 1] as GroupedClass;
  return {
    min: Number.isFinite(first.lower) ? first.lower : (mids[0] as number),
    max: Number.isFinite(last.upper) ? last.upper : (mids[rows.length - 1] as number),
    mean,
    sd: total > 1 ? Math.sqrt(ss / (total - 1)) : 0,
    distinct: rows.length,
  };
}

export function groupedReport(rows: readonly GroupedClass[], options: DatasetOptions, settings: WorkflowSettings): GroupedDatasetReport {
  if (settings.returnPeriods !== null || settings.bLifePercents !== null || settings.reliabilityTimes.length > 0) {
    throw new InputError('Grouped counts support the model fit and ppm out of spec; B-lives, reliability and return levels need the individual values.', {}, 'bad-option');
  }
  const opts = resolveOptions({ ...options, families: options.families ?? DEFAULT_FAMILIES });
  const data = prepareGrouped(rows);
  const analysis = analyzeGrouped(data, { families: opts.families, alpha: opts.alpha });
  const n = data.total;
  const notApplicable: NotApplicableReport[] = [];
  const drafts = [];
  for (const c of analysis.candidates) {
    if (!c.fit.ok) {
      notApplicable.push({ family: c.fit.family, reason: c.fit.reason, offendingCount: c.fit.offendingCount });
      continue;
    }
    const family = getFamily(c.fit.family);
    const m = family.estimatedParameters;
    if (!(n - m - 1 > 0)) {
      notApplicable.push({ family: family.name, reason: `AICc is undefined with a total count of ${n} and ${m} parameters.`, offendingCount: 0 });
      continue;
    }
    drafts.push({ c, fit: c.fit, family: family.name, label: family.label, estimatedParameters: m, ...informationCriteria(c.fit.logLikelihood, m, n) });
  }
  const ranked = rankCandidates(drafts);
  const ad = { offered: false as const, reason: GROUPED_AD_NOTE };
  const candidates: GroupedCandidateReport[] = ranked.map((d) => {
    const cs = d.c.chiSquare ?? { computable: false as const, reason: 'not computed' };
    const rejected = cs.computable && cs.rejected;
    return {
      rank: d.rank,
      family: d.family,
      label: d.label,
      parameters: d.fit.parameters,
      estimatedParameters: d.estimatedParameters,
      logLikelihood: d.fit.logLikelihood,
      aic: d.aic,
      aicc: d.aicc,
      bic: d.bic,
      deltaAicc: d.deltaAicc,
      fit: { method: d.fit.method, iterations: d.fit.iterations, converged: d.fit.converged },
      chiSquare: cs,
      andersonDarling: ad,
      rejectedBy: rejected ? ['chi-square'] : [],
      verdict: groupedVerdict(d.rank, d.deltaAicc, rejected, cs.computable, opts.alpha),
      ...(settings.capability ? { ppmOutOfSpec: ppmOutOfSpec(getFamily(d.family).make(d.fit.parameters), settings.lsl, settings.usl) } : {}),
    };
  });
  const warnings: string[] = [];
  for (const c of candidates) {
    if (!c.chiSquare.computable) warnings.push(`${c.label}: chi-square test not computed. ${c.chiSquare.reason}`);
    if (!c.fit.converged) warnings.push(`${c.label}: the maximum-likelihood solver did not converge; treat its numbers with caution.`);
  }
  if (candidates.length > 0 && candidates.every((c) => c.rejectedBy.length > 0)) {
    warnings.push(`Every candidate is rejected at α = ${formatNumber(opts.alpha)}: none of these models describes the counts well; the ranking only says which is least bad.`);
  }
  for (const na of notApplicable) warnings.push(`${na.family}: not applicable. ${na.reason}`);
  const methods: MethodNote[] = [
    {
      topic: 'fitting',
      description: 'Grouped-data maximum likelihood: ℓ(θ) = Σ c_j ln P_θ(a_j < X ≤ b_j) over the classes, class probabilities in log space, maximised numerically.',
      source: 'Kulldorff (1961), Contributions to the Theory of Estimation from Grouped and Partially Grouped Samples [from memory].',
    },
    { topic: 'chi-square on classes', description: GROUPED_DOF_RULE, source: 'Cramér (1946), Mathematical Methods of Statistics, §30.3; Cochran (1952), Ann. Math. Stat. 23:315-345.' },
    { topic: 'Anderson–Darling', description: GROUPED_AD_NOTE, source: 'common practice, no source' },
    { topic: 'ranking', description: `${RANKING_RULE} For grouped counts n is the total count and ℓ the grouped log-likelihood.`, source: 'Akaike (1974); Hurvich & Tsai (1989), Biometrika 76:297-307; Schwarz (1978), Ann. Stat. 6:461-464.' },
  ];
  const sensitivity = settings.capability
    ? sensitivityRows(candidates, [{ quantity: 'ppm out of spec', value: (c: GroupedCandidateReport) => (c.ppmOutOfSpec ? { estimate: c.ppmOutOfSpec.total } : null) }])
    : undefined;
  return {
    software: { name: 'plumbline', version: PLUMBLINE_VERSION },
    n,
    summary: summaryOf(rows, classMidpoints(data), n),
    options: { ...opts, families: [...opts.families] },
    rankingRule: `${RANKING_RULE} For grouped counts n is the total count.`,
    candidates,
    notApplicable,
    warnings,
    methods,
    dataKind: 'grouped',
    grouped: {
      total: n,
      classes: rows.map((r) => ({ lower: r.lower, upper: r.upper, count: r.count })),
      chiSquareRule: GROUPED_DOF_RULE,
      andersonDarling: ad,
      notes: [...analysis.notes],
    },
    ...(sensitivity ? { sensitivity } : {}),
  };
}
