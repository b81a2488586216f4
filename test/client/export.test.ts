// @vitest-environment jsdom
/**
 * The exports: the self-contained HTML report, the bins CSV, and the escaping and number
 * formatting they rely on. The report is built from a real core analysis of an invented sample.
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it, vi } from 'vitest';
import { analyze, analyzeDataset, computeEvidence, formatNumber, pValueText, prepareSample } from '../../core/index.js';
import { csvCell, csvDocument } from '../../client/src/csv-export.js';
import { escapeHtml } from '../../client/src/escape.js';
import { pValue, sig } from '../../client/src/format.js';
import { buildReportHtml, dataRecord, DATA_INLINE_LIMIT } from '../../client/src/report-html.js';
import { binsCsv } from '../../client/src/bins-csv.js';
import { binsTableRows, drawEvidence, evidenceFor } from '../../client/src/evidence-render.js';
import { candidateCells } from '../../client/src/candidate-cells.js';
import type { AnalyzeResponse } from '../../client/src/api.js';
import { exportHtml } from '../../client/src/page-export.js';
import { INITIAL_STATE, update } from '../../client/src/state.js';

describe('CSV cells (OWASP "CSV Injection": neutralise cells starting with = + - @, tab or CR)', () => {
  it.each([
    ['=1+2', `"'=1+2"`],
    ['+SUM(A1:A2)', `"'+SUM(A1:A2)"`],
    ['-2+3', `"'-2+3"`],
    ['@cmd', `"'@cmd"`],
    ['\tx', `"'\tx"`],
  ])('neutralises %j', (input, expected) => {
    expect(csvCell(input)).toBe(expected);
  });

  it('quotes commas, quotes and line breaks by RFC 4180 §2 and leaves plain text and numbers alone', () => {
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
    expect(csvCell('two\nlines')).toBe('"two\nlines"');
    expect(csvCell('bearing')).toBe('bearing');
    expect(csvCell(-3.5)).toBe('-3.5');
    expect(csvCell(null)).toBe('');
    expect(csvDocument([['a', 1], ['b', 2]])).toBe('a,1\r\nb,2\r\n');
  });
});

describe('HTML escaping (OWASP XSS Prevention Cheat Sheet, rule 1)', () => {
  it('encodes & < > " and \'', () => {
    expect(escapeHtml(`<a href="x" onclick='y'>&</a>`)).toBe('&lt;a href=&quot;x&quot; onclick=&#39;y&#39;&gt;&amp;&lt;/a&gt;');
  });
});

describe('number formatting for reading', () => {
  it('shows a p-value bound as a bound, e.g. "< 0.005" (the AD table gives only a bound beyond its range)', () => {
    expect(pValue(0.005, 'upper-bound')).toBe('< 0.005');
    expect(pValue(0.25, 'lower-bound')).toBe('> 0.25');
    expect(pValue(0.04321)).toBe('0.0432');
    expect(pValue(3.2e-7)).toBe('3.2e-7');
  });
  it('rounds to significant figures with a true minus sign (common practice, no source)', () => {
    expect(sig(1234.5678)).toBe('1235');
    expect(sig(-0.000123456)).toBe('−0.0001235');
    expect(sig(1.5e9)).toBe('1.5e+9');
  });
  it('prints the same digits as the CLI: sig is core formatNumber with a true minus sign, pValue is core pValueText', () => {
    for (const x of [1234.5678, -0.000123456, 1.5e9, 9999999.6, -2.5e-9, 0.1 + 0.2, 42, -7.25, 6.02e23]) {
      for (const d of [2, 3, 4, 6]) expect(sig(x, d)).toBe(formatNumber(x, d).replace(/^-/, '−'));
    }
    // 9999999.6 to 4 digits rounds up to 1e7, past plain notation: written as the CLI writes it.
    expect(sig(9999999.6)).toBe('1e+7');
    expect(sig(null)).toBe('—');
    for (const p of [0.04321, 3.2e-7, 0, 1e-320, 0.5]) expect(pValue(p)).toBe(pValueText(p));
    // A bound below 1e-4 keeps two digits, as an estimate there does.
    expect(pValue(3.214e-7, 'upper-bound')).toBe('< 3.2e-7');
    expect(pValue(3.214e-7, 'upper-bound')).toBe(pValueText(3.214e-7, 'upper-bound'));
  });
});

// An invented sample: Weibull-like quantiles, with hostile text in every user field.
const VALUES = Array.from({ length: 40 }, (_, i) => 100 * Math.pow(-Math.log(1 - (i + 0.5) / 40), 1 / 1.8));
const HOSTILE = '<script>alert("x")</script>';

function response(): AnalyzeResponse {
  const report = analyze(VALUES, { alpha: 0.05 });
  const evidence = computeEvidence(prepareSample(VALUES), report);
  return {
    ...report,
    dataKind: 'complete' as const,
    evidence,
    input: {
      source: 'csv',
      n: 40,
      column: HOSTILE,
      rowsRead: 42,
      skipped: [{ reason: 'non-numeric', count: 2, firstRow: 5, firstColumn: HOSTILE, firstValue: '=cmd|x', description: 'not a number' }],
      blankLines: 0,
      header: [HOSTILE],
      warnings: [],
    },
  };
}

function buildReport(): string {
  const resp = response();
  const selected = resp.candidates[0]!.family;
  const targets = { histogram: document.createElement('div'), probability: document.createElement('div'), bins: document.createElement('div'), cdf: document.createElement('div') };
  const svgs = drawEvidence(targets, resp.evidence!, selected, { units: HOSTILE, quantity: HOSTILE, sizeOf: () => ({ width: 760, height: 440 }) });
  const ce = evidenceFor(resp.evidence!, selected)!;
  return buildReportHtml({
    response: resp,
    selected,
    sourceName: `${HOSTILE}.csv`,
    column: HOSTILE,
    units: HOSTILE,
    quantity: HOSTILE,
    generatedAt: new Date('2026-12-01T22:00:00Z'),
    charts: svgs.map((s) => ({ svg: s.outerHTML, caption: 'caption' })),
    binsTable: binsTableRows(ce, (x) => (x === null ? '∞' : String(x))),
    requestedBins: null,
  });
}

describe('the HTML report', () => {
  const html = buildReport();
  const doc = new DOMParser().parseFromString(html, 'text/html');

  it('contains the ranking table with every candidate and four inline SVG charts', () => {
    const rows = doc.querySelectorAll('table.ranking tbody tr');
    expect(rows.length).toBe(response().candidates.length);
    expect(doc.querySelectorAll('figure svg')).toHaveLength(4);
    expect(doc.querySelector('tr.selected')).not.toBeNull();
  });

  it('records software version, date, seed, α and the methods with their sources', () => {
    const text = doc.body.textContent ?? '';
    const r = response();
    expect(text).toContain(`plumbline ${r.software.version}`);
    expect(text).toContain('2026-12-01T22:00:00.000Z');
    expect(text).toContain(String(r.options.seed));
    expect(text).toContain('Significance level α0.05');
    for (const m of r.methods) expect(text).toContain(m.source);
    expect(text).toContain('licensed');
  });

  it('has no script and no external resource: self-contained (no src/href to other files)', () => {
    expect(doc.querySelectorAll('script')).toHaveLength(0);
    expect(html).not.toMatch(/<script/i);
    expect(doc.querySelectorAll('[src], link[href]')).toHaveLength(0);
    expect(html).not.toMatch(/url\((?!#)/); // only in-document references such as url(#clip-1)
    expect(html).not.toMatch(/https?:\/\/(?!www\.w3\.org\/2000\/svg)/);
  });

  it('escapes user text everywhere it appears (OWASP XSS Prevention Cheat Sheet, rule 1)', () => {
    expect(html).toContain('&lt;script&gt;');
    // The hostile text is shown as text, in the title, the headings and the chart labels.
    expect(doc.title).toContain(HOSTILE);
    expect(doc.body.textContent).toContain(`${HOSTILE}.csv`);
  });
});

describe('the report opens with the answer and records every input', () => {
  it('the first section is the answer, before the models, the evidence and the record', () => {
    const doc = new DOMParser().parseFromString(buildReport(), 'text/html');
    const heads = [...doc.querySelectorAll('h2')].map((h) => h.textContent ?? '');
    expect(heads[0]).toBe('The answer');
    expect(heads.indexOf('What shaped this answer')).toBeGreaterThan(heads.indexOf('Candidate models, best first'));
    // No decision number was asked for: the answer is the verdict on the selected model.
    expect(doc.querySelector('.answer')?.textContent).toMatch(/best by AICc/);
  });

  it('a life report: the B10 answer with its cautions first; status column, confidence, seed and the data (SHA-256, FIPS 180-4) recorded', async () => {
    const times = VALUES.map((v, i) => (i % 5 === 4 ? Math.round(v) + 0.5 : v));
    const status = VALUES.map((_, i) => (i % 5 === 4 ? 0 : 1));
    const report = analyzeDataset({ values: times, status }, { families: ['weibull', 'lognormal'], bLifePercents: [10], confidence: 0.9, bootstrapReplicates: 19, seed: 7 });
    const csv = 'hours,failed\n' + times.map((t, i) => `${t},${status[i]}`).join('\n');
    const data = await dataRecord(csv);
    const html = buildReportHtml({
      response: { ...report, input: { source: 'csv', n: 40, column: 'hours', otherColumns: [{ role: 'status', column: 'failed' }] } } as AnalyzeResponse,
      selected: 'weibull',
      sourceName: 'bench.csv',
      column: 'hours',
      units: 'h',
      quantity: 'Life',
      generatedAt: new Date('2026-12-01T22:00:00Z'),
      charts: [],
      binsTable: [],
      requestedBins: null,
      data,
    });
    const doc = new DOMParser().parseFromString(html, 'text/html');
    const answer = doc.querySelector('.answer')!.textContent ?? '';
    expect(answer).toMatch(/^B10 life under Weibull: .+ h \(two-sided 90 % bounds/);
    // The answer comes before the first table of the report.
    expect(html.indexOf('class="answer')).toBeLessThan(html.indexOf('<table'));
    const record = doc.getElementById('record')!.parentElement!.textContent ?? '';
    expect(record).toContain('Status column (1 failed, 0 suspended)failed');
    expect(record).toContain('Confidence level90 % two-sided');
    expect(record).toContain('Random seed7');
    expect(record).toContain('B-livesB10');
    expect(record).toContain(`SHA-256 of the data as analysed${data.sha256}`);
    expect(doc.querySelector('pre.data')?.textContent).toBe(csv);
  });

  it('records the subgroup and order columns with their roles, and says when there are none', () => {
    const base = response();
    const ctx = { selected: base.candidates[0]!.family, sourceName: 's.csv', column: 'd', units: 'mm', quantity: 'Diameter', generatedAt: new Date(0), charts: [], binsTable: [], requestedBins: null };
    const withRoles = buildReportHtml({ ...ctx, response: { ...base, input: { ...base.input!, otherColumns: [{ role: 'subgroups', column: 'lot' }, { role: 'order', column: 'made' }] } } });
    const text = new DOMParser().parseFromString(withRoles, 'text/html').getElementById('record')!.parentElement!.textContent ?? '';
    expect(text).toContain('Subgroup columnlot');
    expect(text).toContain('Order column (time or year)made');
    const none = new DOMParser().parseFromString(buildReportHtml({ ...ctx, response: base }), 'text/html').body.textContent ?? '';
    expect(none).toContain('Other column rolesnone');
    expect(none).toContain('Confidence levelnot used');
  });

  it('interval rows with a failure-mode column: the record names the interval columns and each role in words', () => {
    const base = response();
    const ctx = { selected: base.candidates[0]!.family, sourceName: 'inspections.csv', column: 'start–end, units', units: 'h', quantity: 'Time', generatedAt: new Date(0), charts: [], binsTable: [], requestedBins: null };
    // the roles as the server lists them for interval rows (server/analysis.ts otherColumns)
    const otherColumns = [{ role: 'interval end', column: 'end' }, { role: 'count', column: 'units' }, { role: 'failure mode', column: 'mode' }];
    const html = buildReportHtml({ ...ctx, response: { ...base, input: { ...base.input!, otherColumns } } as unknown as AnalyzeResponse });
    const text = new DOMParser().parseFromString(html, 'text/html').getElementById('record')!.parentElement!.textContent ?? '';
    expect(text).toContain('Interval columns (start–end, units per row)start–end, units');
    expect(text).toContain('Interval end column (found failed by)end');
    expect(text).toContain('Units per row columnunits');
    expect(text).toContain("Failure-mode column (each failed unit's mode)mode");
    expect(text).not.toContain('Value column');
  });

  it('shows the bootstrap chi-square p where it decides the test, beside the asymptotic pair', () => {
    const base = response();
    const i = base.candidates.findIndex((c) => c.chiSquare.computable);
    const c = base.candidates[i]!;
    const boot = { ...c, chiSquare: { ...c.chiSquare, decidedBy: 'bootstrap' as const, bootstrap: { pValue: 0.0312, monteCarloStandardError: 0.0055, replicates: 999, unrefitted: 0, seed: 1 } } };
    const candidates = base.candidates.map((x, j) => (j === i ? boot : x));
    const html = buildReportHtml({ response: { ...base, candidates } as AnalyzeResponse, selected: c.family, sourceName: 's', column: 'c', units: '', quantity: '', generatedAt: new Date(0), charts: [], binsTable: [], requestedBins: null });
    expect(html).toContain('bootstrap p = 0.0312');
    expect(html).toContain('B = 999; decides');
    // Only where the bootstrap decides (for n = 40 the core decides by bootstrap where the Chernoff–Lehmann bracket is wide).
    const deciding = candidates.filter((x) => x.chiSquare.computable && (x.chiSquare as { decidedBy?: string }).decidedBy === 'bootstrap').length;
    expect(html.match(/bootstrap p = /g)).toHaveLength(deciding);
    const asymptotic = candidates.map((x, j) => (j === i ? x : { ...x, chiSquare: { ...x.chiSquare, decidedBy: 'asymptotic' as const } }));
    const html2 = buildReportHtml({ response: { ...base, candidates: asymptotic } as AnalyzeResponse, selected: c.family, sourceName: 's', column: 'c', units: '', quantity: '', generatedAt: new Date(0), charts: [], binsTable: [], requestedBins: null });
    expect(html2.match(/bootstrap p = /g)).toHaveLength(1);
  });

  it('dataRecord: SHA-256 of "abc" is the FIPS 180-2 Appendix B.1 value (from memory; python3 hashlib.sha256(b"abc") agrees); large data are recorded by checksum only', async () => {
    const abc = await dataRecord('abc');
    expect(abc.sha256).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(abc.bytes).toBe(3);
    expect(abc.text).toBe('abc');
    const big = await dataRecord('x'.repeat(DATA_INLINE_LIMIT + 1));
    expect(big.text).toBeNull();
    expect(big.sha256).toMatch(/^[0-9a-f]{64}$/);
  });

  it('prints on A4 portrait: @page size A4 and the ranking table laid out to the page width', () => {
    const html = buildReport();
    expect(html).toMatch(/@page\{size:A4 portrait;margin:14mm 12mm\}/);
    expect(html).toMatch(/@media print\{[^]*table\.ranking\{table-layout:fixed/);
  });
});

describe('the bins CSV', () => {
  it('has one row per bin plus a header, observed counts summing to n, and neutralised user text', () => {
    const resp = response();
    const ce = evidenceFor(resp.evidence!, resp.candidates[0]!.family)!;
    const csv = binsCsv(ce, '=HYPERLINK("http://x")', '@col', '+u');
    const lines = csv.trimEnd().split('\r\n');
    expect(lines.length).toBe(ce.bins.rows.length + 1);
    // Observed counts sum to n (every value falls in exactly one bin; common practice, no source).
    const observed = lines.slice(1).map((l) => Number(l.split(',').at(-4)));
    expect(observed.reduce((a, b) => a + b, 0)).toBe(40);
    expect(csv).toContain(`"'=HYPERLINK(""http://x"")"`);
    expect(csv).toContain(`"'@col"`);
    expect(csv).toContain(`"'+u"`);
    for (const line of lines) for (const cell of line.split(',')) expect(cell).not.toMatch(/^[=+@]/);
  });

  it('writes both open outer edges the same way (an empty cell) and says which end is open', () => {
    const resp = response();
    const ce = evidenceFor(resp.evidence!, 'normal')!;
    const lines = binsCsv(ce, 's', 'c', 'u').trimEnd().split('\r\n');
    const head = lines[0]!.split(',');
    const lower = head.indexOf('lower');
    const upper = head.indexOf('upper');
    const first = lines[1]!.split(',');
    const last = lines.at(-1)!.split(',');
    // A normal model's first bin starts at -infinity and its last ends at +infinity (support of the normal).
    expect(first[lower]).toBe('');
    expect(last[upper]).toBe('');
    expect(first[head.indexOf('open_edge')]).toMatch(/^lower \(/);
    expect(last[head.indexOf('open_edge')]).toMatch(/^upper \(/);
    expect(lines.join('\n')).not.toMatch(/Infinity|'-/);
  });
});

describe('table cells shared by the page and the report', () => {
  it('give the chi-square p with its k-1 bracket and the AD method', () => {
    const resp = response();
    const c = resp.candidates.find((x) => x.chiSquare.computable)!;
    const cells = candidateCells(c);
    expect(cells.dof).toMatch(/^\d+ \[\d+\]$/);
    expect(cells.chiP).toMatch(/\[.+\]$/);
    // The published formula, or the parametric bootstrap where the core chose it (small samples).
    expect(cells.adMethod).toMatch(/^(published formula|bootstrap, B = \d+)/);
    expect(cells.badge).toMatch(/^(✓ not rejected|✗ rejected by .+)$/);
  });
});

describe('the page\'s report export records the data it analysed', () => {
  // An invented column; its SHA-256 by python3 hashlib.sha256 (printf 'value\n12.5\n…\n' | sha256sum agrees).
  const CSV = 'value\n12.5\n13.1\n11.8\n14.2\n12.9\n13.7\n12.2\n13.3\n';
  const SHA = '1317d1e4a2b8c909c371af506b15b65b8704b26735c25748ec67cd0624881e13';

  async function exported(csv: string, decimal?: ','): Promise<Document> {
    const page = new DOMParser().parseFromString(readFileSync(resolve(process.cwd(), 'client/index.html'), 'utf8'), 'text/html');
    document.body.innerHTML = page.body.innerHTML;
    const values = csv.split('\n').slice(1).filter(Boolean).map((v) => Number(v.replace(',', '.')));
    const report = analyzeDataset({ values }, { families: ['normal', 'lognormal'], seed: 3 });
    const resp = { ...report, evidence: computeEvidence(prepareSample(values), report), input: { source: 'csv', n: values.length, column: 'value' } } as AnalyzeResponse;
    let st = update(INITIAL_STATE, { type: 'source-loaded', source: { kind: 'file', name: 'parts.csv', csv } });
    if (decimal) st = update(st, { type: 'reading-changed', decimal });
    st = update(st, { type: 'run-started' });
    st = update(st, { type: 'run-finished', generation: st.run.generation, report: resp, column: 'value', requestedBins: null });
    let blob: Blob | null = null;
    const create = vi.spyOn(URL, 'createObjectURL').mockImplementation((b) => {
      blob = b as Blob;
      return 'blob:report';
    });
    vi.spyOn(URL, 'revokeObjectURL').mockImplementation(() => undefined);
    const click = vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => undefined); // jsdom does not navigate
    await exportHtml(st);
    create.mockRestore();
    click.mockRestore();
    expect(blob).not.toBeNull();
    const text = await new Promise<string>((done) => {
      const reader = new FileReader();
      reader.onload = () => done(String(reader.result));
      reader.readAsText(blob!);
    });
    return new DOMParser().parseFromString(text, 'text/html');
  }

  it('a small file: its SHA-256 (FIPS 180-4, checked with python3 hashlib) and the text itself, with the reading settings', async () => {
    const doc = await exported(CSV);
    const record = doc.getElementById('record')!.parentElement!.textContent ?? '';
    expect(record).toContain(`SHA-256 of the data as analysed${SHA}`);
    expect(doc.querySelector('pre.data')?.textContent).toBe(CSV);
    expect(record).toContain('Decimal markpoint (.)');
    expect(record).toContain('Header linefirst line is a header');
  });

  it('a file past the inline limit: the SHA-256 only, no copy of the data', async () => {
    const rows = Array.from({ length: 4000 }, (_, i) => (10 + ((i * 7919) % 1000) / 100).toFixed(2));
    const csv = `value\n${rows.join('\n')}\n`;
    expect(csv.length).toBeGreaterThan(DATA_INLINE_LIMIT);
    const doc = await exported(csv);
    const record = doc.getElementById('record')!.parentElement!.textContent ?? '';
    expect(record).toContain(`SHA-256 of the data as analysed${(await dataRecord(csv)).sha256}`);
    expect(doc.querySelector('pre.data')).toBeNull();
  });
});

describe('the report records every form setting the request carried', () => {
  it('a transform, a natural bound and a Weibayes shape are listed by their page labels; settings the report restates and column roles are not', async () => {
    const { sentSettings } = await import('../../client/src/page-export.js');
    const rows = sentSettings({ families: ['normal'], alpha: 0.05, statusColumn: 2, transform: 'boxcox', naturalLowerBound: 0, assumedShape: 2.5, lsl: 1 });
    expect(rows).toEqual([
      ['Weibull shape known from experience', '2.5'],
      ['Transform to normal', 'Box–Cox (λ by maximum likelihood)'],
      ['Natural lower bound', '0'],
    ]);
    expect(sentSettings(undefined)).toEqual([]);
  });
});
