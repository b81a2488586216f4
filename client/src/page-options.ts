/**
 * Which options of the core's table (core/options) the page's form shows, where, and in what
 * words. Pure: no DOM. form.ts builds the controls from this list, settings.ts takes the defaults
 * from it and request.ts sends what applies; nothing else names the page's settings.
 *
 * Every option the JSON API accepts appears on the page, except the reading of the file (the data
 * card's own controls: column, decimal mark, header, ...) and the plot-data settings the page sets
 * itself. A new option in the table therefore appears on the page with no hand-written HTML: in its
 * group's place, labelled from its name and unit, with its one line of help beneath it. The words
 * below only improve what the page shows for options it knows (a label with the symbol the report
 * uses, the words of a choice, an element id the browser tests use).
 */
import { OPTION_TABLE, onSurface, type OptionSpec } from '../../core/index.js';

/** How a file's rows are read (client/src/state.ts Shape): one value per row, class counts, or inspection intervals. */
export type DataShape = 'values' | 'grouped' | 'interval';

export type ControlKind = 'number' | 'text' | 'select' | 'radio' | 'checkbox' | 'families' | 'role';

/** Where a field is placed: the "How to judge" card, the "What you decide" card, or the data card's column roles. */
export type Place = 'judge' | 'decide' | 'roles';

export interface PageField {
  readonly spec: OptionSpec;
  /** The option's name: the settings key and the request field. */
  readonly name: string;
  /** The element id of its control (of its box, for the families). */
  readonly id: string;
  readonly control: ControlKind;
  readonly label: string;
  readonly place: Place;
  /** The fieldset it sits in (its table group), for 'decide'. */
  readonly group: OptionSpec['group'];
  /** A line shown under the control (the page's words, else the table's help). '' for none. */
  readonly hint: string;
  /** The words shown for each choice. */
  readonly choiceWords: Readonly<Record<string, string>>;
  readonly placeholder: string;
  /** Folded under "More settings" in its fieldset. */
  readonly secondary: boolean;
  /** Drawn inside the fieldset of this option (replicates inside the p-value method). */
  readonly within?: string;
  /** Column roles: the data shapes the role applies to (one value per row; interval rows). */
  readonly shapes: readonly DataShape[];
  /** The radio group name. */
  readonly radioName?: string;
}

interface Words {
  readonly label?: string;
  readonly id?: string;
  readonly hint?: string;
  readonly choices?: Readonly<Record<string, string>>;
  readonly placeholder?: string;
  readonly place?: Place;
  readonly secondary?: boolean;
  readonly within?: string;
  readonly radio?: string;
  /** Column roles: the data shapes the role applies to (default: one value per row only). */
  readonly shapes?: readonly DataShape[];
}

/** The page's words for the options it knows. An option not listed here is still shown (see the file comment). */
const WORDS: Readonly<Record<string, Words>> = {
  families: { label: 'Models to try', id: 'family-boxes', hint: 'Gumbel and GEV are for annual maxima (ticked when you give return periods); the threshold models (A² p-value by bootstrap) for lives with a failure-free period.' },
  alpha: { label: 'Significance level α', hint: 'A model is rejected when a test’s p-value falls below α.' },
  bins: { label: 'Chi-square bins k', placeholder: 'automatic', hint: 'Bins have equal probability under each model, so each expects n/k values. The chi-square approximation needs at least 5 expected per bin: k can be at most n/5.' },
  pMethod: { label: 'Anderson–Darling p-value', radio: 'pmethod', hint: '', choices: { table: 'Published formula for the family (fast)', bootstrap: 'Parametric bootstrap (refits every replicate; slower)' } },
  replicates: { label: 'Replicates B', within: 'pMethod', hint: '' },
  seed: { label: 'Random seed', placeholder: 'report default', hint: 'The same data, settings and seed always give the same result.' },
  estimation: { label: 'Parameter estimates', secondary: true, choices: { ml: 'maximum likelihood', 'rank-regression': 'rank regression (life data)', lmoments: 'L-moments (flood levels)', ema: 'expected moments (flood levels)' } },
  confidence: { label: 'Confidence, two-sided', place: 'decide', hint: '' },
  statusColumn: { label: 'Failed / still-running column', id: 'status-select', placeholder: 'none (every value is an observed value)' },
  subgroupColumn: { label: 'Subgroup column', id: 'subgroup-select' },
  orderColumn: { label: 'Time order / year column', id: 'order-select' },
  bLifePercents: { label: 'B-lives, % failed', id: 'blife-input', hint: '' },
  reliabilityTimes: { label: 'Reliability at time', id: 'reltime-input', placeholder: 'none', hint: '' },
  boundMethod: { label: 'Bounds', id: 'bounds-select', hint: '', choices: { 'likelihood-ratio': 'likelihood ratio', 'fisher-matrix': 'Fisher matrix' } },
  lifePlotPositions: { label: 'Failures on the plot at', secondary: true, choices: { 'johnson-benard': 'adjusted ranks (Johnson, Benard)', 'kaplan-meier': 'Kaplan–Meier' } },
  assumedShape: { label: 'Weibull shape known from experience', placeholder: 'none', secondary: true },
  planReliability: { label: 'Test plan: reliability R to show', placeholder: 'none', secondary: true },
  planTime: { label: 'Test plan: at time t', placeholder: 'none', secondary: true },
  planConfidence: { label: 'Test plan: confidence C', secondary: true },
  planFailures: { label: 'Test plan: failures allowed', secondary: true },
  returnPeriods: { label: 'Return periods, years', id: 'periods-input', placeholder: 'e.g. 10, 100', hint: '' },
  designLife: { label: 'Design life, years', id: 'designlife-input', placeholder: 'none', hint: '' },
  plottingPosition: { label: 'Plotting positions', id: 'plotpos-select', hint: '', choices: { weibull: 'Weibull i/(n+1)', gringorten: 'Gringorten', cunnane: 'Cunnane' } },
  lsl: { label: 'Lower limit LSL', placeholder: 'none', hint: '' },
  usl: { label: 'Upper limit USL', placeholder: 'none', hint: '' },
  target: { label: 'Target', placeholder: 'none', hint: '' },
  transform: { label: 'Transform to normal', hint: 'For a skewed characteristic: the indices on a scale where it is normal, Box–Cox (λ by maximum likelihood) or Johnson (Slifker–Shapiro percentile fit).', choices: { none: 'none', boxcox: 'Box–Cox (λ by maximum likelihood)', johnson: 'Johnson (percentile fit)' } },
  naturalLowerBound: { label: 'Natural lower bound', placeholder: 'none' },
  withinMethod: { label: 'Within-subgroup σ', secondary: true, choices: { pooled: 'pooled s / c4', range: 'mean range / d2' } },
  capabilityReplicates: { label: 'Replicates for percentile Pp, Ppk', secondary: true },
  trend: { label: 'Check the file order for a drift' },
  // Settings of the expected-moments (log-Pearson III) and peaks-over-threshold methods: folded, since they apply only with those methods.
  regionalSkew: { label: 'Regional skew (log10 peaks)', placeholder: 'none', secondary: true },
  regionalSkewMse: { label: 'Mean square error of the regional skew', placeholder: 'none', secondary: true },
  perceptionThreshold: { label: 'Perception threshold', placeholder: 'none', secondary: true },
  historicalStart: { label: 'Historical period starts (year)', placeholder: 'none', secondary: true },
  threshold: { label: 'Peaks over a threshold of', placeholder: 'none', secondary: true },
  minSeparation: { label: 'Days between independent peaks', secondary: true },
  dateColumn: { label: 'Date column (peaks over a threshold)', id: 'date-select', placeholder: 'none' },
  inspectionTimesColumn: { label: 'Inspection-times column', id: 'inspection-times-select', placeholder: 'none (rebuilt from the rows)', shapes: ['interval'], hint: 'With interval rows: each unit’s inspection times separated by ; (e.g. 20; 45; 70), every inspection it was due up to the end of its follow-up, also those after it was found failed; empty for an exact time. The fit test then re-inspects each unit at exactly these times.' },
  modeColumn: { label: 'Failure-mode column', id: 'mode-select', placeholder: 'none (one failure mode)', shapes: ['values', 'interval'], hint: 'With the failed / still-running column, or with interval rows: the mode of each failed unit (e.g. leak, crack; blank for a unit still running). Each mode is fitted on its own and the whole unit’s life is the earlier of its modes.' },
};

/** The data card reads the file itself; the page sets the plot-data settings; many series have their own page. */
const NOT_ON_FORM = new Set<OptionSpec['group']>(['input', 'output', 'batch']);

/** 'reliabilityTimes' → 'reliability-times'. */
const kebab = (name: string): string => name.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`);

/** The table's help as a sentence on the page: a capital first letter and a full stop. */
function sentence(help: string): string {
  const t = help.trim();
  return t === '' ? '' : `${t[0]!.toUpperCase()}${t.slice(1)}${/[.!?]$/.test(t) ? '' : '.'}`;
}

/** A label from the option's name and unit, for an option the page has no words for: 'planTime' → 'Plan time (hours)'. */
function nameLabel(spec: OptionSpec): string {
  const words = kebab(spec.name).replace(/-/g, ' ');
  return `${words[0]!.toUpperCase()}${words.slice(1)}${spec.unit ? ` (${spec.unit})` : ''}`;
}

function controlOf(spec: OptionSpec, w: Words): ControlKind {
  if (spec.name === 'families') return 'families';
  switch (spec.kind) {
    case 'number':
    case 'integer':
      return 'number';
    case 'boolean':
      return 'checkbox';
    case 'choice':
      return w.radio ? 'radio' : 'select';
    case 'column':
      return 'role';
    default:
      return 'text';
  }
}

function fieldOf(spec: OptionSpec): PageField {
  const w = WORDS[spec.name] ?? {};
  const control = controlOf(spec, w);
  const place: Place = w.place ?? (control === 'role' ? 'roles' : spec.group === 'fitting' || spec.group === 'tests' ? 'judge' : 'decide');
  const choiceWords = Object.fromEntries((spec.choices ?? []).map((c) => [c, w.choices?.[c] ?? c.replace(/-/g, ' ')]));
  return {
    spec,
    name: spec.name,
    id: w.id ?? `${kebab(spec.name)}-${control === 'select' || control === 'role' ? 'select' : 'input'}`,
    control,
    label: w.label ?? nameLabel(spec),
    place,
    group: spec.group,
    hint: w.hint ?? sentence(spec.help),
    choiceWords,
    placeholder: w.placeholder ?? (control === 'number' || control === 'text' ? (spec.default === null ? 'none' : '') : ''),
    secondary: w.secondary ?? false,
    shapes: w.shapes ?? (control === 'role' ? ['values'] : []),
    ...(w.within ? { within: w.within } : {}),
    ...(w.radio ? { radioName: w.radio } : {}),
  };
}

/** Whether the page's form shows an option: it reaches the API, and it is not a reading or plot-data setting. */
export function onForm(spec: OptionSpec): boolean {
  return onSurface(spec, 'api') && spec.jsonParent === undefined && !NOT_ON_FORM.has(spec.group);
}

/** Every field of the page's form, in table order. */
export const PAGE_FIELDS: readonly PageField[] = OPTION_TABLE.filter(onForm).map(fieldOf);

const BY_NAME = new Map(PAGE_FIELDS.map((f) => [f.name, f]));

/** The field of an option, or undefined when the form does not show it. */
export function pageField(name: string): PageField | undefined {
  return BY_NAME.get(name);
}

/** The column-role options (status, subgroups, order): a column of this source, by its 1-based index. */
export const ROLE_FIELDS: readonly PageField[] = PAGE_FIELDS.filter((f) => f.control === 'role');

/**
 * Whether a column role applies to data read in this shape: every role to one value per row; to
 * interval rows only the failure-mode and inspection-times columns (the API takes them with intervalColumns, core
 * options/combinations.ts); none to class counts.
 */
export function roleApplies(f: PageField, shape: DataShape): boolean {
  return f.shapes.includes(shape);
}

/** The fieldsets of the "What you decide" card, by table group, with their legends. */
export const DECIDE_LEGENDS: Readonly<Partial<Record<OptionSpec['group'], string>>> = {
  life: 'Life of units (with a failed / still-running column)',
  flood: 'Flood levels (annual maxima)',
  capability: 'Tolerance (process capability)',
  trend: 'Drift (in time order)',
};
