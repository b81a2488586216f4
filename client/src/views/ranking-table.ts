/**
 * The test numbers of every candidate, on demand under the model choices: one row per model with
 * ln L, AICc, the chi-square and Anderson–Darling results (the cells of candidate-cells.ts, which
 * the exported report shares). Pure: report in, table body nodes out.
 */
import type { AnalyzeResponse } from '../api.js';
import { candidateCells } from '../candidate-cells.js';
import { el } from '../dom.js';

/** The header words that differ for class counts (chi-square on the given classes, no bracket). */
export function tableHeads(grouped: boolean): { chi: string; dof: string; chiP: string } {
  return grouped ? { chi: 'χ² (classes)', dof: 'dof k−1−m', chiP: 'p (χ²)' } : { chi: 'χ²', dof: 'dof [k−1]', chiP: 'p (χ²) [k−1]' };
}

export function rankingRows(resp: AnalyzeResponse, selected: string | null): HTMLElement[] {
  return resp.candidates.map((c) => {
    const k = candidateCells(c);
    const row = el('tr', { className: 'cand-main', 'data-family': c.family, 'aria-selected': String(c.family === selected) });
    row.append(
      el('td', { className: 'num' }, k.rank),
      el('td', { className: 'model' }, k.model),
      el('td', { className: 'params' }, ...k.parameters.split(' · ').map((p) => el('span', { className: 'p-line' }, p))),
      el('td', { className: 'num' }, k.logLikelihood),
      el('td', { className: 'num' }, k.aicc, el('span', { className: 'sub' }, k.deltaAicc)),
    );
    if (k.chiComputable) {
      row.append(
        el('td', { className: 'num' }, k.chiSquare, el('span', { className: 'sub' }, k.chiSquareNote)),
        el('td', { className: 'num' }, k.dofMain, el('span', { className: 'sub' }, k.dofBracket)),
        el('td', { className: 'num' }, k.chiPMain, el('span', { className: 'sub' }, k.chiPBracket)),
      );
    } else {
      row.append(el('td', { colspan: 3, className: 'na-cell' }, 'not computed', el('span', { className: 'sub wrap' }, k.chiSquareNote)));
    }
    if (k.adOffered) {
      row.append(el('td', { className: 'num' }, k.adStatistic), el('td', { className: 'num' }, k.adP, el('span', { className: 'sub' }, k.adMethod)));
    } else {
      row.append(el('td', { colspan: 2, className: 'na-cell ad-not-offered' }, k.adStatistic, el('span', { className: 'sub wrap' }, k.adMethodDetail)));
    }
    const words = el('tr', { className: 'cand-words' }, el('td', {}), el('td', { colspan: 9 }, k.verdict));
    return el('tbody', { className: 'cand', 'data-family': c.family }, row, words);
  });
}
