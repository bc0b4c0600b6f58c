import { useMemo, useState, useSyncExternalStore } from 'react';
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
import type { Parameter, Sheet } from '@/shared/schemas/sheet';

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

/** One row as the live sheet has it now; the same object until the row's definition, value or error changes. */
export interface LiveRow {
  readonly parameter: Parameter | undefined;
  readonly value: EvaluatedValue | undefined;
  readonly error: EngineError | undefined;
  readonly rejection: Rejection | undefined;
}

/** What a row component subscribes to, so that an edit re-renders only the rows whose results changed. */
export interface LiveRowSource {
  subscribe(listener: () => void): () => void;
  row(key: string): LiveRow;
}

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

/** A live craft sheet that follows the server's copy while a person edits some of its rows. */
export interface FollowingSheetHandle {
  readonly state: SheetSessionState;
  readonly rows: LiveRowSource;
  /** Tries typed text on a row: "=..." as a formula, anything else as an input; false when the engine refused it. */
  setText(key: string, text: string): boolean;
  /** Puts a row back to a definition (the saved one, when a person cancels an edit). */
  restore(parameter: Parameter): void;
  /**
   * Takes the server's sheet into the session: changed rows are updated in place, a changed set or order of
   * rows rebuilds the session. Rows named in `pinned` (being edited here) keep their live definition.
   */
  follow(sheet: Sheet, pinned: ReadonlySet<string>): void;
  /** Starts again from the sheet most recently followed. */
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
class LiveSheet implements LiveRowSource {
  private session: SheetSession | undefined;
  private state: SheetSessionState = { status: 'starting' };
  private readonly listeners = new Set<() => void>();
  private readonly rowCache = new Map<string, { state: SheetSessionState; row: LiveRow }>();
  private errorsOf: { state: SheetSessionState; byKey: Map<string, EngineError> } | undefined;

  constructor(private initial: Sheet) {}

  readonly subscribe = (listener: () => void): (() => void) => {
    this.listeners.add(listener);
    if (this.session === undefined && this.state.status === 'starting') this.open();
    return () => {
      this.listeners.delete(listener);
      if (this.listeners.size === 0) this.close();
    };
  };

  readonly getSnapshot = (): SheetSessionState => this.state;

  readonly setInput = (key: string, text: string): boolean => this.tryRow(key, text, (session) => session.setInput(key, text));

  readonly setText = (key: string, text: string): boolean =>
    text.trimStart().startsWith('=') ? this.tryRow(key, text, (session) => session.setFormula(key, text.trim())) : this.setInput(key, text);

  readonly restore = (parameter: Parameter): void =>
    this.edit((session, rejected) => {
      const { [parameter.key]: _previous, ...others } = rejected;
      return { result: session.updateParameter(parameter.key, parameter), rejected: others };
    });

  readonly follow = (sheet: Sheet, pinned: ReadonlySet<string>): void => {
    const { session, state } = this;
    if (session === undefined || state.status !== 'ready') {
      this.initial = sheet;
      return;
    }
    const current = session.sheet();
    const live = new Map(current.parameters.map((parameter) => [parameter.key, parameter]));
    const next: Sheet = {
      ...sheet,
      parameters: sheet.parameters.map((parameter) => (pinned.has(parameter.key) ? (live.get(parameter.key) ?? parameter) : parameter)),
    };
    this.initial = next;
    const sameRows =
      current.name === next.name &&
      JSON.stringify(current.budget) === JSON.stringify(next.budget) &&
      sameKeys(current.parameters, next.parameters);
    const changed = sameRows ? next.parameters.filter((parameter) => !sameParameter(parameter, live.get(parameter.key))) : [];
    // Protected rows refuse in-place edits, so a change to one rebuilds the session like a change of rows.
    if (!sameRows || changed.some((parameter) => parameter.protected === true || live.get(parameter.key)?.protected === true)) {
      const rejected = state.rejected;
      this.close();
      this.open();
      if (this.state.status === 'ready') this.state = { ...this.state, rejected };
      this.emit();
      return;
    }
    if (changed.length === 0) return;
    this.edit((open, rejected) => {
      let result: EditResult | false = false;
      for (const parameter of changed) result = open.updateParameter(parameter.key, parameter);
      return { result, rejected };
    });
  };

  readonly row = (key: string): LiveRow => {
    const state = this.state;
    const cached = this.rowCache.get(key);
    if (cached !== undefined && cached.state === state) return cached.row;
    const next = state.status === 'ready' ? this.readRow(state, key) : emptyRow;
    const row = cached !== undefined && sameRow(cached.row, next) ? cached.row : next;
    this.rowCache.set(key, { state, row });
    return row;
  };

  private readRow(state: Extract<SheetSessionState, { status: 'ready' }>, key: string): LiveRow {
    if (this.errorsOf?.state !== state) {
      this.errorsOf = { state, byKey: new Map(state.snapshot.errors.map((error) => [error.key, error])) };
    }
    return {
      parameter: state.snapshot.sheet.parameters[this.indexOf(state, key)],
      value: state.snapshot.values[key],
      error: this.errorsOf.byKey.get(key),
      rejection: state.rejected[key],
    };
  }

  private indexCache: { sheet: Sheet; indexOf: Map<string, number> } | undefined;

  private indexOf(state: Extract<SheetSessionState, { status: 'ready' }>, key: string): number {
    const { sheet } = state.snapshot;
    // Checked once per snapshot; the index itself is rebuilt only when the list of keys differs.
    if (this.indexCache?.sheet !== sheet) {
      const indexOf =
        this.indexCache !== undefined && sameKeys(this.indexCache.sheet.parameters, sheet.parameters)
          ? this.indexCache.indexOf
          : new Map(sheet.parameters.map((parameter, index) => [parameter.key, index]));
      this.indexCache = { sheet, indexOf };
    }
    return this.indexCache.indexOf.get(key) ?? -1;
  }

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

  /** Runs an edit of one row from typed text; a refusal is kept (with the text) until the row is edited again. */
  private tryRow(key: string, text: string, change: (session: SheetSession) => EditResult): boolean {
    let accepted = false;
    this.edit((session, rejected) => {
      const result = change(session);
      const { [key]: _previous, ...others } = rejected;
      accepted = result.ok;
      return { result, rejected: result.ok ? others : { ...others, [key]: { text, error: result.error } } };
    });
    return accepted;
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

const emptyRow: LiveRow = { parameter: undefined, value: undefined, error: undefined, rejection: undefined };

function sameKeys(a: readonly Parameter[], b: readonly Parameter[]): boolean {
  return a.length === b.length && a.every((parameter, index) => parameter.key === b[index]?.key);
}

function sameParameter(a: Parameter, b: Parameter | undefined): boolean {
  return a === b || JSON.stringify(a) === JSON.stringify(b);
}

function sameRow(a: LiveRow, b: LiveRow): boolean {
  return (
    a.parameter === b.parameter &&
    a.value?.value === b.value?.value &&
    a.value?.unit === b.value?.unit &&
    a.error?.code === b.error?.code &&
    a.error?.message === b.error?.message &&
    a.rejection === b.rejection
  );
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

/**
 * A live engine session on a craft's sheet as the server has it: `initial` opens it, then the caller passes
 * each newer server copy to `follow` (keeping the rows a person is typing in). The session outlives those
 * copies, so others' edits arrive without reopening the workbook.
 */
export function useFollowingSheetSession(initial: Sheet): FollowingSheetHandle {
  const [live] = useState(() => new LiveSheet(initial));
  const state = useSyncExternalStore(live.subscribe, live.getSnapshot, live.getSnapshot);
  return { state, rows: live, setText: live.setText, restore: live.restore, follow: live.follow, reset: live.reset };
}

/** One row of a live sheet, re-rendering its component only when that row changes. */
export function useLiveRow(rows: LiveRowSource, key: string): LiveRow {
  const read = () => rows.row(key);
  return useSyncExternalStore(rows.subscribe, read, read);
}
