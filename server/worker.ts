/**
 * Worker thread for the parametric bootstrap: runs one replicate range [start, end) at a time with
 * the core's pure range function, so the counts are the same whichever worker runs which range.
 * Cancellation: the main thread sets a shared flag, checked between replicates.
 */
import { parentPort } from 'node:worker_threads';
import { runBootstrapRange, type BootstrapJob } from '../core/index.js';
import type { FromWorker, ToWorker } from './pool-messages.js';

const port = parentPort;
if (!port) throw new Error('bootstrap-worker.ts must run as a worker thread');

/** Progress messages at most this often (ms), plus one at the end of a range. */
const PROGRESS_INTERVAL_MS = 50;

port.on('message', (msg: ToWorker) => {
  const flag = new Int32Array(msg.cancel);
  const signal = {
    get aborted(): boolean {
      return Atomics.load(flag, 0) !== 0;
    },
  };
  let last = Date.now();
  const post = (m: FromWorker): void => port.postMessage(m);
  try {
    const job: BootstrapJob = msg.job;
    const counts = runBootstrapRange(job, {
      signal,
      onProgress: (done, total) => {
        const now = Date.now();
        if (now - last >= PROGRESS_INTERVAL_MS && done < total) {
          last = now;
          post({ type: 'progress', id: msg.id, done });
        }
      },
    });
    post({ type: 'done', id: msg.id, counts });
  } catch (e) {
    post({ type: 'error', id: msg.id, message: e instanceof Error ? (e.stack ?? e.message) : String(e) });
  }
});
