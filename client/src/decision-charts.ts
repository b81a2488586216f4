/** Draws the decision area's chart slots from the report (page and exported report alike). */
import type { DatasetReport, Evidence } from '../../core/index.js';
import { capabilityHistogramChart } from '../charts/capability-histogram.js';
import { controlChart } from '../charts/control-chart.js';
import { hazardChart } from '../charts/hazard.js';
import { lifeProbabilityChart, type LifeScale } from '../charts/life-probability.js';
import { lmomentDiagramChart } from '../charts/lmoment-diagram.js';
import { modesReliabilityChart } from '../charts/modes-reliability.js';
import type { ChartOptions } from '../charts/options.js';
import { returnPeriodChart } from '../charts/return-period.js';
import { thresholdMeanExcessChart } from '../charts/threshold-mean-excess.js';
import { thresholdStabilityChart } from '../charts/threshold-stability.js';
import { turnbullChart } from '../charts/turnbull.js';
import { capital, type ChartSlot } from './decision.js';

export interface SlotContext {
  readonly report: DatasetReport & { readonly evidence?: Evidence };
  readonly selected: string;
  readonly lifeScale: LifeScale;
}

/** Draw one slot into `box`; null when the report lacks what it needs. */
export function drawSlot(slot: ChartSlot, box: Element, ctx: SlotContext, options: ChartOptions): SVGSVGElement | null {
  const r = ctx.report;
  const labels = Object.fromEntries(r.candidates.map((c) => [c.family, capital(c.label)]));
  const selected = r.candidates.some((c) => c.family === ctx.selected) ? ctx.selected : (r.candidates[0]?.family ?? '');
  switch (slot) {
    case 'life-probability':
      return r.life ? lifeProbabilityChart(box, { plot: r.life.plot, curves: r.life.curves, labels, scale: ctx.lifeScale, selected, suspensions: r.life.suspensions }, options) : null;
    case 'hazard':
      return r.life ? hazardChart(box, { curves: r.life.curves, labels, selected }, options) : null;
    case 'return-period':
      return r.flood ? returnPeriodChart(box, { flood: r.flood, candidates: r.candidates.map((c) => ({ ...c, label: capital(c.label) })), selected }, options) : null;
    case 'control-chart':
      return r.capability?.stability ? controlChart(box, r.capability.stability, options) : null;
    case 'range-chart':
      return r.capability?.rangeChart ? controlChart(box, r.capability.rangeChart, options) : null;
    case 'turnbull': {
      const rec = r.life?.recorded?.report;
      if (!rec) return null;
      const c = rec.candidates.find((x) => x.family === selected) ?? rec.candidates[0];
      return turnbullChart(box, { turnbull: rec.turnbull, fitted: c ? { family: c.family, label: capital(c.label), time: c.curves.time, cdf: c.curves.cdf } : null }, options);
    }
    case 'ema-return-period': {
      // Log-Pearson III by expected moments on the return-period plot of the flood section's points, with its intervals.
      const f = r.flood;
      const ema = f?.estimators?.ema;
      if (!f || !ema || !ema.applicable) return null;
      const rows = ema.returnLevels.map((l) => ({ ...l, exceedanceProbability: 1 / l.period, confidence: ema.confidence, beyondRecord: l.period > 2 * f.recordLength }));
      return returnPeriodChart(box, { flood: f, candidates: [{ family: 'logpearson3', label: 'Log-Pearson III (expected moments)', returnLevels: rows }], selected: 'logpearson3' }, options);
    }
    case 'lmoment-diagram': {
      const lm = r.flood?.estimators?.lmoments;
      return lm && lm.applicable ? lmomentDiagramChart(box, lm.diagram, options) : null;
    }
    case 'threshold-mean-excess':
      // Peaks over a threshold: the diagnostics users choose the threshold from (core/workflow/flood-pot.ts).
      return r.pot && r.pot.diagnostics.length > 0 ? thresholdMeanExcessChart(box, { diagnostics: r.pot.diagnostics, chosen: r.pot.threshold }, options) : null;
    case 'threshold-stability':
      return r.pot && r.pot.diagnostics.some((d) => d.shape !== null) ? thresholdStabilityChart(box, { diagnostics: r.pot.diagnostics, chosen: r.pot.threshold }, options) : null;
    case 'modes-reliability':
      // Several failure modes: each mode's reliability and the whole unit's (core/life analyzeModes system.curve).
      return r.life?.modes ? modesReliabilityChart(box, { modes: r.life.modes }, options) : null;
    case 'capability-histogram': {
      const ev = r.evidence;
      const ce = ev?.candidates.find((c) => c.family === selected);
      if (!r.capability || !ev || !ce) return null;
      const ppm = r.candidates.find((c) => c.family === selected)?.ppmOutOfSpec ?? null;
      return capabilityHistogramChart(box, { histogram: ce.histogram, densities: { ...ev.densities, curves: ev.densities.curves.map((c) => ({ ...c, label: capital(c.label) })) }, lsl: r.capability.lsl, usl: r.capability.usl, target: r.capability.target, dataMin: ev.min, dataMax: ev.max, selected, ppm }, options);
    }
  }
}
