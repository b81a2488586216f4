/**
 * The regional frequency analysis in words: sites with their L-moment ratios and discordancy, the
 * heterogeneity verdict, the growth curves' fit, the growth factors and each site's quantiles, with
 * the cautions first.
 */
import { formatNumber, type RegionalReport } from '../core/index.js';

const f = (x: number, d = 4): string => formatNumber(x, d);

export function regionalText(r: RegionalReport): string {
  const out: string[] = [];
  out.push('', 'Regional frequency analysis (index flood, L-moments; Hosking & Wallis 1997)');
  for (const c of r.cautions) out.push(`  ! ${c}`);
  out.push(`  ${r.sites.length} sites, ${r.regional.totalYears} site-years; regional L-CV ${f(r.regional.t)}, L-skewness ${f(r.regional.t3)}, L-kurtosis ${f(r.regional.t4)}.`);
  const h = r.heterogeneity;
  out.push(
    `  Heterogeneity: H1 = ${f(h.h1, 3)} (${h.verdict}); H2 = ${f(h.h2, 3)}, H3 = ${f(h.h3, 3)}; ${h.simulations} simulated regions from a ${h.parent.family} parent (seed ${h.seed}).`,
  );
  const d = r.discordancy;
  if (d.computed) {
    const flagged = d.sites.filter((s) => s.discordant);
    out.push(`  Discordancy (critical value ${f(d.critical, 4)} for ${d.sites.length} sites): ${flagged.length === 0 ? 'no site is discordant' : `discordant: ${flagged.map((s) => `${s.name} (D = ${f(s.d, 3)})`).join(', ')}`}.`);
  } else out.push(`  Discordancy: not computed (${d.reason}).`);
  for (const fit of r.fits) out.push(`  ${fit.label}: Z = ${f(fit.z, 3)} (${fit.acceptable ? 'acceptable, |Z| ≤ 1.64' : 'not acceptable, |Z| > 1.64'}).`);
  out.push(`  Growth curve (${r.growthCurve.label}${r.growthCurve.acceptable ? '' : ', NOT an acceptable fit'}): ${r.growthCurve.rows.map((g) => `T = ${g.period}: ${f(g.growth)}`).join('; ')}.`);
  out.push('', '  site        n   mean (index flood)  t       t3      t4      D       ' + r.growthCurve.rows.map((g) => `Q${g.period}`.padEnd(10)).join(''));
  for (const s of r.sites) {
    const q = r.siteQuantiles.find((x) => x.name === s.name);
    const ds = d.computed ? d.sites.find((x) => x.name === s.name) : undefined;
    out.push(
      `  ${s.name.padEnd(10).slice(0, 10)}  ${String(s.n).padEnd(3)} ${f(s.l1).padEnd(19)} ${f(s.t, 3).padEnd(7)} ${f(s.t3, 3).padEnd(7)} ${f(s.t4, 3).padEnd(7)} ${(ds ? f(ds.d, 3) + (ds.discordant ? '*' : '') : '–').padEnd(7)} ` +
        (q?.levels.map((l) => f(l.level).padEnd(10)).join('') ?? ''),
    );
  }
  out.push('', '  Methods:', ...r.methods.map((m) => `  - ${m}`), '');
  return out.join('\n');
}
