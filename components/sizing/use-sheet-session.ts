import { useCallback, useMemo, useState, useSyncExternalStore } from 'react';
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
  /** Calls `listener` whenever the row of `key` changes (and only then); returns the unsubscribe. */
  subscribeRow(key: string, listener: () => void): () => void;
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
 * Rows subscribe by key: after an edit only the rows whose definition, value, error or refusal changed
 * are told, so a keystroke costs the rows it changed, not every row of the sheet.
 */
class LiveSheet implements LiveRowSource {
  private session: SheetSession | undefined;
  private state: SheetSessionState = { status: 'starting' };
  private readonly listeners = new Set<() => void>();
  private readonly rowListeners = new Map<string, Set<() => void>>();
  private subscribers = 0;
  /** Each row as the state `rowsOf` has it, by key; a row keeps its object until it changes. */
  private readonly liveRows = new Map<string, LiveRow>();
  private rowsOf: SheetSessionState | undefined;
  /** Keys of the rows that changed since the last emit. */
  private readonly changedRows = new Set<string>();

  constructor(private initial: Sheet) {}

  readonly subscribe = (listener: () => void): (() => void) => {
    this.listeners.add(listener);
    return this.hold(() => this.listeners.delete(listener));
  };

  readonly subscribeRow = (key: string, listener: () => void): (() => void) => {
    let forKey = this.rowListeners.get(key);
    if (forKey === undefined) {
      forKey = new Set();
      this.rowListeners.set(key, forKey);
    }
    forKey.add(listener);
    return this.hold(() => {
      forKey.delete(listener);
      if (forKey.size === 0) this.rowListeners.delete(key);
    });
  };

  /** Counts a subscriber in: the first opens the session, the last one out closes it. */
  private hold(release: () => void): () => void {
    this.subscribers += 1;
    if (this.session === undefined && this.state.status === 'starting') {
      this.open();
      // Nobody else listens yet: each subscriber reads the opened sheet as it subscribes, so there is no one to tell.
      this.syncRows();
      this.changedRows.clear();
    }
    let held = true;
    return () => {
      if (!held) return;
      held = false;
      release();
      this.subscribers -= 1;
      if (this.subscribers === 0) this.close();
    };
  }

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
    this.syncRows();
    return this.liveRows.get(key) ?? emptyRow;
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

  /** Tells the whole-sheet listeners, then the listeners of the rows that changed since the last time. */
  private emit(): void {
    this.syncRows();
    const changed = [...this.changedRows];
    this.changedRows.clear();
    for (const listener of [...this.listeners]) listener();
    for (const key of changed) {
      for (const listener of [...(this.rowListeners.get(key) ?? [])]) listener();
    }
  }

  /**
   * Brings `liveRows` to the current state, keeping the object of every unchanged row, and notes the keys
   * that changed for the next emit (a row read before the emit has to leave them there for it).
   */
  private syncRows(): void {
    const { state, liveRows } = this;
    if (this.rowsOf === state) return;
    this.rowsOf = state;
    const parameters = state.status === 'ready' ? state.snapshot.sheet.parameters : [];
    const values = state.status === 'ready' ? state.snapshot.values : {};
    const rejected = state.status === 'ready' ? state.rejected : {};
    const errorOf = new Map(state.status === 'ready' ? state.snapshot.errors.map((error) => [error.key, error]) : []);
    const current = new Set<string>();
    let added = false;
    for (const parameter of parameters) {
      const { key } = parameter;
      // The first row of a key is the row of that key, as everywhere else in the engine.
      if (current.has(key)) continue;
      current.add(key);
      const before = liveRows.get(key);
      const value = values[key];
      const error = errorOf.get(key);
      const rejection = rejected[key];
      if (before !== undefined && sameRow(before, parameter, value, error, rejection)) continue;
      added ||= before === undefined;
      liveRows.set(key, { parameter, value, error, rejection });
      this.changedRows.add(key);
    }
    // Only a sheet that gained a key (or has fewer) may have lost one: then look for the keys that are gone.
    if (added || current.size !== liveRows.size) {
      for (const key of liveRows.keys()) {
        if (current.has(key)) continue;
        liveRows.delete(key);
        this.changedRows.add(key);
      }
    }
  }
}

const emptyRow: LiveRow = { parameter: undefined, value: undefined, error: undefined, rejection: undefined };

function sameKeys(a: readonly Parameter[], b: readonly Parameter[]): boolean {
  return a.length === b.length && a.every((parameter, index) => parameter.key === b[index]?.key);
}

function sameParameter(a: Parameter, b: Parameter | undefined): boolean {
  return a === b || JSON.stringify(a) === JSON.stringify(b);
}

/** Whether a row reads the same with these parts: values and errors compare by content, since each state makes new ones. */
function sameRow(
  row: LiveRow,
  parameter: Parameter,
  value: EvaluatedValue | undefined,
  error: EngineError | undefined,
  rejection: Rejection | undefined,
): boolean {
  return (
    row.parameter === parameter &&
    row.value?.value === value?.value &&
    row.value?.unit === value?.unit &&
    row.error?.code === error?.code &&
    row.error?.message === error?.message &&
    row.rejection === rejection
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
  const subscribe = useCallback((listener: () => void) => rows.subscribeRow(key, listener), [rows, key]);
  const read = () => rows.row(key);
  return useSyncExternalStore(subscribe, read, read);
}
