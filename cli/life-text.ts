/**
 * Plain-text report of life data as recorded (core analyzeRecordedLife) and of a test plan: what
 * was read, the candidates with the estimator behind every number, B-lives and reliability with
 * their bounds, the Turnbull boxes, Weibayes, the modes and the system, then warnings, cautions and
 * methods.
 */
import { formatNumber, type BLife, type RecordedLifeCandidate, type RecordedLifeReport, type ReliabilityAt, type TestPlan } from '../core/index.js';
import type { RecordedLifeJson } from './life-recorded.js';

const f = (x: number | null | undefined, d = 4): string => (x === null || x === undefined || Number.isNaN(x) ? '—' : formatNumber(x, d));

function table(head: readonly string[], rows: readonly (readonly string[])[]): string[] {
  const w = head.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? '').length)));
  // Numbers right-aligned, words left-aligned.
  const line = (r: readonly string[]) => r.map((c, i) => (/^[-−]?[0-9.—]/.test(c) ? c.padStart(w[i] as number) : c.padEnd(w[i] as number))).join('  ').trimEnd();
  return [line(head), ...rows.map(line)];
}

function params(c: RecordedLifeCandidate): string {
  return Object.entries(c.parameters)
    .map(([k, v]) => `${k} ${f(v, 5)}`)
    .join(', ');
}

function bound(b: BLife | ReliabilityAt): [string, string] {
  return b.boundsFound ? [f(b.lower), f(b.upper)] : [Number.isNaN(b.lower) ? '—' : `${f(b.lower)}*`, Number.isNaN(b.upper) ? '—' : `${f(b.upper)}*`];
}

const ESTIMATOR = { ml: 'maximum likelihood', 'rank-regression': 'rank regression' } as const;

export function lifeReportLines(r: RecordedLifeReport): string[] {
  const out: string[] = [];
  const pc = `${f(100 * r.confidence, 3)} %`;
  out.push(
    `Units: ${r.n} — exact failure times ${r.exact}, failed before the first inspection ${r.left}, found failed at an inspection ${r.interval}, still running ${r.right}`,
    `Estimation: ${ESTIMATOR[r.estimation]}${r.estimation === 'ml' ? ' (the default)' : ''}; candidates ranked by ${r.rankedBy}`,
    '',
  );
  if (r.candidates.length > 0) {
    out.push('Candidates');
    out.push(
      ...table(
        ['rank', 'model', 'estimator', 'parameters', 'ln L', 'AICc', r.estimation === 'rank-regression' ? 'r' : 'ΔAICc'],
        r.candidates.map((c) => [
          String(c.rank),
          c.label + (c.identified === false ? ' (NOT IDENTIFIED)' : ''),
          ESTIMATOR[c.estimation],
          params(c),
          f(c.logLikelihood, 6),
          f(c.aicc, 6),
          r.estimation === 'rank-regression' ? f(c.correlation, 5) : f(c.deltaAicc, 3),
        ]),
      ),
      '',
    );
    const tested = r.candidates.filter((c) => c.goodnessOfFit !== null);
    if (tested.length > 0) {
      // Every family of one data set gets the same test, named by the result (core/life interval-gof-design.ts).
      const g0 = tested[0]!.goodnessOfFit!;
      out.push(`Goodness of fit: ${g0.testLabel}${g0.test === 'anderson-darling' ? ' on the Turnbull estimate' : ''}, p by a bootstrap that reproduces each unit's inspections (α = ${f(r.alpha, 3)})`);
      out.push(
        ...table(
          ['model', g0.test === 'likelihood-ratio' ? 'LR' : 'A²', 'p', '± MC SE', 'B', 'unrefitted', 'decision'],
          tested.map((c) => {
            const g = c.goodnessOfFit!;
            return [c.label, f(g.statistic, 4), f(g.pValue, 3), f(g.monteCarloError, 2), String(g.replicates), String(g.failedReplicates), c.rejected === null ? 'no decision (not size-calibrated)' : c.rejected ? 'rejected' : 'not rejected'];
          }),
        ),
        '',
      );
    } else if (r.goodnessOfFitNote) out.push(`Goodness of fit: ${r.goodnessOfFitNote}.`, '');
    const first = r.candidates[0]!;
    if (first.bLives.length > 0) {
      out.push(`B-lives (bounds two-sided ${pc}; * = bound not closed, the end shown is the search limit; — = no bound for this estimator)`);
      const rows: string[][] = [];
      for (const c of r.candidates) for (const b of c.bLives) rows.push([c.label, `B${f(b.percent, 3)}`, f(b.estimate), ...bound(b), b.method]);
      out.push(...table(['model', 'life', 'estimate', 'lower', 'upper', 'estimator / bounds'], rows), '');
    }
    if (first.reliability.length > 0) {
      out.push(`Reliability (bounds two-sided ${pc})`);
      const rows: string[][] = [];
      for (const c of r.candidates) for (const x of c.reliability) rows.push([c.label, f(x.time), f(x.estimate, 5), ...bound(x), x.method]);
      out.push(...table(['model', 'time', 'R', 'lower', 'upper', 'estimator / bounds'], rows), '');
    }
    for (const c of r.candidates) for (const w of c.warnings) out.push(`warning (${c.label}): ${w}`);
    if (r.candidates.some((c) => c.warnings.length > 0)) out.push('');
  }
  if (r.notFitted.length > 0) {
    out.push('Not fitted');
    for (const n of r.notFitted) out.push(`  ${n.family}: ${n.reason}`);
    out.push('');
  }
  out.push('Nonparametric estimate (Turnbull): the mass in each box is known, not where in the box it lies');
  out.push(
    ...table(
      ['from', 'to', 'mass', 'F before', 'F after'],
      r.turnbull.intervals.map((iv) => [f(iv.lower), Number.isFinite(iv.upper) ? f(iv.upper) : 'beyond', f(iv.mass, 5), f(iv.cdfBefore, 5), f(iv.cdfAfter, 5)]),
    ),
    `  ${r.turnbull.converged ? 'converged' : 'NOT converged'} after ${r.turnbull.iterations} iterations; Kuhn–Tucker excess ${f(r.turnbull.kuhnTuckerExcess, 2)}`,
    '',
  );
  if (r.weibayes) {
    const w = r.weibayes;
    out.push(`Weibayes (shape β = ${f(w.shape)} ASSUMED, not estimated)`);
    out.push(
      // Exposure is absent (null/NaN) for inspection intervals: the bound is then the likelihood-ratio one (see method).
      Number.isFinite(w.exposure ?? Number.NaN) ? `  ${w.failures} failures among ${w.units} units; Σ t^β = ${f(w.exposure, 6)}` : `  ${w.failures} failures among ${w.units} units, some known only to an inspection interval`,
      `  scale: ${w.scale === null ? 'no estimate with zero failures' : f(w.scale, 5)}; lower bound (one-sided ${f(100 * w.confidence, 3)} %): ${f(w.scaleLower, 5)} (${Number.isFinite(w.exposure ?? Number.NaN) ? `χ² with ${w.degreesOfFreedom} degrees of freedom` : 'likelihood ratio'})`,
    );
    for (const b of w.bLives) out.push(`  B${f(b.percent, 3)}: estimate ${f(b.estimate)}, lower bound ${f(b.lower)}`);
    for (const x of w.reliability) out.push(`  R(${f(x.time)}): estimate ${f(x.estimate, 5)}, lower bound ${f(x.lower, 5)}`);
    out.push(`  ${w.statement}`, `  method: ${w.method} (${w.source})`, '');
  }
  if (r.modes) {
    const m = r.modes;
    out.push(`Failure modes (${m.method})`);
    const rows: string[][] = [];
    for (const x of m.modes) {
      for (const b of x.bLives) rows.push([x.mode, String(x.failures), x.family ?? '—', `B${f(b.percent, 3)}`, f(b.estimate), ...bound(b)]);
      if (x.bLives.length === 0) rows.push([x.mode, String(x.failures), x.family ?? 'not fitted', '', '', '', '']);
    }
    // The system: the product of the modes' reliabilities; its B-lives bounded as the modes' are (m.system.method).
    if (m.system) for (const b of m.system.bLives) rows.push(['system', String(m.modes.reduce((a, x) => a + x.failures, 0)), 'product', `B${f(b.percent, 3)}`, f(b.estimate), ...bound(b)]);
    out.push(...table(['mode', 'failures', 'model', 'life', 'estimate', 'lower', 'upper'], rows));
    if (m.system) {
      for (const x of m.system.reliability) out.push(`  system R(${f(x.time)}): ${f(x.estimate, 5)} (point estimate, no bound)`);
      out.push(`  system: ${m.system.method}`);
    }
    out.push('');
  }
  if (r.warnings.length > 0) out.push('Warnings', ...r.warnings.map((w) => `  ${w}`), '');
  out.push('Cautions', ...r.cautions.map((c) => `  ${c}`), '');
  out.push('Methods', ...r.methods.map((m) => `  ${m.topic}: ${m.text} (${m.source})`));
  return out;
}

export function planText(p: TestPlan): string {
  const i = p.input;
  const out = [
    `Test plan: demonstrate R(${f(i.time)}) ≥ ${i.reliability} with ${f(100 * i.confidence, 4)} % confidence, Weibull shape β = ${i.shape} ASSUMED, at most ${i.failuresAllowed} failure${i.failuresAllowed === 1 ? '' : 's'}`,
    ...table(
      ['test time per unit', 'k = test/t', 'units (binomial)', 'units (Weibayes form)'],
      p.rows.map((r) => [f(r.testTime), f(r.timeRatio, 3), String(r.unitsBinomial), `${r.unitsWeibayes} (${f(r.unitsWeibayesExact, 5)})`]),
    ),
    '',
    'Derivation',
    ...p.derivation.map((d) => `  ${d}`),
    '',
    'Cautions',
    ...p.cautions.map((c) => `  ${c}`),
    `Source: ${p.source}`,
  ];
  return `${out.join('\n')}\n`;
}

export function recordedLifeText(j: RecordedLifeJson): string {
  const out: string[] = [];
  if (j.life) {
    out.push(`Life data as recorded: ${j.input.file} (${j.input.rows} rows; ${j.input.columns.map((c) => `${c.role}: ${c.column}`).join(', ')})`, '');
    for (const w of j.input.warnings ?? []) out.push(`note: ${w}`, '');
    out.push(...lifeReportLines(j.life));
  }
  let text = out.length > 0 ? `${out.join('\n')}\n` : '';
  if (j.plan) text += (text ? '\n' : '') + planText(j.plan);
  return text;
}
