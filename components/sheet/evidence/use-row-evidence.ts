import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { WEIGHING_REPORT, type AttachmentKind } from '@/shared/schemas/attachments';
import { sheetKeys } from '../queries';
import { attachEvidence, getRowEvidence, removeEvidence } from './api';

/** Query keys of rows' evidence: under the craft's key, so the craft's live events refetch them with the sheet. */
export const evidenceKeys = {
  all: (craftId: string) => [...sheetKeys.craft(craftId), 'evidence'] as const,
  row: (craftId: string, revisionId: string, key: string) => [...evidenceKeys.all(craftId), revisionId, key] as const,
};

/** One row's evidence. */
export const rowEvidenceOptions = (craftId: string, revisionId: string, key: string) =>
  queryOptions({ queryKey: evidenceKeys.row(craftId, revisionId, key), queryFn: () => getRowEvidence(craftId, revisionId, key) });

/**
 * A row's evidence: the list, attaching a file (with the fraction uploaded while it goes) and removing one;
 * both changes refetch the list. `weighingReports` counts what the measured maturity rests on.
 */
export function useRowEvidence(craftId: string, revisionId: string, key: string) {
  const queryClient = useQueryClient();
  const evidence = useQuery(rowEvidenceOptions(craftId, revisionId, key));
  const [progress, setProgress] = useState<number | null>(null);
  const refetch = () => queryClient.invalidateQueries({ queryKey: evidenceKeys.row(craftId, revisionId, key) });
  const attach = useMutation({
    mutationFn: (upload: { file: Blob; name: string; kind: AttachmentKind }) => {
      setProgress(0);
      return attachEvidence(craftId, revisionId, key, upload, setProgress);
    },
    onSettled: async () => {
      setProgress(null);
      await refetch();
    },
  });
  const remove = useMutation({
    mutationFn: (attachmentId: string) => removeEvidence(craftId, revisionId, key, attachmentId),
    onSettled: refetch,
  });
  const weighingReports = evidence.data?.attachments.filter((file) => file.kind === WEIGHING_REPORT).length;
  return { evidence, attach, remove, progress, weighingReports };
}
