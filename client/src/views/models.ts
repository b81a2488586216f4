/**
 * "Which models can you design on?": the candidates sorted into those no test rejects (best by
 * AICc first), those a test rejects, and those not fitted, each said in words with the numbers
 * that decide it. Pure: report in, nodes out; main.ts wires the buttons (data-family) to selection.
 */
import type { AnalyzeResponse } from '../api.js';
import { styleFor } from '../../charts/palette.js';
import { el } from '../dom.js';
import { capital, modelLabel } from '../families.js';
import { chiSquareBootstrap, chiSquareDecidingP } from '../candidate-cells.js';
import { fixed, pValue } from '../format.js';
import type { CandidateReport, GroupedCandidateReport } from '../types.js';
import { testWords } from './test-words.js';

type Candidate = CandidateReport | GroupedCandidateReport;


/** The p-values in short: "A² p = 0.43 · χ² p = 0.21". */
function pWords(c: Candidate): string {
  const parts: string[] = [];
  const ad = c.andersonDarling;
  if (!('offered' in ad)) parts.push(`A² p ${ad.pValueIs === 'estimate' ? '= ' : ''}${pValue(ad.pValue, ad.pValueIs)}`);
  const chi = c.chiSquare;
  const asymptotic = chi.computable ? `${pValue(chi.pValue)}${'pValueUpper' in chi ? ` to ${pValue(chi.pValueUpper)}` : ''}` : '';
  if (chi.computable && chiSquareBootstrap(chi)) parts.push(`χ² ${chiSquareDecidingP(chi)} (asymptotic ${asymptotic})`);
  else if (chi.computable) parts.push(`χ² p = ${asymptotic}`);
  else parts.push('χ² not computed');
  return parts.join(' · ');
}

/** One sentence: can the user design on this model, and why (not). */
export function modelSentence(c: Candidate, alpha: number, best: boolean): string {
  if (c.rejectedBy.length > 0) return `Rejected by ${testWords(c.rejectedBy)} at α = ${alpha}: the data contradict it.`;
  if (!c.fit.converged) return 'The fit did not converge: not a maximum-likelihood estimate.';
  if (best) return `No test rejects it at α = ${alpha}, and it is the best by AICc.`;
  const d = c.deltaAicc;
  const support = d <= 2 ? 'about as well supported as the best' : d <= 7 ? 'less supported than the best' : 'much less supported than the best';
  return `No test rejects it at α = ${alpha}; AICc ${fixed(d, 1)} above the best (${support}).`;
}

function pick(c: Candidate, alpha: number, best: boolean, selected: string | null): HTMLElement {
  const style = styleFor(c.family);
  const swatch = el('span', { className: 'swatch', 'aria-hidden': 'true' });
  swatch.style.borderTopColor = style.colour;
  swatch.style.borderTopStyle = style.dash ? 'dashed' : 'solid';
  const name = capital(c.label || modelLabel(c.family));
  return el(
    'li',
    {},
    el(
      'button',
      { type: 'button', className: `model-pick${c.rejectedBy.length > 0 ? ' is-rejected' : ''}`, 'data-family': c.family, 'aria-pressed': String(c.family === selected) },
      el('span', { className: 'model-name' }, swatch, name),
      el('span', { className: 'model-say' }, modelSentence(c, alpha, best)),
      el('span', { className: 'model-nums' }, `rank ${c.rank} by AICc · Δ ${fixed(c.deltaAicc, 2)} · ${pWords(c)}`),
    ),
  );
}

/** The answer to "which models can I design on?" for the whole report. */
export function modelChoices(resp: AnalyzeResponse, selected: string | null): HTMLElement {
  const alpha = resp.options.alpha;
  const cands = resp.candidates as readonly Candidate[];
  const usable = cands.filter((c) => c.rejectedBy.length === 0);
  const rejected = cands.filter((c) => c.rejectedBy.length > 0);
  const bestUsable = usable[0]?.family;
  const box = el('div', { className: 'model-choices' });
  const lead =
    cands.length === 0
      ? 'No model could be fitted to these data.'
      : usable.length === 0
        ? `Every model tried is rejected at α = ${alpha}: none describes these data well enough to design on.`
        : usable.length === 1
          ? `One model survives the tests at α = ${alpha}: ${capital(usable[0]!.label)}.`
          : `${usable.length} models survive the tests at α = ${alpha}; ${capital(usable[0]!.label)} is the best of them by AICc. Passing a test does not prove a model right: check the evidence in the tail your decision depends on.`;
  box.append(el('p', { className: 'model-lead', id: 'summary-line' }, lead));
  if (usable.length > 0) {
    box.append(el('h3', { className: 'model-group' }, 'No test rejects these'), el('ul', { className: 'model-list', 'data-group': 'usable' }, ...usable.map((c) => pick(c, alpha, c.family === bestUsable && c.rank === 1, selected))));
  }
  if (rejected.length > 0) {
    box.append(el('h3', { className: 'model-group' }, 'Rejected by a test (shown for comparison)'), el('ul', { className: 'model-list', 'data-group': 'rejected' }, ...rejected.map((c) => pick(c, alpha, false, selected))));
  }
  if (resp.notApplicable.length > 0) {
    box.append(
      el(
        'div',
        { id: 'not-applicable' },
        el('h3', { className: 'model-group na-title' }, 'Not fitted'),
        el('ul', { className: 'na-list' }, ...resp.notApplicable.map((n) => el('li', {}, el('strong', {}, modelLabel(n.family)), `: ${n.reason}`))),
      ),
    );
  }
  return box;
}
