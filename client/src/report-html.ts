/**
 * The exported report: one self-contained HTML file (no scripts, no external resources; the
 * styles are in the file and the charts are inline SVG), printable to PDF from a browser.
 * Every piece of user text (file name, column name, units, quantity, warnings that quote cells)
 * goes through escapeHtml. Pure: everything it shows comes in through `ReportContext`.
 */
import { candidateCells } from './candidate-cells.js';
import { escapeHtml as e } from './escape.js';
import { sig } from './format.js';
import type { AnalyzeResponse } from './api.js';
import { skipLine } from './skip-words.js';
import { cellRows, classRows, groupedText, isGrouped } from './grouped-view.js';

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
}

const CSS = `
body{font-family:system-ui,-apple-system,"Segoe UI",Roboto,Arial,sans-serif;color:#1b1b1b;margin:2rem auto;max-width:60rem;padding:0 1rem;font-size:11pt;line-height:1.4}
h1{font-size:1.5rem;margin:0 0 .2rem;color:#0a4d68}h2{font-size:1.1rem;margin:1.6rem 0 .5rem;border-bottom:1px solid #ccd;padding-bottom:.2rem}
.sub{color:#555b61;margin:0 0 1rem}.caution{background:#fbf1d9;border-left:4px solid #9a6700;padding:.5rem .8rem;margin:1rem 0}
table{border-collapse:collapse;font-variant-numeric:tabular-nums;font-size:9.5pt;margin:.3rem 0}
th,td{border-bottom:1px solid #d5d9dd;padding:.25rem .45rem;text-align:left;vertical-align:top}
th{color:#444;font-size:8.5pt}td.num{text-align:right;white-space:nowrap}
table.kv th{width:13rem;font-size:9.5pt}
tr.selected{background:#fff6d6}.ok{color:#1f5f3a;font-weight:600}.no{color:#8a1c1c;font-weight:600}
.small{font-size:8.5pt;color:#555b61}figure{margin:1rem 0;break-inside:avoid;page-break-inside:avoid}
figure svg{max-width:100%;height:auto;border:1px solid #d5d9dd}figcaption{font-size:9pt;color:#555b61}
ol.methods li{margin-bottom:.4rem}section.decision{margin:1rem 0 1.5rem}section.decision h3{font-size:1rem;margin:.8rem 0 .2rem;color:#0a4d68}
caption{text-align:left;padding:.2rem 0}li.line-warning{color:#7a3a00}li.line-caution{background:#fbf1d9;list-style:none;margin-left:-1rem;padding:.2rem .5rem;border-left:3px solid #9a6700}
@media print{body{margin:0;max-width:none}h2{break-after:avoid}table{break-inside:auto}tr{break-inside:avoid}}
@page{margin:15mm}
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

  const record: [string, string][] = [
    ['Software', `${r.software.name} ${r.software.version}`],
    ['Report generated', when],
    ['Data source', ctx.sourceName],
    [isGrouped(r) ? 'Class columns (lower–upper, count)' : 'Value column', ctx.column],
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
    ['Model shown in the charts', selected ? `${selected.label} (rank ${selected.rank})` : ctx.selected],
  ];

  // One reason shared by every candidate (e.g. censored data) is printed once below the table.
  const reasons = new Set(r.candidates.map((c) => (c.chiSquare.computable ? '' : c.chiSquare.reason)));
  const sharedReason = reasons.size === 1 && !reasons.has('') ? [...reasons][0]! : null;
  const rows = r.candidates
    .map((c) => {
      const k = candidateCells(c);
      const chi = k.chiComputable
        ? `<td class="num">${e(k.chiSquare)}<div class="small">${e(k.chiSquareNote)}</div></td><td class="num">${e(k.dof)}</td><td class="num">${e(k.chiP)}</td>`
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
<p class="caution"><strong>Caution.</strong> These are statistical results, not approvals. A part's life, a design flood or a safety-critical dimension taken from them must be reviewed under the governing codes and standards and by a licensed or otherwise qualified engineer before it is used.</p>
<h2>Inputs</h2>${kv(record)}
<h2>Settings</h2>${kv(settings)}
<h2>Candidate models, best first</h2><p class="small">${e(r.rankingRule)} ${
    grouped
      ? 'For class counts the chi-square runs on the classes given, merged to at least 5 expected, with k−1−m degrees of freedom (exact here); Anderson–Darling is not offered.'
      : 'The chi-square p is given with k−1−m degrees of freedom and, in brackets, with k−1 (Chernoff–Lehmann: the true p lies between).'
  }</p>${table}${na}${warn}
${ctx.decisionHtml ? `<h2>Decision numbers under ${e(selected?.label ?? ctx.selected)}</h2>${ctx.decisionHtml}` : ''}
${grouped ? groupedSection : `<h2>Evidence for ${e(selected?.label ?? ctx.selected)}</h2>${figures}
<h2>Bins for ${e(selected?.label ?? ctx.selected)}</h2>${bins}`}
<h2>Methods and sources</h2>${methods}
<p class="small">Generated by ${e(r.software.name)} ${e(r.software.version)} on ${e(when)}. ln L: log-likelihood at the maximum-likelihood estimate; AICc: corrected Akaike information criterion (lower is better).</p>
</body></html>
`;
}
