/**
 * Standard normal quantile Φ⁻¹(p), its upper-tail form and inverses from a log probability.
 *
 * Wichura, M. J. (1988), "Algorithm AS 241: The percentage points of the normal distribution",
 * Applied Statistics 37:477-484 (PPND16, about 16 digits for min(p, 1 − p) ≥ 10^-316). The tail
 * branches need only r = √(−ln min(p, 1−p)), so they take a log probability directly; below
 * ln p = −729 (r > 27, beyond AS 241's range, reachable only through the log forms) the start
 * x² ≈ 2t − ln(4πt), t = −ln p (the leading terms of Mills' ratio, Abramowitz & Stegun 26.2.12), is
 * polished by Newton steps on ln Φ.
 */
import { log1mexp } from './log-exp.js';
import { normalLogCdf, normalPdfOverCdf } from './normal.js';

function central(q: number): number {
  const r = 0.180625 - q * q;
  return (
    (q *
      (((((((2.5090809287301226727e3 * r + 3.3430575583588128105e4) * r + 6.7265770927008700853e4) * r +
        4.5921953931549871457e4) * r + 1.3731693765509461125e4) * r + 1.9715909503065514427e3) * r +
        1.3314166789178437745e2) * r + 3.387132872796366608)) /
    (((((((5.226495278852854561e3 * r + 2.8729085735721942674e4) * r + 3.930789580009271061e4) * r +
      2.1213794301586595867e4) * r + 5.3941960214247511077e3) * r + 6.871870074920579083e2) * r +
      4.2313330701600911252e1) * r + 1)
  );
}

/** Φ⁻¹(p) for the lower tail given r = √(−ln p); returns a negative number. */
function tail(r: number, logP: number): number {
  if (r <= 5) {
    const s = r - 1.6;
    return -(
      (((((((7.7454501427834140764e-4 * s + 2.27238449892691845833e-2) * s + 2.4178072517745061177e-1) * s +
        1.27045825245236838258) * s + 3.64784832476320460504) * s + 5.7694972214606914055) * s +
        4.6303378461565452959) * s + 1.42343711074968357734) /
      (((((((1.05075007164441684324e-9 * s + 5.475938084995344946e-4) * s + 1.51986665636164571966e-2) * s +
        1.4810397642748007459e-1) * s + 6.8976733498510000455e-1) * s + 1.6763848301838038494) * s +
        2.05319162663775882187) * s + 1)
    );
  }
  if (r <= 27) {
    const s = r - 5;
    return -(
      (((((((2.01033439929228813265e-7 * s + 2.71155556874348757815e-5) * s + 1.2426609473880784386e-3) * s +
        2.6532189526576123093e-2) * s + 2.9656057182850489123e-1) * s + 1.7848265399172913358) * s +
        5.4637849111641143699) * s + 6.6579046435011037772) /
      (((((((2.04426310338993978564e-15 * s + 1.4215117583164458887e-7) * s + 1.8463183175100546818e-5) * s +
        7.868691311456132591e-4) * s + 1.48753612908506148525e-2) * s + 1.3692988092273580531e-1) * s +
        5.9983220655588793769e-1) * s + 1)
    );
  }
  // Far beyond AS 241: asymptotic start, then Newton on g(x) = ln Φ(x) − ln p,
  // g'(x) = φ(x)/Φ(x).
  const t = -logP;
  let x = -Math.sqrt(2 * t - Math.log(4 * Math.PI * t));
  for (let i = 0; i < 8; i++) {
    const step = (normalLogCdf(x) - logP) / normalPdfOverCdf(x);
    x -= step;
    if (Math.abs(step) <= 1e-16 * Math.abs(x)) break;
  }
  return x;
}

/** Standard normal quantile Φ⁻¹(p); −∞ at 0, +∞ at 1, NaN outside [0, 1]. */
export function normalQuantile(p: number): number {
  if (!(p >= 0 && p <= 1)) return Number.NaN;
  const q = p - 0.5;
  if (Math.abs(q) <= 0.425) return central(q);
  if (p === 0) return Number.NEGATIVE_INFINITY;
  if (p === 1) return Number.POSITIVE_INFINITY;
  if (q < 0) {
    const lp = Math.log(p);
    return tail(Math.sqrt(-lp), lp);
  }
  const lq = Math.log1p(-p);
  return -tail(Math.sqrt(-lq), lq);
}

/** Upper-tail quantile: z with 1 − Φ(z) = q, accurate for tiny q (no 1 − q is formed). */
export function normalIsf(q: number): number {
  return -normalQuantile(q);
}

/** Φ⁻¹(e^{logP}): the quantile from a log probability, for logP ≤ 0 down to −10^300. */
export function normalLogQuantile(logP: number): number {
  if (!(logP <= 0)) return Number.NaN;
  if (logP === Number.NEGATIVE_INFINITY) return logP;
  if (logP === 0) return Number.POSITIVE_INFINITY;
  if (logP < -2.5902671654458267) return tail(Math.sqrt(-logP), logP); // p < 0.075
  if (logP < -0.0779615414697118) return central(Math.exp(logP) - 0.5); // p ≤ 0.925
  const lq = log1mexp(logP); // ln(1 − p)
  return -tail(Math.sqrt(-lq), lq);
}

/** z with ln(1 − Φ(z)) = logQ: the upper-tail quantile from a log probability. */
export function normalLogIsf(logQ: number): number {
  return -normalLogQuantile(logQ);
}
