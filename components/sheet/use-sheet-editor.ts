import { useQueryClient } from '@tanstack/react-query';
import { useLayoutEffect, useMemo, useRef, useState } from 'react';
import { z } from 'zod';
import { ApiError } from '@/components/api/client';
import type { FollowingSheetHandle } from '@/components/sizing/use-sheet-session';
import {
  versionConflictDetailsSchema,
  type CreateParameterBody,
  type RevisionDetail,
  type RevisionParameter,
  type UpdateParameterBody,
} from '@/shared/schemas/revisions';
import type { EngineErrorCode } from '@/shared/engine';
import { sheetKeys, useCreateParameter, useDeleteParameter, useUpdateParameter } from './queries';
import { replaceRow, toParameter } from './revision-cache';

/** The fields of a row edit, without the version it was read at. */
export type RowFields = Omit<UpdateParameterBody, 'version'>;

/** A save the server refused because someone changed the row first: the person's change and the row now. */
export interface RowConflict {
  readonly mine: RowFields;
  readonly current: RevisionParameter;
}

/** Said beside a row: why the server refused a change (and, for a delete, which rows still read it). */
export interface RowMessage {
  readonly text: string;
  readonly usedBy?: readonly string[];
}

/** One of the person's own saved edits, with what undoes it. */
interface OwnEdit {
  readonly key: string;
  readonly before: RowFields;
  readonly after: RowFields;
}

/** What the rows call; the object stays the same across renders so that memoised rows do not re-render. */
export interface SheetActions {
  /** The person typed in a row: the engine recomputes at once, nothing is sent. */
  change(key: string, text: string): void;
  /** Enter or leaving the field: saves the typed text if the engine accepts it. */
  commit(key: string, text: string): void;
  /** Escape: the row goes back to its saved definition. */
  cancel(key: string): void;
  /** Saves other fields of a row (unit, label, maturity, subsystem, key, position). */
  save(key: string, fields: RowFields): void;
  remove(key: string): void;
  keepMine(key: string): void;
  takeTheirs(key: string): void;
}

export interface SheetEditor {
  readonly actions: SheetActions;
  readonly messages: Readonly<Record<string, RowMessage>>;
  readonly conflicts: Readonly<Record<string, RowConflict>>;
  readonly canUndo: boolean;
  readonly canRedo: boolean;
  undo(): void;
  redo(): void;
  /** Adds a row; rejects with the server's error for the form to show. */
  add(body: CreateParameterBody): Promise<void>;
  /** Keys being typed in: the server's copies of these rows wait until the person is done. */
  readonly pinned: ReadonlySet<string>;
}

/** Formula errors of the row itself (not of rows it reads) that the server would refuse as well. */
const unsendable = new Set<EngineErrorCode>([
  'syntax_error',
  'unknown_key',
  'unknown_function',
  'wrong_argument_count',
  'cycle',
  'dimension_mismatch',
  'unknown_unit',
]);

const inUseDetailsSchema = z.object({ keys: z.array(z.string()) });

/** The fields that put a row back as it is now, for the fields an edit is about to change; undefined when not invertible. */
function inverseOf(row: RevisionParameter, fields: RowFields): RowFields | undefined {
  const inverse: RowFields = {};
  if (fields.value !== undefined || fields.formula !== undefined) {
    if (row.formula !== undefined) inverse.formula = row.formula;
    else if (row.value !== undefined) inverse.value = row.value;
    else return undefined;
  }
  if (fields.unit !== undefined) inverse.unit = row.unit;
  if (fields.label !== undefined) inverse.label = row.label;
  if (fields.note !== undefined) inverse.note = row.note ?? '';
  if (fields.subsystem !== undefined) inverse.subsystem = row.subsystem;
  if (fields.mass !== undefined) inverse.mass = row.mass ?? null;
  // Renames and moves are not undone here: they change other rows too.
  if (fields.key !== undefined || fields.before !== undefined) return undefined;
  return inverse;
}

function without<T>(record: Readonly<Record<string, T>>, key: string): Record<string, T> {
  const { [key]: _dropped, ...rest } = record;
  return rest;
}

/**
 * The editing of a craft's sheet: typed text goes to the live engine at once, saves go to the server as
 * optimistic mutations, refusals roll back with the server's words beside the row, version conflicts offer
 * both copies, and the person's own saved edits can be undone and redone (each undo is a new save).
 */
export function useSheetEditor(craftId: string, detail: RevisionDetail, live: FollowingSheetHandle): SheetEditor {
  const queryClient = useQueryClient();
  const revisionId = detail.revision.id;
  const update = useUpdateParameter(craftId, revisionId);
  const create = useCreateParameter(craftId, revisionId);
  const destroy = useDeleteParameter(craftId, revisionId);
  const [messages, setMessages] = useState<Readonly<Record<string, RowMessage>>>({});
  const [conflicts, setConflicts] = useState<Readonly<Record<string, RowConflict>>>({});
  const [history, setHistory] = useState<{ undo: OwnEdit[]; redo: OwnEdit[] }>({ undo: [], redo: [] });
  const [pinned] = useState(() => new Set<string>());

  // Rows and handlers read the latest values through this ref, so `actions` never changes identity.
  const latest = useRef({ detail, live, update, destroy, conflicts });
  useLayoutEffect(() => {
    latest.current = { detail, live, update, destroy, conflicts };
  });

  const actions = useMemo<SheetActions>(() => {
    // The version of each row a person is typing in, as it was when they started: a save is checked against it.
    const readAt = new Map<string, number>();
    const rowOf = (key: string) => latest.current.detail.sheet.parameters.find((row) => row.key === key);

    const refused = (key: string, error: Error, mine: RowFields) => {
      const conflict =
        error instanceof ApiError && error.code === 'version_conflict' ? versionConflictDetailsSchema.safeParse(error.details) : undefined;
      if (conflict?.success === true) {
        const { current } = conflict.data;
        queryClient.setQueryData<RevisionDetail>(
          sheetKeys.revision(craftId, revisionId),
          (cached) => cached && replaceRow(cached, key, current),
        );
        setConflicts((all) => ({ ...all, [key]: { mine, current } }));
        return;
      }
      setMessages((all) => ({ ...all, [key]: { text: `Not saved: ${error.message}` } }));
    };

    /**
     * Sends fields for a row, checked against the version the person read it at (by default the row's current
     * one); `onSaved` runs once the server accepted them.
     */
    const send = (key: string, fields: RowFields, readVersion?: number, onSaved?: (before: RowFields | undefined) => void) => {
      const row = rowOf(key);
      if (row === undefined) return;
      const before = inverseOf(row, fields);
      setMessages((all) => without(all, key));
      latest.current.update.mutate(
        { key, body: { ...fields, version: readVersion ?? row.version } },
        { onError: (error) => refused(key, error, fields), onSuccess: () => onSaved?.(before) },
      );
    };

    const record = (key: string, fields: RowFields, readVersion?: number) =>
      send(key, fields, readVersion, (before) => {
        if (before !== undefined) setHistory(({ undo }) => ({ undo: [...undo, { key, before, after: fields }], redo: [] }));
      });

    const restoreSaved = (key: string) => {
      const row = rowOf(key);
      if (row !== undefined) latest.current.live.restore(toParameter(row));
    };

    return {
      change: (key, text) => {
        const row = rowOf(key);
        if (!pinned.has(key) && row !== undefined) readAt.set(key, row.version);
        pinned.add(key);
        latest.current.live.setText(key, text);
      },
      cancel: (key) => {
        pinned.delete(key);
        readAt.delete(key);
        restoreSaved(key);
      },
      commit: (key, text) => {
        pinned.delete(key);
        const readVersion = readAt.get(key);
        readAt.delete(key);
        const saved = rowOf(key);
        if (saved === undefined) return;
        const formula = text.trimStart().startsWith('=');
        if (formula && text.trim() === saved.formula) return restoreSaved(key);
        // The engine's parse is the validation: refused text stays beside the row and nothing is sent.
        if (!latest.current.live.setText(key, text)) return;
        const { parameter: edited, error } = latest.current.live.rows.row(key);
        if (formula) {
          // A formula the engine cannot read (its error is shown in the row's status) is not sent.
          if (error === undefined || !unsendable.has(error.code)) record(key, { formula: text.trim() }, readVersion);
        } else if (edited?.value !== undefined && edited.value !== saved.value) {
          record(key, { value: edited.value }, readVersion);
        }
      },
      save: (key, fields) => record(key, fields),
      remove: (key) => {
        const row = rowOf(key);
        if (row === undefined) return;
        setMessages((all) => without(all, key));
        latest.current.destroy.mutate(row, {
          onError: (error) => {
            const inUse = error instanceof ApiError && error.code === 'in_use' ? inUseDetailsSchema.safeParse(error.details) : undefined;
            const usedBy = inUse?.success === true ? inUse.data.keys : undefined;
            setMessages((all) => ({ ...all, [key]: { text: `Not deleted: ${error.message}`, usedBy } }));
          },
        });
      },
      keepMine: (key) => {
        const conflict = latest.current.conflicts[key];
        setConflicts((all) => without(all, key));
        if (conflict !== undefined) record(key, conflict.mine);
      },
      takeTheirs: (key) => setConflicts((all) => without(all, key)),
    };
  }, [queryClient, craftId, revisionId, pinned]);

  const step = (from: 'undo' | 'redo') => {
    const edit = history[from].at(-1);
    if (edit === undefined) return;
    const fields = from === 'undo' ? edit.before : edit.after;
    const row = detail.sheet.parameters.find((candidate) => candidate.key === edit.key);
    if (row === undefined) return;
    setMessages((all) => without(all, edit.key));
    update.mutate(
      { key: edit.key, body: { ...fields, version: row.version } },
      {
        onError: (error) =>
          setMessages((all) => ({ ...all, [edit.key]: { text: `Not ${from === 'undo' ? 'undone' : 'redone'}: ${error.message}` } })),
        onSuccess: () =>
          setHistory((now) =>
            from === 'undo'
              ? { undo: now.undo.slice(0, -1), redo: [...now.redo, edit] }
              : { undo: [...now.undo, edit], redo: now.redo.slice(0, -1) },
          ),
      },
    );
  };

  return {
    actions,
    messages,
    conflicts,
    canUndo: history.undo.length > 0,
    canRedo: history.redo.length > 0,
    undo: () => step('undo'),
    redo: () => step('redo'),
    add: async (body) => {
      await create.mutateAsync(body);
    },
    pinned,
  };
}
