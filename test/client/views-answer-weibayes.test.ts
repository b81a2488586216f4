/**
 * The answer at the top of the page with no failures and the Weibull shape given from experience
 * (client/src/views/answer-weibayes.ts): the Weibayes lower bounds equal Nelson's closed form
 * (J. Quality Technology 17:140-146, 1985; r = 0: η_L = (Σ t^β / −ln(1 − C))^{1/β},
 * B10_L = η_L (−ln 0.9)^{1/β}), the shape said to be ASSUMED, the cautions carried; without an
 * assumed shape there is no answer (nothing to state). Data invented: ten units still running.
 */
import { describe, expect, it } from 'vitest';
import { analyzeDataset, type DatasetReport } from '../../core/index.js';
import { sig } from '../../client/src/format.js';
import { answerFor } from '../../client/src/views/answer.js';
import { recordedBlock } from '../../client/src/views/life-recorded.js';

const RUNNING = [800, 950, 1000, 1000, 1200, 1200, 1500, 1500, 1500, 2000];
const interval = { start: RUNNING, end: RUNNING.map(() => Number.POSITIVE_INFINITY), counts: RUNNING.map(() => 1) };
const report = (assumedShape?: number): DatasetReport =>
  JSON.parse(JSON.stringify(analyzeDataset({ interval }, { bLifePercents: [10], confidence: 0.9, ...(assumedShape ? { assumedShape } : {}), bootstrapReplicates: 19, seed: 1 }))) as DatasetReport;

describe('the answer with no failures and an assumed Weibull shape', () => {
  it('states the Weibayes lower bounds (Nelson 1985 closed form), the shape as assumed, and the cautions', () => {
    const r = report(2);
    expect(r.candidates).toHaveLength(0);
    const a = answerFor(r, null, 'h')!;
    const exposure = RUNNING.reduce((s, t) => s + t * t, 0);
    const scale = Math.sqrt(exposure / -Math.log(1 - 0.9));
    const b10 = scale * Math.sqrt(-Math.log(0.9));
    expect(a.sentence).toBe(`With the Weibull shape ASSUMED at β = 2 (Weibayes, 0 failures in 10 units): B10 life at least ${sig(b10)} h, the scale at least ${sig(scale)} h (one-sided 90 % lower bounds; no model could be fitted to these data).`);
    expect(a.undermined).toBe(false);
    expect(a.cautions.some((c) => /ASSUMED .*not estimated from these data/.test(c))).toBe(true);
    expect(a.cautions.some((c) => /licensed practice/.test(c))).toBe(true);
    // each caution once (the core lists Weibayes' statement among its cautions too)
    expect(new Set(a.cautions).size).toBe(a.cautions.length);
    const block = recordedBlock(r.life!.recorded!.report!, null, 'h');
    const said = block.lines.filter((l) => l.kind === 'caution').map((l) => l.text);
    expect(new Set(said).size).toBe(said.length);
    expect(said.filter((t) => /is ASSUMED/.test(t))).toHaveLength(1);
  });

  it('without an assumed shape there is no number to state', () => {
    expect(answerFor(report(), null, 'h')).toBeNull();
  });
});
