/**
 * The decision area: the numbers a user decides on (B-lives, return levels, capability indices,
 * trend, and the model-sensitivity table), built from the core's report as plain blocks of text,
 * tables and chart slots. One model, two renderings: DOM nodes for the page (text through
 * textContent only) and escaped HTML for the exported report, so both say the same thing.
 */
import type { DatasetCandidate, DatasetReport } from '../../core/index.js';
import { escapeHtml as e } from './escape.js';
import { sig } from './format.js';
import { el } from './dom.js';

export type ChartSlot = 'life-probability' | 'hazard' | 'return-period' | 'capability-histogram';

export interface DecisionTable {
  readonly caption: string;
  readonly head: readonly string[];
  readonly rows: readonly (readonly string[])[];
}

export interface DecisionLine {
  readonly kind: 'fact' | 'note' | 'warning' | 'caution';
  readonly text: string;
}

export interface DecisionBlock {
  readonly id: 'life' | 'flood' | 'capability' | 'trend' | 'sensitivity';
  readonly title: string;
  readonly lead: string;
  readonly lines: readonly DecisionLine[];
  readonly tables: readonly DecisionTable[];
  readonly charts: readonly ChartSlot[];
}

/** A model's label with a capital first letter, as in the ranking table. */
export const capital = (label: string): string => (label ? label[0]!.toUpperCase() + label.slice(1) : label);
const pct = (c: number): string => `${sig(100 * c, 3)} %`;
const end = (v: number | null | undefined, open: string): string => (v === null || v === undefined ? open : sig(v));
const withU = (v: string, u: string): string => (u ? `${v} ${u}` : v);

function lifeBlock(r: DatasetReport, c: DatasetCandidate | undefined, u: string): DecisionBlock | null {
  const life = r.life;
  if (!life) return null;
  const lines: DecisionLine[] = [
    { kind: 'fact', text: `${life.units} units on test: ${life.failures} failed, ${life.suspensions} suspended (still running or removed unfailed, treated as right-censored).` },
    { kind: 'note', text: life.chiSquare.reason },
  ];
  const tables: DecisionTable[] = [];
  if (c) {
    if (c.bLives && c.bLives.length > 0) {
      tables.push({
        caption: `B-lives under ${c.label}: the time by which the given share of units has failed; two-sided ${pct(life.confidence)} bounds (${c.bLifeMethod ?? life.boundMethod}).`,
        head: ['Life', `Estimate${u ? ` [${u}]` : ''}`, 'Lower bound', 'Upper bound', 'Bounds closed'],
        rows: c.bLives.map((b) => [`B${sig(b.percent, 3)}`, sig(b.estimate), sig(b.lower), sig(b.upper), b.boundsFound ? 'yes' : 'no: search limit shown']),
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
  lines.push({ kind: 'note', text: `Plotting positions: ${life.plot.description}` });
  for (const w of life.warnings) lines.push({ kind: 'warning', text: w });
  for (const k of life.cautions) lines.push({ kind: 'caution', text: k });
  return { id: 'life', title: 'Life of the units', lead: 'Failures and suspensions together: how long until a share of units fails, and the chance a unit survives a given time.', lines, tables, charts: ['life-probability', 'hazard'] };
}

function floodBlock(r: DatasetReport, c: DatasetCandidate | undefined, u: string): DecisionBlock | null {
  const f = r.flood;
  if (!f) return null;
  const lines: DecisionLine[] = [{ kind: 'fact', text: `Record: ${f.recordLength} annual maxima. Return periods asked for: ${f.periods.join(', ')} years.` }];
  const tables: DecisionTable[] = [];
  if (c?.returnLevels) {
    tables.push({
      caption: `Return levels under ${c.label}, two-sided ${pct(f.confidence)} intervals (${c.returnLevelMethod ?? ''}).`,
      head: ['Return period T [years]', 'Chance per year', `Level${u ? ` [${u}]` : ''}`, 'Lower', 'Upper', 'Record'],
      rows: c.returnLevels.map((x) => [sig(x.period), sig(x.exceedanceProbability, 3), sig(x.estimate), end(x.lower, 'not closed'), end(x.upper, 'unbounded'), x.beyondRecord ? 'far beyond (> 2 × record)' : 'within reach']),
    });
  }
  if (f.designLife) {
    tables.push({
      caption: `Chance of at least one exceedance within a design life of ${f.designLife.years} years, 1 − (1 − 1/T)^L (independent years).`,
      head: ['Return period T [years]', `Chance in ${f.designLife.years} years`],
      rows: f.designLife.exceedance.map((x) => [sig(x.period), x.probability > 0.999 ? '> 99.9 %' : pct(x.probability)]),
    });
  }
  lines.push({ kind: 'note', text: `Plotting positions: ${f.plottingPositions.description}.` });
  if (f.gevSignNote) lines.push({ kind: 'note', text: f.gevSignNote });
  for (const w of f.warnings) lines.push({ kind: 'warning', text: w });
  if (c) for (const w of c.warnings ?? []) lines.push({ kind: 'warning', text: `${c.label}: ${w}` });
  for (const k of f.cautions) lines.push({ kind: 'caution', text: k });
  return { id: 'flood', title: 'Flood levels by return period', lead: 'The level exceeded on average once in T years, with its interval, and the chance of seeing it during the life of the works.', lines, tables, charts: ['return-period'] };
}

function capabilityBlock(r: DatasetReport, u: string): DecisionBlock | null {
  const cap = r.capability;
  if (!cap) return null;
  const limits = [cap.lsl !== null ? `LSL ${sig(cap.lsl, 6)}` : 'no lower limit', cap.usl !== null ? `USL ${sig(cap.usl, 6)}` : 'no upper limit', ...(cap.target !== null ? [`target ${sig(cap.target, 6)}`] : [])];
  const lines: DecisionLine[] = [
    { kind: 'fact', text: `Tolerance: ${limits.join(', ')}${u ? ` (${u})` : ''}. n = ${cap.n}, mean ${sig(cap.mean, 6)}, overall sd ${sig(cap.sdOverall, 4)} (n − 1).` },
  ];
  if (cap.normality) lines.push({ kind: cap.normality.passes ? 'fact' : 'warning', text: `Normality gate: ${cap.normality.statement}` });
  else lines.push({ kind: 'note', text: 'Normality gate: the normal model was not among the candidates.' });
  lines.push({ kind: 'note', text: cap.gateRule });
  const idx = (rows: readonly { name: string; estimate: number; lower: number; upper: number; intervalMethod: string }[]): string[][] =>
    rows.map((x) => [x.name, sig(x.estimate, 4), sig(x.lower, 4), sig(x.upper, 4), x.intervalMethod]);
  const tables: DecisionTable[] = [
    { caption: `Overall (long-term) indices from the overall sd; two-sided ${pct(cap.confidence)} intervals.`, head: ['Index', 'Estimate', 'Lower', 'Upper', 'Interval method'], rows: idx(cap.overall) },
  ];
  if (cap.within) {
    tables.push({
      caption: `Within-subgroup (short-term) indices: sigma ${sig(cap.within.sigma, 4)} from ${cap.within.description}, ${cap.within.subgroups} subgroups.`,
      head: ['Index', 'Estimate', 'Lower', 'Upper', 'Interval method'],
      rows: idx(cap.within.indices),
    });
  }
  if (cap.percentile) {
    tables.push({
      caption: `Percentile method (ISO 22514-2) under ${cap.percentile.family}: quantiles 0.135 % = ${sig(cap.percentile.lowerQuantile, 6)}, median ${sig(cap.percentile.median, 6)}, 99.865 % = ${sig(cap.percentile.upperQuantile, 6)}. ${cap.percentile.method}`,
      head: ['Index', 'Estimate'],
      rows: cap.percentile.indices.map((x) => [x.name, sig(x.estimate, 4)]),
    });
  }
  const ppmRows = r.candidates.filter((c) => c.ppmOutOfSpec).map((c) => [capital(c.label), c.rejectedBy.length === 0 ? 'passes' : `rejected (${c.rejectedBy.join(', ')})`, sig(c.ppmOutOfSpec!.belowLsl, 3), sig(c.ppmOutOfSpec!.aboveUsl, 3), sig(c.ppmOutOfSpec!.total, 3)]);
  ppmRows.push(['Normal, overall mean and sd', '', sig(cap.normalPpm.belowLsl, 3), sig(cap.normalPpm.aboveUsl, 3), sig(cap.normalPpm.total, 3)]);
  tables.push({ caption: 'Parts per million outside the tolerance from each fitted model\'s tails.', head: ['Model', 'Tests', 'Below LSL', 'Above USL', 'Total ppm'], rows: ppmRows });
  if (cap.resolution.warning) lines.push({ kind: 'warning', text: `Gauge resolution: ${cap.resolution.warning}` });
  for (const w of cap.warnings) if (w !== cap.resolution.warning) lines.push({ kind: 'warning', text: w });
  for (const k of cap.cautions) lines.push({ kind: 'caution', text: k });
  return { id: 'capability', title: 'Against the tolerance', lead: 'How much of the tolerance the process uses, with intervals, and how many parts fall outside under each model.', lines, tables, charts: ['capability-histogram'] };
}

function trendBlock(r: DatasetReport): DecisionBlock | null {
  const t = r.trend;
  if (!t) return null;
  const lines: DecisionLine[] = [
    { kind: t.trendDetected ? 'warning' : 'fact', text: t.decision },
    { kind: 'note', text: `Order from ${t.orderFrom === 'column' ? 'the order/year column' : 'the row order'}. ${t.method}` },
  ];
  if (t.warning) lines.push({ kind: 'warning', text: t.warning });
  for (const k of t.cautions) lines.push({ kind: 'caution', text: k });
  const tables: DecisionTable[] = [{
    caption: 'Mann–Kendall trend test and Sen\'s slope.',
    head: ['n', 'S', 'Z', 'p (two-sided)', 'Kendall τ-b', 'Sen slope per unit of order', 'Interval'],
    rows: [[String(t.n), String(t.s), sig(t.z, 3), `${sig(t.pValue, 3)} (${t.pMethod})`, sig(t.tauB, 3), t.senSlope ? sig(t.senSlope.estimate, 4) : '—', t.senSlope ? `${sig(t.senSlope.lower, 4)} to ${sig(t.senSlope.upper, 4)} (${pct(t.senSlope.confidence)})` : '—']],
  }];
  return { id: 'trend', title: 'Drift over time', lead: 'Do the values creep up or down with time? A trend breaks the assumption that every value comes from one distribution.', lines, tables, charts: [] };
}

function sensitivityBlock(r: DatasetReport): DecisionBlock | null {
  const rows = r.sensitivity;
  if (!rows || rows.length === 0) return null;
  const families: string[] = [];
  const labels = new Map<string, string>();
  for (const row of rows) for (const v of row.values) if (!labels.has(v.family)) { labels.set(v.family, capital(v.label)); families.push(v.family); }
  const none = rows.some((x) => x.basis !== 'passing');
  const lines: DecisionLine[] = [
    { kind: none ? 'warning' : 'note', text: none ? 'No model passes every test: the numbers below are shown under all of them, none of which describes the data well.' : 'Only models that no test rejects are listed. A wide spread means the choice of model, not the data, decides the number.' },
  ];
  const table: DecisionTable = {
    caption: 'Each decision number under every passing model (estimate, interval where one exists), with the spread.',
    head: ['Decision number', ...families.map((f) => labels.get(f) ?? f), 'Spread (max/min)'],
    rows: rows.map((row) => [
      row.quantity,
      ...families.map((f) => {
        const v = row.values.find((x) => x.family === f);
        if (!v) return '—';
        const iv = v.lower !== undefined || v.upper !== undefined ? ` (${end(v.lower, '…')} to ${end(v.upper, '…')})` : '';
        return `${sig(v.estimate)}${iv}${v.passes ? '' : ' ✗'}`;
      }),
      row.min > 0 ? `${sig(row.max / row.min, 3)}×` : `${sig(row.min)} to ${sig(row.max)}`,
    ]),
  };
  return { id: 'sensitivity', title: 'How much the model choice moves the answer', lead: 'The same decision numbers under each model side by side.', lines, tables: [table], charts: [] };
}

/** The blocks to show, in order, for the selected candidate. Empty when the report has no workflow section. */
export function decisionBlocks(r: DatasetReport, selected: string | null, units: string): DecisionBlock[] {
  const found = r.candidates.find((x) => x.family === selected) ?? r.candidates[0];
  const c = found ? { ...found, label: capital(found.label) } : undefined;
  const u = units.trim();
  return [lifeBlock(r, c, u), floodBlock(r, c, u), capabilityBlock(r, u), trendBlock(r), sensitivityBlock(r)].filter((b): b is DecisionBlock => b !== null);
}

const LINE_LABEL: Record<DecisionLine['kind'], string> = { fact: '', note: 'Note: ', warning: 'Warning: ', caution: 'Caution: ' };

/** DOM for one block; `chart` makes the element a chart slot is drawn into. */
export function blockNode(b: DecisionBlock, chart: (slot: ChartSlot) => HTMLElement): HTMLElement {
  const sec = el('section', { className: `decision-block decision-${b.id}`, 'data-block': b.id, 'aria-labelledby': `decision-${b.id}-h` });
  sec.append(el('h3', { id: `decision-${b.id}-h` }, b.title), el('p', { className: 'hint tight' }, b.lead));
  const facts = el('ul', { className: 'decision-lines' });
  for (const l of b.lines) facts.append(el('li', { className: `line-${l.kind}` }, l.kind === 'fact' ? null : el('strong', {}, LINE_LABEL[l.kind]), l.text));
  for (const t of b.tables) {
    const table = el('table', { className: 'decision-table' }, el('caption', {}, t.caption), el('thead', {}, el('tr', {}, ...t.head.map((h) => el('th', { scope: 'col' }, h)))));
    table.append(el('tbody', {}, ...t.rows.map((r) => el('tr', {}, ...r.map((v, i) => el(i === 0 ? 'th' : 'td', i === 0 ? { scope: 'row' } : {}, v))))));
    sec.append(el('div', { className: 'table-scroll' }, table));
  }
  if (b.charts.length > 0) sec.append(el('div', { className: 'decision-charts' }, ...b.charts.map((s) => chart(s))));
  sec.append(facts);
  return sec;
}

/** Escaped HTML for one block (the exported report); `chartSvg` gives each slot's SVG markup. */
export function blockHtml(b: DecisionBlock, chartSvg: (slot: ChartSlot) => string): string {
  const lines = b.lines.map((l) => `<li class="line-${l.kind}">${l.kind === 'fact' ? '' : `<strong>${e(LINE_LABEL[l.kind])}</strong>`}${e(l.text)}</li>`).join('');
  const tables = b.tables
    .map((t) => `<table><caption class="small">${e(t.caption)}</caption><thead><tr>${t.head.map((h) => `<th>${e(h)}</th>`).join('')}</tr></thead><tbody>${t.rows.map((r) => `<tr>${r.map((v, i) => (i === 0 ? `<th>${e(v)}</th>` : `<td class="num">${e(v)}</td>`)).join('')}</tr>`).join('')}</tbody></table>`)
    .join('');
  const charts = b.charts.map((s) => `<figure>${chartSvg(s)}</figure>`).join('');
  return `<section class="decision" data-block="${e(b.id)}"><h3>${e(b.title)}</h3><p class="small">${e(b.lead)}</p>${tables}${charts}<ul>${lines}</ul></section>`;
}

/** One sentence with the first decision number, for the top of the page (null when there is none). */
export function headline(r: DatasetReport, selected: string | null, units: string): string | null {
  const found = r.candidates.find((x) => x.family === selected) ?? r.candidates[0];
  if (!found) return null;
  const label = capital(found.label);
  const u = units.trim();
  const b = found.bLives?.[0];
  if (r.life && b) return `B${sig(b.percent, 3)} life under ${label}: ${withU(sig(b.estimate), u)} (two-sided ${pct(b.confidence)} bounds ${sig(b.lower)} to ${sig(b.upper)}), from ${r.life.failures} failures and ${r.life.suspensions} suspensions.`;
  const rl = found.returnLevels?.[found.returnLevels.length - 1];
  if (r.flood && rl) return `${sig(rl.period)}-year level under ${label}: ${withU(sig(rl.estimate), u)} (${pct(rl.confidence)} interval ${end(rl.lower, 'open')} to ${end(rl.upper, 'unbounded')})${rl.beyondRecord ? ', far beyond the record' : ''}.`;
  const cap = r.capability;
  const ppk = cap?.overall.find((x) => x.name === 'Ppk');
  if (cap && ppk) return `Ppk ${sig(ppk.estimate, 3)} (lower bound ${sig(ppk.lower, 3)})${cap.normality && !cap.normality.passes ? '; the normal model fails its test, see the percentile method' : ''}; ${sig(found.ppmOutOfSpec?.total ?? cap.normalPpm.total, 3)} ppm out of tolerance under ${label}.`;
  return null;
}
