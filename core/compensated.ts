/**
 * Compensated (Neumaier's improvement of Kahan) summation. Neumaier, A. (1974),
 * "Rundungsfehleranalyse einiger Verfahren zur Summation endlicher Summen", ZAMM 54:39-51.
 */
export class CompensatedSum {
  private s = 0;
  private c = 0;
  add(x: number): void {
    const t = this.s + x;
    if (Math.abs(this.s) >= Math.abs(x)) this.c += this.s - t + x;
    else this.c += x - t + this.s;
    this.s = t;
  }
  get value(): number {
    return this.s + this.c;
  }
}

/** Compensated sum of an array (or of f applied to each element). */
export function kahanSum(xs: ArrayLike<number>, f?: (x: number) => number): number {
  let s = 0;
  let c = 0;
  for (let i = 0; i < xs.length; i++) {
    const x = f ? f(xs[i] as number) : (xs[i] as number);
    const t = s + x;
    if (Math.abs(s) >= Math.abs(x)) c += s - t + x;
    else c += x - t + s;
    s = t;
  }
  return s + c;
}
