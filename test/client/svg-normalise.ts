/**
 * Snapshot normaliser for SVG markup: every decimal number is rounded to one decimal place, so
 * that a snapshot records the drawing (structure, labels, approximate geometry) and does not
 * break on the last digits of floating-point layout arithmetic. Common practice, no source.
 */
export function normaliseSvg(markup: string): string {
  return markup
    .replace(/-?\d+\.\d+(e[-+]?\d+)?/gi, (m) => {
      const v = Number(m);
      const r = Math.round(v * 10) / 10;
      return Object.is(r, -0) ? '0' : String(r);
    })
    .replace(/></g, '>\n<');
}
