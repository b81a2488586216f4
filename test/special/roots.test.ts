import { describe, expect, it } from 'vitest';
import { BracketError, findRoot, newtonBracketed } from '../../core/special/index.js';
import { isPlumblineError } from '../../core/errors.js';

describe('findRoot (Brent 1973)', () => {
  it('finds √2 of x² − 2 on [0, 2] to 1e-12 relative (exact value: Math.SQRT2)', () => {
    const r = findRoot((x) => x * x - 2, 0, 2);
    expect(r.converged).toBe(true);
    expect(Math.abs(r.root - Math.SQRT2) / Math.SQRT2).toBeLessThan(1e-12);
    expect(r.fLower).toBe(-2);
    expect(r.fUpper).toBe(2);
    expect(r.iterations).toBeLessThan(15);
  });
  it('handles a root at an end, a flat-then-steep function, and honours absTol near 0', () => {
    expect(findRoot((x) => x - 1, 1, 3).root).toBe(1);
    // Brent's classic hard case: f(x) = x^9 on [-1, 4] (root 0): needs absTol.
    const r = findRoot((x) => x ** 9, -1, 4, { absTol: 1e-10 });
    expect(Math.abs(r.root)).toBeLessThan(1e-9);
    // cos x = x: the Dottie number 0.7390851332151607 (from memory; checked by the residual too)
    const d = findRoot((x) => Math.cos(x) - x, 0, 1);
    expect(Math.abs(d.root - 0.7390851332151607) / 0.7390851332151607).toBeLessThan(1e-12);
    expect(Math.abs(Math.cos(d.root) - d.root)).toBeLessThan(1e-11);
  });
  it('throws a typed BracketError when the ends have the same sign', () => {
    let caught: unknown;
    try {
      findRoot((x) => x * x + 1, -1, 1);
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(BracketError);
    expect(isPlumblineError(caught)).toBe(true);
    expect((caught as BracketError).code).toBe('not-computable');
    expect((caught as BracketError).fLower).toBe(2);
  });
  it('reports non-convergence in the result object instead of looping', () => {
    const r = findRoot((x) => Math.atan(x - 0.3), -10, 10, { maxIterations: 2 });
    expect(r.converged).toBe(false);
    expect(r.iterations).toBe(2);
  });
});

describe('newtonBracketed (Numerical Recipes §9.4 rtsafe)', () => {
  it('solves ln x = 1 (root e) to 1e-12 relative from a poor start', () => {
    const out = { f: 0, df: 0 };
    const r = newtonBracketed(
      (x) => {
        out.f = Math.log(x) - 1;
        out.df = 1 / x;
        return out;
      },
      0.1,
      100,
      90,
    );
    expect(r.converged).toBe(true);
    expect(Math.abs(r.root - Math.E) / Math.E).toBeLessThan(1e-12);
  });
  it('falls back to bisection where Newton would leave the bracket (atan, start far out)', () => {
    const r = newtonBracketed((x) => ({ f: Math.atan(x - 1), df: 1 / (1 + (x - 1) ** 2) }), -20, 30, 25);
    expect(r.converged).toBe(true);
    expect(Math.abs(r.root - 1)).toBeLessThan(1e-12);
  });
  it('throws BracketError on a non-bracket', () => {
    expect(() => newtonBracketed((x) => ({ f: x * x + 1, df: 2 * x }), -1, 1)).toThrow(BracketError);
  });
});
