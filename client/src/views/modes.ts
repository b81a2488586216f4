/**
 * Several failure modes (report `life.modes`, a failure-mode column): which mode limits life, the
 * B-lives of each mode (its best model by AICc, with its bounds) and of the whole unit (the product
 * of the modes' reliabilities: a point value, no bound), the reliability curves, and the cautions
 * (independent, correctly classified modes; a maintenance or safety decision follows its governing
 * practice). Pure: report → block; the numbers are the core's (core/life analyzeModes).
 */
import type { CompetingModesReport, ModeResult } from '../../../core/index.js';
import { modelLabel } from '../families.js';
import { sig } from '../format.js';
import type { BlockLine, BlockTable, SectionView } from './block.js';
import { end, pct, withU } from './numbers.js';

/** The bound method in words (the report's `boundMethod` of the life section). */
export const BOUND_WORDS: Readonly<Record<string, string>> = { 'likelihood-ratio': 'likelihood-ratio (profile likelihood)', 'fisher-matrix': 'Fisher-matrix' };

/** The family's one label (client/src/families.ts), or 'no model'. */
export const familyWords = (f: string | null): string => (f === null ? 'no model' : modelLabel(f));

/** 'B10'. */
export const bName = (percent: number): string => `B${sig(percent, 3)}`;

/** The mode that reaches each asked-for percent failed first (smallest B-life), among the fitted modes; null when fewer than two are fitted. */
export function firstToReach(m: CompetingModesReport, j: number): { readonly first: ModeResult; readonly others: readonly ModeResult[] } | null {
  const fitted = m.modes.filter((x) => x.bLives[j] !== undefined && Number.isFinite(x.bLives[j]!.estimate));
  if (fitted.length < 2) return null;
  const sorted = [...fitted].sort((a, b) => a.bLives[j]!.estimate - b.bLives[j]!.estimate);
  return { first: sorted[0]!, others: sorted.slice(1) };
}

/**
 * The short name of the method behind a bound, from the core's method text (core/life bounds.ts,
 * competing-modes-bounds.ts): 'likelihood-ratio ' or 'Fisher-matrix ' (with its space), '' when
 * the text names neither.
 */
export function boundName(method: string | undefined): string {
  if (method === undefined) return '';
  if (/^likelihood ratio/i.test(method)) return 'likelihood-ratio ';
  if (/^Fisher matrix/i.test(method)) return 'Fisher-matrix ';
  return '';
}

/** One mode's B-life in words: 'crack 3930 h (Exponential; 90 % likelihood-ratio bounds 2704 to 6025)'. */
export function modeBLifeWords(x: ModeResult, j: number, u: string): string {
  const b = x.bLives[j];
  if (!b) return `${x.mode}: not fitted`;
  return `${x.mode} ${withU(sig(b.estimate), u)} (${familyWords(x.family)}; ${pct(b.confidence)} ${boundName(b.method)}bounds ${end(b.lower, 'open')} to ${end(b.upper, 'open')})`;
}

/**
 * The whole unit's B-life bounds when the report carries them (a core BLife with finite ends), else
 * null: the report then gives a point value only, and the page says "no bound".
 */
export function unitBounds(b: { readonly percent: number; readonly estimate: number }): { readonly lower: number; readonly upper: number } | null {
  const x = b as { readonly lower?: unknown; readonly upper?: unknown };
  return typeof x.lower === 'number' && Number.isFinite(x.lower) && typeof x.upper === 'number' && Number.isFinite(x.upper) ? { lower: x.lower, upper: x.upper } : null;
}

/** A bound's method in two words for a table cell ('likelihood ratio', 'Fisher matrix'); the full text goes in a note. */
function shortMethod(method: string | undefined): string {
  const name = boundName(method).trim();
  return name === '' ? (method ?? '—') : name.replace('-', ' ');
}

/** The core's method text of the whole unit's B-life bounds, when it gives one. */
const methodOf = (b: { readonly estimate: number }): string | undefined => {
  const m = (b as { readonly method?: unknown }).method;
  return typeof m === 'string' ? m : undefined;
};

/** The whole unit's B-life in words: '2893 h (90 % likelihood-ratio bounds 2400 to 3300)' or '2893 h (point estimate)'. */
export function unitBLifeWords(b: { readonly percent: number; readonly estimate: number }, confidence: number, u: string): string {
  const bd = unitBounds(b);
  return `${withU(sig(b.estimate), u)} (${bd ? `${pct(confidence)} ${boundName(methodOf(b))}bounds ${sig(bd.lower)} to ${sig(bd.upper)}` : 'point estimate'})`;
}

export const modesSection: SectionView = ({ report, units: u }) => {
  const m = report.life?.modes;
  if (!m) return null;
  const life = report.life!;
  const unitHead = u ? ` [${u}]` : '';
  const bound = BOUND_WORDS[life.boundMethod] ?? life.boundMethod;
  const conf = pct(life.confidence);
  const lines: BlockLine[] = [];
  const tables: BlockTable[] = [];
  const percents = life.bLifePercents;
  const sys = m.system;
  // Interval rows (some failure known only within an interval): a unit failed by another mode is running up to the last inspection it was seen working.
  const rec = life.recorded?.report;
  const inspected = rec !== undefined && rec !== null && rec.left + rec.interval > 0;
  lines.push({
    kind: 'fact',
    text: `${m.modes.length} failure modes among ${m.n} units: ${m.modes.map((x) => `${x.mode} ${x.failures} failed`).join(', ')}; each mode is fitted with every other unit (failed by another mode, or not failed) counted as still running ${inspected ? 'up to the last inspection it was seen working (a unit found failed by another mode) or to its last inspection' : 'at its time'}.`,
  });
  percents.forEach((p, j) => {
    const r = firstToReach(m, j);
    if (!r) return;
    lines.push({
      kind: 'fact',
      text: `At ${sig(p, 3)} % failed the ${r.first.mode} mode comes first: ${bName(p)} ${withU(sig(r.first.bLives[j]!.estimate), u)}, against ${r.others.map((o) => `${withU(sig(o.bLives[j]!.estimate), u)} for ${o.mode}`).join(', ')}.`,
    });
  });
  const rows: string[][] = [];
  for (const x of m.modes) {
    x.bLives.forEach((b) => rows.push([`${x.mode}: ${bName(b.percent)}`, `${familyWords(x.family)}`, String(x.failures), sig(b.estimate), end(b.lower, 'not closed'), end(b.upper, 'not closed')]));
    if (x.bLives.length === 0) rows.push([`${x.mode}`, 'not fitted', String(x.failures), '—', '—', '—']);
  }
  const unitHasBounds = sys !== null && sys.bLives.some((b) => unitBounds(b) !== null);
  const modeMethod = [...new Set(m.modes.flatMap((x) => x.bLives.map((b) => shortMethod(b.method))))].join(' or ') || shortMethod(bound);
  const unitMethod = [...new Set((sys?.bLives ?? []).filter((b) => unitBounds(b) !== null).map((b) => shortMethod(methodOf(b))))].join(' or ');
  if (sys) {
    for (const b of sys.bLives) {
      const bd = unitBounds(b);
      rows.push([`whole unit: ${bName(b.percent)}`, 'product of the modes', String(m.modes.reduce((a, x) => a + x.failures, 0)), sig(b.estimate), bd ? sig(bd.lower) : 'no bound', bd ? sig(bd.upper) : 'no bound']);
    }
  }
  // Each bound method in full once (the table's last column names it in two words).
  const full = [...new Set([...m.modes.flatMap((x) => x.bLives.map((b) => `per mode: ${b.method}`)), ...(sys?.bLives ?? []).filter((b) => unitBounds(b) !== null).map((b) => `whole unit: ${methodOf(b) ?? '—'}`)])];
  if (full.length > 0) lines.push({ kind: 'note', text: `Bounds on the B-lives, ${full.join('; ')}.` });
  tables.push({
    // The method of every bound named in the caption, from the rows' own method texts (a column for it did not fit at 800 px).
    caption: `B-lives${unitHead} by mode (each under its best model by AICc) and for the whole unit; ${conf} two-sided bounds: per mode by ${modeMethod}; ${unitHasBounds ? `for the whole unit by ${unitMethod} over every mode's parameters at once` : 'the whole unit\'s B-lives are point estimates (no bound)'}`,
    head: ['Life', 'Model', 'Failures', 'Estimate', 'Lower', 'Upper'],
    rows,
  });
  const times = life.reliabilityTimes;
  if (times.length > 0) {
    tables.push({
      caption: `Reliability at the times asked for; ${conf} two-sided ${bound} bounds per mode; the whole unit's is the product of the modes' estimates (no bound)`,
      head: ['Reliability', ...m.modes.map((x) => `mode ${x.mode}`), 'whole unit'],
      rows: times.map((t, j) => [
        `R(${sig(t)})`,
        ...m.modes.map((x) => {
          const r = x.reliability[j];
          return r ? `${sig(r.estimate, 4)} (${end(r.lower, 'open')} to ${end(r.upper, 'open')})` : '—';
        }),
        sys?.reliability[j] ? sig(sys.reliability[j]!.estimate, 4) : '—',
      ]),
    });
  }
  tables.push({
    caption: 'Models tried for each mode, ranked by AICc (n = all units); the first is used',
    head: ['Mode: rank', 'Model', 'Parameters', 'ln L', 'ΔAICc'],
    rows: m.modes.flatMap((x) =>
      x.candidates.map((c) => [
        `${x.mode}: ${c.rank}`,
        familyWords(c.family),
        Object.entries(c.parameters)
          .map(([k, v]) => `${k} ${sig(v, 4)}`)
          .join(', '),
        sig(c.logLikelihood, 6),
        sig(c.deltaAicc, 3),
      ]),
    ),
    folded: true,
  });
  for (const x of m.modes) for (const nf of x.notFitted) lines.push({ kind: 'note', text: `Mode ${x.mode}: ${familyWords(nf.family)} not fitted (${nf.reason}).` });
  lines.push({ kind: 'note', text: `Method: ${m.method} (${m.source}).${sys ? ` Whole unit: ${sys.method}.` : ''}` });
  for (const c of m.cautions) lines.push({ kind: 'caution', text: c });
  lines.push({
    kind: 'caution',
    text: 'A maintenance interval or a safety decision set from these lives follows the governing maintenance and safety practice for the equipment (its codes, standards and approved programmes) and licensed review; these numbers inform that decision, they do not make it.',
  });
  const first = percents.length > 0 ? firstToReach(m, 0) : null;
  const sb = sys?.bLives[0];
  const answer = sb
    ? `Whole unit ${bName(sb.percent)}: ${unitBLifeWords(sb, life.confidence, u)} from ${m.modes.length} modes: ${m.modes.map((x) => modeBLifeWords(x, 0, u)).join('; ')}.${first ? ` The ${first.first.mode} mode limits life at ${sig(sb.percent, 3)} % failed.` : ''}`
    : 'No life for the whole unit: some mode could not be fitted (see the notes).';
  return {
    id: 'modes',
    title: 'Failure modes: which one limits life',
    answer,
    lead: 'Each mode fitted on its own, as if the other modes only ever removed units from the test (competing risks, modes independent); a unit lives until its first mode fails, so the whole unit’s reliability is the product of the modes’.',
    lines,
    tables,
    charts: sys ? ['modes-reliability'] : [],
    terms: ['blife', 'censored', 'bounds'],
  };
};
