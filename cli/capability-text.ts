/**
 * The text-report lines of the capability section beyond the normal-theory table: the
 * transformation (Box–Cox or Johnson), the percentile indices with their bootstrap interval, the
 * honest model comparison (passing models, rejected ones apart, the spread over passing models only,
 * each row naming its sigma), the natural-bound statement and the stability chart's verdict.
 */
import { formatNumber, formatPValue, testNames, type CapabilitySection, type ComparisonRow, type PercentileIntervals } from '../core/index.js';
import { wrap } from './text-report.js';

const f4 = (x: number): string => formatNumber(x, 4);

function intervalText(name: string, iv: PercentileIntervals | null): string {
  const i = iv?.intervals?.find((x) => x.name === name);
  if (!i) return '';
  return ` (${formatNumber(100 * i.confidence, 3)} % BCa bootstrap ${f4(i.lower)} … ${f4(i.upper)}, ${i.replicates} replicates)`;
}

function indicesWithIntervals(indices: readonly { name: string; estimate: number }[], iv: PercentileIntervals | null): string {
  return indices.map((i) => `${i.name} ${f4(i.estimate)}${intervalText(i.name, iv)}`).join('; ');
}

function rowCells(r: ComparisonRow): string[] {
  const ppk = r.indices.find((i) => i.name === 'Ppk');
  return [
    r.model,
    r.kind === 'normal' ? 'sd (n - 1)' : 'fitted quantiles',
    ppk ? f4(ppk.estimate) : '',
    f4(r.ppmBelow),
    f4(r.ppmAbove),
    f4(r.ppmTotal),
    r.ppmBelowNaturalBound === null ? '' : f4(r.ppmBelowNaturalBound),
  ];
}

function table(head: readonly string[], rows: readonly (readonly string[])[]): string[] {
  const widths = head.map((h, j) => Math.max(h.length, ...rows.map((r) => (r[j] ?? '').length)));
  // model, spread-from and rejected-by columns are words (left-aligned); the rest numbers
  const left = (j: number): boolean => j <= 1 || head[j] === 'rejected by';
  const line = (cells: readonly string[]): string => '    ' + cells.map((s, j) => (left(j) ? s.padEnd(widths[j] as number) : s.padStart(widths[j] as number))).join('  ').trimEnd();
  return [line(head), line(widths.map((w) => '-'.repeat(w))), ...rows.map(line)];
}

const BASIS_WORDS: Readonly<Record<CapabilitySection['answer']['basis'], string>> = {
  transformation: 'the transformation asked for; its transformed values pass the normality test',
  'selected model': 'the best-ranked model',
  normal: 'the normal model, which passes its test',
  'best passing model': 'the best model that passes the tests',
  'no passing model': '',
};

/**
 * The answer first, under the model the page's headline and capability section use for the
 * best-ranked candidate (core/capability/answer.ts): its Ppk with the bootstrap interval computed
 * for that very model, and its ppm out of specification.
 */
export function capabilityAnswerLine(c: CapabilitySection): string {
  const a = c.answer;
  if (!a.row) return wrap('No model passes the tests, so no share outside the tolerance is stated with a model behind it; the rejected models below show what each would say.', '  Answer: ', '  ');
  const ppk = a.row.indices.find((i) => i.name === 'Ppk');
  // why there is no interval, said once: the transformation's own note is printed with it below
  const t = c.transform;
  const saidBelow = t.kind !== 'none' && a.intervalNote === t.intervals.note;
  const idx = ppk ? `Ppk ${f4(ppk.estimate)}${intervalText('Ppk', a.intervals) || (a.intervalNote ? (saidBelow ? ' (no interval, see below)' : ' (no interval)') : '')}` : '';
  const rejected = a.row.passes ? '' : ', which a test rejects';
  const line = wrap(`${idx}${idx ? '; ' : ''}ppm out of spec ${f4(a.row.ppmTotal)} under ${a.row.model} (${BASIS_WORDS[a.basis]}${rejected}).`, '  Answer: ', '  ');
  return a.intervalNote && !saidBelow ? `${line}\n${wrap(a.intervalNote, '  ', '  ')}` : line;
}

export function capabilityExtensionLines(c: CapabilitySection): string[] {
  const out: string[] = [];
  if (c.bounds) out.push(wrap(c.bounds.statement, '  One-sided: ', '  '));
  if (c.percentileIntervals?.intervals && c.percentile) {
    out.push(wrap(`${c.percentile.family}: ${indicesWithIntervals(c.percentile.indices, c.percentileIntervals)}.`, '  Percentile indices with intervals, ', '  '));
  } else if (c.percentileIntervals?.note) out.push(wrap(c.percentileIntervals.note, '  ', '  '));

  const t = c.transform;
  if (t.kind !== 'none') {
    const head =
      t.kind === 'boxcox'
        ? `Box–Cox, λ = ${f4(t.lambda as number)} (${formatNumber(100 * (t.lambdaInterval?.confidence ?? 0.95), 3)} % profile-likelihood interval ${t.lambdaInterval?.lower === null ? 'unbounded' : f4(t.lambdaInterval?.lower as number)} … ${t.lambdaInterval?.upper === null ? 'unbounded' : f4(t.lambdaInterval?.upper as number)})`
        : `Johnson ${t.type as string} by Slifker & Shapiro percentiles, γ = ${f4(t.parameters?.gamma as number)}, δ = ${f4(t.parameters?.delta as number)}, ξ = ${f4(t.parameters?.xi as number)}, λ = ${f4(t.parameters?.lambda as number)}`;
    const lim = [t.transformedLimits.lsl !== null ? `LSL → ${f4(t.transformedLimits.lsl)}` : null, t.transformedLimits.usl !== null ? `USL → ${f4(t.transformedLimits.usl)}` : null].filter((x) => x !== null).join(', ');
    out.push(wrap(`${head}; limits on the transformed scale: ${lim || 'none inside the support'}; model support ${t.support.text}.`, '  Transformation: ', '  '));
    out.push(
      wrap(
        `A² = ${f4(t.normality.statistic)}, ${formatPValue(t.normality.pValue)}: ${t.normality.passes ? 'passes' : 'fails'} at α = ${t.normality.alpha}. ${t.normality.caveat}`,
        '  Normality of the transformed values: ',
        '  ',
      ),
    );
    if (t.indices.length > 0) {
      out.push(wrap(`${t.indices.map((i) => `${i.name} ${f4(i.estimate)} (${f4(i.lower)} … ${f4(i.upper)})`).join('; ')} (sigma: standard deviation of the transformed values, n - 1).`, '  On the transformed scale: ', '  '));
    }
    out.push(wrap(`${indicesWithIntervals(t.percentile.indices, t.intervals)}; ppm out of spec ${f4(t.ppm.total)} (below ${f4(t.ppm.belowLsl)}, above ${f4(t.ppm.aboveUsl)}).`, '  In the original units (ISO 22514-2 percentile method): ', '  '));
    if (!t.intervals.intervals && t.intervals.note) out.push(wrap(t.intervals.note, '  ', '  '));
  }

  const cmp = c.comparison;
  const head = ['model', 'spread from', 'Ppk', 'ppm below', 'ppm above', 'ppm total', cmp.passing.some((r) => r.ppmBelowNaturalBound !== null) ? 'ppm below bound' : ''];
  if (cmp.passing.length > 0) {
    out.push('  Models that pass the tests:');
    out.push(...table(head, cmp.passing.map(rowCells)));
  } else out.push('  No model passes the tests.');
  if (cmp.rejected.length > 0) {
    out.push('  Rejected by a test (shown apart, not in the spread):');
    out.push(...table([...head.slice(0, 6), 'rejected by'], cmp.rejected.map((r) => [...rowCells(r).slice(0, 6), testNames(r.rejectedBy)])));
  }
  if (cmp.spread) out.push(wrap(`${f4(cmp.spread.lowest)} ppm (${cmp.spread.lowestModel}) to ${f4(cmp.spread.highest)} ppm (${cmp.spread.highestModel}).`, '  Spread over passing models: ', '  '));
  out.push(wrap(cmp.note, '  ', '  '));

  const s = c.stability;
  if (s) {
    out.push(wrap(`${s.kind} (order from the ${s.orderFrom}${s.scale && s.scale !== 'original' ? `, on the ${s.scale} scale` : ''}); sigma ${f4(s.sigma)} from ${s.sigmaMethod}. ${s.statement} (${s.source}.)`, '  Stability: ', '  '));
  }
  const r = c.rangeChart;
  if (r) {
    // the location limits sit close to the centre: 7 significant digits so they differ in print
    const f7 = (x: number): string => formatNumber(x, 7);
    const lim = (p: { lower: number; upper: number } | undefined, f: (x: number) => string): string => (p ? `${f(p.lower)} … ${f(p.upper)}` : '');
    const k = r.factors;
    const factors = k ? ` Factors for subgroups of ${k.n}: A2 ${f4(k.A2)}, D3 ${f4(k.D3)}, D4 ${f4(k.D4)} (d2 ${f4(k.d2)}, d3 ${f4(k.d3)}).` : ' Unequal subgroup sizes: each subgroup has its own limits.';
    const same = k ? ` x̄ limits ${lim(r.location.points[0], f7)}; range limits ${lim(r.dispersion.points[0], f4)}.` : '';
    out.push(wrap(`centre x̿ ${f7(r.location.center)}, R̄ ${f4(r.dispersion.center)}; sigma ${f4(r.sigma)} from ${r.sigmaMethod}.${same}${factors} ${r.statement}`, '  Beside it, subgroup means and ranges: ', '  '));
  }
  return out;
}
