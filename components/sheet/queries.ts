import { queryOptions, useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import {
  sheetEventSchema,
  type CreateParameterBody,
  type RevisionDetail,
  type RevisionParameter,
  type UpdateParameterBody,
} from '@/shared/schemas/revisions';
import {
  createParameter,
  createSubsystem,
  deleteParameter,
  deleteSubsystem,
  getRevision,
  getRowHistory,
  renameSubsystem,
  sheetEventsUrl,
  updateParameter,
} from './api';
import { applyCreate, applyDelete, applyUpdate, replaceRow, restoreRows } from './revision-cache';

/** Query keys for craft sheets, general to specific. */
export const sheetKeys = {
  all: ['sheets'] as const,
  craft: (craftId: string) => [...sheetKeys.all, craftId] as const,
  revision: (craftId: string, revisionId: string) => [...sheetKeys.craft(craftId), 'revision', revisionId] as const,
  rowHistory: (craftId: string, revisionId: string, key: string) => [...sheetKeys.craft(craftId), 'history', revisionId, key] as const,
};

/** How often the sheet is refetched while the events stream is down: others' edits then show within this time. */
export const pollMilliseconds = 2000;

/** One revision with its rows; polled while `poll` is on (no events stream). */
export const revisionOptions = (craftId: string, revisionId: string, poll: boolean) =>
  queryOptions({
    queryKey: sheetKeys.revision(craftId, revisionId),
    queryFn: () => getRevision(craftId, revisionId),
    refetchInterval: poll ? pollMilliseconds : false,
  });

/** One row's history in a revision; under the craft's key, so the craft's live events refetch it with the sheet. */
export const rowHistoryOptions = (craftId: string, revisionId: string, key: string) =>
  queryOptions({ queryKey: sheetKeys.rowHistory(craftId, revisionId, key), queryFn: () => getRowHistory(craftId, revisionId, key) });

type Snapshot = { previous: RevisionDetail | undefined };

/**
 * Shared plumbing of the row mutations: an optimistic change of the cached revision, undone row by row on
 * failure; on success `confirm` puts the server's answer in its place.
 */
function useRowMutation<V, R>(
  craftId: string,
  revisionId: string,
  send: (variables: V) => Promise<R>,
  optimistic: (detail: RevisionDetail, variables: V) => RevisionDetail,
  touched: (variables: V) => string[],
  confirm?: (detail: RevisionDetail, variables: V, result: R) => RevisionDetail,
) {
  const queryClient = useQueryClient();
  const key = sheetKeys.revision(craftId, revisionId);
  return useMutation<R, Error, V, Snapshot>({
    mutationFn: send,
    onMutate: async (variables) => {
      await queryClient.cancelQueries({ queryKey: key });
      const previous = queryClient.getQueryData<RevisionDetail>(key);
      if (previous !== undefined) queryClient.setQueryData(key, optimistic(previous, variables));
      return { previous };
    },
    onError: (_error, variables, context) => {
      // Only the rows this change touched go back, so other edits made meanwhile stay.
      rollBack(queryClient, key, context?.previous, touched(variables));
    },
    onSuccess: (result, variables) => {
      if (confirm !== undefined) queryClient.setQueryData<RevisionDetail>(key, (detail) => detail && confirm(detail, variables, result));
    },
    onSettled: () => queryClient.invalidateQueries({ queryKey: key }),
  });
}

function rollBack(queryClient: QueryClient, key: readonly unknown[], previous: RevisionDetail | undefined, keys: string[]): void {
  if (previous === undefined) return;
  queryClient.setQueryData<RevisionDetail>(key, (detail) => (detail === undefined ? previous : restoreRows(detail, previous, keys)));
}

/** What a row edit sends: the row's key as it was read and the PATCH body (with that version). */
export type RowUpdate = { key: string; body: UpdateParameterBody };

/** Changes a row, showing the change at once and taking it back if the server refuses it. */
export function useUpdateParameter(craftId: string, revisionId: string) {
  return useRowMutation<RowUpdate, RevisionParameter>(
    craftId,
    revisionId,
    ({ key, body }) => updateParameter(craftId, revisionId, key, body),
    (detail, { key, body }) => applyUpdate(detail, key, body),
    ({ key, body }) => (body.key === undefined ? [key] : [key, body.key]),
    (detail, { key, body }, row) => replaceRow(detail, body.key ?? key, row),
  );
}

/** Adds a row, shown at once and removed again if the server refuses it. */
export function useCreateParameter(craftId: string, revisionId: string) {
  return useRowMutation<CreateParameterBody, RevisionParameter>(
    craftId,
    revisionId,
    (body) => createParameter(craftId, revisionId, body),
    applyCreate,
    (body) => [body.parameter.key],
    (detail, body, row) => replaceRow(detail, body.parameter.key, row),
  );
}

/** Removes a row, hidden at once and put back if the server refuses (409 in_use while other rows read it). */
export function useDeleteParameter(craftId: string, revisionId: string) {
  return useRowMutation<RevisionParameter, void>(
    craftId,
    revisionId,
    (row) => deleteParameter(craftId, revisionId, row.key, row.version),
    (detail, row) => applyDelete(detail, row.key),
    (row) => [row.key],
  );
}

/** A change to the craft's subsystems: add one (no id), rename one, or delete one (no name). */
export type SubsystemChange = { id?: string; name?: string };

/**
 * Adds, renames or deletes a subsystem of the craft. Subsystems are the craft's, not a revision's: every
 * cached revision of the craft is refetched afterwards (row groups and owners follow the change).
 */
export function useChangeSubsystem(craftId: string) {
  const queryClient = useQueryClient();
  return useMutation<unknown, Error, SubsystemChange>({
    mutationFn: ({ id, name }) => {
      if (id === undefined) return createSubsystem(craftId, name ?? '');
      return name === undefined ? deleteSubsystem(craftId, id) : renameSubsystem(craftId, id, name);
    },
    onSettled: () => queryClient.invalidateQueries({ queryKey: sheetKeys.craft(craftId) }),
  });
}

/** How the screen hears of others' edits: the events stream, a connection being made, or polling. */
export type LiveStatus = 'connecting' | 'live' | 'polling';

const eventTypes = sheetEventSchema.shape.type.options;

function parseJson(text: unknown): unknown {
  if (typeof text !== 'string') return undefined;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return undefined;
  }
}

/**
 * Listens to the craft's events stream and refetches the revision when its rows change. Where the stream is
 * unavailable or drops, the status turns to polling (the revision query then refetches on an interval); a
 * stream that comes back refetches once to catch up.
 */
export function useSheetEvents(craftId: string, revisionId: string | undefined): LiveStatus {
  const queryClient = useQueryClient();
  const [status, setStatus] = useState<LiveStatus>(typeof EventSource === 'undefined' ? 'polling' : 'connecting');
  useEffect(() => {
    if (typeof EventSource === 'undefined') return;
    const refetch = () => void queryClient.invalidateQueries({ queryKey: sheetKeys.craft(craftId) });
    const source = new EventSource(sheetEventsUrl(craftId), { withCredentials: true });
    let droppedBefore = false;
    const onEvent = (message: MessageEvent) => {
      const event = sheetEventSchema.safeParse(parseJson(message.data));
      if (event.success && (event.data.revisionId === null || event.data.revisionId === revisionId)) refetch();
    };
    source.onopen = () => {
      if (droppedBefore) refetch();
      setStatus('live');
    };
    source.onerror = () => {
      droppedBefore = true;
      setStatus('polling');
    };
    source.onmessage = onEvent;
    for (const type of eventTypes) source.addEventListener(type, onEvent);
    return () => source.close();
  }, [craftId, revisionId, queryClient]);
  return status;
}
