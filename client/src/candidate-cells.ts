/**
 * The ranking table's cells as plain text, shared by the page and the exported report so that
 * both say exactly the same thing. Pure: report in, strings out.
 */
import type { CandidateReport } from './types.js';
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
  readonly adStatistic: string;
  readonly adP: string;
  readonly adMethod: string;
  readonly adMethodDetail: string;
  readonly rejected: boolean;
  readonly badge: string;
  readonly verdict: string;
}

const TEST_NAMES: Readonly<Record<string, string>> = { 'chi-square': 'χ²', 'anderson-darling': 'A²' };

export function parametersText(c: CandidateReport): string {
  return Object.entries(c.parameters)
    .map(([name, v]) => `${name} ${sig(v, 5)}`)
    .join(' · ');
}

export function candidateCells(c: CandidateReport): CandidateCells {
  const chi = c.chiSquare;
  const ad = c.andersonDarling;
  const rejected = c.rejectedBy.length > 0;
  const adMethod =
    ad.method === 'bootstrap'
      ? `bootstrap, B = ${ad.replicates ?? '?'}${ad.monteCarloStandardError !== undefined ? `, ± ${sig(ad.monteCarloStandardError, 2)}` : ''}`
      : 'published formula';
  return {
    rank: String(c.rank),
    model: c.label ? c.label[0]!.toUpperCase() + c.label.slice(1) : c.family,
    parameters: parametersText(c),
    logLikelihood: fixed(c.logLikelihood, 2),
    aicc: fixed(c.aicc, 2),
    deltaAicc: `Δ ${fixed(c.deltaAicc, 2)}`,
    chiComputable: chi.computable,
    chiSquare: chi.computable ? sig(chi.statistic, 4) : 'not computed',
    chiSquareNote: chi.computable ? `k = ${chi.k} bins` : chi.reason,
    chiSquareShort: chi.computable ? `k = ${chi.k} bins` : (chi.reason.split(/[:.;]/)[0] ?? chi.reason).trim(),
    dof: chi.computable ? `${chi.dof} [${chi.dofUpper}]` : '—',
    chiP: chi.computable ? `${pValue(chi.pValue)} [${pValue(chi.pValueUpper)}]` : '—',
    dofMain: chi.computable ? String(chi.dof) : '—',
    dofBracket: chi.computable ? `[${chi.dofUpper}]` : '',
    chiPMain: chi.computable ? pValue(chi.pValue) : '—',
    chiPBracket: chi.computable ? `[${pValue(chi.pValueUpper)}]` : '',
    adStatistic: sig(ad.statistic, 4),
    adP: pValue(ad.pValue, ad.pValueIs),
    adMethod,
    adMethodDetail: ad.methodDetail,
    rejected,
    badge: rejected ? `✗ rejected by ${c.rejectedBy.map((t) => TEST_NAMES[t] ?? t).join(' and ')}` : '✓ not rejected',
    verdict: c.verdict,
  };
}
