/**
 * Run rules on the location panel of a Shewhart chart (Western Electric Company, Statistical Quality
 * Control Handbook, 1956, the zone rules [from memory]). With z = (value - centre) / σ of the plotted
 * statistic (σ̂ for individual values, σ̂/√nᵢ for subgroup means):
 *   rule 1: a point beyond 3σ (ChartPoint.beyond, control-chart.ts);
 *   rule 2: two of three successive points beyond 2σ on the same side;
 *   rule 3: four of five successive points beyond 1σ on the same side;
 *   rule 4: eight successive points on the same side of the centre line.
 * A signal is attached to the point that completes the pattern (the last of its window; common
 * practice, no source). With all four rules an in-control normal chart signals on average every
 * 91.75 points instead of 370.4 with rule 1 alone (Champ & Woodall 1987, Technometrics 29:393-399
 * [from memory]; checked by simulation in test/capability/run-rules.test.ts), so some signals on a
 * long chart are false alarms.
 */

export type RunRule = 2 | 3 | 4;

export const RUN_RULES_SOURCE = 'Western Electric Statistical Quality Control Handbook (1956), zone rules 2-4';

/** The rule of each number, in words. */
export const RUN_RULE_WORDS: Readonly<Record<RunRule, string>> = {
  2: 'two of three successive points beyond 2 sigma on one side',
  3: 'four of five successive points beyond 1 sigma on one side',
  4: 'eight successive points on one side of the centre line',
};

function countIn(z: readonly number[], end: number, width: number, test: (v: number) => boolean): number {
  let c = 0;
  for (let j = end - width + 1; j <= end; j++) if (test(z[j] as number)) c++;
  return c;
}

/**
 * The run rules (2-4) each point completes, in order of the points. `sigmas[i]` is the standard
 * deviation of point i's statistic; a point exactly on the centre line is on neither side.
 */
export function runRuleSignals(values: readonly number[], center: number, sigmas: readonly number[]): RunRule[][] {
  const z = values.map((v, i) => (v - center) / (sigmas[i] as number));
  return z.map((_, i) => {
    const out: RunRule[] = [];
    if (i >= 2 && (countIn(z, i, 3, (v) => v > 2) >= 2 || countIn(z, i, 3, (v) => v < -2) >= 2)) out.push(2);
    if (i >= 4 && (countIn(z, i, 5, (v) => v > 1) >= 4 || countIn(z, i, 5, (v) => v < -1) >= 4)) out.push(3);
    if (i >= 7 && (countIn(z, i, 8, (v) => v > 0) === 8 || countIn(z, i, 8, (v) => v < 0) === 8)) out.push(4);
    return out;
  });
}
