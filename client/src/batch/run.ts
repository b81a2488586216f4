/**
 * Running a batch on the page: the series (split by the core from the file's cells) go to a few Web
 * Workers, two in flight per worker; summaries come back in finishing order and are stored by series
 * index; progress is reported as they arrive; Stop terminates the workers at once.
 */
import type { DatasetOptions, SeriesRecord, SeriesSummary } from '../../../core/index.js';
import type { WorkerDone, WorkerTask } from './worker.js';

export interface BatchRun {
  /** Resolves with every summary in series order (or the ones finished when stopped). */
  readonly done: Promise<{ readonly summaries: (SeriesSummary | undefined)[]; readonly stopped: boolean }>;
  stop(): void;
}

export function runBatchOnPage(
  records: readonly SeriesRecord[],
  options: DatasetOptions,
  onProgress: (done: number, total: number) => void,
  makeWorker: () => Worker = () => new Worker(new URL('./worker.ts', import.meta.url), { type: 'module' }),
): BatchRun {
  const summaries: (SeriesSummary | undefined)[] = new Array<SeriesSummary | undefined>(records.length);
  const threads = Math.max(1, Math.min(4, (typeof navigator !== 'undefined' && navigator.hardwareConcurrency) || 2));
  const workers: Worker[] = [];
  let next = 0;
  let finished = 0;
  let settle: (v: { summaries: (SeriesSummary | undefined)[]; stopped: boolean }) => void = () => {};
  let fail: (e: unknown) => void = () => {};
  const done = new Promise<{ summaries: (SeriesSummary | undefined)[]; stopped: boolean }>((resolve, reject) => {
    settle = resolve;
    fail = reject;
  });
  const end = (stopped: boolean): void => {
    for (const w of workers) w.terminate();
    workers.length = 0;
    settle({ summaries, stopped });
  };
  const feed = (w: Worker): void => {
    if (next >= records.length) return;
    const id = next++;
    w.postMessage({ id, record: records[id] as SeriesRecord, options } satisfies WorkerTask);
  };
  if (records.length === 0) end(false);
  else {
    for (let t = 0; t < Math.min(threads, records.length); t++) {
      const w = makeWorker();
      workers.push(w);
      w.onmessage = (e: MessageEvent<WorkerDone>) => {
        summaries[e.data.id] = e.data.summary;
        finished++;
        onProgress(finished, records.length);
        if (finished === records.length) end(false);
        else feed(w);
      };
      w.onerror = (e) => {
        for (const x of workers) x.terminate();
        fail(new Error(`a worker of the batch failed: ${e.message}`));
      };
      feed(w);
      feed(w);
    }
  }
  return { done, stop: () => end(true) };
}
