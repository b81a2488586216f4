#!/usr/bin/env node
/**
 * The `plumbline` command. Errors: one line on standard error, never a stack trace;
 * exit code 2 for a problem with the input or the options, 70 for an internal error.
 */
import { runCli } from './run.js';

process.stdout.on('error', (e: NodeJS.ErrnoException) => {
  // A closed pipe (e.g. `| head`) is not an error of ours.
  if (e.code === 'EPIPE') process.exit(process.exitCode ?? 0);
  throw e;
});

process.exitCode = runCli(process.argv.slice(2), {
  out: (s) => process.stdout.write(s),
  err: (s) => process.stderr.write(s),
});
