import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { API_PATH, BEGIN, DOC_PATH, END, apiOptionsSection, optionsDocSection, withOptionsSection } from '../../scripts/options-doc.js';

// The options part of docs/report-fields.md is generated from the option table (common practice,
// no source: a generated document checked against its generator cannot drift from the code).
describe('the generated options sections of docs/report-fields.md and server/API.md', () => {
  it('is exactly what scripts/options-doc.ts generates (run it with --write after changing core/options)', () => {
    const text = readFileSync(DOC_PATH, 'utf8');
    const a = text.indexOf(BEGIN);
    const b = text.indexOf(END);
    expect(a).toBeGreaterThan(0);
    expect(text.slice(a, b + END.length)).toBe(optionsDocSection());
  });

  it('server/API.md holds exactly the generated option fields', () => {
    const text = readFileSync(API_PATH, 'utf8');
    const a = text.indexOf(BEGIN);
    const b = text.indexOf(END);
    expect(a).toBeGreaterThan(0);
    expect(text.slice(a, b + END.length)).toBe(apiOptionsSection());
  });

  it('replaces only the marked section and keeps the hand-written text around it', () => {
    const hand = `# Title\n\nintro\n\n${BEGIN}\nold\n${END}\n\n## After\n`;
    const out = withOptionsSection(hand);
    expect(out.startsWith('# Title\n\nintro\n\n')).toBe(true);
    expect(out.endsWith(`${END}\n\n## After\n`)).toBe(true);
    expect(out).not.toContain('\nold\n');
    expect(out).toContain('| `alpha` |');
  });
});
