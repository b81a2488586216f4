/**
 * Colours and line patterns for the candidate models.
 *
 * Hues from the Okabe–Ito colour-blind-safe set (M. Okabe and K. Ito, "Color Universal Design
 * (CUD): how to make figures and presentations that are friendly to colorblind people", 2008,
 * https://jfly.uni-koeln.de/color/), in an order of our own; yellow is left out because it is too
 * pale on white. Each family also has its own dash pattern, so the curves stay distinguishable in
 * grey print and for readers who cannot separate two of the hues.
 */
export interface SeriesStyle {
  readonly colour: string;
  /** SVG stroke-dasharray; '' for a solid line. */
  readonly dash: string;
  /** Short name of the pattern, for the legend's text alternative. */
  readonly pattern: string;
}

const BY_FAMILY: Readonly<Record<string, SeriesStyle>> = {
  normal: { colour: '#0072B2', dash: '', pattern: 'solid' },
  lognormal: { colour: '#D55E00', dash: '7 3', pattern: 'long dashes' },
  gamma: { colour: '#009E73', dash: '2 2', pattern: 'dots' },
  weibull: { colour: '#CC79A7', dash: '9 3 2 3', pattern: 'dash-dot' },
  exponential: { colour: '#E69F00', dash: '4 4', pattern: 'short dashes' },
  gumbel: { colour: '#56B4E9', dash: '12 4', pattern: 'very long dashes' },
  gev: { colour: '#000000', dash: '', pattern: 'solid black' },
  weibull3: { colour: '#882255', dash: '6 2 1 2', pattern: 'dash-dot-dot' },
  lognormal3: { colour: '#7a4b00', dash: '3 5', pattern: 'sparse dashes' },
};

const SPARE: readonly SeriesStyle[] = [
  { colour: '#56B4E9', dash: '12 4', pattern: 'very long dashes' },
  { colour: '#000000', dash: '1 3', pattern: 'fine dots' },
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
  /** Out-of-tolerance region and its edge, and the text written in it. */
  outside: '#f1d9a6',
  outsideEdge: '#9a6700',
  outsideText: '#5c3d00',
} as const;

export function styleFor(family: string, index = 0): SeriesStyle {
  return BY_FAMILY[family] ?? SPARE[index % SPARE.length] ?? SPARE[0]!;
}

export const FONT = 'system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif';
