/**
 * The shared request/response contract of the local server (server/API.md), type-only: the
 * server builds these shapes and the page reads them, both through core/index.js, so the two
 * cannot drift apart. The analysis options of a body are the option table's API options
 * (core/options; their names, kinds and limits are checked there), so they appear here only as
 * OptionValue by name; the data fields and the responses are spelled out.
 */
import type { SkipCount } from './csv/index.js';
import type { Evidence, EvidenceOptions } from './evidence/types.js';
import type { OptionValue } from './options/index.js';
import type { ErrorPlace } from './errors.js';
import type { AnyDatasetReport } from './workflow/types.js';

/** The data of a request: a `values` array or a `csv` text (with its columns), or grouped counts. */
export interface RequestData {
  readonly values?: readonly number[];
  readonly csv?: string;
  /** With `csv`: header name, or 1-based column index. */
  readonly column?: string | number;
  readonly csvOptions?: { readonly delimiter?: string; readonly decimal?: '.' | ','; readonly skipInvalid?: boolean; readonly header?: boolean };
  /** With `values`: one status per value (1 failed, 0 still running or removed unfailed). */
  readonly status?: readonly (0 | 1)[];
  readonly subgroups?: readonly (string | number)[];
  readonly order?: readonly number[];
  /** With `csv`: the status, subgroup and order columns, and the failure-mode column (with the status column). */
  readonly statusColumn?: string | number;
  readonly modeColumn?: string | number;
  readonly subgroupColumn?: string | number;
  readonly orderColumn?: string | number;
  /** Class limits with counts instead of values (`null` = open class). */
  readonly grouped?: readonly { readonly lower: number | null; readonly upper: number | null; readonly count: number }[];
  readonly evidence?: boolean;
  readonly evidenceOptions?: EvidenceOptions;
}

/** `POST /api/analyze`: the data plus any API option of the option table, by its name. */
export type AnalyzeRequestBody = RequestData & { readonly [option: string]: OptionValue | RequestData[keyof RequestData] };

/** `POST /api/jobs`: as /api/analyze, plus the client's tab id (a newer job of the same client cancels the older). */
export type JobRequestBody = AnalyzeRequestBody & { readonly client?: string };

/** How the values were obtained (`input` of every analysis response). */
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
  /** Workflow columns read from the CSV besides the value column. */
  readonly otherColumns?: readonly { readonly role: 'status' | 'subgroups' | 'order' | 'interval end' | 'count' | 'date' | 'failure mode' | 'inspection times'; readonly column: string }[];
}

/** `POST /api/analyze` 200, and a done job's `result`: the report as `plumbline analyze --json` prints it. */
export type AnalyzeResponse = AnyDatasetReport & { readonly input: InputSummary; readonly evidence?: Evidence };

/** The `error` of every 4xx/5xx body, and of a failed job. */
export interface ErrorBody {
  readonly message: string;
  readonly field?: string;
  /** The core's ErrorCode, or bad-request, unknown-field, body-too-large, too-much-work, too-many-jobs, not-found, unsupported-media-type, worker-failed. */
  readonly code?: string;
  readonly place?: ErrorPlace;
}

export type JobState = 'running' | 'done' | 'cancelled' | 'failed';

/** `POST /api/jobs` 202 (without result/error) and `GET /api/jobs/:id` 200. */
export interface JobViewBody {
  readonly id: string;
  readonly state: JobState;
  /** Replicates done / replicates total, 0..1. */
  readonly progress: number;
  readonly result?: AnalyzeResponse;
  readonly error?: ErrorBody;
}

/** A demo's decision settings (server/demo.ts DEMO_SETTINGS): request fields and the same in words. */
export interface DemoSettings {
  readonly column: string;
  readonly fields: Readonly<Record<string, unknown>>;
  /** In words, for the page ("Demo settings: ..."). */
  readonly description: string;
}

/** One entry of `GET /api/demo`. */
export interface DemoEntry {
  readonly name: string;
  readonly file: string;
  readonly bytes: number;
  readonly columns: readonly string[];
  readonly defaultColumn: string;
  readonly settings?: DemoSettings;
}

/** `GET /api/demo/:name`. */
export interface DemoFileBody {
  readonly name: string;
  readonly file: string;
  readonly columns: readonly string[];
  readonly defaultColumn: string;
  readonly settings?: DemoSettings;
  readonly csv: string;
}

/** `GET /api/demo-analysis`: the demo analysed at start, with its result. */
export interface DemoAnalysisBody {
  readonly name: string;
  readonly column: string;
  readonly settings?: DemoSettings;
  readonly csv: string;
  readonly result: AnalyzeResponse;
}
