/**
 * The answer at the top of the page: the first decision number under the selected model, and the
 * cautions that undermine it, said next to it (the selected model is rejected by a test, its fit
 * did not converge, every model is rejected, a trend was found, the number lies far beyond the
 * record, another acceptable model gives a very different number). Pure: report in, words out.
 */
import type { ComparisonRow, DatasetCandidate, DatasetReport } from '../../../core/index.js';
import { capabilityAnswer, comparisonRowOf } from '../../../core/capability/answer.js';
import { chiSquareDecidingP } from '../candidate-cells.js';
import { capital } from '../families.js';
import { pValue, sig } from '../format.js';
import { end, pct, withU } from './numbers.js';
import { modesAnswer } from './answer-modes.js';
import { weibayesAnswer } from './answer-weibayes.js';
import { testWords } from './test-words.js';
import { intervalNoteOnPage } from './capability.js';

export interface Answer {
  /** The sentence with the number. */
  readonly sentence: string;
  /** What undermines it, most serious first; empty when nothing does. */
  readonly cautions: readonly string[];
  /** What would change the number when nothing undermines it: its range across the acceptable models, or ''. */
  readonly change: string;
  /** True when a caution says the number should not be used as it stands (rejected model, no convergence, trend). */
  readonly undermined: boolean;
}

/** The sensitivity rows' quantity names (core/workflow quantityNumber: 6 significant digits, plain). */
const q = (x: number): string => String(Number(x.toPrecision(6)));

const TEST_WORDS: Readonly<Record<string, string>> = { 'chi-square': testWords(['chi-square']), 'anderson-darling': testWords(['anderson-darling']) };

function testP(c: DatasetCandidate, test: string): string {
  if (test === 'chi-square' && c.chiSquare.computable) return ` (${chiSquareDecidingP(c.chiSquare)})`;
  if (test === 'anderson-darling' && !('offered' in c.andersonDarling)) return ` (p ${c.andersonDarling.pValueIs === 'estimate' ? '= ' : ''}${pValue(c.andersonDarling.pValue, c.andersonDarling.pValueIs)})`;
  return '';
}

/** The first decision number's sentence and what quantity it is (for the spread caution). */
function sentenceFor(r: DatasetReport, c: DatasetCandidate, u: string): { text: string; quantity: string | null } | null {
  const label = capital(c.label);
  const b = c.bLives?.[0];
  if (r.life && b) {
    return {
      text: `B${sig(b.percent, 3)} life under ${label}: ${withU(sig(b.estimate), u)} (two-sided ${pct(b.confidence)} bounds ${sig(b.lower)} to ${sig(b.upper)}), from ${r.life.failures} failures and ${r.life.suspensions} suspensions.`,
      quantity: `B${q(b.percent)} life`,
    };
  }
  const rl = c.returnLevels?.[c.returnLevels.length - 1];
  if (r.flood && rl) {
    return {
      text: `${sig(rl.period)}-year level under ${label}: ${withU(sig(rl.estimate), u)} (${pct(rl.confidence)} interval ${end(rl.lower, 'open')} to ${end(rl.upper, 'unbounded')})${rl.beyondRecord ? ', far beyond the record' : ''}.`,
      quantity: `return level T=${q(rl.period)}`,
    };
  }
  const cap = r.capability;
  const ppk = cap?.overall.find((x) => x.name === 'Ppk');
  if (cap && ppk) return { text: capabilitySentence(r, cap, ppk, c, label), quantity: 'ppm out of spec' };
  return null;
}

type Capability = NonNullable<DatasetReport['capability']>;

/**
 * Ppk and ppm under one and the same model, the one the capability section answers with (one
 * decision, core/capability/answer.ts): a transformation the user asked for when its transformed
 * values pass the normality test; else the selected model's percentile-method Ppk (ISO 22514-2,
 * the comparison row of that model, with its bootstrap interval when the report ran one for it)
 * next to its ppm; the normal-theory Ppk is named as such. Under the normal model, the
 * normal-theory Ppk with its lower bound.
 */
function capabilitySentence(r: DatasetReport, cap: Capability, ppk: Capability['overall'][number], c: DatasetCandidate, label: string): string {
  const normalPpk = `Ppk ${sig(ppk.estimate, 3)} (lower bound ${sig(ppk.lower, 3)})`;
  const gate = cap.normality && !cap.normality.passes ? ', but the normal model fails its test' : '';
  const a = capabilityAnswer(cap, r.candidates, c.family);
  const ownPpk = (row: ComparisonRow | null) => row?.indices.find((x) => x.name === 'Ppk');
  const interval = a.intervals?.intervals?.find((x) => x.name === 'Ppk');
  const bound = interval ? ` (${pct(interval.confidence)} interval ${sig(interval.lower, 3)} to ${sig(interval.upper, 3)})` : '';
  const tr = a.basis === 'transformation' ? a.row : null;
  const trPpk = ownPpk(tr);
  if (tr && trPpk) {
    return `Ppk ${sig(trPpk.estimate, 3)}${bound} under ${tr.model}, the transformation asked for, by its percentiles (ISO 22514-2); ${sig(tr.ppmTotal, 3)} ppm out of tolerance under ${tr.model}. Normal theory gives ${normalPpk}${gate}.`;
  }
  const ppm = `${sig(c.ppmOutOfSpec?.total ?? cap.normalPpm.total, 3)} ppm out of tolerance under ${label}`;
  if (c.family === 'normal') return `${normalPpk} under the normal model${gate}; ${ppm}.`;
  const own = ownPpk(comparisonRowOf(cap.comparison, c));
  if (!own) return `${ppm}; normal-theory ${normalPpk}${gate}.`;
  const ownBound = a.family === c.family ? bound : '';
  return `Ppk ${sig(own.estimate, 3)}${ownBound} under ${label} by its percentiles (ISO 22514-2); ${ppm}. Normal theory gives ${normalPpk}${gate}.`;
}

/** ppm out of tolerance over the capability comparison's passing rows (a transformation included), as the sensitivity rows give it. */
function capabilitySpread(r: DatasetReport): { values: readonly unknown[]; min: number; max: number } | undefined {
  const passing = r.capability?.comparison.passing ?? [];
  if (passing.length === 0) return undefined;
  const ppm = passing.map((x) => x.ppmTotal);
  return { values: passing, min: Math.min(...ppm), max: Math.max(...ppm) };
}

export function answerFor(r: DatasetReport, selected: string | null, units: string): Answer | null {
  // With a failure-mode column the answer is the whole unit's life from the modes (answer-modes.ts), not a fit that mixes them.
  const byModes = modesAnswer(r, units);
  if (byModes) return byModes;
  const c = r.candidates.find((x) => x.family === selected) ?? r.candidates[0];
  // No model fitted (no or too few failures) but a shape given from experience: the Weibayes lower bounds (answer-weibayes.ts).
  if (!c) return weibayesAnswer(r, units);
  const s = sentenceFor(r, c, units.trim());
  if (!s) return null;
  const label = capital(c.label);
  const alpha = r.options.alpha;
  const cautions: string[] = [];
  let undermined = false;
  // A transformation the user asked for carries the capability number: the selected model's rejection, fit and warnings are not its.
  const capAnswer = s.quantity === 'ppm out of spec' && r.capability ? capabilityAnswer(r.capability, r.candidates, c.family) : null;
  const viaTransform = capAnswer?.basis === 'transformation';
  if (c.rejectedBy.length > 0 && !viaTransform) {
    undermined = true;
    const tests = c.rejectedBy.map((t) => `${TEST_WORDS[t] ?? t}${testP(c, t)}`).join(' and ');
    const ok = r.candidates.find((x) => x.rejectedBy.length === 0);
    cautions.push(`${label} is rejected by ${tests} at α = ${alpha}: the data contradict this model, so do not design on this number.${ok ? ` The best model no test rejects is ${capital(ok.label)}.` : ' No model tried passes every test.'}`);
  }
  if (!c.fit.converged && !viaTransform) {
    undermined = true;
    cautions.push(`The ${label} fit did not converge (${c.fit.method}, ${c.fit.iterations} iterations): the number is not a maximum-likelihood estimate.`);
  }
  if (r.trend?.trendDetected) {
    undermined = true;
    cautions.push(`A trend was found over time (Mann–Kendall p = ${pValue(r.trend.pValue)}): the values may not come from one distribution, which this number assumes.`);
  }
  // The warnings of the section that gave the number (not those about other models, nor the rejection said above).
  const section = s.quantity?.startsWith('B') ? r.life : s.quantity?.startsWith('return level') ? r.flood : r.capability;
  const others = r.candidates.filter((x) => x !== c).flatMap((x) => [x.label, capital(x.label)]);
  const own = (section?.warnings ?? []).filter((w) => !others.some((l) => w.startsWith(`${l}:`)) && !w.startsWith(`${c.label}:`) && !w.startsWith(`${label}:`) && !/^Every candidate is rejected/.test(w));
  const rl = c.returnLevels?.[c.returnLevels.length - 1];
  if (r.flood && rl?.beyondRecord && !own.some((w) => /record/.test(w))) cautions.push(`The ${sig(rl.period)}-year level is more than twice the ${r.flood.recordLength}-year record: the model's tail, not the data, sets it.`);
  // A spread is drawn only across models no test rejects: across rejected ones it says nothing (the rejection is said above).
  // Under a transformation, the spread over the same passing rows as the capability section's (the transformation among them).
  const row = viaTransform ? capabilitySpread(r) : s.quantity ? r.sensitivity?.find((x) => x.quantity === s.quantity && x.basis === 'passing') : undefined;
  let change = '';
  const which = 'models no test rejects';
  if (row && row.values.length > 1 && row.min > 0 && row.max / row.min >= 1.25) {
    cautions.push(`Across the ${which} this number runs from ${sig(row.min)} to ${sig(row.max)} (a factor of ${sig(row.max / row.min, 3)}): the choice of model moves it; see ${viaTransform ? '“Can it meet the tolerance?” (the transformation is among those models there)' : '“What would change the answer”'}.`);
  } else if (row && row.values.length > 1) {
    change = `Across the ${row.values.length} ${which} it runs from ${sig(row.min)} to ${sig(row.max)}: the choice among them changes it little.`;
  } else if (row && row.values.length === 1) {
    change = `No other model passes the tests, so there is nothing to compare it with.`;
  }
  // A point estimate without an interval (a Johnson curve's is withheld, too much work): why, beside the number.
  // Its first sentence only: the section beside it gives the measured reason in full.
  // (Only where the sentence quotes the answer's own Ppk: the transformation's, or the selected fitted model's row.)
  const quotesAnswer = viaTransform || (capAnswer?.basis === 'selected model' && capAnswer.family === c.family);
  const why = quotesAnswer && capAnswer ? intervalNoteOnPage(capAnswer) : null;
  if (why) cautions.push(`${why.split(/(?<=\.) /)[0]?.replace(/\.$/, '')}; the Ppk above is a point estimate (more in “Can it meet the tolerance?”).`);
  for (const w of own) cautions.push(w);
  if (!viaTransform) for (const w of c.warnings ?? []) cautions.push(`${label}: ${w}`);
  return { sentence: s.text, cautions, change, undermined };
}
