/**
 * The many-series page's settings as the core's analysis options, each field judged by the option
 * table's own rule (core parseFormOption, as the API judges it): the decision number to compare
 * (a return level, a B-life or the ppm outside the limits) and nothing else. Pure.
 */
import { optionNamed, parseFormOption, type DatasetOptions, type OptionValue } from '../../../core/index.js';

export type Decision = 'none' | 'return' | 'blife' | 'ppm';

export interface BatchSettings {
  readonly decision: Decision;
  readonly period: string;
  readonly percent: string;
  readonly lsl: string;
  readonly usl: string;
  readonly withStatus: boolean;
}

export type SettingsCheck = { readonly ok: true; readonly options: DatasetOptions } | { readonly ok: false; readonly message: string };

function field(name: string, text: string): { ok: true; value: OptionValue } | { ok: false; message: string } {
  const spec = optionNamed(name);
  if (!spec) return { ok: false, message: `no option ${name}` };
  const r = parseFormOption(spec, text);
  return r.ok ? { ok: true, value: r.value } : { ok: false, message: r.message };
}

export function optionsFrom(s: BatchSettings): SettingsCheck {
  switch (s.decision) {
    case 'none':
      return { ok: true, options: {} };
    case 'return': {
      const p = field('returnPeriods', s.period);
      return p.ok ? { ok: true, options: { returnPeriods: p.value as number[] } } : { ok: false, message: p.message };
    }
    case 'blife': {
      if (!s.withStatus) return { ok: false, message: 'A B-life needs the status column (1 failed, 0 still running).' };
      const p = field('bLifePercents', s.percent);
      return p.ok ? { ok: true, options: { bLifePercents: p.value as number[] } } : { ok: false, message: p.message };
    }
    case 'ppm': {
      const out: { lsl?: number; usl?: number } = {};
      if (s.lsl.trim() !== '') {
        const r = field('lsl', s.lsl);
        if (!r.ok) return { ok: false, message: r.message };
        out.lsl = r.value as number;
      }
      if (s.usl.trim() !== '') {
        const r = field('usl', s.usl);
        if (!r.ok) return { ok: false, message: r.message };
        out.usl = r.value as number;
      }
      if (out.lsl === undefined && out.usl === undefined) return { ok: false, message: 'Give a lower or an upper specification limit (or both).' };
      if (out.lsl !== undefined && out.usl !== undefined && !(out.lsl < out.usl)) return { ok: false, message: `The lower limit (${out.lsl}) must be below the upper limit (${out.usl}).` };
      return { ok: true, options: out };
    }
  }
}

/** The values of one series as the CSV text the main page reads (for "open in the full view"). */
export function seriesCsv(values: ArrayLike<number>, status: ArrayLike<number> | null): string {
  const lines = [status ? 'time,status' : 'value'];
  for (let i = 0; i < values.length; i++) lines.push(status ? `${values[i]},${status[i]}` : String(values[i]));
  return `${lines.join('\n')}\n`;
}
