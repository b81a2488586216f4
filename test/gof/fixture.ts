/** The committed SciPy/mpmath fixture of scripts/fixtures/gof.py. */
import { readFixture, rel } from '../helpers/fixtures.js';

export interface GofFixture {
  chiSquareCritical: { df: number; alpha: number; critical: number }[];
  chiSquareSf: { df: number; x: number; sf: number }[];
  D1: {
    values: number[];
    n: number;
    k: number;
    models: Record<
      string,
      {
        parameters: Record<string, number>;
        logLikelihood: number;
        estimatedParameters: number;
        a2: number;
        innerEdges: number[];
        observed: number[];
        chiSquare: number;
        pValue: number;
        pValueUpper: number;
      }
    >;
    normalA2WithNMinus1Sd: number;
    lognormalA2WithNMinus1Sd: number;
  };
  tails: { family: string; parameters: Record<string, number>; values: number[]; a2: number }[];
  samples: { family: string; parameters: Record<string, number>; values: number[]; a2: number }[];
}

export const fixture: GofFixture = readFixture('gof.json') as GofFixture;

/** Relative difference |a - b| / |b|. */
export { rel };
