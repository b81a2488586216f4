/**
 * A small pool of worker threads for bootstrap replicate ranges. At most
 * os.availableParallelism() workers, started lazily and kept for reuse. Each family's job
 * [0, B) is split into contiguous ranges (several per worker, so the load evens out and progress
 * is smooth); ranges are queued first-in first-out across all running analyses; the counts of
 * each family are added back up with the core's combineBootstrapCounts. Since replicate i always
 * draws from random stream i, the result does not depend on the number of workers or the split.
 */
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import {
  PlumblineError,
  combineBootstrapCounts,
  splitBootstrapJob,
  type BootstrapCounts,
  type BootstrapJob,
} from '../core/index.js';
import type { FromWorker, ToWorker } from './pool-messages.js';

export interface RunOptions {
  readonly signal?: AbortSignal;
  /** Replicates done over all jobs of this run, and their total. */
  readonly onProgress?: (done: number, total: number) => void;
}

interface Task {
  readonly id: number;
  readonly job: BootstrapJob;
  readonly cancel: SharedArrayBuffer;
  done: number;
  readonly onProgress: (delta: number) => void;
  readonly resolve: (c: BootstrapCounts) => void;
  readonly reject: (e: unknown) => void;
}

interface Slot {
  worker: Worker;
  task: Task | null;
}

const here = import.meta.url;
const fromSource = here.endsWith('.ts');
// From TypeScript sources the worker starts through a tiny .mjs entry that registers tsx.
const WORKER_URL = new URL(fromSource ? './bootstrap-worker-entry.mjs' : './bootstrap-worker.js', here);

/** Largest pool size allowed on this machine. */
export function maxWorkers(): number {
  return Math.max(1, availableParallelism());
}

export class WorkerPool {
  readonly size: number;
  private readonly slots: Slot[] = [];
  private readonly queue: Task[] = [];
  private nextId = 1;
  private closed = false;
  private readonly log: (m: string, e?: unknown) => void;

  constructor(size: number = maxWorkers(), log: (m: string, e?: unknown) => void = () => {}) {
    this.size = Math.max(1, Math.min(Math.floor(size), maxWorkers()));
    this.log = log;
  }

  /** Number of ranges waiting or running. */
  get pending(): number {
    return this.queue.length + this.slots.filter((s) => s.task !== null).length;
  }

  /**
   * Run full-range jobs ([0, B) per family) and return one combined count per job, in order.
   * Throws PlumblineError 'cancelled' when the signal aborts.
   */
  async run(jobs: readonly BootstrapJob[], opts: RunOptions = {}): Promise<BootstrapCounts[]> {
    if (this.closed) throw new Error('worker pool is closed');
    const total = jobs.reduce((s, j) => s + (j.end - j.start), 0);
    let done = 0;
    const report = (delta: number): void => {
      done += delta;
      opts.onProgress?.(done, total);
    };
    const parts = this.size * 4;
    const tasks: Task[] = [];
    const perJob = jobs.map((job) => {
      const ranges = splitBootstrapJob(job, job.end - job.start, parts).map((r) => ({ ...r, start: r.start + job.start, end: r.end + job.start }));
      return Promise.all(
        ranges.map(
          (r) =>
            new Promise<BootstrapCounts>((resolve, reject) => {
              const t: Task = { id: this.nextId++, job: r, cancel: new SharedArrayBuffer(4), done: 0, onProgress: report, resolve, reject };
              tasks.push(t);
              this.queue.push(t);
            }),
        ),
      ).then((counts) => combineBootstrapCounts(counts));
    });
    const abort = (): void => {
      for (const t of tasks) {
        Atomics.store(new Int32Array(t.cancel), 0, 1);
        const qi = this.queue.indexOf(t);
        if (qi >= 0) {
          this.queue.splice(qi, 1);
          t.resolve({ start: t.job.start, end: t.job.end, completed: 0, valid: 0, exceed: 0, failed: 0, cancelled: true });
        }
      }
    };
    if (opts.signal?.aborted) abort();
    else opts.signal?.addEventListener('abort', abort, { once: true });
    this.dispatch();
    try {
      const counts = await Promise.all(perJob);
      if (counts.some((c) => c.cancelled)) throw new PlumblineError('cancelled', 'The analysis was cancelled.');
      return counts;
    } finally {
      opts.signal?.removeEventListener('abort', abort);
    }
  }

  private spawn(): Slot {
    const worker = new Worker(WORKER_URL);
    worker.unref();
    const slot: Slot = { worker, task: null };
    worker.on('message', (m: FromWorker) => this.onMessage(slot, m));
    worker.on('error', (e) => this.onFailure(slot, e));
    worker.on('exit', (code) => {
      if (!this.closed) this.onFailure(slot, new Error(`bootstrap worker exited with code ${code}`));
    });
    this.slots.push(slot);
    return slot;
  }

  private onMessage(slot: Slot, m: FromWorker): void {
    const t = slot.task;
    if (!t || t.id !== m.id) return;
    if (m.type === 'progress') {
      t.onProgress(m.done - t.done);
      t.done = m.done;
      return;
    }
    slot.task = null;
    slot.worker.unref(); // an idle worker must not keep the process alive
    if (m.type === 'done') {
      t.onProgress(m.counts.completed - t.done);
      t.done = m.counts.completed;
      t.resolve(m.counts);
    } else {
      this.log('bootstrap worker failed on a range', new Error(m.message));
      t.reject(new Error(`bootstrap worker failed: ${m.message.split('\n')[0] ?? ''}`));
    }
    this.dispatch();
  }

  private onFailure(slot: Slot, e: unknown): void {
    const i = this.slots.indexOf(slot);
    if (i < 0) return;
    this.slots.splice(i, 1);
    this.log('bootstrap worker died', e);
    const t = slot.task;
    slot.task = null;
    void slot.worker.terminate().catch(() => {});
    if (t) t.reject(e instanceof Error ? e : new Error(String(e)));
    this.dispatch();
  }

  private dispatch(): void {
    if (this.closed) return;
    while (this.queue.length > 0) {
      let slot = this.slots.find((s) => s.task === null);
      if (!slot) {
        if (this.slots.length >= this.size) return;
        slot = this.spawn();
      }
      const t = this.queue.shift() as Task;
      if (Atomics.load(new Int32Array(t.cancel), 0) !== 0) {
        t.resolve({ start: t.job.start, end: t.job.end, completed: 0, valid: 0, exceed: 0, failed: 0, cancelled: true });
        continue;
      }
      slot.task = t;
      slot.worker.ref(); // keep the process alive while a range runs
      const msg: ToWorker = { id: t.id, job: t.job, cancel: t.cancel };
      slot.worker.postMessage(msg);
    }
  }

  /** Stop every worker; running and queued ranges are rejected. */
  async close(): Promise<void> {
    this.closed = true;
    const err = new PlumblineError('cancelled', 'The server is shutting down.');
    for (const t of this.queue.splice(0)) t.reject(err);
    const slots = this.slots.splice(0);
    for (const s of slots) if (s.task) s.task.reject(err);
    await Promise.all(slots.map((s) => s.worker.terminate().catch(() => 0)));
  }
}
