import type { Sheet } from '@/shared/schemas/sheet';
import type { UncertaintyRequest } from '@/shared/schemas/uncertainty';
import { createStudyRunner, type StudyCommand, type StudyEvent } from './study-protocol';

/** Where the web build puts the worker (same origin: `script-src 'self'`, which `worker-src` falls back to, allows it). */
export const WORKER_URL = '/uncertainty-worker.js';

/** The studies under way, by id, with the command that started them (to start them again on this thread). */
const inFlight = new Map<number, { command: StudyCommand; onEvent: (event: StudyEvent) => void }>();

function dispatch(event: StudyEvent): void {
  const entry = inFlight.get(event.id);
  if (entry === undefined) return;
  if (event.type !== 'progress') inFlight.delete(event.id);
  entry.onEvent(event);
}

let mainThread: ((command: StudyCommand) => void) | undefined;
let worker: Worker | undefined;
/** Set once the worker failed to load: later studies run on the main thread straight away. */
let workerUnavailable = false;

function onMainThread(): (command: StudyCommand) => void {
  mainThread ??= createStudyRunner(dispatch);
  return mainThread;
}

/** Where commands go: the worker where the browser has one and it loads, else the main thread. */
function runner(): { send: (command: StudyCommand) => void; inWorker: boolean } {
  if (workerUnavailable || typeof Worker !== 'function') return { send: onMainThread(), inWorker: false };
  if (worker === undefined) {
    const created = new Worker(WORKER_URL);
    created.addEventListener('message', (message: MessageEvent<StudyEvent>) => dispatch(message.data));
    created.addEventListener('error', () => {
      // The worker file did not load (an old build, a blocked script): the studies it had run here instead.
      workerUnavailable = true;
      worker = undefined;
      created.terminate();
      for (const { command } of inFlight.values()) onMainThread()(command);
    });
    worker = created;
  }
  const target = worker;
  return { send: (command) => target.postMessage(command), inWorker: true };
}

let nextId = 1;

/** A study under way: cancel stops it, and a `cancelled` event follows. */
export interface StudyHandle {
  readonly id: number;
  cancel(): void;
}

/**
 * Starts a study in the Web Worker where the browser has one, else on this thread in the same steps (jest, or a
 * worker file that does not load). `onEvent` gets this study's events, progress until the last (done, failed or
 * cancelled).
 */
export function startStudy(sheet: Sheet, request: UncertaintyRequest, onEvent: (event: StudyEvent) => void): StudyHandle {
  const id = nextId++;
  const command: StudyCommand = { type: 'run', id, sheet, request };
  inFlight.set(id, { command, onEvent });
  runner().send(command);
  return { id, cancel: () => runner().send({ type: 'cancel', id }) };
}
