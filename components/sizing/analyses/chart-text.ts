import { formatNumber, formatUnit } from '@/shared/format/quantity';
import { colors } from '@/components/ui/theme';

/** An axis title with its unit: "Cone angle (°)"; a pure number has none. */
export function axisTitle(label: string, unit: string): string {
  const shown = formatUnit(unit);
  return shown === '' ? label : `${label} (${shown})`;
}

/** Tick and summary numbers of the sheet's charts: three significant digits, powers of ten where fixed notation would not read. */
export function chartNumber(value: number): string {
  return formatNumber(value, 3);
}

/** Line colours in drawing order: the palette's inks first, then the accent and the others. */
export const lineColors = [colors.ink, colors.inkFaint, colors.film, colors.nominal, colors.focusRing] as const;

/** The colour of the i-th line, cycling through `lineColors`. */
export function lineColor(index: number): string {
  return lineColors[index % lineColors.length] ?? colors.ink;
}
