/**
 * Command-line arguments of `plumbline`: parsed by hand (no dependency), strictly: an unknown
 * option, a missing value or a malformed number is a usage error (exit code 2).
 */
import { InputError, parseStrictNumber, type FamilyName, type PMethod } from '../core/index.js';

export interface AnalyzeArgs {
  readonly command: 'analyze';
  readonly file: string;
  readonly column?: string;
  readonly json: boolean;
  readonly families?: FamilyName[];
  readonly bins?: number;
  readonly alpha?: number;
  readonly seed?: number;
  readonly pMethod?: PMethod;
  readonly replicates?: number;
  readonly skipInvalid: boolean;
  readonly decimalComma: boolean;
  readonly delimiter?: string;
  readonly noHeader: boolean;
  /** Trade workflows (issue 4); see docs/report-fields.md. */
  readonly censorColumn?: string;
  readonly bLife?: number[];
  readonly confidence?: number;
  readonly bounds?: 'likelihood-ratio' | 'fisher-matrix';
  readonly reliabilityAt?: number[];
  readonly returnPeriods?: number[];
  readonly designLife?: number;
  readonly plottingPosition?: 'weibull' | 'gringorten' | 'cunnane';
  readonly lsl?: number;
  readonly usl?: number;
  readonly target?: number;
  readonly subgroupColumn?: string;
  readonly orderColumn?: string;
  readonly trend: boolean;
  readonly grouped: boolean;
  readonly lowerColumn?: string;
  readonly upperColumn?: string;
  readonly countColumn?: string;
}

export type ParsedArgs = AnalyzeArgs | { readonly command: 'help' } | { readonly command: 'version' };

function usage(message: string, value?: string): InputError {
  return new InputError(`${message} (see plumbline --help)`, value === undefined ? {} : { value }, 'bad-option');
}

const VALUE_OPTIONS = new Set([
  '--column',
  '--families',
  '--bins',
  '--alpha',
  '--seed',
  '--p-method',
  '--replicates',
  '--delimiter',
  '--censor-column',
  '--b-life',
  '--confidence',
  '--bounds',
  '--reliability-at',
  '--return-periods',
  '--design-life',
  '--plotting-position',
  '--lsl',
  '--usl',
  '--target',
  '--subgroup-column',
  '--order-column',
  '--lower-column',
  '--upper-column',
  '--count-column',
]);
const FLAG_OPTIONS = new Set(['--json', '--skip-invalid', '--decimal-comma', '--no-header', '--help', '-h', '--grouped', '--trend']);

/** A finite number, or a usage error naming the option. */
function numberOption(option: string, text: string): number {
  const v = parseStrictNumber(text.trim());
  if (!Number.isFinite(v)) throw usage(`${option} needs a number, got ${JSON.stringify(text)}`, text);
  return v;
}

/** A comma-separated list of numbers, each checked by `ok`. */
function numberList(option: string, text: string, ok: (x: number) => boolean, rule: string, example: string): number[] {
  const parts = text.split(',').map((s) => s.trim());
  if (parts.length === 0 || parts.every((p) => p === '')) throw usage(`${option} needs a comma-separated list of numbers, e.g. ${example}`, text);
  const out: number[] = [];
  for (const p of parts) {
    if (p === '') throw usage(`${option} has an empty entry in ${JSON.stringify(text)}; e.g. ${example}`, text);
    const v = numberOption(option, p);
    if (!ok(v)) throw usage(`${option}: ${JSON.stringify(p)} is not ${rule}`, p);
    if (out.includes(v)) throw usage(`${option}: ${JSON.stringify(p)} is listed twice`, p);
    out.push(v);
  }
  return out;
}

function columnName(option: string, text: string): string {
  if (text.trim() === '') throw usage(`${option} needs a column name or a 1-based index`);
  return text;
}

function wholeNumber(option: string, text: string, min: number): number {
  const v = parseStrictNumber(text);
  if (!Number.isSafeInteger(v) || v < min) throw usage(`${option} needs a whole number of at least ${min}, got ${JSON.stringify(text)}`, text);
  return v;
}

function delimiterOf(text: string): string {
  const named: Record<string, string> = { tab: '\t', '\\t': '\t', comma: ',', semicolon: ';', pipe: '|', space: ' ' };
  const d = named[text.toLowerCase()] ?? text;
  if ([...d].length !== 1 || d === '"' || d === '\r' || d === '\n') {
    throw usage(`--delimiter needs one character (or tab, comma, semicolon), got ${JSON.stringify(text)}`, text);
  }
  return d;
}

export function parseArgs(argv: readonly string[]): ParsedArgs {
  if (argv.length === 0) return { command: 'help' };
  const first = argv[0] as string;
  if (first === '--help' || first === '-h' || first === 'help') return { command: 'help' };
  if (first === '--version' || first === '-V' || first === 'version') return { command: 'version' };
  if (first !== 'analyze') throw usage(`unknown command ${JSON.stringify(first)}; the command is "analyze"`, first);

  const values = new Map<string, string>();
  const flags = new Set<string>();
  const positional: string[] = [];
  for (let k = 1; k < argv.length; k++) {
    const a = argv[k] as string;
    if (a === '--') {
      positional.push(...argv.slice(k + 1));
      break;
    }
    if (a.startsWith('-') && a !== '-') {
      const eq = a.indexOf('=');
      const name = a.startsWith('--') && eq > 0 ? a.slice(0, eq) : a;
      if (VALUE_OPTIONS.has(name)) {
        let v: string | undefined;
        if (eq > 0 && a.startsWith('--')) v = a.slice(eq + 1);
        else {
          v = argv[k + 1];
          k++;
        }
        if (v === undefined) throw usage(`${name} needs a value`);
        if (values.has(name)) throw usage(`${name} is given twice`);
        values.set(name, v);
      } else if (FLAG_OPTIONS.has(name) && eq < 0) {
        flags.add(name);
      } else {
        throw usage(`unknown option ${JSON.stringify(a)}`, a);
      }
    } else {
      positional.push(a);
    }
  }
  if (flags.has('--help') || flags.has('-h')) return { command: 'help' };
  if (positional.length === 0) throw usage('analyze needs a CSV file (or - for standard input)');
  if (positional.length > 1) throw usage(`analyze takes one file, got ${positional.length}: ${positional.map((p) => JSON.stringify(p)).join(' ')}`);

  const out: {
    -readonly [K in keyof AnalyzeArgs]: AnalyzeArgs[K];
  } = {
    command: 'analyze',
    file: positional[0] as string,
    json: flags.has('--json'),
    skipInvalid: flags.has('--skip-invalid'),
    decimalComma: flags.has('--decimal-comma'),
    noHeader: flags.has('--no-header'),
    trend: flags.has('--trend'),
    grouped: flags.has('--grouped'),
  };
  const column = values.get('--column');
  if (column !== undefined) {
    if (column.trim() === '') throw usage('--column needs a column name or a 1-based index');
    out.column = column;
  }
  const families = values.get('--families');
  if (families !== undefined) {
    const list = families
      .split(',')
      .map((s) => s.trim().toLowerCase())
      .filter((s) => s !== '');
    if (list.length === 0) throw usage('--families needs a comma-separated list, e.g. weibull,lognormal');
    out.families = list as FamilyName[];
  }
  const bins = values.get('--bins');
  if (bins !== undefined) out.bins = wholeNumber('--bins', bins, 2);
  const alpha = values.get('--alpha');
  if (alpha !== undefined) {
    const a = parseStrictNumber(alpha);
    if (!(a > 0 && a < 1)) throw usage(`--alpha needs a number between 0 and 1, got ${JSON.stringify(alpha)}`, alpha);
    out.alpha = a;
  }
  const seed = values.get('--seed');
  if (seed !== undefined) out.seed = wholeNumber('--seed', seed, 0);
  const pMethod = values.get('--p-method');
  if (pMethod !== undefined) {
    if (pMethod !== 'table' && pMethod !== 'bootstrap') {
      throw usage(`--p-method is "table" or "bootstrap", got ${JSON.stringify(pMethod)}`, pMethod);
    }
    out.pMethod = pMethod;
  }
  const replicates = values.get('--replicates');
  if (replicates !== undefined) out.replicates = wholeNumber('--replicates', replicates, 1);
  const delimiter = values.get('--delimiter');
  if (delimiter !== undefined) out.delimiter = delimiterOf(delimiter);
  workflowArgs(values, out);
  return out;
}

/** The trade-workflow options (issue 4), each validated on its own, then their combinations. */
function workflowArgs(values: ReadonlyMap<string, string>, out: { -readonly [K in keyof AnalyzeArgs]: AnalyzeArgs[K] }): void {
  const text = (k: string): string | undefined => values.get(k);
  const censor = text('--censor-column');
  if (censor !== undefined) out.censorColumn = columnName('--censor-column', censor);
  const bLife = text('--b-life');
  if (bLife !== undefined) out.bLife = numberList('--b-life', bLife, (x) => x > 0 && x < 100, 'a percent strictly between 0 and 100', '1,10,50');
  const confidence = text('--confidence');
  if (confidence !== undefined) {
    const c = numberOption('--confidence', confidence);
    if (!(c > 0 && c < 1)) throw usage(`--confidence needs a level between 0 and 1 (exclusive), e.g. 0.90, got ${JSON.stringify(confidence)}`, confidence);
    out.confidence = c;
  }
  const bounds = text('--bounds');
  if (bounds !== undefined) {
    const b = bounds.trim().toLowerCase();
    if (b === 'lr') out.bounds = 'likelihood-ratio';
    else if (b === 'fisher') out.bounds = 'fisher-matrix';
    else throw usage(`--bounds is "lr" (likelihood ratio) or "fisher" (Fisher matrix), got ${JSON.stringify(bounds)}`, bounds);
  }
  const relAt = text('--reliability-at');
  if (relAt !== undefined) out.reliabilityAt = numberList('--reliability-at', relAt, (x) => x > 0, 'a time > 0', '500,1000');
  const periods = text('--return-periods');
  if (periods !== undefined) out.returnPeriods = numberList('--return-periods', periods, (x) => x > 1, 'a return period in years greater than 1', '2,10,100');
  const designLife = text('--design-life');
  if (designLife !== undefined) {
    const d = numberOption('--design-life', designLife);
    if (!(d > 0)) throw usage(`--design-life needs a number of years > 0, got ${JSON.stringify(designLife)}`, designLife);
    out.designLife = d;
  }
  const pp = text('--plotting-position');
  if (pp !== undefined) {
    const v = pp.trim().toLowerCase();
    if (v !== 'weibull' && v !== 'gringorten' && v !== 'cunnane') throw usage(`--plotting-position is weibull, gringorten or cunnane, got ${JSON.stringify(pp)}`, pp);
    out.plottingPosition = v;
  }
  const lsl = text('--lsl');
  if (lsl !== undefined) out.lsl = numberOption('--lsl', lsl);
  const usl = text('--usl');
  if (usl !== undefined) out.usl = numberOption('--usl', usl);
  const target = text('--target');
  if (target !== undefined) out.target = numberOption('--target', target);
  const sub = text('--subgroup-column');
  if (sub !== undefined) out.subgroupColumn = columnName('--subgroup-column', sub);
  const order = text('--order-column');
  if (order !== undefined) out.orderColumn = columnName('--order-column', order);
  for (const k of ['--lower-column', '--upper-column', '--count-column'] as const) {
    const v = text(k);
    if (v === undefined) continue;
    const name = columnName(k, v);
    if (k === '--lower-column') out.lowerColumn = name;
    else if (k === '--upper-column') out.upperColumn = name;
    else out.countColumn = name;
  }

  // Combinations.
  const needs = (present: boolean, option: string, requirement: string): void => {
    if (present) throw usage(`${option} ${requirement}`);
  };
  const life = out.censorColumn !== undefined;
  needs(!life && out.bLife !== undefined, '--b-life', 'needs --censor-column (life data with a status column)');
  needs(!life && out.reliabilityAt !== undefined, '--reliability-at', 'needs --censor-column (life data with a status column)');
  needs(!life && out.bounds !== undefined, '--bounds', 'needs --censor-column (life data with a status column)');
  needs(out.designLife !== undefined && out.returnPeriods === undefined, '--design-life', 'needs --return-periods');
  needs(out.plottingPosition !== undefined && out.returnPeriods === undefined, '--plotting-position', 'needs --return-periods');
  const spec = out.lsl !== undefined || out.usl !== undefined;
  needs(out.target !== undefined && !spec, '--target', 'needs --lsl and/or --usl');
  needs(out.subgroupColumn !== undefined && !spec, '--subgroup-column', 'needs --lsl and/or --usl (it gives the within-subgroup sigma for Cp and Cpk)');
  if (out.lsl !== undefined && out.usl !== undefined && !(out.lsl < out.usl)) throw usage(`--lsl (${out.lsl}) must be below --usl (${out.usl})`);
  needs(out.orderColumn !== undefined && out.trend, '--trend', 'uses the row order; with --order-column the order comes from that column (give one of them)');
  needs(life && (out.returnPeriods !== undefined || spec || out.orderColumn !== undefined || out.trend || out.subgroupColumn !== undefined),
    '--censor-column', 'cannot be combined with --return-periods, --lsl/--usl, --subgroup-column, --order-column or --trend (they need a complete sample)');
  const groupedCols = out.lowerColumn !== undefined || out.upperColumn !== undefined || out.countColumn !== undefined;
  needs(groupedCols && !out.grouped, '--lower-column/--upper-column/--count-column', 'need --grouped');
  if (out.grouped) {
    needs(out.column !== undefined, '--grouped', 'reads the columns lower, upper, count (or --lower-column, --upper-column, --count-column), not --column');
    needs(life || out.returnPeriods !== undefined || out.subgroupColumn !== undefined || out.orderColumn !== undefined || out.trend,
      '--grouped', 'cannot be combined with --censor-column, --return-periods, --subgroup-column, --order-column or --trend (grouped counts have no individual values)');
  }
}
