/**
 * A suggestion for "what was measured" and its units, read from a column name such as
 * `peak_flow_m3s`, `diameter_mm`, `wear [µm]` or `hours`. Only a suggestion: the page fills
 * the fields while the user has not typed in them, and says where the text came from.
 */
const UNIT_WORDS: Readonly<Record<string, { units: string; time?: boolean }>> = {
  mm: { units: 'mm' },
  um: { units: 'µm' },
  'µm': { units: 'µm' },
  micron: { units: 'µm' },
  microns: { units: 'µm' },
  cm: { units: 'cm' },
  m: { units: 'm' },
  km: { units: 'km' },
  in: { units: 'in' },
  inch: { units: 'in' },
  h: { units: 'h', time: true },
  hr: { units: 'h', time: true },
  hrs: { units: 'h', time: true },
  hours: { units: 'h', time: true },
  min: { units: 'min', time: true },
  minutes: { units: 'min', time: true },
  s: { units: 's', time: true },
  sec: { units: 's', time: true },
  seconds: { units: 's', time: true },
  d: { units: 'd', time: true },
  days: { units: 'd', time: true },
  day: { units: 'd', time: true },
  weeks: { units: 'weeks', time: true },
  week: { units: 'weeks', time: true },
  months: { units: 'months', time: true },
  month: { units: 'months', time: true },
  years: { units: 'years', time: true },
  yrs: { units: 'years', time: true },
  cycles: { units: 'cycles', time: true },
  kcycles: { units: 'thousand cycles', time: true },
  m3s: { units: 'm³/s' },
  'm3/s': { units: 'm³/s' },
  cms: { units: 'm³/s' },
  cfs: { units: 'ft³/s' },
  mpa: { units: 'MPa' },
  kpa: { units: 'kPa' },
  kn: { units: 'kN' },
  kg: { units: 'kg' },
  degc: { units: '°C' },
  pct: { units: '%' },
  percent: { units: '%' },
};

export interface QuantityGuess {
  readonly quantity: string;
  readonly units: string;
}

export function guessFromColumn(name: string): QuantityGuess {
  const trimmed = name.trim();
  if (/^#\d+$/.test(trimmed) || trimmed === '') return { quantity: '', units: '' };
  // "wear [µm]" or "wear (um)"
  const bracket = /^(.*?)[\s_]*[[(]([^\])]+)[\])]\s*$/.exec(trimmed);
  if (bracket) {
    const u = bracket[2]!.trim();
    return { quantity: tidy(bracket[1]!), units: UNIT_WORDS[u.toLowerCase()]?.units ?? u };
  }
  const tokens = trimmed.split(/[\s_]+/).filter(Boolean);
  const last = tokens[tokens.length - 1]?.toLowerCase() ?? '';
  const unit = UNIT_WORDS[last];
  if (unit && tokens.length > 1) return { quantity: tidy(tokens.slice(0, -1).join(' ')), units: unit.units };
  if (unit && tokens.length === 1) return { quantity: unit.time ? 'Time' : '', units: unit.units };
  return { quantity: tidy(trimmed), units: '' };
}

function tidy(text: string): string {
  const t = text.replace(/[_]+/g, ' ').replace(/\s+/g, ' ').trim();
  return t ? t[0]!.toUpperCase() + t.slice(1) : '';
}
