#!/usr/bin/env node
/**
 * The `plumbline` command. Errors: one line on standard error, never a stack trace;
 * exit code 2 for a problem with the input or the options, 70 for an internal error.
 */
import { runCli } from './run.js';
import { isWorkerRun, runSecondThread } from './second-thread.js';
import { isBatchWorker, runBatchWorker } from './batch-pool.js';

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
