/**
 * Draw the four evidence charts of one candidate into four containers. Used by the page and by
 * the report export, so both show the same pictures.
 */
import { binCountsChart } from '../charts/bin-counts.js';
import { cdfChart } from '../charts/cdf.js';
import { histogramChart } from '../charts/histogram.js';
import type { ChartOptions } from '../charts/options.js';
import { probabilityPlotChart } from '../charts/probability-plot.js';
import type { CandidateEvidence, Evidence } from './types.js';

export interface ChartTargets {
  readonly histogram: Element;
  readonly probability: Element;
  readonly bins: Element;
  readonly cdf: Element;
}

export function evidenceFor(evidence: Evidence, family: string): CandidateEvidence | undefined {
  return evidence.candidates.find((c) => c.family === family);
}

/**
 * The horizontal range for the histogram and CDF charts of one candidate: the data and the
 * candidate's inner bin edges, padded by 4%, inside the core's suggested domain. (The core's
 * domain covers every candidate's bins, which for a poorly fitting candidate can dwarf the data.)
 */
export function displayDomain(evidence: Evidence, ce: CandidateEvidence): [number, number] {
  let lo = evidence.min;
  let hi = evidence.max;
  const bars = ce.histogram.bars;
  for (let i = 0; i + 1 < bars.length; i++) {
    const edge = bars[i]!.upper;
    if (Number.isFinite(edge)) {
      lo = Math.min(lo, edge);
      hi = Math.max(hi, edge);
    }
  }
  // Take in the outer bars' drawn edges when they lie close to the data (within a quarter of
  // the range), so that they are not cut for a sliver; far-reaching ones are cut and labelled.
  const reach = (hi - lo) * 0.25;
  const first = bars[0];
  const last = bars[bars.length - 1];
  if (first && first.lower < lo && first.lower >= lo - reach) lo = first.lower;
  if (last && last.upper > hi && last.upper <= hi + reach) hi = last.upper;
  const pad = (hi - lo) * 0.02 || Math.abs(lo) * 0.01 || 1;
  return [Math.max(lo - pad, evidence.xDomain[0]), Math.min(hi + pad, evidence.xDomain[1])];
}

export function drawEvidence(
  targets: ChartTargets,
  evidence: Evidence,
  family: string,
  options: { readonly units: string; readonly quantity: string; readonly sizeOf: (el: Element) => { width: number; height: number } },
): SVGSVGElement[] {
  const ce = evidenceFor(evidence, family);
  if (!ce) return [];
  const domain = displayDomain(evidence, ce);
  const opt = (el: Element): ChartOptions => ({ ...options.sizeOf(el), units: options.units, quantity: options.quantity || 'Value' });
  return [
    histogramChart(
      targets.histogram,
      { histogram: ce.histogram, densities: evidence.densities, xDomain: domain, selected: family, selectedLabel: ce.label, censoring: evidence.censoring },
      opt(targets.histogram),
    ),
    probabilityPlotChart(targets.probability, { plot: ce.probabilityPlot, family, label: ce.label }, opt(targets.probability)),
    binCountsChart(targets.bins, { bins: ce.bins, family, label: ce.label }, opt(targets.bins)),
    cdfChart(targets.cdf, { cdf: evidence.cdf, xDomain: domain, selected: family }, opt(targets.cdf)),
  ];
}

/** The bins table of one candidate as rows of text (header first), for the page and the report.
 *  A censored sample has no bins: one column saying so, and why. */
export function binsTableRows(ce: CandidateEvidence, format: (x: number | null, isLower: boolean) => string): string[][] {
  const na = ce.bins.notApplicable;
  if (na) return [['Bins: not applicable (censored)'], [na.reason]];
  const head = ['Bin', 'From', 'To', 'Observed', 'Expected', 'Residual', 'Adds to χ²'];
  const rows = ce.bins.rows.map((r) => [
    String(r.index + 1),
    format(r.lower, true),
    format(r.upper, false),
    String(r.observed),
    Number(r.expected.toPrecision(4)).toString(),
    Number(r.pearsonResidual.toPrecision(3)).toString().replace(/^-/, '−'),
    Number(r.contribution.toPrecision(3)).toString(),
  ]);
  return [head, ...rows];
}
