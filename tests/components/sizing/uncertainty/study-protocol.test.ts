import { startStudy } from '@/components/sizing/uncertainty/study-client';
import { createStudyRunner, SAMPLES_PER_STEP, type StudyEvent } from '@/components/sizing/uncertainty/study-protocol';
import { uncertaintyRequestSchema } from '@/shared/schemas/uncertainty';
import { squareSailTemplate } from '@/shared/templates';
import { runStudy } from '@/shared/uncertainty';

const sheet = squareSailTemplate();
const request = uncertaintyRequestSchema.parse({
  inputs: [{ key: 'sail_side', distribution: { kind: 'uniform', min: 35, max: 45 } }],
  samples: 3 * SAMPLES_PER_STEP + 10,
  seed: 3,
});

/** A runner whose turns run only when the test says, as a worker's event loop would between messages. */
function manualRunner() {
  const events: StudyEvent[] = [];
  const turns: (() => void)[] = [];
  const handle = createStudyRunner(
    (event) => events.push(event),
    (next) => turns.push(next),
  );
  const turn = () => turns.shift()?.();
  return { events, handle, turn, pending: () => turns.length };
}

describe('the study protocol', () => {
  it('reports progress after each step, then the result the study gives in one go', () => {
    const { events, handle, turn, pending } = manualRunner();
    handle({ type: 'run', id: 1, sheet, request });
    expect(events).toEqual([]);
    while (pending() > 0) turn();
    expect(events.filter((event) => event.type === 'progress').map((event) => (event.type === 'progress' ? event.done : 0))).toEqual([
      SAMPLES_PER_STEP,
      2 * SAMPLES_PER_STEP,
      3 * SAMPLES_PER_STEP,
      request.samples,
    ]);
    const last = events[events.length - 1];
    const whole = runStudy(sheet, request);
    expect(last).toEqual({ type: 'done', id: 1, result: whole.ok ? whole.result : undefined });
  });

  it('stops at the next turn when cancelled, says so, and never sends a result', () => {
    const { events, handle, turn, pending } = manualRunner();
    handle({ type: 'run', id: 7, sheet, request });
    turn();
    handle({ type: 'cancel', id: 7 });
    while (pending() > 0) turn();
    expect(events.map((event) => event.type)).toEqual(['progress', 'cancelled']);
  });

  it('cancels a study under way when another starts, and ignores a cancel of another id', () => {
    const { events, handle, turn, pending } = manualRunner();
    handle({ type: 'run', id: 1, sheet, request });
    turn();
    handle({ type: 'run', id: 2, sheet, request: { ...request, samples: 100 } });
    handle({ type: 'cancel', id: 1 });
    while (pending() > 0) turn();
    expect(events.map((event) => `${event.type} ${event.id}`)).toEqual(['progress 1', 'cancelled 1', 'progress 2', 'done 2']);
  });

  it('answers a request the sheet cannot run with its problems', () => {
    const { events, handle } = manualRunner();
    handle({
      type: 'run',
      id: 4,
      sheet,
      request: { ...request, inputs: [{ key: 'sail_area', distribution: { kind: 'uniform', min: 1, max: 2 } }] },
    });
    expect(events).toEqual([
      { type: 'failed', id: 4, problems: [{ path: 'inputs.0.key', message: expect.stringContaining('is a formula') }] },
    ]);
  });
});

describe('startStudy', () => {
  afterEach(() => {
    delete (globalThis as { Worker?: unknown }).Worker;
  });

  it('runs on this thread where there is no Web Worker', async () => {
    expect(typeof Worker).toBe('undefined');
    const events: StudyEvent[] = [];
    await new Promise<void>((resolve) => {
      startStudy(sheet, { ...request, samples: 200 }, (event) => {
        events.push(event);
        if (event.type !== 'progress') resolve();
      });
    });
    expect(events.map((event) => event.type)).toEqual(['progress', 'done']);
  });

  it('starts the worker from its same-origin file, and runs the study here when that file does not load', async () => {
    const created: string[] = [];
    class MissingWorker extends EventTarget {
      constructor(url: string) {
        super();
        created.push(url);
        setTimeout(() => this.dispatchEvent(new Event('error')), 0);
      }
      postMessage() {}
      terminate() {}
    }
    (globalThis as { Worker?: unknown }).Worker = MissingWorker;
    const last = await new Promise<StudyEvent>((resolve) => {
      startStudy(sheet, { ...request, samples: 200 }, (event) => {
        if (event.type !== 'progress') resolve(event);
      });
    });
    expect(created).toEqual(['/uncertainty-worker.js']);
    expect(last.type).toBe('done');
  });
});
