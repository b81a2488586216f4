/**
 * Discordancy of each site in a region (Hosking & Wallis 1997, Regional Frequency Analysis, §3.2):
 * with u_i = (t, t3, t4) of site i, ū their unweighted mean and A = Σ (u_i − ū)(u_i − ū)ᵀ,
 *
 *   D_i = (N/3) (u_i − ū)ᵀ A⁻¹ (u_i − ū),
 *
 * whose average over the sites is exactly 1. A site is flagged when D_i exceeds the critical value
 * of H&W Table 3.1 for N sites (3 for N ≥ 15) [values from memory]. Fewer than 5 sites: not computed
 * (the measure cannot flag anything there).
 */
export interface SiteRatios {
  readonly name: string;
  readonly t: number;
  readonly t3: number;
  readonly t4: number;
}

export type DiscordancyResult =
  | {
      readonly computed: true;
      readonly critical: number;
      readonly sites: readonly { readonly name: string; readonly d: number; readonly discordant: boolean }[];
    }
  | { readonly computed: false; readonly reason: string };

/** H&W (1997) Table 3.1, N = 5 … 14 [from memory]; 3 from N = 15 on. */
const CRITICAL: Readonly<Record<number, number>> = { 5: 1.333, 6: 1.648, 7: 1.917, 8: 2.14, 9: 2.329, 10: 2.491, 11: 2.632, 12: 2.757, 13: 2.869, 14: 2.971 };

export function discordancyCritical(sites: number): number {
  return sites >= 15 ? 3 : (CRITICAL[sites] ?? Number.NaN);
}

/** Inverse of a symmetric 3×3 matrix by cofactors; null when singular (relative to its size). */
function inverse3(a: readonly number[][]): number[][] | null {
  const [[a00, a01, a02], [a10, a11, a12], [a20, a21, a22]] = a as [[number, number, number], [number, number, number], [number, number, number]];
  const c00 = a11 * a22 - a12 * a21;
  const c01 = a12 * a20 - a10 * a22;
  const c02 = a10 * a21 - a11 * a20;
  const det = a00 * c00 + a01 * c01 + a02 * c02;
  const scale = Math.abs(a00 * a11 * a22) + 1e-300;
  if (!(Math.abs(det) > 1e-12 * scale)) return null;
  return [
    [c00 / det, (a02 * a21 - a01 * a22) / det, (a01 * a12 - a02 * a11) / det],
    [c01 / det, (a00 * a22 - a02 * a20) / det, (a02 * a10 - a00 * a12) / det],
    [c02 / det, (a01 * a20 - a00 * a21) / det, (a00 * a11 - a01 * a10) / det],
  ];
}

export function discordancy(sites: readonly SiteRatios[]): DiscordancyResult {
  const n = sites.length;
  if (n < 5) return { computed: false, reason: `discordancy needs at least 5 sites (Hosking & Wallis 1997 §3.2); the region has ${n}` };
  const u = sites.map((s) => [s.t, s.t3, s.t4]);
  const mean = [0, 1, 2].map((j) => u.reduce((acc, r) => acc + (r[j] as number), 0) / n);
  const a = [0, 1, 2].map(() => [0, 0, 0]);
  for (const r of u) {
    for (let j = 0; j < 3; j++) for (let k = 0; k < 3; k++) (a[j] as number[])[k] = ((a[j] as number[])[k] as number) + ((r[j] as number) - (mean[j] as number)) * ((r[k] as number) - (mean[k] as number));
  }
  const inv = inverse3(a);
  if (inv === null) return { computed: false, reason: 'the sites’ L-moment ratios lie on a plane (their scatter matrix is singular): discordancy is not defined' };
  const critical = discordancyCritical(n);
  return {
    computed: true,
    critical,
    sites: sites.map((s, i) => {
      const d3 = [0, 1, 2].map((j) => ((u[i] as number[])[j] as number) - (mean[j] as number));
      let q = 0;
      for (let j = 0; j < 3; j++) for (let k = 0; k < 3; k++) q += (d3[j] as number) * ((inv[j] as number[])[k] as number) * (d3[k] as number);
      const d = (n / 3) * q;
      return { name: s.name, d, discordant: d > critical };
    }),
  };
}
