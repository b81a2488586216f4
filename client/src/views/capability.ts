/**
 * The capability section, built around three questions: can this process meet the tolerance, by
 * how much (the room between the process's 0.135 % / 99.865 % points and each limit, and the share
 * expected outside), and what would change that (centering, the model one believes, the process's
 * stability). Only models that pass the tests carry the answer; rejected ones are listed apart.
 * Every number names its model and the spread it uses. Pure: report in, block out.
 */
import type { ComparisonRow, DatasetReport, PercentileIntervals } from '../../../core/index.js';
import { capabilityAnswer, comparisonRowOf, noIntervalNote, type CapabilityAnswer } from '../../../core/capability/answer.js';
import { RUN_RULE_WORDS } from '../../../core/capability/run-rules.js';
import { capital, modelLabel } from '../families.js';
import { sig } from '../format.js';
import { testNames } from './test-words.js';
import type { BlockLine, BlockTable, SectionView } from './block.js';
import { pct } from './numbers.js';

type Cap = NonNullable<DatasetReport['capability']>;

/** "12 ppm, about 1 part in 83,000" (or "none expected"). */
export function shareWords(ppm: number): string {
  if (!(ppm > 0)) return 'none expected';
  const oneIn = 1e6 / ppm;
  const inWords = oneIn >= 2 ? `, about 1 part in ${sig(oneIn, 2)}` : '';
  return `${sig(ppm, 3)} ppm${inWords}`;
}

function intervalOf(name: string, iv: PercentileIntervals | null | undefined): string {
  const i = iv?.intervals?.find((x) => x.name === name);
  return i ? ` (${pct(i.confidence)} bootstrap interval ${sig(i.lower, 3)} to ${sig(i.upper, 3)})` : '';
}

/** Room between the model's 0.135 % / 99.865 % points and each limit, under the model the answer stands on. */
function headroom(cap: Cap, row: ComparisonRow | null, u: string): BlockLine[] {
  let lo = cap.mean - 3 * cap.sdOverall;
  let hi = cap.mean + 3 * cap.sdOverall;
  let basis = 'under the normal model (mean ± 3 overall sd)';
  if (row && row.kind !== 'normal') {
    lo = row.lowerQuantile;
    hi = row.upperQuantile;
    basis = `under ${modelName(row)}${row.passes ? '' : ' (rejected by a test)'}`;
  } else if (row) {
    if (!row.passes) basis += ' (rejected by a test)';
  } else if (cap.percentile) {
    lo = cap.percentile.lowerQuantile;
    hi = cap.percentile.upperQuantile;
    basis = `under ${capital(modelLabel(cap.percentile.family))} (rejected by a test, as every model is here)`;
  } else basis += ' (rejected by a test, as every model is here)';
  const lines: BlockLine[] = [];
  const unit = u ? ` ${u}` : '';
  if (cap.usl !== null) {
    const room = cap.usl - hi;
    lines.push({ kind: room >= 0 ? 'fact' : 'warning', text: `Upper side: the 99.865 % point (${sig(hi, 5)}${unit}) is ${sig(Math.abs(room), 3)}${unit} ${room >= 0 ? 'inside' : 'beyond'} the USL ${basis}.` });
  }
  if (cap.lsl !== null) {
    const room = lo - cap.lsl;
    lines.push({ kind: room >= 0 ? 'fact' : 'warning', text: `Lower side: the 0.135 % point (${sig(lo, 5)}${unit}) is ${sig(Math.abs(room), 3)}${unit} ${room >= 0 ? 'inside' : 'beyond'} the LSL ${basis}.` });
  }
  return lines;
}

/** Why the answer's Ppk has no interval, with the model named as the page names it (core/capability/answer.ts). */
export function intervalNoteOnPage(a: CapabilityAnswer): string | null {
  return a.row && a.intervalNote === noIntervalNote(a.row.model) ? noIntervalNote(modelName(a.row)) : a.intervalNote;
}

/** A model's one label with its one case (as everywhere on the page); a transformation row keeps its own words. */
function modelName(row: ComparisonRow): string {
  return row.kind === 'transformation' ? row.model : capital(row.model);
}

/**
 * Where the model lives, and with a natural lower bound the share it puts below that bound (the core's
 * ppmBelowNaturalBound; the CLI's 'ppm below bound' column): a model reaching below a bound the
 * characteristic cannot cross is flagged with that share, as the bound's note promises.
 */
function supportWords(r: ComparisonRow, bound: number | null): string {
  const below = r.ppmBelowNaturalBound;
  if (bound === null || below === null || !(below > 0)) return r.support;
  return `${r.support}; below the natural bound ${sig(bound, 6)}: ${shareWords(below)}`;
}

function comparisonRows(rows: readonly ComparisonRow[], bound: number | null): string[][] {
  return rows.map((r) => {
    const ppk = r.indices.find((i) => i.name === 'Ppk');
    const sides = `${sig(r.ppmBelow, 3)} below, ${sig(r.ppmAbove, 3)} above`;
    return [modelName(r), r.kind === 'normal' ? 'overall sd (n − 1)' : 'its 0.135 %, 50 %, 99.865 % points', ppk ? sig(ppk.estimate, 3) : '—', `${shareWords(r.ppmTotal)} (${sides})`, supportWords(r, bound), ...(r.passes ? [] : [testNames(r.rejectedBy)])];
  });
}

export const capabilitySection: SectionView = ({ report: r, selected, units: u }) => {
  const cap = r.capability;
  if (!cap) return null;
  const limits = [cap.lsl !== null ? `LSL ${sig(cap.lsl, 6)}` : 'no lower limit', cap.usl !== null ? `USL ${sig(cap.usl, 6)}` : 'no upper limit', ...(cap.target !== null ? [`target ${sig(cap.target, 6)}`] : [])];
  // The model the answer stands on and its own interval: one decision with the headline (core/capability/answer.ts).
  const decided = capabilityAnswer(cap, r.candidates, selected?.family ?? null);
  const { row, intervals: chosenIntervals } = decided;
  const intervalNote = intervalNoteOnPage(decided);
  const t = cap.transform;
  const ppk = row?.indices.find((i) => i.name === 'Ppk');
  const unstable = cap.stability ? !cap.stability.stable : false;
  const first = unstable ? 'Not yet answerable with confidence — the process is not shown to be stable. ' : '';
  const answer = row
    ? `${first}${unstable ? 'As measured: a' : 'A'}bout ${shareWords(row.ppmTotal)} outside the tolerance under ${modelName(row)}${row.passes ? '' : ' (a model the tests reject)'}${ppk ? `; Ppk ${sig(ppk.estimate, 3)}${intervalOf('Ppk', chosenIntervals)}` : ''}.`
    : `${first}No model passes the tests, so no share outside the tolerance can be stated with a model behind it; the rejected models below show what each would say.`;

  const lines: BlockLine[] = [
    { kind: 'fact', text: `Tolerance: ${limits.join(', ')}${u ? ` (${u})` : ''}. n = ${cap.n}, mean ${sig(cap.mean, 6)}, overall sd ${sig(cap.sdOverall, 4)} (n − 1).` },
  ];
  if (cap.bounds) lines.push({ kind: 'note', text: cap.bounds.statement });
  // Another passing model that a reader may look for (the normal theory, a transformation): named as a comparison, never as the answer.
  const selectedRow = selected ? comparisonRowOf(cap.comparison, selected) : null;
  for (const other of (cap.comparison?.passing ?? []).filter((x) => x !== row && (x.kind === 'normal' || x.kind === 'transformation' || x === selectedRow))) {
    const k = other.indices.find((i) => i.name === 'Ppk');
    lines.push({ kind: 'note', text: `For comparison only, under ${other.kind === 'normal' ? 'the normal model (overall sd, n − 1)' : modelName(other)}${other === selectedRow ? ' (the model selected above)' : ''}: ${shareWords(other.ppmTotal)}${k ? `, Ppk ${sig(k.estimate, 3)}` : ''}; the answer above stands on ${row ? modelName(row) : 'no model'}.` });
  }
  // Why an index has no interval (a Johnson curve's interval is withheld, too much work, ...): said once, beside the answer.
  const transformNote = t && t.kind !== 'none' && !t.intervals.intervals ? t.intervals.note : null;
  for (const note of new Set([intervalNote, transformNote])) if (note) lines.push({ kind: 'warning', text: note });
  // By how much
  lines.push(...headroom(cap, row, u));
  // What would change it
  const pp = cap.overall.find((x) => x.name === 'Pp');
  const ppkN = cap.overall.find((x) => x.name === 'Ppk');
  if (pp && ppkN && pp.estimate > ppkN.estimate * 1.05) {
    lines.push({ kind: 'note', text: `Centering: the process sits off the middle of the tolerance; centred, its normal-theory Pp ${sig(pp.estimate, 3)} is what Ppk (${sig(ppkN.estimate, 3)}) could become.` });
  }
  const spread = cap.comparison?.spread;
  if (spread) lines.push({ kind: 'note', text: `The model matters: among models that pass the tests, the share outside ranges from ${sig(spread.lowest, 3)} ppm (${spread.lowestModel}) to ${sig(spread.highest, 3)} ppm (${spread.highestModel}).` });
  if (cap.stability) lines.push({ kind: cap.stability.stable ? 'fact' : 'warning', text: `Stability (${cap.stability.kind}, order from the ${cap.stability.orderFrom}${cap.stability.scale && cap.stability.scale !== 'original' ? `, on the ${cap.stability.scale} scale` : ''}): ${cap.stability.statement}` });
  const rc = cap.rangeChart;
  if (rc) {
    const k = rc.factors;
    const factors = k ? ` Factors for subgroups of ${k.n}: A2 ${sig(k.A2)}, D3 ${sig(k.D3)}, D4 ${sig(k.D4)} (Montgomery's table; d2 ${sig(k.d2)} and d3 ${sig(k.d3)} integrated here).` : ' Subgroups of unequal size: each has its own limits.';
    lines.push({ kind: rc.stable ? 'fact' : 'warning', text: `Beside it, subgroup means and ranges: sigma ${sig(rc.sigma)} from ${rc.sigmaMethod}.${factors} ${rc.statement}` });
  }
  // Only without any chart (the else once hung on the range chart, so an individuals chart was also called "not checked").
  if (!cap.stability) lines.push({ kind: 'note', text: 'Stability not checked: give an order or subgroup column to see a control chart; indices of an unstable process do not predict its future.' });
  if (cap.normality) lines.push({ kind: cap.normality.passes ? 'fact' : 'warning', text: `Normality gate: ${cap.normality.statement}` });
  if (t && t.kind !== 'none') {
    const what = t.kind === 'boxcox' ? `Box–Cox λ = ${sig(t.lambda ?? Number.NaN, 4)} (${pct(t.lambdaInterval?.confidence ?? 0.95)} profile interval ${sig(t.lambdaInterval?.lower ?? null, 3)} to ${sig(t.lambdaInterval?.upper ?? null, 3)})` : `Johnson ${t.type ?? ''} curve`;
    lines.push({ kind: t.normality.passes ? 'fact' : 'warning', text: `Transformation: ${what}; the transformed values ${t.normality.passes ? 'pass' : 'fail'} the Anderson–Darling test (A² = ${sig(t.normality.statistic, 3)}, p = ${sig(t.normality.pValue, 2)}). ${t.normality.caveat} Model support: ${t.support.text}.` });
  }

  const tables: BlockTable[] = [];
  const idxRows: string[][] = cap.overall.map((x) => [x.name, 'overall sd (n − 1)', sig(x.estimate, 4), `${sig(x.lower, 4)} to ${sig(x.upper, 4)}`, x.intervalMethod]);
  if (cap.within) for (const x of cap.within.indices) idxRows.push([x.name, `within subgroups: ${cap.within.description} (σ ${sig(cap.within.sigma, 4)})`, sig(x.estimate, 4), `${sig(x.lower, 4)} to ${sig(x.upper, 4)}`, x.intervalMethod]);
  tables.push({ caption: `Normal-theory indices, each with the spread it uses; two-sided ${pct(cap.confidence)} intervals.`, head: ['Index', 'Spread used', 'Estimate', 'Interval', 'Interval method'], rows: idxRows, folded: true });
  if (cap.comparison) {
    const none = cap.comparison.passing.length === 0;
    if (!none) tables.push({ caption: 'Share outside the tolerance under each model that passes the tests (the model and the spread each number uses).', head: ['Model', 'Spread from', 'Ppk', 'Outside the tolerance', 'Model lives on'], rows: comparisonRows(cap.comparison.passing, cap.bounds?.naturalLowerBound ?? null) });
    if (cap.comparison.rejected.length > 0) {
      tables.push({
        caption: none
          ? 'Models the tests reject — here every one: what each would say, not an answer; no spread is drawn from them.'
          : 'Models the tests reject: not used for the answer and not in the spread.',
        head: ['Model', 'Spread from', 'Ppk', 'Outside the tolerance', 'Model lives on', 'Rejected by'],
        rows: comparisonRows(cap.comparison.rejected, cap.bounds?.naturalLowerBound ?? null),
        folded: !none,
      });
    }
  }
  if (t && t.kind !== 'none') {
    tables.push({
      caption: `On the transformed scale (limits: ${sig(t.transformedLimits.lsl, 4)} to ${sig(t.transformedLimits.usl, 4)}) and in the original units (ISO 22514-2 percentile method).`,
      head: ['Index', 'Transformed scale (normal theory)', 'Original units (percentile method)'],
      rows: t.percentile.indices.map((p) => {
        const tr = t.indices.find((i) => i.name === p.name);
        return [p.name, tr ? `${sig(tr.estimate, 3)} (${sig(tr.lower, 3)} to ${sig(tr.upper, 3)})` : '—', `${sig(p.estimate, 3)}${intervalOf(p.name, t.intervals)}`];
      }),
      folded: true,
    });
  }
  if (cap.stability && (cap.stability.pointsBeyond > 0 || (cap.stability.runSignals ?? 0) > 0)) {
    // every point that signals: beyond a limit (rule 1) or completing a run (Western Electric rules 2-4)
    const signalled = [...cap.stability.location.points.map((p) => ({ p, what: cap.stability!.location.statistic })), ...cap.stability.dispersion.points.map((p) => ({ p, what: cap.stability!.dispersion.statistic }))].filter((x) => x.p.beyond !== null || (x.p.runRules?.length ?? 0) > 0);
    const why = (p: (typeof signalled)[number]['p']): string =>
      [...(p.beyond ? [`beyond the ${p.beyond === 'above' ? 'upper' : 'lower'} limit`] : []), ...(p.runRules ?? []).map((k) => `rule ${k}: ${RUN_RULE_WORDS[k]}`)].join('; ');
    tables.push({
      caption: 'Points that signal: beyond the control limits, or completing a run (Western Electric rules 2-4, on the location chart).',
      head: ['At', 'Statistic', 'Value', 'Limits', 'Signal'],
      rows: signalled.map(({ p, what }) => [String(p.label), what, sig(p.value, 4), `${sig(p.lower, 4)} to ${sig(p.upper, 4)}`, why(p)]),
      folded: true,
    });
  }
  if (cap.resolution.warning) lines.push({ kind: 'warning', text: `Gauge resolution: ${cap.resolution.warning}` });
  for (const w of cap.warnings) if (w !== cap.resolution.warning && !w.startsWith('Stability:')) lines.push({ kind: 'warning', text: w });
  for (const k of cap.cautions) lines.push({ kind: 'caution', text: k });
  // The core's caution (CAPABILITY_CAUTION) already says: decide on the lower bound, inspect, follow the standard. Added here only what it does not say.
  lines.push({ kind: 'caution', text: 'The 0.135 % points and the ppm figures rest on the model far beyond most samples: they say what the model implies, not what was measured; licensed practice decides what a safety-critical characteristic needs.' });
  return {
    id: 'capability',
    title: 'Can it meet the tolerance?',
    answer,
    lead: 'How far the process sits from each limit, the share expected outside under each model that fits, and what would change the answer.',
    lines,
    tables,
    // The stability chart (individuals, or subgroup means and standard deviations) and, with subgroups, the means-and-ranges chart beside it.
    charts: ['capability-histogram', ...(cap.stability ? (['control-chart'] as const) : []), ...(cap.rangeChart ? (['range-chart'] as const) : [])],
  };
};
