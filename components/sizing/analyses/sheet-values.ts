import type { Evaluation } from '@/shared/engine';
import type { SheetSnapshot } from '../use-sheet-session';

/** The snapshot's values and errors as the engine's evaluation, the shape the shared analyses read. */
export function evaluationOf(snapshot: SheetSnapshot): Evaluation {
  return { values: { ...snapshot.values }, errors: [...snapshot.errors] };
}

/** The message of anything a physics function throws (they throw RangeErrors naming the argument). */
export function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

/** Degrees to radians. */
export function radians(degrees: number): number {
  return (degrees * Math.PI) / 180;
}

/** Radians to degrees. */
export function degrees(rad: number): number {
  return (rad * 180) / Math.PI;
}
