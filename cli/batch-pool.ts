/**
 * The batch's worker threads: each series is analysed by `analyzeSeries` on one of a few
 * worker_threads (the same one-file bundle the command runs from, branching on `isBatchWorker()`),
 * and its JSON line comes back as text with its summary, so the main thread only writes and counts.
 * Without a bundle to start workers from (sources run through a TypeScript loader) the series are
 * analysed on the main thread, one by one: same lines, same numbers.
 */
import { availableParallelism } from 'node:os';
import { Worker, isMainThread, parentPort, workerData } from 'node:worker_threads';
import { analyzeSeries, summarizeSeries, type DatasetOptions, type SeriesRecord, type SeriesSummary } from '../core/index.js';

interface BatchWorkerData {
  readonly plumblineBatch: true;
  readonly options: DatasetOptions;
}

interface Task {
  readonly id: number;
  readonly record: SeriesRecord;
}

export interface Done {
  readonly id: number;
  /** The series' JSON line (no trailing newline). */
  readonly json: string;
  readonly summary: SeriesSummary;
}

export function isBatchWorker(): boolean {
  return !isMainThread && (workerData as Partial<BatchWorkerData> | null)?.plumblineBatch === true;
}

function analyzeToLine(record: SeriesRecord, options: DatasetOptions, id: number): Done {
  const line = analyzeSeries(record, options);
  return { id, json: JSON.stringify(line), summary: summarizeSeries(line) };
}

/** The worker's side: analyse each series it is sent. */
export function runBatchWorker(): void {
  const { options } = workerData as BatchWorkerData;
  parentPort?.on('message', (task: Task | null) => {
    if (task === null) {
      parentPort?.close();
      return;
    }
    parentPort?.postMessage(analyzeToLine(task.record, options, task.id));
  });
}

/** How many worker threads: one per core, at most 8; none for a handful of series. */
export function workerCount(series: number): number {
  return series < 8 ? 0 : Math.min(8, availableParallelism());
}

/**
 * Analyse every record, calling `done` as each finishes (in finishing order). Workers are started
 * from `entry` when given and worth it; otherwise everything runs here.
 */
export async function analyzeAll(
  records: readonly SeriesRecord[],
  options: DatasetOptions,
  entry: URL | undefined,
  done: (d: Done) => void,
): Promise<void> {
  if (records.length === 0) return;
  const threads = entry ? workerCount(records.length) : 0;
  if (threads === 0) {
    for (let i = 0; i < records.length; i++) {
      done(analyzeToLine(records[i] as SeriesRecord, options, i));
      // Let stdout drain and progress print between series.
      if (i % 64 === 63) await new Promise((r) => setImmediate(r));
    }
    return;
  }
  let next = 0;
  let finished = 0;
  await new Promise<void>((resolve, reject) => {
    const workers: Worker[] = [];
    const feed = (w: Worker): void => {
      if (next < records.length) {
        const id = next++;
        w.postMessage({ id, record: records[id] as SeriesRecord } satisfies Task);
      } else w.postMessage(null);
    };
    for (let t = 0; t < threads; t++) {
      const w = new Worker(entry as URL, { workerData: { plumblineBatch: true, options } satisfies BatchWorkerData });
      workers.push(w);
      w.on('message', (d: Done) => {
        done(d);
        finished++;
        if (finished === records.length) {
          for (const x of workers) void x.terminate();
          resolve();
        } else feed(w);
      });
      w.on('error', (e) => {
        for (const x of workers) void x.terminate();
        reject(e);
      });
      // Two tasks in flight per worker keeps it busy while the main thread writes.
      feed(w);
      feed(w);
    }
  });
}
