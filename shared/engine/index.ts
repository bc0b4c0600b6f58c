/** The sizing engine's public API: evaluation, live sessions, analyses, budget roll-up, units. */
export { evaluateSheet, applyOverrides, type Evaluation, type Overrides } from '@/shared/engine/evaluate';
export { createSheetSession, valueInRowUnit, type EditResult, type EvaluatedValue, type SheetSession } from '@/shared/engine/session';
export {
  findMaximum,
  solveForTarget,
  sweep,
  sweep2,
  type AnalysisResult,
  type TargetSolveRequest,
  type TargetSolveResult,
  type MaximumRequest,
  type MaximumResult,
  type RowValue,
  type Series,
  type Sweep2Result,
  type SweepAxis,
  type SweepResult,
} from '@/shared/engine/analyses';
export { compileSheet, evaluateCompiled, type CompiledSheet } from '@/shared/engine/compile';
export { sheetBudget } from '@/shared/engine/budget';
export { readSheet, type SheetFileError } from '@/shared/engine/read-sheet';
export { sheetFunctions } from '@/shared/engine/functions';
export {
  compatibleUnits,
  parseUnit,
  parseQuantity,
  toSI,
  fromSI,
  formatDimension,
  sameDimension,
  type ParsedUnit,
  type Dimension,
} from '@/shared/engine/units';
export type { EngineError, EngineErrorCode } from '@/shared/engine/errors';
