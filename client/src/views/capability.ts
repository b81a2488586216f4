/**
 * The capability section, led by the answer: how much of the tolerance the process uses (Ppk with
 * its lower bound) and how many parts fall outside; then, model by model, what the share outside
 * would be; the indices themselves (overall and within-subgroup spread in one table, each row
 * saying which spread it uses) on demand. Pure.
 */
import { capital } from '../families.js';
import { sig } from '../format.js';
import type { BlockLine, BlockTable, SectionView } from './block.js';
import { pct } from './numbers.js';
import { testWords } from './test-words.js';

/** Parts per million in words: "12 ppm (3 below LSL, 9 above USL)". */
function ppmWords(p: { belowLsl: number; aboveUsl: number; total: number }): string {
  return `${sig(p.total, 3)} ppm (${sig(p.belowLsl, 3)} below LSL, ${sig(p.aboveUsl, 3)} above USL)`;
}

export const capabilitySection: SectionView = ({ report: r, selected: c, units: u }) => {
  const cap = r.capability;
  if (!cap) return null;
  const limits = [cap.lsl !== null ? `LSL ${sig(cap.lsl, 6)}` : 'no lower limit', cap.usl !== null ? `USL ${sig(cap.usl, 6)}` : 'no upper limit', ...(cap.target !== null ? [`target ${sig(cap.target, 6)}`] : [])];
  const ppk = cap.overall.find((x) => x.name === 'Ppk');
  const under = c?.ppmOutOfSpec ? { label: c.label, ppm: c.ppmOutOfSpec } : { label: 'the normal model (overall mean and sd)', ppm: cap.normalPpm };
  const gateFails = cap.normality !== undefined && cap.normality !== null && !cap.normality.passes;
  const answer = ppk
    ? `Ppk ${sig(ppk.estimate, 3)}, lower bound ${sig(ppk.lower, 3)} (two-sided ${pct(cap.confidence)}): about ${ppmWords(under.ppm)} outside the tolerance under ${under.label}.${gateFails ? ' The normal model fails its test, so read the percentile method below.' : ''}`
    : undefined;
  const lines: BlockLine[] = [
    { kind: 'fact', text: `Tolerance: ${limits.join(', ')}${u ? ` (${u})` : ''}. n = ${cap.n}, mean ${sig(cap.mean, 6)}, overall sd ${sig(cap.sdOverall, 4)} (n − 1).` },
  ];
  if (cap.normality) lines.push({ kind: cap.normality.passes ? 'fact' : 'warning', text: `Normality gate: ${cap.normality.statement}` });
  else lines.push({ kind: 'note', text: 'Normality gate: the normal model was not among the candidates.' });
  lines.push({ kind: 'note', text: cap.gateRule });
  // What would change it: the share outside under every fitted model, the tests' word on each.
  for (const m of r.candidates.filter((x) => x.ppmOutOfSpec)) {
    lines.push({ kind: 'fact', text: `Under ${capital(m.label)} (${m.rejectedBy.length === 0 ? 'no test rejects it' : `rejected by ${testWords(m.rejectedBy)}`}): ${ppmWords(m.ppmOutOfSpec!)} outside.` });
  }
  lines.push({ kind: 'fact', text: `Under a normal model with the overall mean and sd: ${ppmWords(cap.normalPpm)} outside.` });
  const rows: string[][] = cap.overall.map((x) => [x.name, 'overall sd (n − 1)', sig(x.estimate, 4), `${sig(x.lower, 4)} to ${sig(x.upper, 4)}`, x.intervalMethod]);
  if (cap.within) for (const x of cap.within.indices) rows.push([x.name, `within subgroups: ${cap.within.description}, ${cap.within.subgroups} subgroups (σ ${sig(cap.within.sigma, 4)})`, sig(x.estimate, 4), `${sig(x.lower, 4)} to ${sig(x.upper, 4)}`, x.intervalMethod]);
  const tables: BlockTable[] = [
    { caption: `Capability indices, each with the spread it uses; two-sided ${pct(cap.confidence)} intervals.`, head: ['Index', 'Spread used', 'Estimate', 'Interval', 'Interval method'], rows, folded: true },
  ];
  if (cap.percentile) {
    tables.push({
      caption: `Percentile method (ISO 22514-2) under ${cap.percentile.family}: quantiles 0.135 % = ${sig(cap.percentile.lowerQuantile, 6)}, median ${sig(cap.percentile.median, 6)}, 99.865 % = ${sig(cap.percentile.upperQuantile, 6)}. ${cap.percentile.method}`,
      head: ['Index', 'Estimate'],
      rows: cap.percentile.indices.map((x) => [x.name, sig(x.estimate, 4)]),
      folded: !gateFails,
    });
  }
  if (cap.resolution.warning) lines.push({ kind: 'warning', text: `Gauge resolution: ${cap.resolution.warning}` });
  for (const w of cap.warnings) if (w !== cap.resolution.warning) lines.push({ kind: 'warning', text: w });
  for (const k of cap.cautions) lines.push({ kind: 'caution', text: k });
  return {
    id: 'capability',
    title: 'Against the tolerance',
    ...(answer ? { answer } : {}),
    lead: 'How much of the tolerance the process uses, and how many parts fall outside under each model.',
    lines,
    tables,
    charts: ['capability-histogram'],
  };
};
