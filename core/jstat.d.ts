// jstat ships no types; declare only the few functions Plumbline uses.
declare module 'jstat' {
  interface JStatStatic {
    gammaln(x: number): number;
    gammafn(x: number): number;
    lowRegGamma(a: number, x: number): number;
    gammapinv(p: number, a: number): number;
    erf(x: number): number;
    erfc(x: number): number;
    erfcinv(p: number): number;
    normal: { cdf(x: number, mean: number, sd: number): number; inv(p: number, mean: number, sd: number): number };
    chisquare: { cdf(x: number, dof: number): number; inv(p: number, dof: number): number };
    gamma: { cdf(x: number, shape: number, scale: number): number; inv(p: number, shape: number, scale: number): number };
  }
  const jStat: JStatStatic;
  export default jStat;
}
