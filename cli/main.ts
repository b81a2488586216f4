#!/usr/bin/env node
/**
 * The `plumbline` command. Errors: one line on standard error, never a stack trace;
 * exit code 2 for a problem with the input or the options, 70 for an internal error.
 */
import { setFlagsFromString } from 'node:v8';
import { runCli } from './run.js';
import { isWorkerRun, runSecondThread } from './second-thread.js';
import { isBatchWorker, runBatchWorker } from './batch-pool.js';

// One command, run once: its loops over 10^6 values each run once, from cold code. With V8's
// concurrent on-stack replacement a hot loop goes on in baseline code (boxing every double) until a
// background thread has compiled it, which on a busy machine waits for a core; compiled on the spot
// instead, the whole 10^6-value analysis took 1.05 s of CPU against 1.15 s (median of 5 interleaved
// runs each, load 8 on 2 cores, 2026-12-05). The numbers are the same (the same IEEE operations).
setFlagsFromString('--no-concurrent-osr');

if (isWorkerRun()) runSecondThread();
else if (isBatchWorker()) runBatchWorker();
else {
  process.stdout.on('error', (e: NodeJS.ErrnoException) => {
    // A closed pipe (e.g. `| head`) is not an error of ours.
    if (e.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw e;
  });

  const self = new URL(import.meta.url);
  const code = runCli(process.argv.slice(2), {
    out: (s) => process.stdout.write(s),
    err: (s) => process.stderr.write(s),
    progress: true,
    errTty: process.stderr.isTTY === true,
    // The second thread runs this same file; only from the built JavaScript (not from sources
    // run through a TypeScript loader, which a worker would not inherit reliably).
    ...(self.pathname.endsWith('.js') ? { workerEntry: self } : {}),
  });
  if (typeof code === 'number') process.exitCode = code;
  else void code.then((c) => (process.exitCode = c));
}
