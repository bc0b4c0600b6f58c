/**
 * When a mass row may say it was weighed. The measured maturity carries no growth allowance, so the figure
 * must come from a weighing of the item itself.
 */

/** The maturity id that claims a mass was weighed. */
export const MEASURED_MATURITY = 'measured';

/**
 * Whether a row at this maturity needs a weighing report attached.
 * common practice: mass-properties control counts a mass as measured (0 % allowance) only when the weighing
 * of the item is on record; without that record the figure is still an estimate, however exact it looks.
 */
export function needsWeighingReport(maturity: string | undefined): boolean {
  return maturity === MEASURED_MATURITY;
}

/**
 * Why the row may not be at this maturity with this many weighing reports attached, in words for the
 * screen and the API's refusal; undefined when it may.
 */
export function whyNotMeasured(key: string, maturity: string | undefined, weighingReports: number): string | undefined {
  if (!needsWeighingReport(maturity) || weighingReports > 0) return undefined;
  return `Row "${key}" can be marked measured only with a weighing report attached; attach the report first`;
}
