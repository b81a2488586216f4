/**
 * Colours and line patterns for the candidate models: Plumbline's own set of muted, ink-like
 * hues (deep blue, burnt orange, green, plum, ochre, steel, near-black, claret, umber, slate),
 * each with at least 3:1 contrast against the chart paper (WCAG 2.1 success criterion 1.4.11,
 * non-text contrast; checked in test/client/charts-palette.test.ts) and each with its own dash
 * pattern, so the curves stay distinguishable in grey print and for readers who cannot separate
 * two of the hues.
 */
export interface SeriesStyle {
  readonly colour: string;
  /** SVG stroke-dasharray; '' for a solid line. */
  readonly dash: string;
  /** Short name of the pattern, for the legend's text alternative. */
  readonly pattern: string;
}

export const BY_FAMILY: Readonly<Record<string, SeriesStyle>> = {
  normal: { colour: '#1d5f8a', dash: '', pattern: 'solid' },
  lognormal: { colour: '#b4532a', dash: '7 3', pattern: 'long dashes' },
  gamma: { colour: '#2f7a4c', dash: '2 2', pattern: 'dots' },
  weibull: { colour: '#8b3a86', dash: '9 3 2 3', pattern: 'dash-dot' },
  exponential: { colour: '#8a6d00', dash: '4 4', pattern: 'short dashes' },
  gumbel: { colour: '#2f7fa0', dash: '12 4', pattern: 'very long dashes' },
  gev: { colour: '#2b2b2b', dash: '', pattern: 'solid near-black' },
  weibull3: { colour: '#a3324f', dash: '6 2 1 2', pattern: 'dash-dot-dot' },
  lognormal3: { colour: '#6b5a2e', dash: '3 5', pattern: 'sparse dashes' },
  pearson3: { colour: '#4a6b8a', dash: '10 2 2 2 2 2', pattern: 'dash-dot-dot-dot' },
  logpearson3: { colour: '#555555', dash: '1 3', pattern: 'fine dots' },
  genpareto: { colour: '#6a4c93', dash: '5 2', pattern: 'medium dashes' },
  genlogistic: { colour: '#3d7a6e', dash: '1 2', pattern: 'close dots' },
};

export const SPARE: readonly SeriesStyle[] = [
  { colour: '#4a6b8a', dash: '14 3 3 3', pattern: 'long dash-dot' },
  { colour: '#555555', dash: '5 2 5 6', pattern: 'paired dashes' },
];

/**
 * Neutral colours for the data themselves (bars, points, steps), the chart paper and text. Our
 * own scheme: a faintly warm paper, slate-blue data bars, and out-of-tolerance regions in a
 * hatched sand tone rather than limit lines; text contrast ≥ 4.5:1 on the paper (WCAG 2.1, 1.4.3).
 */
export const INK = {
  paper: '#fdfcf8',
  text: '#1b1b1b',
  muted: '#575757',
  grid: '#e6e3da',
  axis: '#4a4a4a',
  barFill: '#cdd6e0',
  barStroke: '#5d6f82',
  data: '#1f2a36',
  /** Suspensions (units still running): open marks in a slate tone. */
  suspension: '#3d5a80',
  /** The minimum-expected-count reference line. */
  reference: '#7a3b00',
  /** Stability charts: a point completing a run rule (a deep teal diamond, apart from the brown ring
   *  of a point beyond a limit), and the faint 1- and 2-sigma zone lines the rules count in. */
  signal: '#0b6e69',
  zone: '#8c8c8c',
  /** Out-of-tolerance region and its edge, and the text written in it. */
  outside: '#f1d9a6',
  outsideEdge: '#9a6700',
  outsideText: '#5c3d00',
} as const;

export function styleFor(family: string, index = 0): SeriesStyle {
  return BY_FAMILY[family] ?? SPARE[index % SPARE.length] ?? SPARE[0]!;
}

export const FONT = 'system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif';
