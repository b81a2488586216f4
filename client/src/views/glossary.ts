/**
 * Every header and symbol the page and the report use, explained in a sentence, each with an id
 * (`g-<key>`) that headers link to, so an explanation is one keyboard step away (a link, not only
 * a hover title). Pure: entries as data, a <dl> as nodes. Sources are the published methods the
 * core implements.
 */
import { el } from '../dom.js';

export interface GlossaryEntry {
  readonly key: string;
  readonly term: string;
  readonly text: string;
}

export const GLOSSARY: readonly GlossaryEntry[] = [
  { key: 'alpha', term: 'α (significance level)', text: 'A model is rejected when a test’s p-value falls below α. A smaller α rejects less often, wrongly or rightly.' },
  { key: 'p', term: 'p-value', text: 'The chance of a test statistic at least this far from the model’s prediction if the model were right. Small p: the data contradict the model. A large p does not prove the model.' },
  { key: 'lnl', term: 'ln L (log-likelihood)', text: 'The natural log of the probability density of the whole sample under the fitted model, at the maximum-likelihood parameters. Higher is a closer fit; it is only compared between models fitted to the same data.' },
  { key: 'aicc', term: 'AICc, Δ AICc', text: 'Akaike’s information criterion with the small-sample correction: 2m − 2 ln L + 2m(m+1)/(n−m−1) for m estimated parameters and n values (Burnham & Anderson 2002). Lower is better; Δ is the distance from the best. Δ up to about 2 is about as well supported as the best.' },
  { key: 'chi', term: 'χ² (chi-square) on equal-probability bins', text: 'The values are sorted into k bins each expecting n/k values under the model; χ² sums (observed − expected)² / expected. Each bin needs at least 5 expected for the approximation to hold.' },
  { key: 'dof', term: 'dof, k − 1 − m and k − 1', text: 'Degrees of freedom (ν) of the chi-square test: k bins less 1, less the m parameters estimated from the same data. With the maximum-likelihood fit to the raw values the true reference lies between k − 1 − m and k − 1 (Chernoff–Lehmann).' },
  { key: 'cl', term: 'Chernoff–Lehmann', text: 'Chernoff & Lehmann (1954): when parameters are estimated from the ungrouped data, the chi-square statistic is not distributed as χ² with k − 1 − m dof; its p-value lies between those with k − 1 − m and k − 1 dof, so both are shown.' },
  { key: 'ad', term: 'A² (Anderson–Darling)', text: 'A distance between the sample’s distribution and the model’s, weighted to the tails. Its p-value here allows for the parameters being estimated: a published formula for the family (D’Agostino & Stephens 1986) or a parametric bootstrap.' },
  { key: 'bootstrap', term: 'Parametric bootstrap, B', text: 'B samples are drawn from the fitted model, each refitted and its A² computed; the p-value is the share of them at least as large as the data’s, with its Monte Carlo standard error. The seed makes it repeatable.' },
  { key: 'band', term: 'Pointwise band', text: 'On the probability plot, the range each plotted point would fall in with the stated probability if the model were right. It holds point by point, not for all points at once, so a few points outside are expected.' },
  { key: 'plotpos', term: 'Plotting positions', text: 'The probability given to the i-th smallest value on a probability plot, e.g. Weibull i/(n+1), Gringorten (i − 0.44)/(n + 0.12), Cunnane (i − 0.4)/(n + 0.2); with suspensions, Kaplan–Meier or adjusted ranks.' },
  { key: 'censored', term: 'Suspension (right-censored value)', text: 'A unit still running, or removed unfailed, at the given time: its life is known only to exceed it. Censored values enter the likelihood through the survival function, not as failures.' },
  { key: 'km', term: 'Kaplan–Meier', text: 'The estimate of the share failed by each failure time that counts suspensions correctly (Kaplan & Meier 1958).' },
  { key: 'blife', term: 'B-life (B10, B50)', text: 'The time by which the given percent of units has failed under the model: B10 is the 10 % failure time.' },
  { key: 'bounds', term: 'Likelihood-ratio and Fisher-matrix bounds', text: 'Likelihood-ratio bounds take every value whose log-likelihood is within the chi-square cut of the maximum; Fisher-matrix bounds use the curvature at the maximum (the inverse Fisher information) and are symmetric on a log scale. Both are large-sample approximations (Meeker & Escobar 1998).' },
  { key: 'return', term: 'Return period T, return level', text: 'The level exceeded on average once in T years, i.e. with chance 1/T in any one year. Over a design life of L years the chance of at least one exceedance is 1 − (1 − 1/T)^L.' },
  { key: 'xi', term: 'ξ (GEV shape)', text: 'The shape of the generalised extreme value model, in the sign convention of Coles (2001): ξ > 0 a heavy upper tail without bound, ξ = 0 the Gumbel model, ξ < 0 an upper bound.' },
  { key: 'mk', term: 'Mann–Kendall test, Sen’s slope, Kendall τ-b', text: 'A test for a monotone trend over the time order (Mann 1945, Kendall 1975), the median of all pairwise slopes (Sen 1968), and the rank correlation with the order. A trend breaks the assumption that all values come from one distribution.' },
  { key: 'cap', term: 'Pp, Ppk, Cp, Cpk', text: 'Capability indices: the tolerance width over six standard deviations (Pp, Cp), and the distance from the mean to the nearer limit over three (Ppk, Cpk). P-indices use the overall spread; C-indices the within-subgroup spread (ISO 22514-2).' },
  { key: 'cpm', term: 'Cpm', text: 'A capability index that also charges the distance of the mean from the target: the tolerance width over six times the root mean square deviation from the target.' },
  { key: 'ppm', term: 'ppm out of tolerance', text: 'Parts per million expected below the lower limit or above the upper one, from the fitted model’s tails. It depends on the model far more than the indices do.' },
  { key: 'percentile', term: 'Percentile method', text: 'Capability from the model’s 0.135 % and 99.865 % quantiles instead of ±3 standard deviations, for data that are not normal (ISO 22514-2).' },
  { key: 'sensitivity', term: 'What would change the answer', text: 'The same decision number under each model no test rejects. A wide spread means the choice of model, not the data, decides the number.' },
];

export function glossaryNode(): HTMLElement {
  const dl = el('dl', { className: 'glossary-list' });
  for (const g of GLOSSARY) dl.append(el('dt', { id: `g-${g.key}`, tabindex: -1 }, g.term), el('dd', {}, g.text));
  return dl;
}
