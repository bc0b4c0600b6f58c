import { useMemo, useSyncExternalStore } from 'react';
import type { BudgetRollUp } from '@/shared/budget';
import {
  createSheetSession,
  sheetBudget,
  type AnalysisResult,
  type EditResult,
  type EngineError,
  type EvaluatedValue,
  type SheetSession,
} from '@/shared/engine';
import type { Sheet } from '@/shared/schemas/sheet';

/** The sheet as evaluated after the latest edit: what the screen shows. */
export interface SheetSnapshot {
  readonly sheet: Sheet;
  readonly values: Readonly<Record<string, EvaluatedValue>>;
  readonly errors: readonly EngineError[];
  readonly budget: AnalysisResult<BudgetRollUp>;
  readonly canUndo: boolean;
  readonly canRedo: boolean;
}

/** An edit the engine refused: the text as typed and why. The row keeps its previous value. */
export interface Rejection {
  readonly text: string;
  readonly error: EngineError;
}

/** Where the live sheet stands: being opened, open, or failed (the engine could not be built or threw). */
export type SheetSessionState =
  | { readonly status: 'starting' }
  | { readonly status: 'failed'; readonly message: string }
  | {
      readonly status: 'ready';
      readonly snapshot: SheetSnapshot;
      /** Refused edits by row key, shown beside their rows until the row is edited again. */
      readonly rejected: Readonly<Record<string, Rejection>>;
      /** How many rows the last edit recomputed; undefined before the first edit. */
      readonly recomputed: number | undefined;
    };

/** The live sheet and what a person can do with it. */
export interface SheetSessionHandle {
  readonly state: SheetSessionState;
  /** Sets an input row from typed text ("60", "60 m", "25 um"); false when the engine refused it. */
  setInput(key: string, text: string): boolean;
  undo(): void;
  redo(): void;
  /** Starts again from the sheet the hook was given; the undo history is dropped. */
  reset(): void;
}

function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

/**
 * Holds one engine session outside React, as an external store: the session is opened when the first
 * component subscribes and destroyed when the last one leaves, so a remount (React's strict mode does
 * one) never leaks a workbook, and every engine call happens in a subscription or an event handler.
 */
class LiveSheet {
  private session: SheetSession | undefined;
  private state: SheetSessionState = { status: 'starting' };
  private readonly listeners = new Set<() => void>();

  constructor(private readonly initial: Sheet) {}

  readonly subscribe = (listener: () => void): (() => void) => {
    this.listeners.add(listener);
    if (this.session === undefined && this.state.status === 'starting') this.open();
    return () => {
      this.listeners.delete(listener);
      if (this.listeners.size === 0) this.close();
    };
  };

  readonly getSnapshot = (): SheetSessionState => this.state;

  readonly setInput = (key: string, text: string): boolean => {
    let accepted = false;
    this.edit((session, rejected) => {
      const result = session.setInput(key, text);
      const { [key]: _previous, ...others } = rejected;
      accepted = result.ok;
      return { result, rejected: result.ok ? others : { ...others, [key]: { text, error: result.error } } };
    });
    return accepted;
  };

  readonly undo = (): void => this.edit((session) => ({ result: session.undo(), rejected: {} }));

  readonly redo = (): void => this.edit((session) => ({ result: session.redo(), rejected: {} }));

  readonly reset = (): void => {
    this.close();
    this.open();
    this.emit();
  };

  private open(): void {
    try {
      const session = createSheetSession(this.initial);
      this.session = session;
      this.state = { status: 'ready', snapshot: snapshotOf(session), rejected: {}, recomputed: undefined };
    } catch (error) {
      this.close();
      this.state = { status: 'failed', message: messageOf(error) };
    }
  }

  private close(): void {
    this.session?.destroy();
    this.session = undefined;
    this.state = { status: 'starting' };
  }

  /** Runs one edit; an exception from the engine turns the screen to its error state instead of crashing it. */
  private edit(
    change: (
      session: SheetSession,
      rejected: Readonly<Record<string, Rejection>>,
    ) => { result: EditResult | false; rejected: Readonly<Record<string, Rejection>> },
  ): void {
    const { session, state } = this;
    if (session === undefined || state.status !== 'ready') return;
    try {
      const { result, rejected } = change(session, state.rejected);
      const recomputed = result !== false && result.ok ? result.recomputed.length : state.recomputed;
      this.state = { status: 'ready', snapshot: snapshotOf(session), rejected, recomputed };
    } catch (error) {
      this.close();
      this.state = { status: 'failed', message: messageOf(error) };
    }
    this.emit();
  }

  private emit(): void {
    for (const listener of this.listeners) listener();
  }
}

function snapshotOf(session: SheetSession): SheetSnapshot {
  const sheet = session.sheet();
  const values = session.values();
  const errors = session.errors();
  return {
    sheet,
    values,
    errors,
    budget: sheetBudget(sheet, { values, errors }),
    canUndo: session.canUndo(),
    canRedo: session.canRedo(),
  };
}

/**
 * A live engine session on `sheet` with React state: values, row errors, the mass budget, undo and redo.
 * Pass a stable sheet (a new object starts a new session).
 */
export function useSheetSession(sheet: Sheet): SheetSessionHandle {
  const live = useMemo(() => new LiveSheet(sheet), [sheet]);
  const state = useSyncExternalStore(live.subscribe, live.getSnapshot, live.getSnapshot);
  return { state, setInput: live.setInput, undo: live.undo, redo: live.redo, reset: live.reset };
}
