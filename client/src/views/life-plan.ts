/**
 * The test-planning calculator on the page: reliability R to show at time t with confidence C, an
 * assumed Weibull shape β and the failures allowed r → how many units for how long (the core's
 * planTest: binomial and Weibayes forms, with its derivation and cautions). `planBlock` is pure
 * (a SectionBlock, so the page and the exported report say the same); `planCalculatorNode` is the
 * small form that recomputes the block as the fields change. Nothing here computes a number.
 */
import { planTest, type TestPlan } from '../../../core/index.js';
import { el } from '../dom.js';
import type { SectionBlock } from './block.js';
import { blockNode } from './block.js';
import { sig } from '../format.js';

const num = (x: number): string => sig(x);

export interface PlanFields {
  readonly reliability: string;
  readonly time: string;
  readonly confidence: string;
  readonly shape: string;
  readonly failures: string;
}

export const DEFAULT_PLAN_FIELDS: PlanFields = { reliability: '0.9', time: '1000', confidence: '0.9', shape: '2', failures: '0' };

/** The plan for the fields, or the reason the fields do not make one. */
export function planFor(f: PlanFields): { ok: true; plan: TestPlan } | { ok: false; message: string } {
  const n = (s: string) => (s.trim() === '' ? Number.NaN : Number(s));
  try {
    return { ok: true, plan: planTest({ reliability: n(f.reliability), time: n(f.time), confidence: n(f.confidence), shape: n(f.shape), failuresAllowed: n(f.failures) }) };
  } catch (e) {
    return { ok: false, message: e instanceof Error ? e.message : String(e) };
  }
}

export function planBlock(plan: TestPlan): SectionBlock {
  const i = plan.input;
  const one = plan.rows.find((r) => r.timeRatio === 1) ?? plan.rows[0]!;
  return {
    id: 'life-plan',
    title: 'How many units to test',
    answer: `To show R(${num(i.time)}) ≥ ${i.reliability} with ${num(100 * i.confidence)} % confidence, allowing ${i.failuresAllowed} failure${i.failuresAllowed === 1 ? '' : 's'}: test ${one.unitsBinomial} units for ${num(one.testTime)} each (shape β = ${i.shape} assumed).`,
    lead: 'Longer tests need fewer units, but only if the Weibull shape is what you assume: the shape is not measured by the test.',
    lines: [...plan.derivation.map((text) => ({ kind: 'fact' as const, text })), ...plan.cautions.map((text) => ({ kind: 'caution' as const, text })), { kind: 'note', text: `Source: ${plan.source}.` }],
    tables: [
      {
        caption: `Units needed for each test length per unit (0.5 to 3 times t = ${num(i.time)})`,
        head: ['Test time', 'Units (binomial)', 'Units (Weibayes)'],
        rows: plan.rows.map((r) => [num(r.testTime), String(r.unitsBinomial), `${r.unitsWeibayes} (${num(r.unitsWeibayesExact)})`]),
      },
    ],
    charts: [],
  };
}

const LABELS: Record<keyof PlanFields, string> = {
  reliability: 'Reliability to show, R',
  time: 'At time t',
  confidence: 'Confidence C',
  shape: 'Weibull shape β (assumed)',
  failures: 'Failures allowed r',
};

/** The calculator: a form and its result, recomputed on every change. */
export function planCalculatorNode(initial: PlanFields = DEFAULT_PLAN_FIELDS): HTMLElement {
  const box = el('section', { className: 'card plan-calculator', id: 'plan-calculator', 'aria-labelledby': 'plan-h' });
  box.append(el('h2', { id: 'plan-h' }, 'Plan a demonstration test'));
  const inputs = {} as Record<keyof PlanFields, HTMLInputElement>;
  const form = el('div', { className: 'plan-fields' });
  for (const k of Object.keys(LABELS) as (keyof PlanFields)[]) {
    const input = el('input', { type: 'text', id: `plan-${k}`, value: initial[k], inputmode: 'decimal', autocomplete: 'off' });
    inputs[k] = input;
    form.append(el('label', { className: 'field', for: `plan-${k}` }, LABELS[k]), input);
  }
  const out = el('div', { className: 'plan-result', 'aria-live': 'polite' });
  const render = (): void => {
    const fields = Object.fromEntries((Object.keys(inputs) as (keyof PlanFields)[]).map((k) => [k, inputs[k].value])) as unknown as PlanFields;
    const r = planFor(fields);
    out.replaceChildren(r.ok ? blockNode(planBlock(r.plan), () => el('div')) : el('p', { className: 'error', role: 'alert' }, r.message));
  };
  for (const input of Object.values(inputs)) input.addEventListener('input', render);
  box.append(form, out);
  render();
  return box;
}
