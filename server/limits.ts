/**
 * The work one request may ask of the server, stated in server/API.md ("Limits"), so that a small
 * body cannot hold the workers for minutes: the number of values (units), the number of grouped
 * classes, and the bootstrap's sampled values (replicates × n summed over the families that need
 * the bootstrap). A request past a limit is refused before that work starts: 413 for the size of
 * the data, 422 for the bootstrap work, each message naming the limit and what to change.
 *
 * The figures were measured on this machine's core (one worker thread, Node 20; common practice,
 * no source): grouped maximum likelihood ≈ 0.9 ms per class for the five default families
 * (1000 classes ≈ 1 s; 10^5 classes took 56 s); the complete-sample bootstrap ≈ 1.4 µs per sampled
 * value with its refit; the censored bootstrap ≈ 11 µs per sampled value (a censored refit each);
 * the failure modes ≈ 13.5 µs per mode × unit × family (each mode's censored fits and bounds).
 */
import { censoredBootstrapWork, DEFAULT_LIFE_REPLICATES, INTERVAL_GOF_REPLICATES, type BootstrapJob, type DatasetInput, type DatasetOptions } from '../core/index.js';
import { HttpError } from './errors.js';

export const REQUEST_LIMITS = {
  /** Values (or units of life data) in one request: 10^6 is analysed in about a second. */
  values: 2_000_000,
  /** Grouped classes (each costs every family's grouped likelihood at every iteration). */
  classes: 1_000,
  /** Complete-sample bootstrap: replicates × n over the families that need it (≈ 70 s on one core). */
  bootstrapValues: 50_000_000,
  /** Censored bootstrap of life data: replicates × units × families (≈ 55 s on one core). */
  censoredBootstrapValues: 5_000_000,
  /** Distinct failure modes (a column with more labels than this is rarely a mode column: unit ids, dates). */
  failureModes: 20,
  /** Failure modes: modes × units × families, each mode's fits and bounds over every unit (≈ 13.5 µs each: 20 modes × 2000 units × 5 families took 2.7 CPU s; ≈ 27 s at the limit). */
  modeFitValues: 2_000_000,
  /**
   * Failure modes: modes³ × units, the system B-life bounds (a profile over every mode's parameters
   * at once; measured ≈ 45-51 µs per mode³·unit at 3, 5 and 8 modes × 2000 units and 3 modes × 8000
   * units: 8 modes × 2000 units took 52 CPU s); ≈ 30 s at the limit.
   */
  modeSystemValues: 600_000,
} as const;

const fmt = (x: number): string => x.toLocaleString('en-US');

/** Refuse data larger than the limits (413), and censored bootstrap work past its limit (422). */
export function checkDatasetSize(dataset: DatasetInput, options: DatasetOptions, limits = REQUEST_LIMITS): void {
  if (dataset.grouped && dataset.grouped.length > limits.classes) {
    throw new HttpError(
      413,
      `Too many grouped classes: ${fmt(dataset.grouped.length)}; the server takes at most ${fmt(limits.classes)} classes per request. Merge adjacent classes, or send the individual values.`,
      { field: 'grouped', code: 'too-much-work' },
    );
  }
  // Units: the values, or the units of interval rows (their counts added up).
  const n = dataset.values?.length ?? (dataset.interval ? (dataset.interval.counts ? Array.from(dataset.interval.counts).reduce((a, c) => a + c, 0) : dataset.interval.start.length) : 0);
  if (n > limits.values) {
    throw new HttpError(413, `Too many values: ${fmt(n)}; the server takes at most ${fmt(limits.values)} values per request. Analyse a sample of them, or use the command line.`, {
      field: 'values',
      code: 'too-much-work',
    });
  }
  if (dataset.modes) {
    const modes = new Set(dataset.modes.filter((m): m is string => m !== null)).size;
    const families = options.families?.length ?? 5;
    if (modes > limits.failureModes) {
      throw new HttpError(422, `Too many failure modes: ${fmt(modes)} different labels in the failure-mode column; the server fits at most ${fmt(limits.failureModes)}. Merge related modes, or check that the column names modes.`, {
        field: 'modeColumn',
        code: 'too-much-work',
      });
    }
    if (modes ** 3 * n > limits.modeSystemValues) {
      const most = Math.floor(limits.modeSystemValues / modes ** 3);
      throw new HttpError(
        422,
        `The failure modes asked for are too much work: the bounds of the whole unit's B-lives cost modes³ × units = ${fmt(modes ** 3 * n)}; the server's limit is ${fmt(limits.modeSystemValues)}. With ${fmt(modes)} modes send at most ${fmt(most)} units, merge related modes, or use the command line.`,
        { field: 'modeColumn', code: 'too-much-work' },
      );
    }
    if (modes * n * families > limits.modeFitValues) {
      throw new HttpError(
        422,
        `The failure modes asked for are too much work: modes × units × families = ${fmt(modes * n * families)}; the server's limit is ${fmt(limits.modeFitValues)}. Use fewer families or merge related modes, or use the command line.`,
        { field: 'modeColumn', code: 'too-much-work' },
      );
    }
  }
  const censored = censoredBootstrapWork(dataset, options);
  if (censored > limits.censoredBootstrapValues) {
    const families = Math.round(censored / (n * (options.bootstrapReplicates ?? (dataset.interval ? INTERVAL_GOF_REPLICATES : DEFAULT_LIFE_REPLICATES))));
    const most = Math.floor(limits.censoredBootstrapValues / (n * families));
    throw new HttpError(
      422,
      `The censored bootstrap asked for is too much work: replicates × units × families = ${fmt(censored)}; the server's limit is ${fmt(limits.censoredBootstrapValues)}. ` +
        (most >= 19 ? `With ${fmt(n)} units and ${families} families use at most ${fmt(most)} replicates, or fewer families.` : `Use fewer families, or the command line.`),
      { field: 'replicates', code: 'too-much-work' },
    );
  }
}

/** Refuse a complete-sample bootstrap past its limit (422); jobs are the plan's full-range jobs. */
export function checkBootstrapWork(jobs: readonly BootstrapJob[], limits = REQUEST_LIMITS): void {
  let work = 0;
  for (const j of jobs) work += (j.end - j.start) * j.n;
  if (work <= limits.bootstrapValues) return;
  const first = jobs[0] as BootstrapJob;
  const most = Math.floor(limits.bootstrapValues / (first.n * jobs.length));
  throw new HttpError(
    422,
    `The bootstrap asked for is too much work: replicates × n summed over the ${jobs.length} famil${jobs.length === 1 ? 'y' : 'ies'} that need it (${jobs.map((j) => j.family).join(', ')}) = ${fmt(work)}; the server's limit is ${fmt(limits.bootstrapValues)}. ` +
      (most >= 19 ? `With n = ${fmt(first.n)} use at most ${fmt(most)} replicates, or fewer families.` : `Use the published-table p-values (pMethod "table"), fewer families, or the command line.`),
    { field: 'replicates', code: 'too-much-work' },
  );
}
