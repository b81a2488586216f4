/** Numbers in the report's plain-words sentences: 4 significant digits, no exponent for ordinary sizes. */
export function formatNumber(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return '0';
  const ax = Math.abs(x);
  if (ax >= 1e-4 && ax < 1e7) return String(Number(x.toPrecision(4)));
  return x.toExponential(3);
}
