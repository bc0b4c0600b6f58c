/**
 * The uncertainty study's Web Worker. Metro does not bundle workers: the web build bundles this file on its own
 * with esbuild into dist/uncertainty-worker.js (server/dev/stack.ts), and the screen starts it from that
 * same-origin address, which the content security policy allows.
 */
import { createStudyRunner, type StudyCommand, type StudyEvent } from './study-protocol';

interface WorkerScope {
  postMessage(event: StudyEvent): void;
  onmessage: ((message: { data: StudyCommand }) => void) | null;
}

const scope = globalThis as unknown as WorkerScope;
const handle = createStudyRunner((event) => scope.postMessage(event));
scope.onmessage = (message) => handle(message.data);
