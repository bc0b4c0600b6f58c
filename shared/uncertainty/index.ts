/** Uncertainty (Monte Carlo) studies of a sheet: seeded sampling through the compiled formulas, statistics, requirement probabilities. */
export { prepareStudy, runStudy, type PreparedStudy, type Study, type StudyOptions } from '@/shared/uncertainty/study';
export { seededRandom, draw, distributionInSI, type RandomSource, type SIDistribution } from '@/shared/uncertainty/random';
export { percentilesOf, meanAndDeviation, histogramOf, extentOf } from '@/shared/uncertainty/statistics';
