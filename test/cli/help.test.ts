/**
 * `plumbline --help` is generated from the option table: every command-line option is listed once,
 * under its group's heading, with its rule and default; API-only options are not. Common practice,
 * no source (a help text derived from the parser cannot drift from it).
 */
import { describe, expect, it } from 'vitest';
import { helpText, optionsHelp } from '../../cli/help.js';
import { OPTION_TABLE, onSurface } from '../../core/index.js';

describe('--help', () => {
  const text = helpText();

  it('lists every command-line option exactly once, and no API-only option', () => {
    for (const spec of OPTION_TABLE) {
      const lines = text.split('\n').filter((l) => l.startsWith(`  ${spec.cli} `) || l === `  ${spec.cli}`);
      expect(lines, spec.cli).toHaveLength(onSurface(spec, 'cli') ? 1 : 0);
    }
  });

  it("states each option's limits and default in the table's words", () => {
    const flat = text.replace(/\s+/g, ' ');
    expect(flat).toContain('--replicates N bootstrap replicates B (a whole number from 19 to 100000; default 999)');
    expect(flat).toContain('--alpha X significance level of the fit tests (a number between 0 and 1, exclusive; default 0.05)');
    expect(flat).toMatch(/--bounds likelihood-ratio\|fisher-matrix .*also "lr" = "likelihood-ratio"/);
  });

  it('keeps lines within 100 columns', () => {
    for (const line of text.split('\n')) expect(line.length, line).toBeLessThanOrEqual(100);
    expect(optionsHelp().length).toBeGreaterThan(0);
  });

  it('names every command the dispatcher takes (cli/args.ts: analyze, merge, plan) with its usage, and Parquet input', () => {
    const usage = text.slice(text.indexOf('Usage'), text.indexOf('FILE is'));
    for (const command of ['analyze', 'merge', 'plan']) expect(usage).toMatch(new RegExp(`^  plumbline ${command} `, 'm'));
    expect(usage).toContain('--plan-reliability R --plan-time T --assumed-shape B');
    expect(text).toMatch(/Parquet/);
  });
});
