import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateCraftBody, UpdateCraftBody } from '@/shared/schemas/crafts';
import { createCraft, getCraft, listCrafts, listTemplates, updateCraft } from './api';

/** Query keys for crafts, general to specific. */
export const craftKeys = {
  all: ['crafts'] as const,
  list: () => [...craftKeys.all, 'list'] as const,
  detail: (craftId: string) => [...craftKeys.all, 'detail', craftId] as const,
};

/** Query keys for the templates a craft can start from: one list, the same for everyone. */
export const templateKeys = {
  all: ['templates'] as const,
};

/** The templates, which change only with a release. */
export const templateListOptions = () => queryOptions({ queryKey: templateKeys.all, queryFn: listTemplates, staleTime: Infinity });

/** The caller's crafts. */
export const craftListOptions = () => queryOptions({ queryKey: craftKeys.list(), queryFn: listCrafts });

/** One craft. */
export const craftOptions = (craftId: string) => queryOptions({ queryKey: craftKeys.detail(craftId), queryFn: () => getCraft(craftId) });

/** Creates a craft and refreshes every craft query. */
export function useCreateCraft() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateCraftBody) => createCraft(body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: craftKeys.all }),
  });
}

/** Renames or re-describes a craft and refreshes every craft query. */
export function useUpdateCraft(craftId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateCraftBody) => updateCraft(craftId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: craftKeys.all }),
  });
}
