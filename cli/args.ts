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
]);
const FLAG_OPTIONS = new Set(['--json', '--skip-invalid', '--decimal-comma', '--no-header', '--help', '-h']);

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
  return out;
}
