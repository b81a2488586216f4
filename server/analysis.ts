/**
 * One analysis request end to end (run inside a worker thread, see worker.ts): values (or the CSV
 * read by the core's reader, the same code as the CLI) → the core's plan → [bootstrap ranges on the
 * worker pool, when any family needs them] → the report, plus evidence when asked. The response is the report exactly as the CLI's
 * `--json` prints it, with `input` (where the values came from) and optionally `evidence`.
 */
import {
  computeEvidence,
  finishAnalysis,
  InputError,
  planAnalysis,
  readColumn,
  SKIP_REASON_WORDS,
  type AnalysisPlan,
  type AnalysisReport,
  type BootstrapCounts,
  type AnalyzeOptions,
  type Evidence,
  type SkipCount,
} from '../core/index.js';
import type { AnalyzeRequest } from './validate.js';

export interface InputSummary {
  readonly source: 'values' | 'csv';
  readonly n: number;
  readonly column?: string;
  readonly columnIndex?: number;
  readonly rowsRead?: number;
  readonly skipped?: readonly (SkipCount & { readonly description: string })[];
  readonly blankLines?: number;
  readonly delimiter?: string;
  readonly delimiterDetected?: boolean;
  readonly header?: readonly string[];
  readonly warnings?: readonly string[];
}

export type AnalyzeResponse = AnalysisReport & { readonly input: InputSummary; readonly evidence?: Evidence };

/** The values of a request and where they came from. Throws the core's InputError on bad CSV. */
export function requestValues(req: AnalyzeRequest): { values: ArrayLike<number>; input: InputSummary } {
  if (req.values !== undefined) return { values: req.values, input: { source: 'values', n: req.values.length } };
  const r = readColumn(req.csv ?? '', { ...req.csvOptions, ...(req.column !== undefined ? { column: req.column } : {}) });
  if (r.values.length === 0) {
    const dropped = r.skipped.reduce((a, k) => a + k.count, 0);
    throw new InputError(
      dropped > 0
        ? `Column ${JSON.stringify(r.column)} has no usable values: all ${dropped} data rows were dropped (${r.skipped
            .map((k) => `${k.count} ${SKIP_REASON_WORDS[k.reason]}, first at row ${k.firstRow}: ${JSON.stringify(k.firstValue)}`)
            .join('; ')}).`
        : `Column ${JSON.stringify(r.column)} has no data rows.`,
      { column: r.column },
      'too-few-values',
    );
  }
  return {
    values: r.values,
    input: {
      source: 'csv',
      n: r.values.length,
      column: r.column,
      columnIndex: r.columnIndex,
      rowsRead: r.rowsRead,
      skipped: r.skipped.map((s) => ({ ...s, description: SKIP_REASON_WORDS[s.reason] })),
      blankLines: r.blankLines,
      delimiter: r.delimiter,
      delimiterDetected: r.delimiterDetected,
      header: r.header,
      warnings: r.warnings,
    },
  };
}

export function analyzeOptions(req: AnalyzeRequest): AnalyzeOptions {
  return {
    ...(req.families !== undefined ? { families: req.families } : {}),
    ...(req.alpha !== undefined ? { alpha: req.alpha } : {}),
    ...(req.bins !== undefined ? { bins: req.bins } : {}),
    ...(req.seed !== undefined ? { seed: req.seed } : {}),
    ...(req.pMethod !== undefined ? { pMethod: req.pMethod } : {}),
    ...(req.replicates !== undefined ? { bootstrapReplicates: req.replicates } : {}),
  };
}

/** A planned analysis: everything but the bootstrap, done synchronously (bad input throws here). */
export interface PlannedAnalysis {
  readonly request: AnalyzeRequest;
  readonly plan: AnalysisPlan;
  readonly input: InputSummary;
  /** Replicates still to run over all families (0: the report can be finished at once). */
  readonly replicates: number;
}

export function planRequest(req: AnalyzeRequest): PlannedAnalysis {
  const { values, input } = requestValues(req);
  const plan = planAnalysis(values, analyzeOptions(req));
  const replicates = plan.bootstrapJobs.reduce((s, j) => s + (j.end - j.start), 0);
  return { request: req, plan, input, replicates };
}

/** Build the response from a plan and its bootstrap counts (one per job, in order). */
export function finishRequest(planned: PlannedAnalysis, counts: readonly BootstrapCounts[]): AnalyzeResponse {
  const { plan, request, input } = planned;
  const report = finishAnalysis(plan, counts);
  if (!request.evidence) return { ...report, input };
  return { ...report, input, evidence: computeEvidence(plan.sample, report, request.evidenceOptions) };
}
