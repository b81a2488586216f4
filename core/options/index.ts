/**
 * The option contract: every analysis option declared once (table.ts and its section files), the
 * two parsers (CLI text, JSON value) with one accept/refuse rule, the combination rules, and the
 * mapping to the core's DatasetOptions. The CLI, the server, the page and the docs derive from it.
 */
export type { OptionScope, OptionSpec, OptionSurface, OptionValue, OptionValueKind } from './spec.js';
export { OPTION_SECTIONS, OPTION_TABLE, jsonField, onSurface, optionNamed, optionTableProblems, optionsOn, sectionOf } from './table.js';
export type { OptionSection } from './table.js';
export { describeJson, isCliFlag, parseCliOption, parseJsonOption } from './parse.js';
export { parseFormOption } from './form.js';
export type { OptionParse } from './parse.js';
export { aliasWords, itemRuleWords, ruleWords } from './words.js';
export { OPTION_COMBINATIONS, checkCombinations, isGiven, ruleApplies, shownName } from './combinations.js';
export type { CombinationCheck, OptionCombination } from './combinations.js';
export { datasetOptionsFrom } from './dataset-options.js';
