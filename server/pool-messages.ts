/** Messages between the worker pool (pool.ts) and its workers (bootstrap-worker.ts). */
import type { BootstrapCounts, BootstrapJob } from '../core/index.js';

export interface ToWorker {
  readonly id: number;
  readonly job: BootstrapJob;
  /** Int32Array(1) over this buffer: non-zero = cancel. */
  readonly cancel: SharedArrayBuffer;
}

export type FromWorker =
  | { readonly type: 'progress'; readonly id: number; readonly done: number }
  | { readonly type: 'done'; readonly id: number; readonly counts: BootstrapCounts }
  | { readonly type: 'error'; readonly id: number; readonly message: string };
