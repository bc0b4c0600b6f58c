import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import type { AllowanceTable } from '@/shared/schemas/allowance-tables';
import { getAllowanceTable, saveAllowanceTable } from './api';

/** Query keys for crafts' own allowance tables, general to specific. */
export const allowanceTableKeys = {
  all: ['allowance-tables'] as const,
  detail: (craftId: string) => [...allowanceTableKeys.all, craftId] as const,
};

/** The craft's own allowance table (null while it has none). */
export const allowanceTableOptions = (craftId: string) =>
  queryOptions({ queryKey: allowanceTableKeys.detail(craftId), queryFn: () => getAllowanceTable(craftId) });

/** Saves the craft's own table and puts the answer in the cache, so the budget rolls up with it at once. */
export function useSaveAllowanceTable(craftId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (table: AllowanceTable) => saveAllowanceTable(craftId, table),
    onSuccess: (saved) => {
      queryClient.setQueryData(allowanceTableKeys.detail(craftId), saved);
      return queryClient.invalidateQueries({ queryKey: allowanceTableKeys.all });
    },
  });
}
