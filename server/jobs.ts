/**
 * Jobs: analyses whose bootstrap runs in the background on the worker pool, polled for progress
 * and cancellable. Planning (reading the data, fitting, the formula tests) is done when the job
 * is created, so bad input is refused at once with a 400; only the bootstrap runs later.
 * Everything is held in memory; finished jobs are forgotten after `keepMs` (or when more than
 * `maxFinished` are held).
 */
import { randomUUID } from 'node:crypto';
import { isPlumblineError } from '../core/index.js';
import { completeRequest, planRequest, type AnalyzeResponse } from './analysis.js';
import { clientFault, HttpError, type ErrorBody, type Logger } from './errors.js';
import type { WorkerPool } from './pool.js';
import type { JobRequest } from './validate.js';

export type JobState = 'running' | 'done' | 'cancelled' | 'failed';

export interface JobView {
  readonly id: string;
  readonly state: JobState;
  readonly progress: number;
  readonly result?: AnalyzeResponse;
  readonly error?: ErrorBody;
}

interface Job {
  readonly id: string;
  readonly client: string | undefined;
  state: JobState;
  done: number;
  readonly total: number;
  result?: AnalyzeResponse;
  error?: ErrorBody;
  finishedAt: number;
  readonly controller: AbortController;
  /** Settles when the job has stopped (done, cancelled or failed). */
  readonly settled: Promise<void>;
}

export interface JobManagerOptions {
  readonly keepMs?: number;
  readonly maxFinished?: number;
  /** Most jobs running at once; more → 429. */
  readonly maxRunning?: number;
  readonly log?: Logger;
}

export class JobManager {
  private readonly jobs = new Map<string, Job>();
  private readonly byClient = new Map<string, string>();
  private readonly pool: WorkerPool;
  private readonly keepMs: number;
  private readonly maxFinished: number;
  private readonly maxRunning: number;
  private readonly log: Logger;

  constructor(pool: WorkerPool, opts: JobManagerOptions = {}) {
    this.pool = pool;
    this.keepMs = opts.keepMs ?? 10 * 60 * 1000;
    this.maxFinished = opts.maxFinished ?? 50;
    this.maxRunning = opts.maxRunning ?? 8;
    this.log = opts.log ?? (() => {});
  }

  get running(): number {
    let k = 0;
    for (const j of this.jobs.values()) if (j.state === 'running') k++;
    return k;
  }

  /** Create and start a job. Throws (400/429) synchronously on bad input or overload. */
  create(req: JobRequest): JobView {
    this.sweep();
    // A new job from the same client replaces its previous one.
    if (req.client !== undefined) {
      const prev = this.byClient.get(req.client);
      if (prev !== undefined) this.cancel(prev);
    }
    if (this.running >= this.maxRunning) {
      throw new HttpError(429, `Too many analyses are running (${this.maxRunning}); wait for one to finish or cancel one.`, { code: 'too-many-jobs' });
    }
    const planned = planRequest(req);
    const id = randomUUID();
    const controller = new AbortController();
    let settle!: () => void;
    const settled = new Promise<void>((r) => (settle = r));
    const job: Job = { id, client: req.client, state: 'running', done: 0, total: planned.replicates, finishedAt: 0, controller, settled };
    this.jobs.set(id, job);
    if (req.client !== undefined) this.byClient.set(req.client, id);
    completeRequest(planned, this.pool, {
      signal: controller.signal,
      onProgress: (done) => {
        job.done = done;
      },
    })
      .then((result) => {
        if (job.state !== 'running') return;
        job.result = result;
        job.done = job.total;
        job.state = 'done';
      })
      .catch((e: unknown) => {
        if (job.state !== 'running') return; // cancelled already
        if (isPlumblineError(e) && e.code === 'cancelled') {
          job.state = 'cancelled';
          return;
        }
        const fault = clientFault(e);
        job.state = 'failed';
        if (fault) job.error = fault.body;
        else {
          this.log(`job ${id} failed`, e);
          job.error = { message: 'Internal error; the server log has the details.' };
        }
      })
      .finally(() => {
        job.finishedAt = Date.now();
        settle();
      });
    return this.view(job);
  }

  get(id: string): JobView | undefined {
    this.sweep();
    const j = this.jobs.get(id);
    return j ? this.view(j) : undefined;
  }

  /** Cancel a running job; returns its view (final state if it had finished), undefined if unknown. */
  cancel(id: string): JobView | undefined {
    const j = this.jobs.get(id);
    if (!j) return undefined;
    if (j.state === 'running') {
      j.state = 'cancelled';
      j.controller.abort();
    }
    return this.view(j);
  }

  /** Wait until a job has stopped (for tests and shutdown). */
  async settled(id: string): Promise<void> {
    await this.jobs.get(id)?.settled;
  }

  cancelAll(): void {
    for (const j of this.jobs.values()) if (j.state === 'running') this.cancel(j.id);
  }

  private view(j: Job): JobView {
    const progress = j.state === 'done' ? 1 : j.total > 0 ? Math.min(1, j.done / j.total) : 0;
    return {
      id: j.id,
      state: j.state,
      progress,
      ...(j.state === 'done' && j.result ? { result: j.result } : {}),
      ...(j.state === 'failed' && j.error ? { error: j.error } : {}),
    };
  }

  private sweep(): void {
    const now = Date.now();
    const finished: Job[] = [];
    for (const j of this.jobs.values()) {
      if (j.state === 'running' || j.finishedAt === 0) continue;
      if (now - j.finishedAt > this.keepMs) this.forget(j);
      else finished.push(j);
    }
    finished.sort((a, b) => a.finishedAt - b.finishedAt);
    while (finished.length > this.maxFinished) this.forget(finished.shift() as Job);
  }

  private forget(j: Job): void {
    this.jobs.delete(j.id);
    if (j.client !== undefined && this.byClient.get(j.client) === j.id) this.byClient.delete(j.client);
  }
}
