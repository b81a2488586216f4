/**
 * Digamma ψ(x) = d/dx ln Γ(x) and trigamma ψ'(x), for x > 0.
 *
 * - ψ on [1, 2]: Taylor series about its positive zero x₀ = 1.46163214496836234126…,
 *   ψ(x₀ + t) = Σ_{n≥1} (−1)^{n+1} ζ(n+1, x₀) t^n (A&S 6.4.10 / DLMF 5.15.1 with the Hurwitz zeta),
 *   t computed as (x − x₀,hi) − x₀,lo so that ψ keeps full relative precision at its zero. The
 *   coefficients are Hurwitz zeta values computed with mpmath at 50 digits
 *   (`python3 scripts/fixtures/special.py --coefficients`).
 * - Below 1: ψ(x) = ψ(x + 1) − 1/x; between 2 and 10: ψ(x) = ψ(x − n) + Σ 1/(x − k).
 * - From 10: the asymptotic series ln x − 1/(2x) − Σ B_{2k}/(2k x^{2k}) (A&S 6.3.18).
 * - ψ'(x): Σ 1/(x + k)² up to x + n ≥ 10, then 1/x + 1/(2x²) + Σ B_{2k}/x^{2k+1} (A&S 6.4.12).
 */

const X0_HI = 1.4616321449683622;
const X0_LO = 9.549995429965697e-17;

// (−1)^{n+1} ζ(n+1, x₀), n = 1 … 44.
const PSI_TAYLOR = [
  0.9676722454476212, -0.4427631689835921, 0.258499760955651, -0.16394270544240652, 0.10782405069126237,
  -0.07219956125645471, 0.04880428816414311, -0.03316112647484736, 0.022597648232218104, -0.01542476590494896,
  0.010538791616612175, -0.007204534386356869, 0.004926781395729853, -0.003369801655439328, 0.002305126326734928,
  -0.0015769367714301972, 0.0010788252019162967, -0.0007380709389960052, 0.000504953265834602,
  -0.0003454680251063077, 0.00023635601564027053, -0.00016170622091974803, 0.0001106337276874741,
  -7.569179582195066e-5, 5.178575795222081e-5, -3.5430070947659604e-5, 2.424006611860132e-5,
  -1.6584242271854135e-5, 1.134638458466385e-5, -7.762817668462094e-6, 5.3110609208898636e-6,
  -3.6336507898010456e-6, 2.486022733129538e-6, -1.7008538854332607e-6, 1.1636675363548843e-6,
  -7.96142543124197e-7, 5.446941930669446e-7, -3.7266161283438227e-7, 2.549626552021554e-7,
  -1.7443695117727745e-7, 1.1934394829830244e-7, -8.165115189488409e-8, 5.586299683532171e-8,
  -3.821960061917494e-8,
];

/** ψ(x) for 1 ≤ x ≤ 2 by the series about x₀ (|t| ≤ 0.54, terms fall like 0.37^n). */
function digammaUnit(x: number): number {
  const t = x - X0_HI - X0_LO;
  let s = 0;
  for (let i = PSI_TAYLOR.length - 1; i >= 0; i--) s = s * t + (PSI_TAYLOR[i] as number);
  return s * t;
}

/** ψ(x) for x ≥ 10 (asymptotic series, error below 1e-17 relative). */
function digammaLarge(x: number): number {
  const r2 = 1 / (x * x);
  const s =
    r2 *
    (1 / 12 -
      r2 * (1 / 120 - r2 * (1 / 252 - r2 * (1 / 240 - r2 * (1 / 132 - r2 * (691 / 32760 - r2 * (1 / 12 - r2 * (3617 / 8160))))))));
  return Math.log(x) - 0.5 / x - s;
}

/** Digamma ψ(x) = Γ'(x)/Γ(x) for x > 0. */
export function digamma(x: number): number {
  if (!(x > 0)) return x === 0 ? Number.NEGATIVE_INFINITY : Number.NaN;
  if (x >= 10) return x === Number.POSITIVE_INFINITY ? x : digammaLarge(x);
  if (x < 1) return digammaUnit(x + 1) - 1 / x;
  if (x <= 2) return digammaUnit(x);
  let s = 0;
  let y = x;
  while (y > 2) {
    y -= 1;
    s += 1 / y;
  }
  return digammaUnit(y) + s;
}

/** Trigamma ψ'(x) for x > 0. */
export function trigamma(x: number): number {
  if (!(x > 0)) return x === 0 ? Number.POSITIVE_INFINITY : Number.NaN;
  let s = 0;
  let y = x;
  while (y < 10) {
    s += 1 / (y * y);
    y += 1;
  }
  const r = 1 / y;
  const r2 = r * r;
  // 1/y + 1/(2y²) + Σ_{k=1..9} B_{2k} / y^{2k+1}
  const series =
    r2 *
    r *
    (1 / 6 -
      r2 *
        (1 / 30 -
          r2 * (1 / 42 - r2 * (1 / 30 - r2 * (5 / 66 - r2 * (691 / 2730 - r2 * (7 / 6 - r2 * (3617 / 510 - r2 * (43867 / 798)))))))));
  return s + r + 0.5 * r2 + series;
}
