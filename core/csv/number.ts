/**
 * Strict decimal numbers, parsed straight from a range of the source text (no slicing on the
 * fast path).
 *
 * Grammar (after trimming spaces and tabs around the cell):
 *   [+-]? ( digits [D digits?] | D digits ) ( [eE] [+-]? digits )?
 * where D is the decimal separator ('.' by default, ',' with the decimal-comma setting).
 * Rejected, unlike `Number()`: the empty string, hexadecimal/octal/binary prefixes, `Infinity`,
 * numeric separators, the other separator character, and anything else.
 *
 * Fast path: up to 15 significant digits with a decimal exponent |e| <= 22 is computed as one
 * exact integer times or divided by an exact power of ten, a single correctly rounded IEEE
 * operation (Clinger 1990, "How to read floating point numbers accurately", PLDI), so the result
 * equals `Number()` of the same text. Everything else is validated here and converted by
 * `Number()`; a finite literal that overflows to ±Infinity or a non-zero literal that underflows
 * to 0 is reported as out of range (NaN is never a valid result, so it is the failure value).
 */

/** Exact powers of ten 10^0 .. 10^22 (all exactly representable in binary64). */
const POW10 = new Float64Array(23);
{
  let p = 1;
  for (let i = 0; i <= 22; i++) {
    POW10[i] = p;
    p *= 10;
  }
}

/** Outcome of the slow path, set on failure so the caller can say why. */
export interface NumberFailure {
  /** 'syntax' = not the grammar; 'range' = grammatical but overflows to ±∞ or underflows to 0. */
  kind: 'syntax' | 'range';
}

const SPACE = 32;
const TAB = 9;
const PLUS = 43;
const MINUS = 45;
const DOT = 46;
const COMMA = 44;
const ZERO = 48;
const LOWER_E = 101;
const UPPER_E = 69;

/**
 * Parse `text[start, end)` as a strict decimal number. Returns NaN when the text is not a number
 * under the grammar above or is out of range; `failure.kind`, when given, says which.
 * `decimalCode` is the char code of the decimal separator (46 '.' or 44 ',').
 */
export function parseNumberRange(
  text: string,
  start: number,
  end: number,
  decimalCode: number,
  failure?: NumberFailure,
): number {
  let i = start;
  let e = end;
  let c = 0;
  while (i < e && ((c = text.charCodeAt(i)) === SPACE || c === TAB)) i++;
  while (e > i && ((c = text.charCodeAt(e - 1)) === SPACE || c === TAB)) e--;
  if (failure) failure.kind = 'syntax';
  if (i >= e) return Number.NaN;

  let negative = false;
  c = text.charCodeAt(i);
  if (c === MINUS) {
    negative = true;
    i++;
  } else if (c === PLUS) {
    i++;
  }
  const bodyStart = i;

  let mantissa = 0;
  let significant = 0; // significant digits accumulated into mantissa
  let exp10 = 0; // decimal exponent adjustment from digits dropped or after the separator
  let digits = 0; // all mantissa digits seen
  let exact = true;

  // Integer part.
  while (i < e) {
    const d = text.charCodeAt(i) - ZERO;
    if (d < 0 || d > 9) break;
    digits++;
    if (significant > 0 || d !== 0) {
      if (significant < 15) {
        mantissa = mantissa * 10 + d;
        significant++;
      } else {
        exact = false;
        exp10++;
      }
    }
    i++;
  }
  // Fraction.
  if (i < e && text.charCodeAt(i) === decimalCode) {
    i++;
    while (i < e) {
      const d = text.charCodeAt(i) - ZERO;
      if (d < 0 || d > 9) break;
      digits++;
      if (significant > 0 || d !== 0) {
        if (significant < 15) {
          mantissa = mantissa * 10 + d;
          significant++;
          exp10--;
        } else {
          exact = false;
        }
      } else {
        exp10--;
      }
      i++;
    }
  }
  if (digits === 0) return Number.NaN;
  // Exponent.
  if (i < e) {
    c = text.charCodeAt(i);
    if (c !== LOWER_E && c !== UPPER_E) return Number.NaN;
    i++;
    let expNegative = false;
    if (i < e) {
      c = text.charCodeAt(i);
      if (c === MINUS) {
        expNegative = true;
        i++;
      } else if (c === PLUS) {
        i++;
      }
    }
    let expDigits = 0;
    let expValue = 0;
    while (i < e) {
      const d = text.charCodeAt(i) - ZERO;
      if (d < 0 || d > 9) return Number.NaN;
      if (expValue < 100000) expValue = expValue * 10 + d;
      expDigits++;
      i++;
    }
    if (expDigits === 0) return Number.NaN;
    exp10 += expNegative ? -expValue : expValue;
  }

  if (mantissa === 0) return negative ? -0 : 0;
  if (exact && exp10 >= -22 && exp10 <= 22) {
    const v = exp10 >= 0 ? mantissa * (POW10[exp10] as number) : mantissa / (POW10[-exp10] as number);
    return negative ? -v : v;
  }
  // Slow path: the text is grammatical; let Number() round it (it rounds correctly).
  let body = text.slice(bodyStart, e);
  if (decimalCode === COMMA) body = body.replace(',', '.');
  const v = Number(body);
  if (!Number.isFinite(v) || v === 0) {
    // v === 0 with a non-zero mantissa: underflow.
    if (failure) failure.kind = 'range';
    return Number.NaN;
  }
  return negative ? -v : v;
}

/** Convenience: parse a whole string strictly. */
export function parseStrictNumber(s: string, decimal: '.' | ',' = '.'): number {
  return parseNumberRange(s, 0, s.length, decimal === ',' ? COMMA : DOT);
}
