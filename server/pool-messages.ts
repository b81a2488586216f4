/** Messages between the worker pool (pool.ts) and its workers (worker.ts). */
import type { DatasetJob, DatasetJobResult } from '../core/index.js';
import type { ErrorBody } from './errors.js';

/** Which route a request body came from (decides the fields allowed). */
export type BodyKind = 'analyze' | 'job';

export type ToWorker =
  /** Run bootstrap replicates [job.start, job.end). `cancel`: Int32Array(1) over it, non-zero = stop. */
  | { readonly type: 'range'; readonly id: number; readonly job: DatasetJob; readonly cancel: SharedArrayBuffer }
  /** Parse, validate and plan a request body (UTF-8 JSON bytes); finish at once when no bootstrap is needed. */
  | { readonly type: 'plan'; readonly id: number; readonly body: Uint8Array; readonly kind: BodyKind }
  /** Finish a plan kept by this worker with the combined bootstrap counts (one per job, in order). */
  | { readonly type: 'finish'; readonly id: number; readonly token: number; readonly counts: readonly DatasetJobResult[] }
  /** Forget a kept plan (its job was cancelled). */
  | { readonly type: 'drop'; readonly id: number; readonly token: number };

export type FromWorker =
  | { readonly type: 'progress'; readonly id: number; readonly done: number }
  | { readonly type: 'counts'; readonly id: number; readonly counts: DatasetJobResult }
  /** The finished response body (JSON text). */
  | { readonly type: 'result'; readonly id: number; readonly json: string; readonly client?: string }
  /** Planned; the bootstrap jobs must run before `finish` (token = this message's id). */
  | { readonly type: 'planned'; readonly id: number; readonly jobs: readonly DatasetJob[]; readonly client?: string }
  /** A client fault (bad body, bad data): answer with this status and error body. */
  | { readonly type: 'fault'; readonly id: number; readonly status: number; readonly body: ErrorBody }
  /** Done with a message that has no other reply (drop). */
  | { readonly type: 'ok'; readonly id: number }
  /** A bug in the worker. */
  | { readonly type: 'error'; readonly id: number; readonly message: string };
