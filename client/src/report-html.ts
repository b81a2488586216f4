/**
 * The exported report: one self-contained HTML file (no scripts, no external resources; the
 * styles are in the file and the charts are inline SVG), printable to PDF from a browser.
 * Every piece of user text (file name, column name, units, quantity, warnings that quote cells)
 * goes through escapeHtml. Pure: everything it shows comes in through `ReportContext`.
 *
 * Order: the answer and its cautions first, then the models, the decision numbers, the evidence,
 * and last the record of every input that shaped the answer (columns and their roles, settings,
 * confidence, seed, and the data themselves or their SHA-256 checksum). Print styles fit A4
 * portrait: @page size A4, tables wrap inside the page width, charts scale to it.
 */
import { candidateCells } from './candidate-cells.js';
import { escapeHtml as e } from './escape.js';
import { pValue, sig } from './format.js';
import type { AnalyzeResponse } from './api.js';
import { skipLine } from './skip-words.js';
import { cellRows, classRows, groupedText, isGrouped } from './grouped-view.js';
import { answerFor } from './views/answer.js';

/** The data as analysed: the text itself when it is small enough to print, and always its checksum. */
export interface DataRecord {
  /** SHA-256 of the UTF-8 bytes, lower-case hex (FIPS 180-4). */
  readonly sha256: string;
  readonly bytes: number;
  /** The text (when at most DATA_INLINE_LIMIT characters), else null. */
  readonly text: string | null;
}

/** Data up to this many characters are printed in the report; larger data are recorded by checksum. */
export const DATA_INLINE_LIMIT = 20_000;

/** The record of the data for the report: SHA-256 by the Web Crypto API (browsers and Node 20). */
export async function dataRecord(text: string, limit = DATA_INLINE_LIMIT): Promise<DataRecord> {
  const bytes = new TextEncoder().encode(text);
  const digest = new Uint8Array(await crypto.subtle.digest('SHA-256', bytes));
  const sha256 = [...digest].map((b) => b.toString(16).padStart(2, '0')).join('');
  return { sha256, bytes: bytes.length, text: text.length <= limit ? text : null };
}

const ROLE_WORDS: Readonly<Record<string, string>> = {
  status: 'Status column (1 failed, 0 suspended)',
  subgroups: 'Subgroup column',
  order: 'Order column (time or year)',
  'failure mode': 'Failure-mode column (each failed unit\'s mode)',
  'interval end': 'Interval end column (found failed by)',
  count: 'Units per row column',
  date: 'Date column',
};

export interface ReportContext {
  readonly response: AnalyzeResponse;
  readonly selected: string;
  readonly sourceName: string;
  readonly column: string;
  readonly units: string;
  readonly quantity: string;
  readonly generatedAt: Date;
  /** SVG markup of the four charts of the selected candidate, with their captions. */
  readonly charts: readonly { readonly svg: string; readonly caption: string }[];
  /** The bins table of the selected candidate (header row first), already formatted. */
  readonly binsTable: readonly (readonly string[])[];
  /** Bins as requested by the user (null = automatic). */
  readonly requestedBins: number | null;
  /** The decision area's blocks as escaped HTML (client/src/decision.ts blockHtml), or '' for none. */
  readonly decisionHtml?: string;
  /** Settings of the page that shaped the answer and are not in the report itself, as label/value pairs. */
  readonly settings?: readonly (readonly [string, string])[];
  /** The data as analysed (dataRecord), or absent when the page did not pass them. */
  readonly data?: DataRecord;
}

const CSS = `
body{font-family:system-ui,-apple-system,"Segoe UI",Roboto,Arial,sans-serif;color:#1b1b1b;margin:2rem auto;max-width:60rem;padding:0 1rem;font-size:11pt;line-height:1.4}
h1{font-size:1.5rem;margin:0 0 .2rem;color:#0a4d68}h2{font-size:1.1rem;margin:1.6rem 0 .5rem;border-bottom:1px solid #ccd;padding-bottom:.2rem}
.sub{color:#555b61;margin:0 0 1rem}.caution{background:#fbf1d9;border-left:4px solid #9a6700;padding:.5rem .8rem;margin:1rem 0}
.answer{border:1px solid #ccd;border-left:5px solid #0a4d68;padding:.6rem .9rem;margin:1rem 0}.answer p{margin:.2rem 0}.answer .the-number{font-size:1.1rem;font-weight:600}
.answer ul{margin:.4rem 0 0;padding-left:1.2rem}.answer li{margin:.2rem 0}.answer.undermined{border-left-color:#8a1c1c}
table{border-collapse:collapse;font-variant-numeric:tabular-nums;font-size:9.5pt;margin:.3rem 0;max-width:100%}
th,td{border-bottom:1px solid #d5d9dd;padding:.25rem .45rem;text-align:left;vertical-align:top;overflow-wrap:anywhere}
th{color:#444;font-size:8.5pt}td.num{text-align:right}
table.kv th{width:13rem;font-size:9.5pt}
tr.selected{background:#fff6d6}.ok{color:#1f5f3a;font-weight:600}.no{color:#8a1c1c;font-weight:600}
.small{font-size:8.5pt;color:#555b61}figure{margin:1rem 0;break-inside:avoid;page-break-inside:avoid}
figure svg{max-width:100%;height:auto;border:1px solid #d5d9dd;box-sizing:border-box}figcaption{font-size:9pt;color:#555b61}
ol.methods li{margin-bottom:.4rem}section.decision{margin:1rem 0 1.5rem}section.decision h3{font-size:1rem;margin:.8rem 0 .2rem;color:#0a4d68}
caption{text-align:left;padding:.2rem 0}li.line-warning{color:#7a3a00}li.line-caution{background:#fbf1d9;list-style:none;margin-left:-1rem;padding:.2rem .5rem;border-left:3px solid #9a6700}
pre.data{font-size:8pt;white-space:pre-wrap;overflow-wrap:anywhere;border:1px solid #d5d9dd;padding:.4rem;max-width:100%}
code{overflow-wrap:anywhere}
@page{size:A4 portrait;margin:14mm 12mm}
@media print{
body{margin:0;max-width:none;padding:0;font-size:9.5pt}
h2{break-after:avoid}table{break-inside:auto;width:100%}tr{break-inside:avoid}
table.ranking{table-layout:fixed;font-size:7.5pt}table.ranking th,table.ranking td{padding:.15rem .2rem}
table.ranking th:nth-child(1){width:3%}table.ranking th:nth-child(2){width:11%}table.ranking th:nth-child(3){width:13%}table.ranking th:nth-child(4){width:7%}table.ranking th:nth-child(5){width:8%}table.ranking th:nth-child(6){width:9%}table.ranking th:nth-child(7){width:6%}table.ranking th:nth-child(8){width:7%}table.ranking th:nth-child(9){width:6%}table.ranking th:nth-child(10){width:9%}table.ranking th:nth-child(11){width:21%}table.ranking td{overflow-wrap:break-word}
table.kv th{width:34%}
figure svg{width:100%}
.answer,.caution{break-inside:avoid}
}
`;

function kv(rows: readonly (readonly [string, string])[]): string {
  return `<table class="kv"><tbody>${rows.map(([k, v]) => `<tr><th scope="row">${e(k)}</th><td>${e(v)}</td></tr>`).join('')}</tbody></table>`;
}

export function buildReportHtml(ctx: ReportContext): string {
  const r = ctx.response;
  const input = r.input;
  const o = r.options;
  const when = ctx.generatedAt.toISOString();
  const selected = r.candidates.find((c) => c.family === ctx.selected);
  const units = ctx.units.trim();
  const skipped = input?.skipped ?? [];
  const totalSkipped = skipped.reduce((s, k) => s + k.count, 0);
  const selectedChi = selected?.chiSquare;
  const grouped = isGrouped(r) ? r : null;
  // Life data found at inspections: the input names an interval-end column (server/analysis.ts otherColumns).
  const intervalRows = (input?.otherColumns ?? []).some((c) => c.role === 'interval end');

  const record: [string, string][] = [
    ['Software', `${r.software.name} ${r.software.version}`],
    ['Report generated', when],
    ['Data source', ctx.sourceName],
    [isGrouped(r) ? 'Class columns (lower–upper, count)' : intervalRows ? 'Interval columns (start–end, units per row)' : 'Value column', ctx.column],
    ...(input?.otherColumns ?? []).map((c) => [ROLE_WORDS[c.role] ?? `${c.role} column`, c.column] as [string, string]),
    ...(grouped || (input?.otherColumns ?? []).length > 0 ? [] : [['Other column roles', 'none (every value an observed value; no status, subgroup or order column)'] as [string, string]]),
    ['Quantity', ctx.quantity || '(not given)'],
    ['Units', units || '(not given)'],
    [isGrouped(r) ? 'Total count (n)' : 'Values analysed (n)', String(r.n)],
  ];
  if (input?.rowsRead !== undefined) record.push(['Data rows read', String(input.rowsRead)]);
  record.push(['Rows skipped', totalSkipped === 0 ? 'none' : `${totalSkipped}: ${skipped.map(skipLine).join('; ')}`]);
  if (input?.blankLines) record.push(['Blank lines passed over', String(input.blankLines)]);
  record.push([grouped ? 'Data summary (from class midpoints weighted by the counts; approximate)' : 'Data summary', `min ${sig(r.summary.min)}, max ${sig(r.summary.max)}, mean ${sig(r.summary.mean)}, sd ${sig(r.summary.sd)}, ${r.summary.distinct} distinct values`]);

  const settings: [string, string][] = [
    ['Models tried', o.families.join(', ')],
    ['Significance level α', String(o.alpha)],
    grouped
      ? [
          'Chi-square cells',
          `the ${grouped.grouped.classes.length} classes given, merged left to right to at least 5 expected` +
            (selectedChi && selectedChi.computable ? `; k = ${selectedChi.k} cells for ${selected?.label ?? ''}` : ''),
        ]
      : [
          'Chi-square bins',
          `${ctx.requestedBins === null ? 'automatic' : `requested k = ${ctx.requestedBins}`}` +
            (selectedChi && selectedChi.computable && 'kRule' in selectedChi ? `; used k = ${selectedChi.k} for ${selected?.label ?? ''} (${selectedChi.kRule})` : ''),
        ],
    [
      'Anderson–Darling p-value',
      grouped ? 'not offered for class counts (reason in the class counts section)' : o.pMethod === 'bootstrap' ? `parametric bootstrap, B = ${o.bootstrapReplicates}` : 'published formula for each family',
    ],
    ...(grouped ? [] : [['Random seed', String(o.seed)] as [string, string]]),
    ...decisionSettings(r),
    ...(ctx.settings ?? []).map(([k, v]) => [k, v] as [string, string]),
    ['Model shown in the charts', selected ? `${selected.label} (rank ${selected.rank})` : ctx.selected],
  ];
  const dataRows: [string, string][] = ctx.data
    ? [
        ['SHA-256 of the data as analysed', ctx.data.sha256],
        ['Size', `${ctx.data.bytes} bytes (UTF-8)`],
        ['Data', ctx.data.text !== null ? 'printed below in full' : `not printed (more than ${DATA_INLINE_LIMIT} characters): the checksum identifies the file`],
      ]
    : [['Data', 'not attached by the page that made this report; the data source above names them']];

  // One reason shared by every candidate (e.g. censored data) is printed once below the table.
  const reasons = new Set(r.candidates.map((c) => (c.chiSquare.computable ? '' : c.chiSquare.reason)));
  const sharedReason = reasons.size === 1 && !reasons.has('') ? [...reasons][0]! : null;
  const rows = r.candidates
    .map((c) => {
      const k = candidateCells(c);
      const chi = k.chiComputable
        ? `<td class="num">${e(k.chiSquare)}<div class="small">${e(k.chiSquareNote)}</div></td><td class="num">${e(k.dof)}</td><td class="num">${e(k.chiP)}${chiBootstrapNote(c)}</td>`
        : `<td colspan="3">${e(sharedReason !== null ? 'not computed (reason below the table)' : `not computed: ${k.chiSquareNote}`)}</td>`;
      return (
        `<tr${c.family === ctx.selected ? ' class="selected"' : ''}><td class="num">${e(k.rank)}</td><td><strong>${e(k.model)}</strong></td>` +
        `<td>${e(k.parameters)}</td><td class="num">${e(k.logLikelihood)}</td><td class="num">${e(k.aicc)}<div class="small">${e(k.deltaAicc)}</div></td>` +
        chi +
        (k.adOffered
          ? `<td class="num">${e(k.adStatistic)}</td><td class="num">${e(k.adP)}<div class="small">${e(k.adMethod)}</div></td>`
          : `<td colspan="2">${e(k.adStatistic)}<div class="small">needs individual values (reason below)</div></td>`) +
        `<td><span class="${k.rejected ? 'no' : 'ok'}">${e(k.badge)}</span><div class="small">${e(k.verdict)}</div></td></tr>`
      );
    })
    .join('');
  const table =
    `<table class="ranking"><thead><tr><th>#</th><th>Model</th><th>Parameters</th><th>ln L</th><th>AICc (Δ)</th><th>χ²</th>` +
    `<th>${grouped ? 'dof k−1−m' : 'dof [k−1]'}</th><th>${grouped ? 'p (χ²)' : 'p (χ²) [k−1]'}</th><th>A²</th><th>p (A²)</th><th>Verdict at α = ${e(o.alpha)}</th></tr></thead><tbody>${rows}</tbody></table>` +
    (sharedReason !== null ? `<p class="small">Chi-square not computed for any model: ${e(sharedReason)}</p>` : '');

  const na =
    r.notApplicable.length === 0
      ? ''
      : `<h3>Models not fitted</h3><ul>${r.notApplicable.map((n) => `<li><strong>${e(n.family)}</strong>: ${e(n.reason)}</li>`).join('')}</ul>`;
  const warnings = [...r.warnings, ...(input?.warnings ?? [])].filter((w) => !r.notApplicable.some((n) => n.reason !== '' && w.includes(n.reason)));
  const warn = warnings.length === 0 ? '' : `<h3>Warnings</h3><ul>${warnings.map((w) => `<li>${e(w)}</li>`).join('')}</ul>`;

  const figures = ctx.charts.map((c) => `<figure>${c.svg}<figcaption>${e(c.caption)}</figcaption></figure>`).join('');
  const [head, ...body] = ctx.binsTable;
  const bins =
    head === undefined
      ? ''
      : `<table><thead><tr>${head.map((h) => `<th>${e(h)}</th>`).join('')}</tr></thead><tbody>${body
          .map((row) => `<tr>${row.map((v) => `<td class="num">${e(v)}</td>`).join('')}</tr>`)
          .join('')}</tbody></table>` + (units ? `<p class="small">Bin edges in ${e(units)}.</p>` : '');
  let groupedSection = '';
  if (grouped) {
    const gc = grouped.candidates.find((c) => c.family === ctx.selected);
    const t = groupedText(grouped, gc);
    const table = (rows: string[][], caption: string): string => {
      const [h, ...b] = rows;
      return h === undefined
        ? ''
        : `<table><caption class="small">${e(caption)}</caption><thead><tr>${h.map((x) => `<th>${e(x)}</th>`).join('')}</tr></thead><tbody>${b
            .map((row) => `<tr>${row.map((v) => `<td class="num">${e(v)}</td>`).join('')}</tr>`)
            .join('')}</tbody></table>`;
    };
    groupedSection =
      `<h2 id="grouped-counts">Class counts: chi-square on the classes for ${e(gc?.label ?? ctx.selected)}</h2>` +
      `<p>${e(t.summary)}</p><p>${e(t.test)}</p>${figures}` +
      table(gc ? cellRows(gc) : [], `Classes merged to at least 5 expected${units ? `, limits in ${units}` : ''}`) +
      `<p class="small">Degrees of freedom: ${e(t.rule)}</p>` +
      `<p class="caution"><strong>Anderson–Darling not offered.</strong> ${e(t.adNote)}</p>` +
      `<p class="small">${e(t.noValues)}</p>` +
      table(classRows(grouped), `Classes as read${units ? `, limits in ${units}` : ''}`);
  }
  const methods = `<ol class="methods">${r.methods
    .map((m) => `<li><strong>${e(m.topic)}.</strong> ${e(m.description)} <span class="small">Source: ${e(m.source)}</span></li>`)
    .join('')}</ol>`;

  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${e(`Plumbline fit report: ${ctx.sourceName}, ${ctx.column}`)}</title>
<style>${CSS}</style></head>
<body>
<h1>Fit report: ${e(ctx.sourceName)}</h1>
<p class="sub">Column ${e(ctx.column)}${units ? ` [${e(units)}]` : ''} · n = ${e(r.n)} · ${e(r.software.name)} ${e(r.software.version)} · ${e(when)}</p>
<h2 id="answer">The answer</h2>${answerHtml(ctx)}
<p class="caution"><strong>Caution.</strong> These are statistical results, not approvals. A part's life, a design flood or a safety-critical dimension taken from them must be reviewed under the governing codes and standards and by a licensed or otherwise qualified engineer before it is used.</p>
<h2>Candidate models, best first</h2><p class="small">${e(r.rankingRule)} ${
    grouped
      ? 'For class counts the chi-square runs on the classes given, merged to at least 5 expected, with k−1−m degrees of freedom (exact here); Anderson–Darling is not offered.'
      : 'The chi-square p is given with k−1−m degrees of freedom and, in brackets, with k−1 (Chernoff–Lehmann: the true p lies between).'
  }</p>${table}${na}${warn}
${ctx.decisionHtml ? `<h2>Decision numbers under ${e(selected?.label ?? ctx.selected)}</h2>${ctx.decisionHtml}` : ''}
${grouped ? groupedSection : `<h2>Evidence for ${e(selected?.label ?? ctx.selected)}</h2>${figures}
<h2>Bins for ${e(selected?.label ?? ctx.selected)}</h2>${bins}`}
<h2 id="record">What shaped this answer</h2>
<h3>Inputs</h3>${kv(record)}
<h3>Settings</h3>${kv(settings)}
<h3>The data</h3>${kv(dataRows)}${ctx.data?.text != null ? `<pre class="data">${e(ctx.data.text)}</pre>` : ''}
<h2>Methods and sources</h2>${methods}
<p class="small">Generated by ${e(r.software.name)} ${e(r.software.version)} on ${e(when)}. ln L: log-likelihood at the maximum-likelihood estimate; AICc: corrected Akaike information criterion (lower is better).</p>
</body></html>
`;
}

/** Settings of the decision sections the report carries (confidence, B-lives, periods, limits, ...). */
function decisionSettings(r: AnalyzeResponse): [string, string][] {
  if (isGrouped(r)) return [];
  const out: [string, string][] = [];
  const confidence = r.life?.confidence ?? r.flood?.confidence ?? r.capability?.confidence;
  out.push(['Confidence level', confidence === undefined ? 'not used (no bounds asked for)' : `${sig(confidence * 100, 4)} % two-sided`]);
  if (r.life) {
    out.push(['B-lives', r.life.bLifePercents.length > 0 ? r.life.bLifePercents.map((p) => `B${sig(p, 3)}`).join(', ') : 'none']);
    out.push(['Reliability at', r.life.reliabilityTimes.length > 0 ? r.life.reliabilityTimes.map((t) => sig(t)).join(', ') : 'none']);
    out.push(['Bounds', r.life.boundMethod]);
    out.push(['Plotting positions (life)', r.life.plot.description]);
  }
  if (r.flood) {
    out.push(['Return periods [years]', r.flood.periods.join(', ')]);
    out.push(['Design life', r.flood.designLife ? `${r.flood.designLife.years} years` : 'none']);
    out.push(['Plotting positions (flood)', r.flood.plottingPositions.description]);
  }
  if (r.capability) {
    out.push(['Lower specification limit', r.capability.lsl === null ? 'none' : sig(r.capability.lsl, 8)]);
    out.push(['Upper specification limit', r.capability.usl === null ? 'none' : sig(r.capability.usl, 8)]);
    out.push(['Target', r.capability.target === null ? 'none' : sig(r.capability.target, 8)]);
  }
  if (r.trend) out.push(['Trend check order', r.trend.orderFrom === 'column' ? 'from the order column' : 'the values as given (row order)']);
  return out;
}

/** The answer: the decision number under the selected model with what undermines it, or the
 *  ranking's verdict when no decision number was asked for. */
function answerHtml(ctx: ReportContext): string {
  const r = ctx.response;
  const a = isGrouped(r) ? null : answerFor(r, ctx.selected, ctx.units);
  const c = r.candidates.find((x) => x.family === ctx.selected) ?? r.candidates[0];
  if (a) {
    return (
      `<div class="answer${a.undermined ? ' undermined' : ''}"><p class="the-number">${e(a.sentence)}</p>` +
      (a.cautions.length > 0 ? `<ul>${a.cautions.map((x) => `<li>${e(x)}</li>`).join('')}</ul>` : '<p class="small">No test rejects this model and no warning undermines the number.</p>') +
      '</div>'
    );
  }
  if (!c) return '<div class="answer"><p class="the-number">No model could be fitted.</p></div>';
  const k = candidateCells(c as Parameters<typeof candidateCells>[0]);
  const best = r.candidates[0];
  const warnings = r.warnings;
  return (
    `<div class="answer${k.rejected ? ' undermined' : ''}"><p class="the-number">${e(`${c.label}${best && best.family === c.family ? ', best by AICc' : `, ranked ${c.rank}`}: ${k.badge}.`)}</p>` +
    `<p>${e(k.verdict)}</p>` +
    (warnings.length > 0 ? `<ul>${warnings.map((w) => `<li>${e(w)}</li>`).join('')}</ul>` : '') +
    '<p class="small">No decision number was asked for (B-life, return level or tolerance); the answer is the verdict on the model.</p></div>'
  );
}

/** When the parametric bootstrap decides the chi-square test, its p-value (with its Monte Carlo
 *  standard error and B) under the asymptotic pair, which no longer decides. */
function chiBootstrapNote(c: AnalyzeResponse['candidates'][number]): string {
  const chi = c.chiSquare as { readonly computable: boolean; readonly decidedBy?: string; readonly bootstrap?: { readonly pValue: number; readonly monteCarloStandardError: number; readonly replicates: number } };
  if (!chi.computable || chi.decidedBy !== 'bootstrap' || !chi.bootstrap) return '';
  const b = chi.bootstrap;
  return `<div class="small"><strong>bootstrap p = ${e(pValue(b.pValue))}</strong> ± ${e(sig(b.monteCarloStandardError, 2))}, B = ${e(b.replicates)}; decides (the pair above is asymptotic)</div>`;
}
