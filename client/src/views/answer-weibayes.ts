/**
 * The answer at the top of the page when no model can be fitted (too few failures, none at all) but
 * the Weibull shape is given from experience: the Weibayes lower bounds (core/life weibayes.ts;
 * Nelson 1985, J. Quality Technology 17:140-146), with the shape said to be ASSUMED, the one-sided
 * level, and the recorded-life section's cautions (the shape assumed, the safety practice). Never an
 * estimate the data do not give: with no failures there is a lower bound only.
 */
import type { DatasetReport } from '../../../core/index.js';
import { sig } from '../format.js';
import type { Answer } from './answer.js';
import { pct, withU } from './numbers.js';

export function weibayesAnswer(r: DatasetReport, units: string): Answer | null {
  const rec = r.life?.recorded?.report;
  const w = rec?.weibayes;
  if (!rec || !w || r.candidates.length > 0) return null;
  const u = units.trim();
  const b = w.bLives[0];
  const what = `${w.failures} failure${w.failures === 1 ? '' : 's'} in ${w.units} units`;
  const life = b && typeof b.lower === 'number' ? `B${sig(b.percent, 3)} life at least ${withU(sig(b.lower), u)}, the scale at least ${withU(sig(w.scaleLower), u)}` : `the Weibull scale at least ${withU(sig(w.scaleLower), u)}`;
  return {
    sentence: `With the Weibull shape ASSUMED at β = ${w.shape} (Weibayes, ${what}): ${life} (one-sided ${pct(w.confidence)} lower bounds; no model could be fitted to these data).`,
    cautions: [...new Set([w.statement, ...rec.cautions])],
    change: `The bound rests on the assumed shape: a smaller β gives a lower bound on the B-life further below the data; the data cannot check β.`,
    undermined: false,
  };
}
