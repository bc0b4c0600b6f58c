/** The sizing engine's public API: evaluation, live sessions, analyses, budget roll-up, units. */
export { evaluateSheet, applyOverrides, type Evaluation, type Overrides } from '@/shared/engine/evaluate';
export { createSheetSession, valueInRowUnit, type EditResult, type EvaluatedValue, type SheetSession } from '@/shared/engine/session';
export {
  goalSeek,
  sweep,
  sweep2,
  type AnalysisResult,
  type GoalSeekRequest,
  type GoalSeekResult,
  type Series,
  type Sweep2Result,
  type SweepAxis,
  type SweepResult,
} from '@/shared/engine/analyses';
export { compileSheet, evaluateCompiled, type CompiledSheet } from '@/shared/engine/compile';
export { sheetBudget, MASS_ALLOCATION_KEY } from '@/shared/engine/budget';
export { readSheet, type SheetFileError } from '@/shared/engine/read-sheet';
export { sheetFunctions } from '@/shared/engine/functions';
export { parseUnit, parseQuantity, toSI, fromSI, formatDimension, type ParsedUnit, type Dimension } from '@/shared/engine/units';
export type { EngineError, EngineErrorCode } from '@/shared/engine/errors';
