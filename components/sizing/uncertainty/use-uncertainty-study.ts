import { useCallback, useEffect, useRef, useState } from 'react';
import type { FieldError } from '@/shared/schemas/common';
import type { Sheet } from '@/shared/schemas/sheet';
import type { UncertaintyRequest, UncertaintyResult } from '@/shared/schemas/uncertainty';
import { startStudy, type StudyHandle } from './study-client';

/** Where the screen's study stands. */
export type UncertaintyState =
  | { readonly status: 'idle' }
  | { readonly status: 'running'; readonly done: number; readonly total: number }
  | { readonly status: 'done'; readonly result: UncertaintyResult; readonly sheet: Sheet }
  | { readonly status: 'failed'; readonly problems: readonly FieldError[] }
  | { readonly status: 'cancelled' };

/**
 * Runs uncertainty studies off the main thread (a Web Worker, see study-client) with progress and cancel; a new
 * run or leaving the screen cancels the one under way.
 */
export function useUncertaintyStudy(): {
  state: UncertaintyState;
  run: (sheet: Sheet, request: UncertaintyRequest) => void;
  cancel: () => void;
} {
  const [state, setState] = useState<UncertaintyState>({ status: 'idle' });
  const current = useRef<StudyHandle | undefined>(undefined);
  // Counts runs: events of an earlier run (or one started before its handle came back) are dropped.
  const generation = useRef(0);
  useEffect(
    () => () => {
      generation.current += 1;
      current.current?.cancel();
    },
    [],
  );

  const cancel = useCallback(() => {
    current.current?.cancel();
  }, []);

  const run = useCallback((sheet: Sheet, request: UncertaintyRequest) => {
    current.current?.cancel();
    generation.current += 1;
    const mine = generation.current;
    setState({ status: 'running', done: 0, total: request.samples });
    current.current = startStudy(sheet, request, (event) => {
      if (generation.current !== mine) return;
      if (event.type === 'progress') setState({ status: 'running', done: event.done, total: event.total });
      else if (event.type === 'done') setState({ status: 'done', result: event.result, sheet });
      else if (event.type === 'failed') setState({ status: 'failed', problems: event.problems });
      else setState({ status: 'cancelled' });
    });
  }, []);

  return { state, run, cancel };
}
