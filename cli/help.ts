/** The text of `plumbline --help`: the frame is written here, the options come from the table. */
import { aliasWords, optionsOn, ruleWords, type OptionSpec } from '../core/index.js';

/** Heading (and a line under it) of each group of options, in the order listed. */
const GROUPS: readonly { readonly group: OptionSpec['group']; readonly title: string }[] = [
  { group: 'input', title: 'Reading the file' },
  { group: 'fitting', title: 'Models and intervals' },
  { group: 'tests', title: 'Fit tests' },
  { group: 'life', title: 'Life data (a status column: 1 = failed, 0 = still running or removed unfailed)' },
  { group: 'flood', title: 'Flood frequency (annual maxima)' },
  { group: 'capability', title: 'Process capability' },
  { group: 'trend', title: 'Trend' },
  { group: 'batch', title: 'Many series in one run' },
  { group: 'output', title: 'Output' },
];

const WIDTH = 100;

/** What the flag takes, e.g. 'LIST', 'X', 'NAME|INDEX', 'table|bootstrap'. */
function metavar(spec: OptionSpec): string {
  if (spec.cliFlagValue !== undefined || spec.kind === 'boolean') return '';
  switch (spec.kind) {
    case 'number':
      return 'X';
    case 'integer':
      return 'N';
    case 'choice':
      return (spec.choices ?? []).join('|');
    case 'numbers':
    case 'choices':
    case 'columns':
      return 'LIST';
    case 'column':
      return 'NAME|INDEX';
    default:
      return 'TEXT';
  }
}

function defaultWords(spec: OptionSpec): string {
  const d = spec.default;
  if (d === null || spec.kind === 'boolean' || spec.cliFlagValue !== undefined) return '';
  const shown = Array.isArray(d) ? d.join(',') : String(d);
  return `default ${shown}`;
}

/** The words after the flag: help, then the rule and default in brackets. */
function describe(spec: OptionSpec): string {
  const notes: string[] = [];
  if (spec.kind !== 'boolean' && spec.cliFlagValue === undefined && spec.kind !== 'column' && spec.kind !== 'columns' && spec.kind !== 'text') {
    notes.push(spec.kind === 'choice' || spec.kind === 'choices' ? `${spec.kind === 'choices' ? 'any of' : 'one of'} ${(spec.choices ?? []).join(', ')}` : ruleWords(spec));
  }
  if (spec.unit) notes.push(spec.unit);
  const d = defaultWords(spec);
  if (d) notes.push(d);
  const aliases = aliasWords(spec);
  if (aliases && spec.kind === 'choice') notes.push(`also ${aliases}`);
  return notes.length > 0 ? `${spec.help} (${notes.join('; ')})` : spec.help;
}

/** Wrap `text` to WIDTH with a hanging indent. */
function wrap(first: string, text: string, indent: number): string {
  const words = text.split(/\s+/);
  const lines: string[] = [];
  let line = first.padEnd(indent);
  if (first.length >= indent) {
    lines.push(first);
    line = ' '.repeat(indent);
  }
  let empty = true;
  for (const w of words) {
    if (!empty && line.length + 1 + w.length > WIDTH) {
      lines.push(line);
      line = ' '.repeat(indent);
      empty = true;
    }
    line += (empty ? '' : ' ') + w;
    empty = false;
  }
  lines.push(line);
  return lines.join('\n');
}

/** The options part of --help, grouped as the table groups them. */
export function optionsHelp(): string {
  const cli = optionsOn('cli');
  const parts: string[] = [];
  for (const { group, title } of GROUPS) {
    const list = cli.filter((s) => s.group === group);
    if (list.length === 0) continue;
    parts.push(title);
    for (const s of list) parts.push(wrap(`  ${s.cli}${metavar(s) ? ` ${metavar(s)}` : ''}`, describe(s), 27));
    parts.push('');
  }
  return parts.join('\n');
}

export function helpText(): string {
  return `plumbline: fit continuous probability models to a column of measurements, test each fit,
and rank the candidates.

Usage
  plumbline analyze FILE [--column NAME|INDEX] [options]
      fit, test and rank the models on one column (or, with --by or --columns, on many series)
  plumbline merge [--json|--csv] RUN.jsonl...
      join the JSON Lines of batch runs (the shards of --shard, say) into one summary by series
  plumbline plan --plan-reliability R --plan-time T --assumed-shape B [--plan-confidence C]
                 [--plan-failures r]
      a life test plan: units to test for each test time, to show R at time T; needs no data
  plumbline --help
  plumbline --version

FILE is a CSV file with a header row (comma, semicolon or tab separated, detected), an Apache
Parquet file (recognised by its PAR1 magic bytes; its top-level columns are read as a table), or -
to read CSV from standard input. Column names are matched exactly, then ignoring case; quote names
with spaces. Lists are comma-separated, e.g. --b-life 1,10,50.

${optionsHelp()}
Exit status
  0 success, 2 a problem with the input or the options (one line on standard error),
  70 an internal error (please report it).

Results that feed safety decisions (a part's life, a design flood, a critical dimension) need review
by a qualified person under the governing codes and standards.
`;
}
