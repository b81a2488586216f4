/**
 * Worker thread of the server. Two kinds of work, so the main thread only moves bytes:
 *  - bootstrap replicate ranges [start, end) with the core's pure range function (the counts are
 *    the same whichever worker runs which range; cancellation through a shared flag, checked
 *    between replicates);
 *  - whole requests: JSON parsing, validation, reading the CSV, fitting and testing (the core's
 *    plan), and, once the bootstrap counts are in, the report and its evidence. A plan that waits
 *    for its bootstrap is kept here under a token until `finish` or `drop`.
 */
import { parentPort } from 'node:worker_threads';
import { runDatasetJob, type DatasetJob } from '../core/index.js';
import { finishRequest, planRequest, type PlannedRequest } from './analysis.js';
import { badRequest, clientFault } from './errors.js';
import type { FromWorker, ToWorker } from './pool-messages.js';
import { parseAnalyzeBody, parseJobBody } from './validate.js';

const port = parentPort;
if (!port) throw new Error('worker.ts must run as a worker thread');

/** Progress messages at most this often (ms). */
const PROGRESS_INTERVAL_MS = 50;
const kept = new Map<number, PlannedRequest>();
const decoder = new TextDecoder('utf-8', { fatal: true });
const post = (m: FromWorker): void => port.postMessage(m);

function runRange(id: number, job: DatasetJob, cancel: SharedArrayBuffer): void {
  const flag = new Int32Array(cancel);
  const signal = {
    get aborted(): boolean {
      return Atomics.load(flag, 0) !== 0;
    },
  };
  let last = Date.now();
  const counts = runDatasetJob(job, {
    signal,
    onProgress: (done, total) => {
      const now = Date.now();
      if (now - last >= PROGRESS_INTERVAL_MS && done < total) {
        last = now;
        post({ type: 'progress', id, done });
      }
    },
  });
  post({ type: 'counts', id, counts });
}

function parseBody(bytes: Uint8Array): unknown {
  let text: string;
  try {
    text = decoder.decode(bytes);
  } catch {
    throw badRequest('The request body is not valid UTF-8 text.', undefined, 'bad-request');
  }
  if (text.trim() === '') return undefined;
  try {
    return JSON.parse(text);
  } catch (e) {
    throw badRequest(`The request body is not valid JSON (${(e as Error).message}).`, undefined, 'bad-request');
  }
}

port.on('message', (msg: ToWorker) => {
  try {
    switch (msg.type) {
      case 'range':
        runRange(msg.id, msg.job, msg.cancel);
        return;
      case 'plan': {
        const body = parseBody(msg.body);
        const req = msg.kind === 'job' ? parseJobBody(body) : parseAnalyzeBody(body);
        const client = 'client' in req && typeof req.client === 'string' ? { client: req.client } : {};
        // One pipeline for every kind of data: plan here, bootstrap ranges on the pool, finish here.
        const planned = planRequest(req);
        if (planned.plan.kind === 'done' || planned.plan.jobs.length === 0) {
          post({ type: 'result', id: msg.id, json: JSON.stringify(finishRequest(planned, [])), ...client });
          return;
        }
        kept.set(msg.id, planned);
        post({ type: 'planned', id: msg.id, jobs: planned.plan.jobs, ...client });
        return;
      }
      case 'finish': {
        const planned = kept.get(msg.token);
        kept.delete(msg.token);
        if (!planned) throw new Error(`no kept plan ${msg.token}`);
        post({ type: 'result', id: msg.id, json: JSON.stringify(finishRequest(planned, msg.counts)) });
        return;
      }
      case 'drop':
        kept.delete(msg.token);
        post({ type: 'ok', id: msg.id });
        return;
    }
  } catch (e) {
    const fault = clientFault(e);
    if (fault) post({ type: 'fault', id: msg.id, status: fault.status, body: fault.body });
    else post({ type: 'error', id: msg.id, message: e instanceof Error ? (e.stack ?? e.message) : String(e) });
  }
});
