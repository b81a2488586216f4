/**
 * The answer at the top of the page when the data carry a failure-mode column (report
 * `life.modes`): the whole unit's first B-life asked for, with each mode's B-life under its own
 * model and bounds, and the mode that limits life; never a number of the candidates fitted to all
 * failures alike (those mix the modes). Its cautions are the modes' own (few failures in a mode,
 * independence, point estimate for the whole unit) and the deferral to maintenance and safety practice.
 */
import type { DatasetReport } from '../../../core/index.js';
import { sig } from '../format.js';
import type { Answer } from './answer.js';
import { bName, firstToReach, modeBLifeWords, unitBLifeWords } from './modes.js';

export function modesAnswer(r: DatasetReport, units: string): Answer | null {
  const m = r.life?.modes;
  if (!m) return null;
  const u = units.trim();
  const sb = m.system?.bLives[0];
  if (!sb) {
    return {
      sentence: `No life for the whole unit: a failure mode could not be fitted (${m.modes.filter((x) => x.family === null).map((x) => x.mode).join(', ')}); see “Failure modes”.`,
      cautions: [...m.cautions],
      change: '',
      undermined: true,
    };
  }
  const first = firstToReach(m, 0);
  const sentence = `${bName(sb.percent)} life of the whole unit, the ${m.modes.length} failure modes together: ${unitBLifeWords(sb, r.life!.confidence, u)}, from ${m.modes.map((x) => modeBLifeWords(x, 0, u)).join('; ')}.${first ? ` The ${first.first.mode} mode limits life at ${sig(sb.percent, 3)} % failed.` : ''}`;
  return {
    sentence,
    cautions: [
      ...m.cautions,
      'The models ranked for all failures together mix the modes; the numbers above come from each mode’s own fit (see “Failure modes”).',
    ],
    change: '',
    undermined: false,
  };
}
