// @vitest-environment jsdom
/**
 * The test-planning calculator on the page (client/src/views/life-plan.ts): the block it shows and
 * the form that recomputes it. Numbers come from the core's planTest (checked against SciPy in
 * test/life/test-plan.test.ts); here: that the page shows them and reacts to the fields.
 */
import { describe, expect, it } from 'vitest';
import { blockHtml } from '../../client/src/views/block.js';
import { DEFAULT_PLAN_FIELDS, planBlock, planCalculatorNode, planFor } from '../../client/src/views/life-plan.js';

describe('test-planning calculator', () => {
  it('R = C = 0.9 at k = 1 with no failures: 22 units (n = ln(1 - C)/ln R = 21.85, rounded up), derivation and cautions shown', () => {
    const r = planFor(DEFAULT_PLAN_FIELDS);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const b = planBlock(r.plan);
    expect(b.answer).toMatch(/test 22 units for 1000 each \(shape β = 2 assumed\)/);
    expect(b.tables[0]!.rows.find((row) => row[0] === '1000')![1]).toBe('22');
    expect(b.lines.map((l) => l.text).join(' ')).toMatch(/rounded up to 22/);
    expect(b.lines.some((l) => l.kind === 'caution' && /assumed, not measured/.test(l.text))).toBe(true);
    // The exported report prints the same block.
    const html = blockHtml(b, () => '');
    expect(html).toContain('How many units to test');
    expect(html).toContain('licensed practice');
  });

  it('the form recomputes as a field changes and names a bad field', () => {
    const node = planCalculatorNode();
    document.body.append(node);
    expect(node.querySelector('.block-answer')!.textContent).toMatch(/test 22 units/);
    const rel = node.querySelector('#plan-reliability') as HTMLInputElement;
    rel.value = '0.95';
    rel.dispatchEvent(new Event('input'));
    // R = 0.95, C = 0.9: ln(0.1)/ln(0.95) = 44.9 → 45 units.
    expect(node.querySelector('.block-answer')!.textContent).toMatch(/test 45 units/);
    rel.value = '1.2';
    rel.dispatchEvent(new Event('input'));
    expect(node.querySelector('[role="alert"]')!.textContent).toMatch(/reliability must be in \(0, 1\)/);
    const r = node.querySelector('#plan-failures') as HTMLInputElement;
    rel.value = '0.9';
    r.value = '1';
    r.dispatchEvent(new Event('input'));
    expect(node.querySelector('.block-answer')!.textContent).toMatch(/allowing 1 failure: test 38 units/);
  });
});
