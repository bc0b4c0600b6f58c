import type { LiveRowSource } from '@/components/sizing/use-sheet-session';
import type { RowAccess, SheetGroup } from './sheet-rows';
import type { RowConflict, RowMessage, SheetActions } from './use-sheet-editor';

/** What every view of one row needs: its key, the live sheet, the actions, and what is said about it. */
export interface RowBinding {
  rowKey: string;
  rows: LiveRowSource;
  actions: SheetActions;
  access: RowAccess | undefined;
  message: RowMessage | undefined;
  conflict: RowConflict | undefined;
}

/** What a view of all the rows (the table, the phone list) takes. */
export interface SheetRowsProps {
  groups: readonly SheetGroup[];
  rows: LiveRowSource;
  actions: SheetActions;
  access: Readonly<Record<string, RowAccess>>;
  messages: Readonly<Record<string, RowMessage>>;
  conflicts: Readonly<Record<string, RowConflict>>;
  /** Opens a row's edit sheet. */
  onOpenRow: (key: string) => void;
}

/** One row's binding out of the views' props. */
export function bindRow({ rows, actions, access, messages, conflicts }: SheetRowsProps, rowKey: string): RowBinding {
  return { rowKey, rows, actions, access: access[rowKey], message: messages[rowKey], conflict: conflicts[rowKey] };
}
