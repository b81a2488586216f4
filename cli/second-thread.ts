/**
 * The CLI's second thread for large samples: on this 2-core machine the per-family work (fit, A²,
 * chi-square) of the five families is most of the time at 10^6 values, so the lognormal and gamma
 * families are evaluated on a worker_thread (core `evaluateFamilies`) while the main thread
 * evaluates the others (core `planAnalysis` with `delegated`). The sorted sample is shared through
 * a SharedArrayBuffer (the reader's own array, or one copy; no sort in the worker: the same sorted
 * values, so the same numbers), with the main thread's Sample summary and, up to LOGS_COPY_MAX_N
 * values, its ln x (the same numbers again, not computed twice); results come back as plain data and planAnalysis combines them in family order, so
 * the report is byte-identical to the one-thread run. The main thread stays synchronous: it
 * blocks on an Atomics flag the worker sets after posting, then takes the message with
 * receiveMessageOnPort. Any failure (worker error, timeout) falls back to evaluating those
 * families on the main thread. When the machine is already busy (idleCore) it is not used either
 * (PLUMBLINE_SECOND_THREAD=on|off overrides that guess, for the benchmark).
 * Below PARALLEL_MIN_N values the ~40-90 ms of starting a worker
 * costs more than it saves, so nothing is started.
 *
 * The worker runs the same file as the command (the one-file bundle dist/cli/main.js), which
 * branches on `isWorkerRun()` at its top.
 */
import { availableParallelism, loadavg } from 'node:os';
import { MessageChannel, Worker, isMainThread, receiveMessageOnPort, workerData, type MessagePort } from 'node:worker_threads';
import {
  LOG_CACHE_MAX_N,
  evaluateFamilies,
  prepareSample,
  sampleSummary,
  type DelegatedFamilies,
  type EvaluatedFamily,
  type FamilyName,
  type Sample,
  type SampleSummary,
} from '../core/index.js';

/** Smallest sample for which the second thread is used (common practice, no source: measured here). */
export const PARALLEL_MIN_N = 200_000;
/**
 * The families handed to the worker: lognormal and gamma (two A² passes, incomplete-gamma tails),
 * which balance normal, Weibull and exponential on the main thread; the worker also prepares its own
 * sample first. Per-family CPU at 10^6 values: normal 190, lognormal 215, gamma 220, Weibull 185,
 * exponential 80 ms (under load). With exponential away too, the whole CLI run at 10^6 values took a
 * median 1.165 s against 1.08 s with it on the main thread (10 alternating runs each, same bundle
 * otherwise, 2026-12-05).
 */
const AWAY: readonly FamilyName[] = ['lognormal', 'gamma'];
/**
 * Most values whose ln x are copied to shared memory for the worker (16 MiB; common practice, no
 * source). At 10^6 values the copy costs the main thread ~3 ms and saves the worker its own ln x
 * passes: with the main thread's summary as well, the worker's CPU for lognormal and gamma went from
 * ~350 to ~281 ms (thread CPU, 6 runs each, 2026-12-05). 10^7 values would need 80 MB more.
 */
const LOGS_COPY_MAX_N = 2 ** 21;
/** How long the main thread waits for the worker before doing its share itself. */
const WAIT_MS = 120_000;

/**
 * Whether another core is likely free: at least 2 CPUs and a 1-minute load average below
 * their number less a half. On a machine already saturated a second thread only adds its ~0.1-0.2 s of
 * extra CPU (starting, JIT warm-up of its own) without shortening the wall time (measured here:
 * at load 4 on 2 cores, 1.29 s median one thread vs 1.34-1.56 s with the worker).
 */
function idleCore(): boolean {
  const cpus = availableParallelism();
  // The benchmark sets PLUMBLINE_SECOND_THREAD=on|off to measure both ways on a shared machine.
  const forced = process.env['PLUMBLINE_SECOND_THREAD'];
  if (forced === 'off') return false;
  return cpus >= 2 && (forced === 'on' || (loadavg()[0] as number) < cpus - 0.5);
}

/** The options evaluateFamilies needs (the rest of the report is built on the main thread). */
export interface SecondThreadOptions {
  readonly alpha?: number;
  readonly bins?: number | null;
  readonly pMethod?: 'table' | 'bootstrap';
  readonly bootstrapReplicates?: number;
  readonly seed?: number;
}

interface WorkerInput {
  readonly plumblineSecondThread: true;
  readonly flag: SharedArrayBuffer;
  readonly port: MessagePort;
  readonly families: readonly FamilyName[];
  readonly options: SecondThreadOptions;
}

/** The one message the worker waits for: the sorted values on shared memory, with what the main thread computed from them. */
interface WorkerValues {
  readonly values: SharedArrayBuffer;
  /** Where the sorted values start in `values` (bytes) and how many there are. */
  readonly offset: number;
  readonly length: number;
  /** The main thread's Sample summary of these values (min, max, sums, counts), so the worker does not repeat that pass. */
  readonly summary: SampleSummary;
  /** The main thread's ln x of the sorted values (same length), on shared memory; null when not cached (some x ≤ 0, or past LOG_CACHE_MAX_N). */
  readonly logs: SharedArrayBuffer | null;
  readonly logsOffset: number;
}

type WorkerOutput = { readonly results: readonly EvaluatedFamily[] } | { readonly error: string };

/** Whether this thread is the CLI's second thread (then call runSecondThread instead of the CLI). */
export function isWorkerRun(): boolean {
  return !isMainThread && (workerData as Partial<WorkerInput> | null)?.plumblineSecondThread === true;
}

/**
 * The worker's side: wait for the shared sorted values (the worker may be started while the main
 * thread is still reading the file), evaluate its families, post, raise the flag.
 */
export function runSecondThread(): void {
  const d = workerData as WorkerInput;
  const flag = new Int32Array(d.flag);
  d.port.once('message', (v: WorkerValues) => {
    let out: WorkerOutput;
    try {
      // The main thread's ln x when it has them (shared, no copy), else none: the lognormal and gamma
      // fits then visit ln x block by block (a second n-length array here would be 80 MB more at 10^7 values).
      const sorted = new Float64Array(v.values, v.offset, v.length);
      const sample =
        v.logs !== null
          ? prepareSample(sorted, { alreadySorted: true, summary: v.summary, logs: new Float64Array(v.logs, v.logsOffset, v.length) })
          : prepareSample(sorted, { alreadySorted: true, summary: v.summary, logCacheMaxN: 0 });
      out = { results: evaluateFamilies(sample, d.families, d.options) };
    } catch (e) {
      out = { error: e instanceof Error ? e.message : String(e) };
    }
    try {
      d.port.postMessage(out);
    } finally {
      Atomics.store(flag, 0, 1);
      Atomics.notify(flag, 0);
      d.port.close();
    }
  });
}

/** The CLI's handle on the second thread: the `delegated` option for analyzeDataset, and `stop`. */
export interface SecondThread extends DelegatedFamilies {
  /** End the worker if it was started and not collected (the run failed before the analysis). */
  stop(): void;
}

/**
 * The `delegated` option for analyzeDataset: a worker (from `entry`, the running command's own
 * file) that evaluates the AWAY families once the sample is prepared, if it is large enough. With
 * `early` (a file large enough to give PARALLEL_MIN_N values) the worker is started at once, so that
 * its start-up (loading the bundle, ~40-90 ms) overlaps the reading of the file; it is ended
 * unused if the sample turns out small.
 */
export function secondThread(entry: URL, options: SecondThreadOptions, early = false): SecondThread {
  let worker: Worker | null = null;
  let port: MessagePort | null = null;
  let flag: Int32Array | null = null;
  const spawn = (): void => {
    try {
      const flagBuffer = new SharedArrayBuffer(Int32Array.BYTES_PER_ELEMENT);
      const channel = new MessageChannel();
      const input: WorkerInput = { plumblineSecondThread: true, flag: flagBuffer, port: channel.port2, families: AWAY, options };
      worker = new Worker(entry, { workerData: input, transferList: [channel.port2] });
      worker.on('error', () => {}); // reported as a missing result: collect() falls back
      worker.unref();
      port = channel.port1;
      flag = new Int32Array(flagBuffer);
    } catch {
      worker = null;
    }
  };
  const stop = (): void => {
    if (worker !== null) void worker.terminate();
    port?.close();
    worker = null;
    port = null;
  };
  if (early && idleCore()) spawn();
  return {
    families: AWAY,
    start(sample: Sample): void {
      if (sample.n < PARALLEL_MIN_N) return stop();
      if (worker === null) {
        if (!idleCore()) return;
        spawn();
      }
      if (worker === null || port === null) return;
      try {
        // The sorted values themselves when they already live on shared memory (the piece reader's
        // array, sorted in place), else one shared copy.
        const own = sample.sorted;
        let values: Float64Array;
        if (own.buffer instanceof SharedArrayBuffer) values = own;
        else if (sample.n > LOG_CACHE_MAX_N) return stop(); // a shared copy of this many values would break the memory bound
        else {
          values = new Float64Array(new SharedArrayBuffer(sample.n * Float64Array.BYTES_PER_ELEMENT));
          values.set(own);
        }
        // ln x: computed here once for both threads (the main thread's Weibull fit needs them too) and
        // handed over as one shared copy up to LOGS_COPY_MAX_N values. Not past it (a large file's
        // values): the copy would be 80 MB more at 10^7 values, so the worker visits ln x block by block.
        let logs: Float64Array | null = null;
        const ownLogs = sample.n <= LOGS_COPY_MAX_N && sample.nonPositive === 0 ? sample.logs() : null;
        if (ownLogs !== null) {
          logs = new Float64Array(new SharedArrayBuffer(sample.n * Float64Array.BYTES_PER_ELEMENT));
          logs.set(ownLogs);
        }
        const message: WorkerValues = {
          values: values.buffer as SharedArrayBuffer,
          offset: values.byteOffset,
          length: values.length,
          summary: sampleSummary(sample),
          logs: logs === null ? null : (logs.buffer as SharedArrayBuffer),
          logsOffset: logs === null ? 0 : logs.byteOffset,
        };
        (port as MessagePort).postMessage(message);
      } catch {
        stop();
      }
    },
    collect(): readonly EvaluatedFamily[] | null {
      if (worker === null || port === null || flag === null) return null;
      const w: Worker = worker;
      const p: MessagePort = port;
      worker = null;
      port = null;
      const done = Atomics.wait(flag, 0, 0, WAIT_MS) !== 'timed-out';
      const m = done ? (receiveMessageOnPort(p)?.message as WorkerOutput | undefined) : undefined;
      p.close();
      if (!done) void w.terminate();
      return m !== undefined && 'results' in m ? m.results : null;
    },
    stop,
  };
}
