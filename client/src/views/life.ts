/** The life section (censored life data): B-lives with bounds, reliability, mean life. Pure. */
import { sig } from '../format.js';
import type { BlockLine, BlockTable, SectionView } from './block.js';
import { pct, withU } from './numbers.js';

export const lifeSection: SectionView = ({ report: r, selected: c, units: u }) => {
  const life = r.life;
  if (!life) return null;
  // Interval rows (core RecordedLifeReport counts): say how each failure is known, not "treated as right-censored" alone.
  const rec = life.recorded?.report;
  const inspected = rec !== undefined && rec !== null && rec.left + rec.interval > 0;
  const lines: BlockLine[] = [
    inspected
      ? { kind: 'fact', text: `${rec.n} units found at inspections: ${rec.failures} failed (${rec.exact} at a known time, ${rec.left} before the first inspection, ${rec.interval} within an inspection interval), ${rec.right} still running at their last inspection (right-censored).` }
      : { kind: 'fact', text: `${life.units} units on test: ${life.failures} failed, ${life.suspensions} suspended (still running or removed unfailed, treated as right-censored).` },
    { kind: 'note', text: life.chiSquare.reason },
  ];
  // With a failure-mode column these fits pool the modes; the whole unit's life by modes is the modes section's (views/modes.ts).
  if (life.modes) lines.unshift({ kind: 'warning', text: `Every failure is fitted here as one mode, whatever its cause (${life.modes.modes.map((m) => m.mode).join(', ')}); the life of the whole unit from each mode's own fit is under “Failure modes: which one limits life”.` });
  const tables: BlockTable[] = [];
  let answer: string | undefined;
  if (c) {
    const b = c.bLives?.[0];
    if (b) answer = `B${sig(b.percent, 3)} life under ${c.label}: ${withU(sig(b.estimate), u)}, between ${sig(b.lower)} and ${sig(b.upper)} (two-sided ${pct(life.confidence)} bounds${b.boundsFound ? '' : ', search limit reached'}).`;
    if (c.bLives && c.bLives.length > 0) {
      tables.push({
        caption: `B-lives under ${c.label}: the time by which the given share of units has failed; two-sided ${pct(life.confidence)} bounds (${c.bLifeMethod ?? life.boundMethod}).`,
        head: ['Life', `Estimate${u ? ` [${u}]` : ''}`, 'Lower bound', 'Upper bound', 'Bounds closed'],
        rows: c.bLives.map((x) => [`B${sig(x.percent, 3)}`, sig(x.estimate), sig(x.lower), sig(x.upper), x.boundsFound ? 'yes' : 'no: search limit shown']),
      });
    }
    for (const rel of c.reliability ?? []) {
      lines.push({
        kind: 'fact',
        text: `Reliability at ${withU(sig(rel.time), u)} under ${c.label}: ${sig(rel.estimate, 4)}; lower bound ${sig(rel.lower, 4)} (one-sided ${pct((1 + rel.confidence) / 2)}), upper ${sig(rel.upper, 4)}.`,
      });
    }
    if (c.meanLife !== undefined) lines.push({ kind: 'fact', text: `Mean life under ${c.label}: ${withU(sig(c.meanLife), u)} (no bounds; the mean leans on the tail beyond the test).` });
    for (const w of c.warnings ?? []) lines.push({ kind: 'warning', text: `${c.label}: ${w}` });
  }
  // A shape given from experience beside the fits (Weibayes, core/life weibayes.ts): named as the alternative it is, here where the maximum-likelihood B-life is.
  const w = rec?.weibayes;
  if (w && c) {
    const b = w.bLives[0];
    lines.push({
      kind: 'fact',
      text: `Alternative with the Weibull shape ASSUMED at β = ${w.shape}, not estimated (Weibayes; Nelson 1985; ${w.failures} failures in ${w.units} units): scale ${w.scale === null ? 'no estimate' : withU(sig(w.scale), u)}, at least ${withU(sig(w.scaleLower), u)}${
        b ? `; B${sig(b.percent, 3)} ${b.estimate === null ? 'no estimate' : withU(sig(b.estimate), u)}, at least ${withU(sig(b.lower), u)}` : ''
      } (one-sided ${pct(w.confidence)} lower bounds). The numbers above are by maximum likelihood, which estimates the shape; details under “Life: other estimators, subpopulations and few failures”.`,
    });
  }
  lines.push({ kind: 'note', text: `Plotting positions: ${life.plot.description}` });
  for (const w of life.warnings) lines.push({ kind: 'warning', text: w });
  for (const k of life.cautions) lines.push({ kind: 'caution', text: k });
  return {
    id: 'life',
    title: 'Life of the units',
    ...(answer ? { answer } : {}),
    lead: 'Failures and suspensions together: how long until a share of units fails, and the chance a unit survives a given time.',
    lines,
    tables,
    charts: ['life-probability', 'hazard'],
    terms: ['blife', 'censored', 'bounds', 'km', 'plotpos'],
  };
};
