/**
 * Chance of at least one exceedance of the T-year level during a design life of L years,
 * assuming independent years: r = 1 - (1 - 1/T)^L, computed as -expm1(L·log1p(-1/T)) so that
 * small risks (large T, short L) keep their precision. Its inverse gives the return period that
 * holds the risk to r over L years: T = 1/(-expm1(log1p(-r)/L)).
 */
import { InputError } from '../errors.js';

function check(name: string, v: number, ok: boolean): void {
  if (!ok) throw new InputError(`Invalid ${name}: ${String(v)}.`, { value: String(v) }, 'bad-option');
}

export function exceedanceRisk(period: number, designLife: number): number {
  check('return period (must be > 1)', period, period > 1);
  check('design life (must be > 0)', designLife, designLife > 0);
  return -Math.expm1(designLife * Math.log1p(-1 / period));
}

export function periodForRisk(risk: number, designLife: number): number {
  check('risk (must lie in (0, 1))', risk, risk > 0 && risk < 1);
  check('design life (must be > 0)', designLife, designLife > 0);
  return 1 / -Math.expm1(Math.log1p(-risk) / designLife);
}
