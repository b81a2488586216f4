/**
 * The shape of one analysis option, declared once. The CLI parser and `--help`, the server's
 * validation and its 400 messages, the page's form and the options part of docs/report-fields.md
 * are all derived from the table of these (core/options/table.ts); nothing else lists options or
 * their limits.
 *
 * One name per option everywhere: `name` is the JSON/API field and the page's form key; `cli` is the
 * flag. Ranges are inclusive unless `minExclusive`/`maxExclusive` say otherwise.
 */

/** What kind of data an option applies to (the report's data kinds, plus the trade sections). */
export type OptionScope =
  | 'all'
  | 'complete'
  | 'censored'
  | 'interval'
  | 'grouped'
  | 'life'
  | 'flood'
  | 'capability'
  | 'trend'
  | 'batch'
  | 'input';

export type OptionValueKind =
  | 'number' // one finite number
  | 'integer' // one safe integer
  | 'boolean' // a CLI flag without a value; true/false in JSON
  | 'choice' // one of `choices`
  | 'numbers' // a comma-separated list on the CLI, an array of numbers in JSON
  | 'choices' // a comma-separated list of `choices`, an array of strings in JSON
  | 'column' // a header name or a 1-based column number
  | 'columns' // a comma-separated list of columns
  | 'text'; // free text (e.g. a delimiter), checked by `pattern` when given

/** The CLI, and the JSON API (which the page's request builder speaks). */
export type OptionSurface = 'cli' | 'api';

/** A parsed option value (`null`: off / absent). */
export type OptionValue = number | boolean | string | readonly number[] | readonly string[] | null;

export interface OptionSpec {
  /** camelCase name: the JSON/API field, the page's form key, the docs' row. */
  readonly name: string;
  /** The CLI flag, e.g. '--b-life'. */
  readonly cli: string;
  readonly kind: OptionValueKind;
  /** Unit in words ('hours', 'years', 'same unit as the data'), when the value has one. */
  readonly unit?: string;
  readonly min?: number;
  readonly max?: number;
  readonly minExclusive?: boolean;
  readonly maxExclusive?: boolean;
  /** Allowed values of a 'choice' or 'choices' option. */
  readonly choices?: readonly string[];
  /** CLI spellings accepted for a choice, mapped to the canonical value (e.g. lr → likelihood-ratio). */
  readonly aliases?: Readonly<Record<string, string>>;
  /** A list option refuses a repeated entry. */
  readonly unique?: boolean;
  /** Longest list accepted. */
  readonly maxItems?: number;
  /** The default; `null` means off / absent (the section or behaviour is not run). */
  readonly default: number | boolean | string | readonly number[] | readonly string[] | null;
  /** Which data or sections the option applies to. */
  readonly appliesTo: readonly OptionScope[];
  /** One line of help, shown by --help, the page and the docs. */
  readonly help: string;
  /**
   * Where the option exists: the command line, the JSON API (the page builds API requests), or both
   * (the default). E.g. `--json` is CLI-only; the evidence settings are API-only.
   */
  readonly surfaces?: readonly OptionSurface[];
  /** On the CLI the option is a flag without a value that sets this value (e.g. --decimal-comma sets ','). */
  readonly cliFlagValue?: string | boolean;
  /** In JSON the field sits inside this object (e.g. 'csvOptions' for `csvOptions.delimiter`). */
  readonly jsonParent?: 'csvOptions' | 'evidenceOptions';
  /**
   * A column option whose data a `values` request gives as an array field instead (e.g. 'status' for
   * the status column); the combination rules count either as the option being given.
   */
  readonly jsonData?: string;
  /** A 'text' option's value must match this (JavaScript RegExp source, `u` flag). */
  readonly pattern?: string;
  /** Words for `pattern`, e.g. 'one character (not a quote or line break)'. */
  readonly patternWords?: string;
  /** What one item of a 'choice'/'choices' option is called in messages ('family'). */
  readonly itemNoun?: string;
  /** The core's option key when it differs from `name` (the core's DatasetOptions). */
  readonly coreName?: string;
  /** The section of --help, the page's form and the docs it is listed under. */
  readonly group: 'input' | 'fitting' | 'tests' | 'life' | 'flood' | 'capability' | 'trend' | 'batch' | 'output';
}
