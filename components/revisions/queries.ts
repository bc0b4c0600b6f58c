import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { craftKeys } from '@/components/crafts/queries';
import { sheetKeys } from '@/components/sheet/queries';
import type { AuditAction } from '@/shared/schemas/audit';
import type { LockBaselineBody, OpenStudyBody, PromoteStudyBody } from '@/shared/schemas/revisions';
import { listAudit, listRevisions, lockBaseline, openStudy, promoteStudy } from './api';

/** Query keys for a craft's revisions. */
export const revisionKeys = {
  all: ['revisions'] as const,
  list: (craftId: string) => [...revisionKeys.all, craftId] as const,
  /** Under the list's key: a lock, a study or a promotion reads the audit log again too. */
  audit: (craftId: string, action: AuditAction | undefined) => [...revisionKeys.list(craftId), 'audit', action ?? 'all'] as const,
};

/** The craft's revisions, oldest first. */
export const revisionListOptions = (craftId: string) =>
  queryOptions({ queryKey: revisionKeys.list(craftId), queryFn: () => listRevisions(craftId) });

/** The craft's audit log, newest first, of one kind of entry or all. */
export const auditOptions = (craftId: string, action: AuditAction | undefined) =>
  queryOptions({ queryKey: revisionKeys.audit(craftId, action), queryFn: () => listAudit(craftId, action) });

/** After a lock, a study or a promotion: the list, the craft (its draft) and its sheets are read again. */
function useRefreshCraft(craftId: string) {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: revisionKeys.list(craftId) }),
      queryClient.invalidateQueries({ queryKey: craftKeys.detail(craftId) }),
      queryClient.invalidateQueries({ queryKey: sheetKeys.craft(craftId) }),
    ]);
}

/** Locks the working draft as a baseline. */
export function useLockBaseline(craftId: string) {
  const refresh = useRefreshCraft(craftId);
  return useMutation({
    mutationFn: ({ revisionId, body }: { revisionId: string; body: LockBaselineBody }) => lockBaseline(craftId, revisionId, body),
    onSuccess: refresh,
  });
}

/** Opens a study from a revision. */
export function useOpenStudy(craftId: string) {
  const refresh = useRefreshCraft(craftId);
  return useMutation({
    mutationFn: ({ revisionId, body }: { revisionId: string; body: OpenStudyBody }) => openStudy(craftId, revisionId, body),
    onSuccess: refresh,
  });
}

/** Promotes a study into the draft, with the resolutions of its conflicts. */
export function usePromoteStudy(craftId: string) {
  const refresh = useRefreshCraft(craftId);
  return useMutation({
    mutationFn: ({ studyId, body }: { studyId: string; body: PromoteStudyBody }) => promoteStudy(craftId, studyId, body),
    onSuccess: refresh,
  });
}
