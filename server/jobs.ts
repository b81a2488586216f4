/**
 * Jobs: analyses whose bootstrap runs in the background on the worker pool, polled for progress
 * and cancellable. The body is planned (parsed, validated, data read, models fitted, formula
 * tests done) in a worker before the job exists, so bad input is refused at once with a 4xx; only
 * the bootstrap and the final report run later. Everything is held in memory; finished jobs are
 * forgotten after `keepMs` (or when more than `maxFinished` are held).
 */
import { randomUUID } from 'node:crypto';
import { isPlumblineError, type JobState } from '../core/index.js';
import { clientFault, HttpError, WorkerFailed, type ErrorBody, type Logger } from './errors.js';
import type { WorkerPool } from './pool.js';

export type { JobState };

export interface JobView {
  readonly id: string;
  readonly state: JobState;
  readonly progress: number;
  /** The finished response as JSON text (state 'done'). */
  readonly resultJson?: string;
  readonly error?: ErrorBody;
}

interface Job {
  readonly id: string;
  readonly client: string | undefined;
  state: JobState;
  done: number;
  total: number;
  resultJson?: string;
  error?: ErrorBody;
  finishedAt: number;
  readonly controller: AbortController;
  settled: Promise<void>;
}

export interface JobManagerOptions {
  readonly keepMs?: number;
  readonly maxFinished?: number;
  /** Most jobs running at once; more → 429. */
  readonly maxRunning?: number;
  readonly log?: Logger;
}

/** The JSON text of a job view (the result is spliced in as it is, never re-parsed). */
export function jobViewJson(v: JobView): string {
  const head = JSON.stringify({ id: v.id, state: v.state, progress: v.progress, ...(v.error ? { error: v.error } : {}) });
  return v.resultJson !== undefined ? `${head.slice(0, -1)},"result":${v.resultJson}}` : head;
}

export class JobManager {
  private readonly jobs = new Map<string, Job>();
  private readonly byClient = new Map<string, string>();
  /** Arrival number of the newest request seen from each client. */
  private readonly latestArrival = new Map<string, number>();
  private arrivals = 0;
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

  /** Requests holding a slot while their body is planned (not yet jobs). */
  private planning = 0;

  get running(): number {
    let k = 0;
    for (const j of this.jobs.values()) if (j.state === 'running') k++;
    return k;
  }

  /**
   * Plan and start a job from a raw JSON body. Rejects with a 4xx fault on bad input or overload.
   * The slot is reserved before planning is awaited, so the limit holds for simultaneous requests.
   */
  async create(body: Uint8Array, signal?: AbortSignal): Promise<JobView> {
    this.sweep();
    if (this.running + this.planning >= this.maxRunning) {
      throw new HttpError(429, `Too many analyses are running (the limit is ${this.maxRunning} at once); wait for one to finish or cancel one.`, { code: 'too-many-jobs' });
    }
    this.planning++;
    try {
      return await this.start(body, signal);
    } finally {
      this.planning--;
    }
  }

  private async start(body: Uint8Array, signal: AbortSignal | undefined): Promise<JobView> {
    const seq = ++this.arrivals;
    const planned = await this.pool.plan(body, 'job', signal);
    // A new job from the same client replaces its previous one. Order is by arrival, not by the
    // end of planning: a request overtaken by a newer one from the same client starts cancelled.
    let stale = false;
    if (planned.client !== undefined) {
      const latest = this.latestArrival.get(planned.client) ?? 0;
      if (latest > seq) stale = true;
      else {
        this.latestArrival.set(planned.client, seq);
        const prev = this.byClient.get(planned.client);
        if (prev !== undefined) this.cancel(prev);
      }
    }
    const id = randomUUID();
    const controller = new AbortController();
    const job: Job = {
      id,
      client: planned.client,
      state: 'running',
      done: 0,
      total: planned.kind === 'planned' ? planned.replicates : 0,
      finishedAt: 0,
      controller,
      settled: Promise.resolve(),
    };
    this.jobs.set(id, job);
    if (stale) {
      if (planned.kind === 'planned') this.pool.drop(planned.ticket);
      job.state = 'cancelled';
      job.finishedAt = Date.now();
      return this.view(job);
    }
    if (planned.client !== undefined) this.byClient.set(planned.client, id);
    if (planned.kind === 'result') {
      job.resultJson = planned.json;
      job.state = 'done';
      job.finishedAt = Date.now();
      return this.view(job);
    }
    job.settled = this.pool
      .complete(planned, { signal: controller.signal, onProgress: (done) => (job.done = done) })
      .then((json) => {
        if (job.state !== 'running') return;
        job.resultJson = json;
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
        else if (e instanceof WorkerFailed) {
          this.log(`job ${id}: worker failed (${e.detail})`);
          job.error = { message: e.message, code: 'worker-failed' };
        } else {
          this.log(`job ${id} failed`, e);
          job.error = { message: 'Internal error; the server log has the details.' };
        }
      })
      .finally(() => {
        job.finishedAt = Date.now();
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
      ...(j.state === 'done' && j.resultJson !== undefined ? { resultJson: j.resultJson } : {}),
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
