/**
 * Which goodness-of-fit test interval rows get, and whether its p-value may decide: the size measured
 * for the inspection design the rows show (interval-inspection-scheme.ts) in committed seeded
 * simulations (scripts/life-interval-size.ts; test/life/interval-gof-size.test.ts checks the words
 * below against the fixtures). Only where the size was measured near α does the p-value decide.
 * The test is Anderson–Darling A² (interval-anderson-darling.ts) on every design; it decides on a
 * common schedule. For rows with each unit at its own inspection times no test decides: A² was
 * measured conservative there, and the candidate built for that case, the likelihood ratio against the
 * Turnbull estimate (interval-likelihood-ratio.ts), was measured too (life-interval-lr-size.json):
 * its size moved with the model and the inspection law (2.9 to 6.9 % by cell) even when each row
 * records every inspection its unit had, and it rejected most true models when the units had
 * inspections their rows do not show (A² none of them). Rows cannot tell those two apart (a row
 * keeps only the inspections around its failure), and the statistic's null distribution depends on
 * which it was, so a bootstrap from the rows cannot be calibrated for both. The likelihood ratio stays available to size studies (IntervalGofOptions.statistic).
 * With the schedules stated (the inspection-times column) the bootstrap reproduces each unit's own
 * inspections exactly; A² was then measured at 4.3 %, 2.5 % and 3.2 % in three designs
 * (scripts/life-interval-stated-size.ts): conservative, not within 5 ± 1.5 in every design, so it does
 * not decide there either (the rows no longer hide inspections; what remains is A²'s own null law with
 * estimated parameters on a coarse Turnbull estimate, not yet corrected).
 */
import type { InspectionSchemeKind } from './interval-inspection-scheme.js';

export type IntervalGofStatistic = 'anderson-darling' | 'likelihood-ratio';

/** The statistic the product's test bootstraps (on every design; see above). */
export const INTERVAL_GOF_DEFAULT_STATISTIC: IntervalGofStatistic = 'anderson-darling';

/** The statistic's name in the report's words. */
export const INTERVAL_GOF_STATISTIC_LABEL: Readonly<Record<IntervalGofStatistic, string>> = {
  'anderson-darling': 'Anderson–Darling A²',
  'likelihood-ratio': 'likelihood ratio against the Turnbull estimate, 2(ln L Turnbull − ln L model)',
};

export const INTERVAL_AD_METHOD =
  'Anderson–Darling A² on the Turnbull estimate (inside each innermost interval the estimate taken nearest the model; cf. Ren 2003), p-value by parametric bootstrap that refits every replicate and reproduces the inspection scheme unit by unit: each unit gets a lifetime from the fitted model and is seen at the inspections the scheme gives it (a common schedule when the rows fit one, every time up to its end of follow-up; else its own recorded times, the inspection a left row or suspension does not record imputed once from the interval rows’ widths; exact rows watched to the last time in the data); replicates that cannot be refitted count as exceeding (conservative). Assumes inspection times independent of the lives';

export const INTERVAL_LR_METHOD =
  'likelihood ratio 2(ln L of the Turnbull (1976) nonparametric estimate − ln L of the fitted model) over the same rows, p-value by parametric bootstrap that refits every replicate and recomputes both sides, each unit seen at its own recorded inspection times (the inspection a left row or suspension does not record imputed once from the interval rows’ widths); replicates that cannot be refitted count as exceeding (conservative). Assumes inspection times independent of the lives, and that each row records every inspection its unit had';

export const INTERVAL_GOF_METHOD: Readonly<Record<IntervalGofStatistic, string>> = {
  'anderson-darling': INTERVAL_AD_METHOD,
  'likelihood-ratio': INTERVAL_LR_METHOD,
};

/**
 * The measured size of the A² test by scheme (α = 5 %, B = 39; test/fixtures/life-interval-size.json,
 * Weibull n = 50), and for own times the likelihood-ratio candidate's (test/fixtures/life-interval-lr-size.json).
 */
export const INTERVAL_GOF_SIZE: Readonly<Record<InspectionSchemeKind, { readonly calibrated: boolean; readonly text: string }>> = {
  'common-schedule': {
    calibrated: true,
    text: 'size measured on a common schedule (every unit inspected every 25 h to 150 h): 106 of 2000 seeded samples rejected at α = 5 % (5.3 %, SE 0.49 points; Weibull n = 50, B = 39)',
  },
  stated: {
    calibrated: false,
    text: 'not size-calibrated with stated inspection schedules: each unit re-inspected at exactly its listed times, A² rejected 85 of 2000 seeded samples at α = 5 % (4.3 %, SE 0.49 points) with schedules of their own and Weibull shape 2, 25 of 1000 (2.5 %, SE 0.69 points) with shape 0.8, and 32 of 1000 (3.2 %, SE 0.69 points) with two inspections per unit (Weibull n = 50, B = 39; test/fixtures/life-interval-stated-size.json): conservative, and outside 5 ± 1.5 points in two of three designs, so the p-value is shown for information and decides nothing',
  },
  'own-times': {
    calibrated: false,
    text: 'not size-calibrated for rows that fit no common inspection schedule: A² with each unit at its own two inspection times rejected 24 of 1000 seeded samples at α = 5 % (2.4 %, SE 0.69 points; Weibull n = 50, B = 39), and 0 of 600 (0.0 %) when the units had inspections their rows do not show (n = 30 and 100); the likelihood ratio against the Turnbull estimate, measured as the alternative (Weibull n = 30 and 100, B = 39), rejected 397 of 8940 (4.4 %) true models of shape 0.8 and 564 of 8997 (6.3 %) of shape 2 when each row records every inspection of its unit, and 638 of 800 (79.8 %) when the units had more inspections; rows cannot tell these apart, so no test decides here: the p-value is shown for information and decides nothing',
  },
};
