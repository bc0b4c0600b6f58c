import type { FieldError } from '@/shared/schemas/common';
import type { Sheet } from '@/shared/schemas/sheet';
import type { UncertaintyRequest, UncertaintyResult } from '@/shared/schemas/uncertainty';
import { prepareStudy, type StudyOptions } from '@/shared/uncertainty';

/**
 * The messages between a screen and whoever runs its uncertainty study: a Web Worker in the browser, or the
 * same runner on the main thread where there is no worker (tests, a build without the worker file). Both
 * sides speak only plain data, so the messages cross a worker boundary as they are.
 */
export type StudyCommand =
  | { readonly type: 'run'; readonly id: number; readonly sheet: Sheet; readonly request: UncertaintyRequest }
  | { readonly type: 'cancel'; readonly id: number };

export type StudyEvent =
  | { readonly type: 'progress'; readonly id: number; readonly done: number; readonly total: number }
  | { readonly type: 'done'; readonly id: number; readonly result: UncertaintyResult }
  | { readonly type: 'failed'; readonly id: number; readonly problems: readonly FieldError[] }
  | { readonly type: 'cancelled'; readonly id: number };

/** Samples between two progress reports: a few frames' work even on the closures a strict content policy leaves. */
export const SAMPLES_PER_STEP = 5000;

/** Lets other work (a cancel message, a frame) run before `next`. */
export type Yield = (next: () => void) => void;

const nextTurn: Yield = (next) => {
  setTimeout(next, 0);
};

/**
 * A runner of study commands: a run prepares the study, then evaluates SAMPLES_PER_STEP samples per turn,
 * posting progress after each, and the result at the end; a cancel (or a newer run) stops the one under way
 * at the next turn, which then posts `cancelled`. Problems of the request come back as `failed`.
 */
export function createStudyRunner(post: (event: StudyEvent) => void, yieldTurn: Yield = nextTurn, options: StudyOptions = {}) {
  let current: number | undefined;
  return (command: StudyCommand): void => {
    if (command.type === 'cancel') {
      if (current === command.id) current = undefined;
      return;
    }
    const { id } = command;
    current = id;
    let prepared: ReturnType<typeof prepareStudy>;
    try {
      prepared = prepareStudy(command.sheet, command.request, options);
    } catch (error) {
      post({ type: 'failed', id, problems: [{ path: '', message: error instanceof Error ? error.message : String(error) }] });
      return;
    }
    if (!prepared.ok) {
      post({ type: 'failed', id, problems: prepared.problems });
      return;
    }
    const { study } = prepared;
    const step = () => {
      if (current !== id) {
        post({ type: 'cancelled', id });
        return;
      }
      study.step(SAMPLES_PER_STEP);
      post({ type: 'progress', id, done: study.done, total: study.total });
      if (study.done < study.total) {
        yieldTurn(step);
        return;
      }
      current = undefined;
      post({ type: 'done', id, result: study.result() });
    };
    yieldTurn(step);
  };
}
