import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { revisionKeys } from '@/components/revisions/queries';
import type { AcceptImportBody } from '@/shared/schemas/exchange';
import { acceptImport, importWorkbook } from './api';

/** Where an import stands while it runs: sending the file (with the fraction sent), then the server reading it. */
export type ImportProgress = { phase: 'idle' } | { phase: 'sending'; fraction: number } | { phase: 'reading' };

/** Uploads a workbook against a revision, following the upload's progress; the preview is the mutation's data. */
export function useImportWorkbook(craftId: string, revisionId: string) {
  const [progress, setProgress] = useState<ImportProgress>({ phase: 'idle' });
  const mutation = useMutation({
    mutationFn: (upload: { file: Blob; name: string }) => {
      setProgress({ phase: 'sending', fraction: 0 });
      return importWorkbook(craftId, revisionId, upload, (fraction) =>
        setProgress(fraction >= 1 ? { phase: 'reading' } : { phase: 'sending', fraction }),
      );
    },
    onSettled: () => setProgress({ phase: 'idle' }),
  });
  return { ...mutation, progress };
}

/** Accepts a preview: the study it opens joins the craft's revisions. */
export function useAcceptImport(craftId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ importId, body }: { importId: string; body: AcceptImportBody }) => acceptImport(craftId, importId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: revisionKeys.list(craftId) }),
  });
}
