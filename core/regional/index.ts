/** core/regional: regional frequency analysis by L-moments and the index flood (Hosking & Wallis 1997). */
export { discordancy, discordancyCritical } from './discordancy.js';
export type { DiscordancyResult, SiteRatios } from './discordancy.js';
export { heterogeneity, regionalAverages, regionalParent } from './heterogeneity.js';
export type { Heterogeneity, RegionalAverages, SiteSample } from './heterogeneity.js';
export { fitGrowth, gevShapeFromT3, growthAt } from './growth-curve.js';
export type { GrowthFamily, GrowthFit } from './growth-curve.js';
export { DEFAULT_REGIONAL_PERIODS, regionalAnalysis } from './analysis.js';
export type { RegionalOptions, RegionalReport, RegionalSiteInput } from './analysis.js';
