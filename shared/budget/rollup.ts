import { growthAllowance, predictedMass } from '@/shared/budget/allowance';
import {
  BudgetInputError,
  type AllowancePreset,
  type BudgetRollUp,
  type BudgetRow,
  type BudgetRowInput,
  type SubsystemTotal,
  type SystemMarginBasis,
} from '@/shared/budget/types';

/** Options of a roll-up: the mass allocation and the system margin required of it. */
export interface RollUpOptions {
  /** Mass allocation (kg), > 0. */
  readonly allocation: number;
  /** Required system margin (%, of the preset's basis); defaults to the preset's systemMarginPercent. */
  readonly requiredMarginPercent?: number;
}

function rollUpRow(row: BudgetRowInput, index: number, preset: AllowancePreset): BudgetRow {
  const where = `rows[${index}] ('${row.key}')`;
  try {
    const allowance = growthAllowance(preset, row.maturity, row.category);
    return { ...row, allowance, predicted: predictedMass(row.cbe, allowance) };
  } catch (error) {
    if (error instanceof BudgetInputError) throw new BudgetInputError(`${where}.${error.path}`, error.detail, row.key);
    throw error;
  }
}

/**
 * Whether the system margin (allocation − predicted, kg) falls short of `requiredPercent` % of the basis: the
 * one statement of the rule, for the roll-up and for anything judging many allocations (an uncertainty study).
 */
export function marginBelowRequired(allocation: number, predicted: number, requiredPercent: number, basis: SystemMarginBasis): boolean {
  return basis === 'predicted'
    ? allocation < (1 + requiredPercent / 100) * predicted
    : ((allocation - predicted) / allocation) * 100 < requiredPercent;
}

/**
 * Rolls a mass budget up: allowance and predicted mass per row, sums per subsystem (in order of
 * first appearance) and in total, and the system margin = allocation − predicted total, checked against the
 * required margin on the preset's basis (a share of the allocation, or of the predicted mass as ESA states it).
 * @param rows budget lines; keys must be unique, cbe in kg
 * @param preset allowance preset giving each row's allowance
 * @param options allocation (kg) and required margin (% of allocation)
 * @returns the rolled-up budget (kg)
 * @throws BudgetInputError naming the row and field for any bad input; nothing is returned partially
 */
export function rollUpBudget(rows: readonly BudgetRowInput[], preset: AllowancePreset, options: RollUpOptions): BudgetRollUp {
  const { allocation } = options;
  if (!Number.isFinite(allocation) || allocation <= 0) {
    throw new BudgetInputError('allocation', `must be a finite mass > 0 kg, got ${String(allocation)}`);
  }
  const requiredPercent = options.requiredMarginPercent ?? preset.systemMarginPercent;
  if (!Number.isFinite(requiredPercent) || requiredPercent < 0 || requiredPercent >= 100) {
    throw new BudgetInputError('requiredMarginPercent', `must be a percentage in [0, 100), got ${String(requiredPercent)}`);
  }
  const seen = new Set<string>();
  rows.forEach((row, index) => {
    if (seen.has(row.key)) throw new BudgetInputError(`rows[${index}].key`, `duplicate key '${row.key}'`, row.key);
    seen.add(row.key);
  });

  const rolled = rows.map((row, index) => rollUpRow(row, index, preset));
  const subsystems = new Map<string, { cbe: number; predicted: number }>();
  let cbe = 0;
  let predicted = 0;
  for (const row of rolled) {
    const sums = subsystems.get(row.subsystem) ?? { cbe: 0, predicted: 0 };
    sums.cbe += row.cbe;
    sums.predicted += row.predicted;
    subsystems.set(row.subsystem, sums);
    cbe += row.cbe;
    predicted += row.predicted;
  }
  const bySubsystem: SubsystemTotal[] = [...subsystems].map(([subsystem, sums]) => ({ subsystem, ...sums }));
  const marginKg = allocation - predicted;
  const percentOfAllocation = (marginKg / allocation) * 100;
  const basis = preset.systemMarginBasis;
  // A margin of p % of the predicted mass is p / (100 + p) of the allocation: 20 % of predicted is 16.7 % of allocation.
  const requiredOfAllocation = basis === 'predicted' ? (100 * requiredPercent) / (100 + requiredPercent) : requiredPercent;
  const belowRequired = marginBelowRequired(allocation, predicted, requiredPercent, basis);
  return {
    rows: rolled,
    bySubsystem,
    total: { cbe, predicted },
    systemMargin: {
      kg: marginKg,
      percentOfAllocation,
      percentOfPredicted: predicted > 0 ? (marginKg / predicted) * 100 : null,
      requiredPercent: requiredOfAllocation,
      requiredPercentOfBasis: requiredPercent,
      requiredBasis: basis,
      belowRequired,
    },
  };
}
