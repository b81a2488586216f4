/**
 * Information criteria and the ranking of fitted candidates.
 *
 * AIC = 2m - 2 ln L (Akaike 1974, IEEE Trans. Autom. Control 19:716-723);
 * AICc = AIC + 2m(m + 1)/(n - m - 1) (Hurvich & Tsai 1989, Biometrika 76:297-307);
 * BIC = m ln n - 2 ln L (Schwarz 1978, Ann. Stat. 6:461-464).
 * Candidates are ranked by AICc, smallest first; ties go to fewer estimated parameters, then to
 * the family name (alphabetical) so the order is always defined.
 */
import type { FamilyName } from './families/index.js';
import { formatNumber } from './gof/index.js';

export const RANKING_RULE =
  'Ranked by AICc = AIC + 2m(m + 1)/(n - m - 1) (Hurvich & Tsai 1989), smallest first; ties go to the model with fewer estimated parameters, then to the family name. AIC and BIC are reported too. deltaAicc is the difference from the best AICc (Burnham & Anderson 2002 rule of thumb [from memory]: up to 2 means substantial support, 4 to 7 considerably less, over 10 essentially none). A candidate rejected by a goodness-of-fit test at α is flagged, not removed.';

export interface InformationCriteria {
  readonly aic: number;
  readonly aicc: number;
  readonly bic: number;
}

/** AIC, AICc and BIC of a fit with log-likelihood `logL`, m estimated parameters, n values (n > m + 1). */
export function informationCriteria(logL: number, m: number, n: number): InformationCriteria {
  const aic = 2 * m - 2 * logL;
  return { aic, aicc: aic + (2 * m * (m + 1)) / (n - m - 1), bic: m * Math.log(n) - 2 * logL };
}

export interface Rankable {
  readonly family: FamilyName;
  readonly estimatedParameters: number;
  readonly aicc: number;
}

/** The ranking order: AICc, then fewer parameters, then name. */
export function compareCandidates(a: Rankable, b: Rankable): number {
  if (a.aicc !== b.aicc) return a.aicc - b.aicc;
  if (a.estimatedParameters !== b.estimatedParameters) return a.estimatedParameters - b.estimatedParameters;
  return a.family < b.family ? -1 : a.family > b.family ? 1 : 0;
}

/** Sorted copies with `rank` (1 = best) and `deltaAicc`. */
export function rankCandidates<T extends Rankable>(candidates: readonly T[]): (T & { rank: number; deltaAicc: number })[] {
  const sorted = [...candidates].sort(compareCandidates);
  const best = sorted[0]?.aicc ?? 0;
  return sorted.map((c, i) => ({ ...c, rank: i + 1, deltaAicc: c.aicc - best }));
}

export type TestName = 'chi-square' | 'anderson-darling';

/** The tests that reject at α (chi-square only when computable). */
export function rejectedBy(chiSquareRejected: boolean | null, andersonDarlingRejected: boolean): TestName[] {
  const out: TestName[] = [];
  if (chiSquareRejected === true) out.push('chi-square');
  if (andersonDarlingRejected) out.push('anderson-darling');
  return out;
}

/** Plain-words verdict for a ranked candidate. */
export function verdict(rank: number, deltaAicc: number, rejected: readonly TestName[], alpha: number, chiSquareComputable: boolean): string {
  const a = formatNumber(alpha);
  const place =
    rank === 1
      ? 'Best by AICc'
      : `Ranked ${rank} by AICc, ${formatNumber(deltaAicc)} above the best (${deltaAicc <= 2 ? 'still substantial support' : deltaAicc <= 7 ? 'less support' : deltaAicc <= 10 ? 'little support' : 'essentially no support'})`;
  const names = rejected.map((t) => (t === 'chi-square' ? 'the chi-square test' : 'the Anderson–Darling test'));
  let fit: string;
  if (names.length === 0) {
    fit = chiSquareComputable
      ? `not rejected at α = ${a} by either goodness-of-fit test`
      : `not rejected at α = ${a} by the Anderson–Darling test (the chi-square test was not computable)`;
  } else {
    fit = `rejected at α = ${a} by ${names.join(' and ')}: the data are unlikely under this model`;
  }
  return `${place}; ${fit}.`;
}
