/**
 * Command-line arguments of `plumbline`, parsed strictly from the option table (core/options): an
 * unknown option, a missing value, a value its option's rule refuses, an option given twice or a
 * combination the table's rules forbid is a usage error (exit code 2). Nothing here lists options
 * or their limits.
 */
import {
  InputError,
  checkCombinations,
  isCliFlag,
  optionsOn,
  parseCliOption,
  type CsvOptions,
  type OptionSpec,
  type OptionValue,
} from '../core/index.js';

export interface AnalyzeArgs {
  readonly command: 'analyze';
  readonly file: string;
  /** Every option given on the command line, parsed, by its table name. */
  readonly options: ReadonlyMap<string, OptionValue>;
}

/** `plumbline merge [--json|--csv] FILE...`: join batch outputs (JSON Lines) into one summary. */
export interface MergeArgs {
  readonly command: 'merge';
  readonly files: readonly string[];
  readonly format: 'text' | 'csv' | 'json';
}

/** `plumbline plan --plan-reliability R --plan-time T --assumed-shape B ...`: the test-planning calculator, no data file. */
export interface PlanArgs {
  readonly command: 'plan';
  readonly options: ReadonlyMap<string, OptionValue>;
}

export type ParsedArgs = AnalyzeArgs | MergeArgs | PlanArgs | { readonly command: 'help' } | { readonly command: 'version' };

function usage(message: string, value?: string): InputError {
  return new InputError(`${message} (see plumbline --help)`, value === undefined ? {} : { value }, 'bad-option');
}

const BY_FLAG: ReadonlyMap<string, OptionSpec> = new Map(optionsOn('cli').map((s) => [s.cli, s]));

/** A column option's text (header name or 1-based number), when given. */
export function columnArg(args: AnalyzeArgs, name: string): string | undefined {
  const v = args.options.get(name);
  return typeof v === 'string' ? v : undefined;
}

/** Whether a true/false option was switched on. */
export function flagArg(args: AnalyzeArgs, name: string): boolean {
  return args.options.get(name) === true;
}

/** The CSV reading options (the table's csvOptions fields), with the table's defaults filled in. */
export function csvArgs(args: AnalyzeArgs): CsvOptions & { readonly decimal: '.' | ','; readonly skipInvalid: boolean; readonly header: boolean } {
  const out: Record<string, OptionValue> = {};
  for (const spec of BY_FLAG.values()) {
    if (spec.jsonParent !== 'csvOptions') continue;
    const v = args.options.get(spec.name) ?? spec.default;
    if (v !== null) out[spec.name] = v;
  }
  return out as unknown as CsvOptions & { decimal: '.' | ','; skipInvalid: boolean; header: boolean };
}

export function parseArgs(argv: readonly string[]): ParsedArgs {
  if (argv.length === 0) return { command: 'help' };
  const first = argv[0] as string;
  if (first === '--help' || first === '-h' || first === 'help') return { command: 'help' };
  if (first === '--version' || first === '-V' || first === 'version') return { command: 'version' };
  if (first === 'merge') return parseMerge(argv.slice(1));
  if (first === 'plan') {
    // The same options as analyze (the table's rules), without a file.
    const parsed = parseArgs(['analyze', '-', ...argv.slice(1)]);
    return parsed.command === 'analyze' ? { command: 'plan', options: parsed.options } : parsed;
  }
  if (first !== 'analyze') throw usage(`unknown command ${JSON.stringify(first)}; the commands are "analyze", "plan" and "merge"`, first);

  const options = new Map<string, OptionValue>();
  const positional: string[] = [];
  let help = false;
  for (let k = 1; k < argv.length; k++) {
    const a = argv[k] as string;
    if (a === '--') {
      positional.push(...argv.slice(k + 1));
      break;
    }
    if (!a.startsWith('-') || a === '-') {
      positional.push(a);
      continue;
    }
    if (a === '--help' || a === '-h') {
      help = true;
      continue;
    }
    const eq = a.startsWith('--') ? a.indexOf('=') : -1;
    const flag = eq > 0 ? a.slice(0, eq) : a;
    const spec = BY_FLAG.get(flag);
    if (spec === undefined) throw usage(`unknown option ${JSON.stringify(a)}`, a);
    let text: string | undefined;
    if (eq > 0) text = a.slice(eq + 1);
    else if (!isCliFlag(spec)) {
      text = argv[k + 1];
      k++;
      if (text === undefined) throw usage(`${flag} needs a value`);
    }
    if (options.has(spec.name)) throw usage(`${flag} is given twice`);
    const r = parseCliOption(spec, text);
    if (!r.ok) throw usage(r.message, r.value);
    options.set(spec.name, r.value);
  }
  if (help) return { command: 'help' };
  if (positional.length === 0) throw usage('analyze needs a CSV file (or - for standard input)');
  if (positional.length > 1) throw usage(`analyze takes one file, got ${positional.length}: ${positional.map((p) => JSON.stringify(p)).join(' ')}`);
  const combined = checkCombinations(options, 'cli');
  if (!combined.ok) throw usage(combined.message);
  return { command: 'analyze', file: positional[0] as string, options };
}

function parseMerge(rest: readonly string[]): MergeArgs | { readonly command: 'help' } {
  let format: MergeArgs['format'] = 'text';
  const files: string[] = [];
  for (const a of rest) {
    if (a === '--help' || a === '-h') return { command: 'help' };
    if (a === '--json' || a === '--csv') {
      const f = a === '--json' ? 'json' : 'csv';
      if (format !== 'text' && format !== f) throw usage('merge takes one of --json and --csv');
      format = f;
    } else if (a.startsWith('-') && a !== '-') throw usage(`unknown option ${JSON.stringify(a)} for merge (it takes --json or --csv, then the files)`, a);
    else files.push(a);
  }
  if (files.length === 0) throw usage('merge needs the JSON Lines files of the batch runs to join');
  return { command: 'merge', files, format };
}
