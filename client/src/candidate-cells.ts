/**
 * The ranking table's cells as plain text, shared by the page and the exported report so that
 * both say exactly the same thing. Pure: report in, strings out.
 */
import type { CandidateReport, GroupedCandidateReport } from './types.js';
import { fixed, pValue, sig } from './format.js';

export interface CandidateCells {
  readonly rank: string;
  readonly model: string;
  readonly parameters: string;
  readonly logLikelihood: string;
  readonly aicc: string;
  readonly deltaAicc: string;
  /** Chi-square statistic, or the reason it was not computed. */
  readonly chiSquare: string;
  readonly chiSquareNote: string;
  /** The reason's first clause, for a narrow table cell (the full reason is `chiSquareNote`). */
  readonly chiSquareShort: string;
  readonly dof: string;
  readonly dofMain: string;
  readonly dofBracket: string;
  readonly chiPMain: string;
  readonly chiPBracket: string;
  readonly chiP: string;
  readonly chiComputable: boolean;
  /** False for grouped counts: no Anderson–Darling test (the reason is `adMethodDetail`). */
  readonly adOffered: boolean;
  readonly adStatistic: string;
  readonly adP: string;
  readonly adMethod: string;
  readonly adMethodDetail: string;
  readonly rejected: boolean;
  readonly badge: string;
  readonly verdict: string;
}

const TEST_NAMES: Readonly<Record<string, string>> = { 'chi-square': 'χ²', 'anderson-darling': 'A²' };

/** The chi-square's parametric-bootstrap p-value when it decides the test (core decidedBy 'bootstrap'), else null. */
export function chiSquareBootstrap(chi: (CandidateReport | GroupedCandidateReport)['chiSquare']): { readonly pValue: number; readonly monteCarloStandardError: number; readonly replicates: number } | null {
  if (!chi.computable || !('decidedBy' in chi) || chi.decidedBy !== 'bootstrap' || !chi.bootstrap) return null;
  return chi.bootstrap;
}

/** The deciding chi-square p-value in words: "bootstrap p = 0.031" when the bootstrap decides, else "p = 0.042". */
export function chiSquareDecidingP(chi: (CandidateReport | GroupedCandidateReport)['chiSquare']): string {
  if (!chi.computable) return '';
  const boot = chiSquareBootstrap(chi);
  return boot ? `bootstrap p = ${pValue(boot.pValue)}` : `p = ${pValue(chi.pValue)}`;
}

export function parametersText(c: CandidateReport | GroupedCandidateReport): string {
  return Object.entries(c.parameters)
    .map(([name, v]) => `${name} ${sig(v, 5)}`)
    .join(' · ');
}

/** A ranking row: a complete-sample or censored candidate, or a grouped-counts one (chi-square on the given classes with k − 1 − m dof, asymptotic p; no A²). */
export function candidateCells(c: CandidateReport | GroupedCandidateReport): CandidateCells {
  const chi = c.chiSquare;
  const ad = c.andersonDarling;
  const rejected = c.rejectedBy.length > 0;
  const adOffered = !('offered' in ad);
  const adMethod =
    'offered' in ad
      ? 'grouped data'
      : ad.method === 'bootstrap'
        ? `bootstrap, B = ${ad.replicates ?? '?'}${ad.monteCarloStandardError !== undefined ? `, ± ${sig(ad.monteCarloStandardError, 2)}` : ''}`
        : 'published formula';
  // Grouped counts: the test runs on the given classes (merged to ≥ 5 expected), k − 1 − m with no bracket (the p-value is asymptotic).
  const grouped = chi.computable && 'classesGiven' in chi ? chi : null;
  const upper = chi.computable && !('classesGiven' in chi) ? chi : null;
  const note = grouped ? `k = ${grouped.k} of ${grouped.classesGiven} classes` : upper ? `k = ${upper.k} bins` : '';
  // When the parametric bootstrap decides, its p is the deciding value and the asymptotic pair stands beside it.
  const boot = chiSquareBootstrap(chi);
  return {
    rank: String(c.rank),
    model: c.label ? c.label[0]!.toUpperCase() + c.label.slice(1) : c.family,
    parameters: parametersText(c),
    logLikelihood: fixed(c.logLikelihood, 2),
    aicc: fixed(c.aicc, 2),
    deltaAicc: `Δ ${fixed(c.deltaAicc, 2)}`,
    chiComputable: chi.computable,
    chiSquare: chi.computable ? sig(chi.statistic, 4) : 'not computed',
    chiSquareNote: chi.computable ? note : chi.reason,
    chiSquareShort: chi.computable ? note : (chi.reason.split(/[:.;]/)[0] ?? chi.reason).trim(),
    dof: upper ? `${upper.dof} [${upper.dofUpper}]` : grouped ? `${grouped.dof} (k − 1 − m)` : '—',
    chiP: upper ? `${pValue(upper.pValue)} [${pValue(upper.pValueUpper)}]` : grouped ? pValue(grouped.pValue) : '—',
    dofMain: chi.computable ? String(chi.dof) : '—',
    dofBracket: upper ? `[${upper.dofUpper}]` : grouped ? 'k − 1 − m, asymptotic' : '',
    chiPMain: boot ? chiSquareDecidingP(chi) : chi.computable ? pValue(chi.pValue) : '—',
    chiPBracket: boot && upper ? `asymptotic ${pValue(upper.pValue)} [${pValue(upper.pValueUpper)}]; bootstrap ± ${sig(boot.monteCarloStandardError, 2)}, B = ${boot.replicates}` : upper ? `[${pValue(upper.pValueUpper)}]` : '',
    adOffered,
    adStatistic: 'offered' in ad ? 'not offered' : sig(ad.statistic, 4),
    adP: 'offered' in ad ? '—' : pValue(ad.pValue, ad.pValueIs),
    adMethod,
    adMethodDetail: 'offered' in ad ? ad.reason : ad.methodDetail,
    rejected,
    badge: rejected ? `✗ rejected by ${c.rejectedBy.map((t) => TEST_NAMES[t] ?? t).join(' and ')}` : '✓ not rejected',
    verdict: c.verdict,
  };
}
