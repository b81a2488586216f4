/**
 * A small pool of worker threads (worker.ts), at most os.availableParallelism(), started lazily
 * and kept for reuse. The main thread only moves bytes: request bodies are parsed, validated,
 * planned and finished in a worker, and bootstrap replicates run there in ranges.
 *
 * Bootstrap: each family's job [0, B) is split into contiguous ranges (several per worker and
 * bounded in size, so the load evens out, progress is smooth and a new request never waits long
 * behind a long bootstrap); the counts of each family are added back up with the core's
 * combineDatasetJobResults (the capability bootstrap's values concatenated). Replicate i always draws from random stream i, so the result does not
 * depend on the number of workers or on the split.
 *
 * Scheduling: a worker's own follow-up (finishing a plan it keeps) first, then request planning,
 * then bootstrap ranges, each first-in first-out.
 */
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { PlumblineError, combineDatasetJobResults, jobSampleSize, splitDatasetJob, type BootstrapCounts, type DatasetJob, type DatasetJobResult, type DatasetJobResultOf } from '../core/index.js';
import { ClientFault, WorkerFailed, type Logger } from './errors.js';
import type { BodyKind, FromWorker, ToWorker } from './pool-messages.js';

export interface RunOptions {
  readonly signal?: AbortSignal;
  /** Replicates done over all jobs of this run, and their total. */
  readonly onProgress?: (done: number, total: number) => void;
}

type Outgoing = ToWorker extends infer T ? (T extends { id: number } ? Omit<T, 'id'> : never) : never;

interface Task {
  readonly id: number;
  readonly msg: Outgoing;
  readonly transfer: ArrayBuffer[];
  /** For ranges: the cancel flag (also in msg). */
  readonly cancel?: SharedArrayBuffer;
  /** Must run on this worker (it keeps the plan). */
  readonly slot?: Slot;
  done: number;
  readonly onProgress?: (delta: number) => void;
  readonly settle: (m: FromWorker | Error) => void;
  /** Its requester has gone (a plan whose client left while a worker was planning it). */
  abandoned?: boolean;
}

interface Slot {
  readonly worker: Worker;
  task: Task | null;
  readonly affine: Task[];
  alive: boolean;
  /** Tokens of the plans this worker keeps for their finish. */
  readonly kept: Set<number>;
  /** Called if this worker dies (the analyses whose plans it keeps stop their bootstrap). */
  readonly onDeath: Set<() => void>;
}

/** A plan kept by a worker, waiting for its bootstrap. */
export interface PlanTicket {
  readonly slot: Slot;
  readonly token: number;
}

export type PlanOutcome =
  | { readonly kind: 'result'; readonly json: string; readonly client?: string }
  | { readonly kind: 'planned'; readonly ticket: PlanTicket; readonly jobs: readonly DatasetJob[]; readonly replicates: number; readonly client?: string };

const here = import.meta.url;
const fromSource = here.endsWith('.ts');
// From TypeScript sources the worker starts through a tiny .mjs entry that registers tsx.
const WORKER_URL = new URL(fromSource ? './worker-entry.mjs' : './worker.js', here);

/** Largest pool size allowed on this machine. */
export function maxWorkers(): number {
  return Math.max(1, availableParallelism());
}

/** Replicates per range: about 4 ranges per worker, and at most ~2·10^5 sampled values per range. */
export function rangeCount(replicates: number, n: number, workers: number): number {
  const bySize = Math.ceil((replicates * Math.max(1, n)) / 200_000);
  return Math.max(1, Math.min(replicates, Math.max(workers * 4, bySize)));
}

const cancelledCounts = (job: DatasetJob): BootstrapCounts => ({ start: job.start, end: job.end, completed: 0, valid: 0, exceed: 0, failed: 0, cancelled: true });

export class WorkerPool {
  readonly size: number;
  private readonly slots: Slot[] = [];
  private readonly urgent: Task[] = [];
  private readonly ranges: Task[] = [];
  private nextId = 1;
  private closed = false;
  private readonly log: Logger;

  constructor(size: number = maxWorkers(), log: Logger = () => {}) {
    this.size = Math.max(1, Math.min(Math.floor(size), maxWorkers()));
    this.log = log;
  }

  /** Plans stopped because their client went away (dropped from the queue, or their worker ended). */
  private stopped = 0;
  get stoppedPlans(): number {
    return this.stopped;
  }

  /** Tasks waiting or running. */
  get pending(): number {
    return this.urgent.length + this.ranges.length + this.slots.reduce((s, sl) => s + sl.affine.length + (sl.task ? 1 : 0), 0);
  }

  private submit(
    msg: Outgoing,
    opts: { transfer?: ArrayBuffer[]; slot?: Slot; urgent?: boolean; cancel?: SharedArrayBuffer; onProgress?: (d: number) => void },
  ): { task: Task; reply: Promise<FromWorker> } {
    if (this.closed) throw new PlumblineError('cancelled', 'The server is shutting down.');
    let settle!: (m: FromWorker | Error) => void;
    const reply = new Promise<FromWorker>((resolve, reject) => {
      settle = (m) => (m instanceof Error ? reject(m) : resolve(m));
    });
    const task: Task = {
      id: this.nextId++,
      msg,
      transfer: opts.transfer ?? [],
      ...(opts.cancel ? { cancel: opts.cancel } : {}),
      ...(opts.slot ? { slot: opts.slot } : {}),
      done: 0,
      ...(opts.onProgress ? { onProgress: opts.onProgress } : {}),
      settle,
    };
    if (opts.slot) {
      if (!opts.slot.alive) throw new WorkerFailed('the worker keeping this analysis has stopped');
      opts.slot.affine.push(task);
    } else if (opts.urgent) this.urgent.push(task);
    else this.ranges.push(task);
    this.dispatch();
    return { task, reply };
  }

  /**
   * Parse, validate and plan a request body in a worker. Client faults reject with ClientFault.
   * When `signal` aborts (the client went away) a queued plan is dropped and a running one is
   * stopped by ending its worker thread (planning is one synchronous step in the worker, so this
   * is the only way to stop it); the pool starts a fresh worker in its place. Rejects 'cancelled'.
   */
  async plan(body: Uint8Array, kind: BodyKind, signal?: AbortSignal): Promise<PlanOutcome> {
    if (signal?.aborted) throw new PlumblineError('cancelled', 'The analysis was cancelled: the client went away.');
    const copy = new Uint8Array(body.byteLength);
    copy.set(body);
    const { task, reply } = this.submit({ type: 'plan', body: copy, kind }, { transfer: [copy.buffer], urgent: true });
    const abort = (): void => this.abortTask(task, 'The analysis was cancelled: the client went away.');
    signal?.addEventListener('abort', abort, { once: true });
    let m: FromWorker;
    try {
      m = await reply;
    } finally {
      signal?.removeEventListener('abort', abort);
    }
    if (m.type === 'result') return { kind: 'result', json: m.json, ...(m.client !== undefined ? { client: m.client } : {}) };
    if (m.type === 'planned') {
      const slot = this.slotOf(task);
      return {
        kind: 'planned',
        ticket: { slot, token: task.id },
        jobs: m.jobs,
        replicates: m.jobs.reduce((s, j) => s + (j.end - j.start), 0),
        ...(m.client !== undefined ? { client: m.client } : {}),
      };
    }
    throw this.unexpected(m);
  }

  /** Finish a kept plan with its bootstrap counts; returns the response JSON. */
  async finish(ticket: PlanTicket, counts: readonly DatasetJobResult[]): Promise<string> {
    ticket.slot.kept.delete(ticket.token);
    const { reply } = this.submit({ type: 'finish', token: ticket.token, counts }, { slot: ticket.slot });
    const m = await reply;
    if (m.type === 'result') return m.json;
    throw this.unexpected(m);
  }

  /** Forget a kept plan (best effort). */
  drop(ticket: PlanTicket): void {
    ticket.slot.kept.delete(ticket.token);
    if (!ticket.slot.alive || this.closed) return;
    this.submit({ type: 'drop', token: ticket.token }, { slot: ticket.slot }).reply.catch(() => {});
  }

  /** A whole request: plan, bootstrap on the pool, finish. Returns the response JSON. */
  async analyze(body: Uint8Array, kind: BodyKind, opts: RunOptions = {}): Promise<{ json: string; client?: string }> {
    const planned = await this.plan(body, kind, opts.signal);
    if (planned.kind === 'result') return planned;
    return { json: await this.complete(planned, opts), ...(planned.client !== undefined ? { client: planned.client } : {}) };
  }

  /** Run a planned analysis's bootstrap and finish it (dropping the plan if cancelled or failed). */
  async complete(planned: Extract<PlanOutcome, { kind: 'planned' }>, opts: RunOptions = {}): Promise<string> {
    // The bootstrap stops when the caller cancels, or when the worker keeping the plan dies.
    const local = new AbortController();
    let keeperDied = false;
    const onDeath = (): void => {
      keeperDied = true;
      local.abort();
    };
    const onAbort = (): void => local.abort();
    const { slot } = planned.ticket;
    if (!slot.alive) throw new WorkerFailed('the worker keeping this analysis has stopped');
    slot.onDeath.add(onDeath);
    if (opts.signal?.aborted) local.abort();
    else opts.signal?.addEventListener('abort', onAbort, { once: true });
    let counts: DatasetJobResult[];
    try {
      counts = await this.run(planned.jobs, { ...opts, signal: local.signal });
    } catch (e) {
      this.drop(planned.ticket);
      throw keeperDied ? new WorkerFailed('the worker keeping this analysis has stopped') : e;
    } finally {
      slot.onDeath.delete(onDeath);
      opts.signal?.removeEventListener('abort', onAbort);
    }
    return this.finish(planned.ticket, counts);
  }

  /**
   * Run full-range jobs ([0, B) per family) and return one combined count per job, in order.
   * Throws PlumblineError 'cancelled' when the signal aborts.
   */
  async run<J extends DatasetJob>(jobs: readonly J[], opts: RunOptions = {}): Promise<DatasetJobResultOf<J>[]> {
    const total = jobs.reduce((s, j) => s + (j.end - j.start), 0);
    let done = 0;
    const report = (delta: number): void => {
      if (delta === 0) return;
      done += delta;
      opts.onProgress?.(done, total);
    };
    const tasks: Task[] = [];
    const perJob = jobs.map((job) => {
      const ranges = splitDatasetJob(job, rangeCount(job.end - job.start, jobSampleSize(job), this.size));
      return Promise.all(
        ranges.map(async (r) => {
          const cancel = new SharedArrayBuffer(4);
          const { task, reply } = this.submit({ type: 'range', job: r, cancel }, { cancel, onProgress: report });
          tasks.push(task);
          const m = await reply;
          if (m.type !== 'counts') throw this.unexpected(m);
          return m.counts;
        }),
      ).then((counts) => combineDatasetJobResults(counts));
    });
    const abort = (): void => {
      for (const t of tasks) {
        if (t.cancel) Atomics.store(new Int32Array(t.cancel), 0, 1);
        const qi = this.ranges.indexOf(t);
        if (qi >= 0) {
          this.ranges.splice(qi, 1);
          if (t.msg.type === 'range') t.settle({ type: 'counts', id: t.id, counts: cancelledCounts(t.msg.job) });
        }
      }
    };
    if (opts.signal?.aborted) abort();
    else opts.signal?.addEventListener('abort', abort, { once: true });
    try {
      const counts = await Promise.all(perJob);
      if (counts.some((c) => c.cancelled)) throw new PlumblineError('cancelled', 'The analysis was cancelled.');
      return counts as DatasetJobResultOf<J>[];
    } catch (e) {
      // One range failed (its worker died): stop the others at once instead of letting them run on.
      abort();
      throw e;
    } finally {
      opts.signal?.removeEventListener('abort', abort);
    }
  }

  private readonly taskSlot = new Map<number, Slot>();

  /** Stop one task: dropped from its queue, or its worker ended if it is running (see plan). */
  private abortTask(task: Task, message: string): void {
    const err = new PlumblineError('cancelled', message);
    const qi = this.urgent.indexOf(task);
    if (qi >= 0) {
      this.stopped++;
      this.urgent.splice(qi, 1);
      task.settle(err);
      return;
    }
    const slot = this.slots.find((s) => s.task === task);
    if (!slot) return; // finished already
    if (slot.kept.size > 0 || slot.affine.length > 0) {
      // The worker keeps other requests' plans: let this planning run out, and drop its result.
      task.abandoned = true;
      task.settle(err);
      return;
    }
    this.stopped++;
    this.retire(slot);
    slot.task = null;
    task.settle(err);
    this.dispatch();
  }

  /** Take a worker out of the pool and end its thread (its exit is then not a failure). */
  private retire(slot: Slot): void {
    const i = this.slots.indexOf(slot);
    if (i >= 0) this.slots.splice(i, 1);
    slot.alive = false;
    void slot.worker.terminate().catch(() => {});
  }

  private slotOf(task: Task): Slot {
    const s = this.taskSlot.get(task.id);
    this.taskSlot.delete(task.id);
    if (!s) throw new Error('planned on an unknown worker');
    return s;
  }

  private unexpected(m: FromWorker): Error {
    if (m.type === 'fault') return new ClientFault(m.status, m.body);
    if (m.type === 'error') {
      this.log('worker failed', new Error(m.message));
      return new Error(`worker failed: ${m.message.split('\n')[0] ?? ''}`);
    }
    return new Error(`unexpected worker reply ${m.type}`);
  }

  private spawn(): Slot {
    const worker = new Worker(WORKER_URL);
    worker.unref();
    const slot: Slot = { worker, task: null, affine: [], alive: true, kept: new Set(), onDeath: new Set() };
    worker.on('message', (m: FromWorker) => this.onMessage(slot, m));
    worker.on('error', (e) => this.onFailure(slot, e));
    worker.on('exit', (code) => {
      if (!this.closed) this.onFailure(slot, new Error(`worker exited with code ${code}`));
    });
    this.slots.push(slot);
    return slot;
  }

  private onMessage(slot: Slot, m: FromWorker): void {
    const t = slot.task;
    if (!t || t.id !== m.id) return;
    if (m.type === 'progress') {
      t.onProgress?.(m.done - t.done);
      t.done = m.done;
      return;
    }
    slot.task = null;
    slot.worker.unref(); // an idle worker must not keep the process alive
    if (m.type === 'counts') {
      t.onProgress?.(m.counts.completed - t.done);
      t.done = m.counts.completed;
    }
    if (m.type === 'planned') {
      slot.kept.add(t.id);
      if (t.abandoned) this.drop({ slot, token: t.id });
      else this.taskSlot.set(t.id, slot);
    }
    t.settle(m);
    this.dispatch();
  }

  private onFailure(slot: Slot, e: unknown): void {
    const i = this.slots.indexOf(slot);
    if (i < 0) return;
    this.slots.splice(i, 1);
    slot.alive = false;
    this.log('worker died', e);
    const t = slot.task;
    slot.task = null;
    void slot.worker.terminate().catch(() => {});
    if (t) t.settle(new WorkerFailed(e));
    for (const a of slot.affine.splice(0)) a.settle(new WorkerFailed(e));
    for (const f of [...slot.onDeath]) f();
    slot.onDeath.clear();
    this.dispatch();
  }

  private take(slot: Slot): Task | undefined {
    return slot.affine.shift() ?? this.urgent.shift() ?? this.ranges.shift();
  }

  private dispatch(): void {
    if (this.closed) return;
    for (;;) {
      let slot = this.slots.find((s) => s.task === null && s.affine.length > 0) ?? this.slots.find((s) => s.task === null);
      if (!slot || (slot.affine.length === 0 && this.urgent.length + this.ranges.length === 0)) {
        if (this.urgent.length + this.ranges.length === 0 || this.slots.length >= this.size) return;
        slot = this.spawn();
      }
      const t = this.take(slot);
      if (!t) return;
      if (t.msg.type === 'range' && t.cancel && Atomics.load(new Int32Array(t.cancel), 0) !== 0) {
        t.settle({ type: 'counts', id: t.id, counts: cancelledCounts(t.msg.job) });
        continue;
      }
      slot.task = t;
      slot.worker.ref(); // keep the process alive while a task runs
      slot.worker.postMessage({ ...t.msg, id: t.id } as ToWorker, t.transfer);
    }
  }

  /** Start all workers now (they load the core), so the first request does not wait for them. */
  warm(): void {
    while (!this.closed && this.slots.length < this.size) this.spawn();
  }

  /** Stop every worker; running and queued tasks are rejected. */
  async close(): Promise<void> {
    this.closed = true;
    const err = new PlumblineError('cancelled', 'The server is shutting down.');
    for (const t of this.urgent.splice(0)) t.settle(err);
    for (const t of this.ranges.splice(0)) t.settle(err);
    const slots = this.slots.splice(0);
    for (const s of slots) {
      s.alive = false;
      if (s.task) s.task.settle(err);
      for (const a of s.affine.splice(0)) a.settle(err);
    }
    await Promise.all(slots.map((s) => s.worker.terminate().catch(() => 0)));
  }
}
