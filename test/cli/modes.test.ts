/**
 * `plumbline analyze --mode-column` reads the mode cells with the core's one reader (the API's):
 * a failed unit with an empty mode stops the run naming the file, row, column and cell; a mode on a
 * unit that did not fail, and a mode with no failure, are notes (JSON input.warnings, and the text).
 * Data: the invented seal demo (datasets/README.md), one cell changed.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseArgs, type AnalyzeArgs } from '../../cli/args.js';
import { runRecordedLife } from '../../cli/life-recorded.js';
import { root, scratchCsv } from '../helpers/cli.js';

const seal = readFileSync(`${root}datasets/seal-failure-modes.csv`, 'utf8');
const csv = scratchCsv('plumbline-modes-');

function run(file: string, ...extra: string[]): string {
  const args = parseArgs(['analyze', file, '--column', 'hours', '--censor-column', 'status', '--mode-column', 'mode', '--families', 'weibull', ...extra]) as AnalyzeArgs;
  let out = '';
  runRecordedLife(args, { out: (s) => (out += s) });
  return out;
}

describe('--mode-column reads the mode cells as the API does', () => {
  it('a failed unit with an empty mode stops the run, naming the file, row, column and cell', () => {
    const lines = seal.split('\n');
    expect(lines[2]).toBe('S002,5707,1,crack');
    lines[2] = 'S002,5707,1,';
    const file = csv('empty-mode.csv', lines.join('\n'));
    expect(() => run(file, '--json')).toThrow(`${file}: row 3, column "mode": the unit failed (status 1) but its failure mode is empty; give every failed unit its mode, or mark it 0 if it did not fail.`);
  });

  it('a mode on a unit that did not fail and a mode with no failure are notes in the JSON and the text; the numbers do not change', () => {
    const lines = seal.split('\n');
    lines[1] = 'S001,4409,0,seize';
    const file = csv('noted.csv', lines.join('\n'));
    const j = JSON.parse(run(file, '--json'));
    expect(j.input.warnings).toEqual([
      `Column "mode": 1 unit that did not fail (status 0) carries a mode: ${file}: row 2 ("seize"). A unit that did not fail counts as a suspension for every mode, so its mode is not used.`,
      'Mode "seize" (column "mode") has no failed unit, only 1 that did not fail: it has nothing to fit and is left out of the modes.',
    ]);
    const plain = JSON.parse(run(`${root}datasets/seal-failure-modes.csv`, '--json'));
    expect(plain.input.warnings).toEqual([]);
    expect(j.life.modes).toEqual(plain.life.modes);
    expect(run(file)).toContain('note: Mode "seize" (column "mode") has no failed unit');
  });
});
