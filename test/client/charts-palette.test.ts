/**
 * The chart palette: every series colour stands out from the chart paper by at least 3:1 (WCAG 2.1
 * success criterion 1.4.11, non-text contrast) and every text ink by at least 4.5:1 (1.4.3), with
 * the contrast ratio and relative luminance as WCAG 2.1 defines them (sRGB channels linearised,
 * L = 0.2126 R + 0.7152 G + 0.0722 B, ratio (L1 + 0.05)/(L2 + 0.05)); and no two families share
 * both a colour and a dash pattern.
 */
import { describe, expect, it } from 'vitest';
import { BY_FAMILY, INK, SPARE, styleFor } from '../../client/charts/palette.js';
import { allFamilies } from '../../core/index.js';

function luminance(hex: string): number {
  const h = hex.replace('#', '');
  const [r, g, b] = [0, 2, 4].map((i) => {
    const c = parseInt(h.slice(i, i + 2), 16) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  }) as [number, number, number];
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

function contrast(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x) as [number, number];
  return (hi + 0.05) / (lo + 0.05);
}

describe('chart palette', () => {
  it('computes WCAG contrast as published: black on white is 21:1, white on white 1:1', () => {
    expect(contrast('#000000', '#ffffff')).toBeCloseTo(21, 10);
    expect(contrast('#ffffff', '#ffffff')).toBe(1);
  });

  it('every series colour has at least 3:1 contrast with the chart paper (WCAG 2.1, 1.4.11)', () => {
    for (const [family, s] of [...Object.entries(BY_FAMILY), ...SPARE.map((s, i) => [`spare ${i}`, s] as const)]) {
      expect(contrast(s.colour, INK.paper), `${family} ${s.colour}`).toBeGreaterThanOrEqual(3);
    }
  });

  it('every text ink has at least 4.5:1 contrast with the paper, and the out-of-tolerance words with their region (WCAG 2.1, 1.4.3)', () => {
    for (const ink of [INK.text, INK.muted, INK.reference, INK.outsideText, INK.suspension]) expect(contrast(ink, INK.paper), ink).toBeGreaterThanOrEqual(4.5);
    expect(contrast(INK.outsideText, INK.outside)).toBeGreaterThanOrEqual(4.5);
  });

  it('every registered family has its own style, and no two share colour and dash pattern', () => {
    const names = allFamilies().map((f) => f.name);
    for (const n of names) expect(BY_FAMILY[n], n).toBeDefined();
    const keys = new Set(names.map((n) => `${styleFor(n).colour}|${styleFor(n).dash}`));
    expect(keys.size).toBe(names.length);
    const patterns = new Set(Object.values(BY_FAMILY).map((s) => s.dash));
    expect(patterns.size).toBeGreaterThanOrEqual(Object.keys(BY_FAMILY).length - 1);
  });
});
