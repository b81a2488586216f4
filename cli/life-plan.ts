/**
 * The test-planning calculator on the command line: --plan-reliability R --plan-time T
 * --assumed-shape B [--plan-confidence C] [--plan-failures r] → the core's planTest (binomial and
 * Weibayes forms), printed as text or JSON. Runs beside an analysis, or alone (`runPlanCommand`).
 */
import { InputError, planTest, type OptionValue, type TestPlan } from '../core/index.js';
import { planText } from './life-text.js';

export type PlanOutcome = TestPlan;

/** The plan the options ask for, or null when --plan-reliability is absent. */
export function planFromOptions(o: ReadonlyMap<string, OptionValue>): PlanOutcome | null {
  const R = o.get('planReliability');
  if (R === undefined || R === null) {
    const stray = ['planTime', 'planConfidence', 'planFailures'].find((n) => o.has(n));
    if (stray) throw new InputError(`--${stray.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`)} is part of a test plan: give --plan-reliability too`, {}, 'bad-option');
    return null;
  }
  const t = o.get('planTime');
  const beta = o.get('assumedShape');
  if (typeof t !== 'number') throw new InputError('--plan-reliability needs --plan-time (the time at which R is to be shown)', {}, 'bad-option');
  if (typeof beta !== 'number') throw new InputError('--plan-reliability needs --assumed-shape (the Weibull shape the plan assumes)', {}, 'bad-option');
  const C = o.get('planConfidence');
  const r = o.get('planFailures');
  return planTest({
    reliability: R as number,
    time: t,
    confidence: typeof C === 'number' ? C : 0.9,
    shape: beta,
    failuresAllowed: typeof r === 'number' ? r : 0,
  });
}

/** `plumbline plan ...`: the plan alone (no data file). */
export function runPlanCommand(o: ReadonlyMap<string, OptionValue>, io: { out(s: string): void }, json = o.get('json') === true): number {
  const plan = planFromOptions(o);
  if (!plan) throw new InputError('plan needs --plan-reliability, --plan-time and --assumed-shape', {}, 'bad-option');
  io.out(json ? `${JSON.stringify({ plan }, null, 2)}\n` : planText(plan));
  return 0;
}
