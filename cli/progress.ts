/**
 * Progress on standard error for a run longer than a second: nothing for a quick run; after the
 * first second, the bootstrap's replicates done of the total (with the family being resampled),
 * at most every half second — one rewritten line on a terminal, plain lines otherwise (a log
 * file). Standard output carries only the report, so `--json > file` is unchanged.
 * Common practice, no source.
 */

export interface ProgressSink {
  (text: string): void;
}

export interface ProgressOptions {
  /** A terminal: rewrite one line with a carriage return instead of printing lines. */
  readonly tty: boolean;
  /** Milliseconds since some origin (injectable for tests). */
  readonly now?: () => number;
  /** Quiet for runs shorter than this (ms). */
  readonly quietMs?: number;
  /** Least time between two updates (ms). */
  readonly everyMs?: number;
}

export interface Progress {
  /** Bootstrap replicates done of the total over all families, and the family being run. */
  replicates(done: number, total: number, family: string): void;
  /** The run is over: clear a terminal line. */
  end(): void;
}

export function createProgress(write: ProgressSink, opts: ProgressOptions): Progress {
  const now = opts.now ?? Date.now;
  const start = now();
  // PLUMBLINE_PROGRESS_QUIET_MS shortens the quiet first second (tests on a fast machine, where the
  // whole run can end inside it).
  const fromEnv = Number(process.env.PLUMBLINE_PROGRESS_QUIET_MS);
  const quiet = opts.quietMs ?? (Number.isFinite(fromEnv) && fromEnv >= 0 ? fromEnv : 1000);
  const every = opts.everyMs ?? 500;
  let last = Number.NEGATIVE_INFINITY;
  let shown = false;
  return {
    replicates(done, total, family) {
      const t = now();
      if (t - start < quiet || (t - last < every && done < total)) return;
      last = t;
      const pct = total > 0 ? Math.floor((100 * done) / total) : 100;
      const line = `plumbline: bootstrap ${pct} % (${done.toLocaleString('en-US')} of ${total.toLocaleString('en-US')} replicates; ${family})`;
      write(opts.tty ? `\r${line}\u001b[K` : `${line}\n`);
      shown = true;
    },
    end() {
      if (shown && opts.tty) write('\r\u001b[K');
    },
  };
}
