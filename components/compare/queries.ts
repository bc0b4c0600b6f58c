import { queryOptions } from '@tanstack/react-query';
import { sheetKeys } from '@/components/sheet/queries';
import { getComparison } from './api';

/**
 * Query keys for comparisons of a craft's revisions, general to specific. They sit under the craft's sheet
 * keys, so an edit the events stream announces refetches an open comparison as it does an open sheet.
 */
export const compareKeys = {
  craft: (craftId: string) => [...sheetKeys.craft(craftId), 'compare'] as const,
  pair: (craftId: string, from: string, to: string) => [...compareKeys.craft(craftId), from, to] as const,
  moved: (craftId: string, from: string, to: string, output: string) => [...compareKeys.pair(craftId, from, to), 'moved', output] as const,
};

/** Two revisions compared: their rows and every output. */
export const comparisonOptions = (craftId: string, from: string, to: string) =>
  queryOptions({ queryKey: compareKeys.pair(craftId, from, to), queryFn: () => getComparison(craftId, { from, to }) });

/**
 * What moved one output between two revisions. A query of its own, so a refusal for that output (no old
 * value, say) is shown in its panel while the rest of the comparison stays on screen.
 */
export const movedOutputOptions = (craftId: string, from: string, to: string, output: string) =>
  queryOptions({
    queryKey: compareKeys.moved(craftId, from, to, output),
    queryFn: () => getComparison(craftId, { from, to, output }),
    select: (comparison) => comparison.moved,
  });
