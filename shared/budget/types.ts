/**
 * Mass budget types: design maturity, hardware category, allowance presets and roll-up results.
 * Masses are in kilograms; allowances are fractions (0.2 = 20 %).
 */

/** AIAA S-120A-style design maturity categories. */
export type Maturity =
  'estimated' | 'layout' | 'pre_release_drawings' | 'released_drawings' | 'existing_hardware' | 'measured' | 'customer_furnished';

/** Hardware categories of a sail craft's mass budget. */
export type HardwareCategory =
  'structure' | 'mechanism' | 'membrane' | 'boom' | 'electrical' | 'harness' | 'thermal' | 'propulsion' | 'payload' | 'other';

/** An id with its display label. */
export interface LabelledId {
  readonly id: string;
  readonly label: string;
}

/**
 * A growth-allowance preset: the allowance fraction for each maturity × category,
 * and the system margin the preset asks for. Presets are editable data.
 */
export interface AllowancePreset {
  readonly id: string;
  readonly name: string;
  readonly source: string;
  readonly caveat: string;
  readonly maturities: readonly LabelledId[];
  readonly categories: readonly LabelledId[];
  /** table[maturityId][categoryId] = allowance fraction in [0, 1]. */
  readonly table: Readonly<Record<string, Readonly<Record<string, number>>>>;
  /** Required system margin (%), of the quantity `systemMarginBasis` names. */
  readonly systemMarginPercent: number;
  /**
   * What the system margin is a share of: the allocation (margin ≥ p % of the allocation), or the predicted
   * (nominal dry) mass (allocation ≥ (1 + p/100) × predicted, ESA's definition).
   */
  readonly systemMarginBasis: SystemMarginBasis;
  /** Shown on screen beside the budget while the preset is in use (e.g. that it is not a standard's own table). */
  readonly notice?: string;
}

/** What a required system margin is a share of. */
export type SystemMarginBasis = 'allocation' | 'predicted';

/** The system-margin bases with the words screens use for them. */
export const systemMarginBases: Readonly<Record<SystemMarginBasis, string>> = {
  allocation: 'of the allocation',
  predicted: 'of the predicted mass',
};

/** One line of a mass budget. */
export interface BudgetRowInput {
  readonly key: string;
  readonly subsystem: string;
  /** Basic mass (kg): AIAA S-120A's term for the unmargined estimate, "current best estimate" elsewhere. */
  readonly cbe: number;
  readonly maturity: string;
  readonly category: string;
}

/** A budget line after the roll-up. */
export interface BudgetRow extends BudgetRowInput {
  /** Growth allowance (fraction). */
  readonly allowance: number;
  /** Predicted mass = cbe × (1 + allowance) (kg). */
  readonly predicted: number;
}

/** Sums for one subsystem (kg). */
export interface SubsystemTotal {
  readonly subsystem: string;
  readonly cbe: number;
  readonly predicted: number;
}

/** Result of a budget roll-up. Masses in kg. */
export interface BudgetRollUp {
  readonly rows: readonly BudgetRow[];
  readonly bySubsystem: readonly SubsystemTotal[];
  readonly total: { readonly cbe: number; readonly predicted: number };
  readonly systemMargin: {
    /** allocation − predicted total (kg); negative when over the allocation. */
    readonly kg: number;
    readonly percentOfAllocation: number;
    /** Margin as a share of the predicted total (%); null when nothing is predicted. */
    readonly percentOfPredicted: number | null;
    /** The required margin as a share of the allocation (%), whatever basis the preset states it on. */
    readonly requiredPercent: number;
    /** The required margin as the preset (or the sheet) states it (%), of `requiredBasis`. */
    readonly requiredPercentOfBasis: number;
    readonly requiredBasis: SystemMarginBasis;
    readonly belowRequired: boolean;
  };
}

/** A problem found in a budget input, with where it is (e.g. "rows[2].cbe" or "table.layout.harness"). */
export interface BudgetIssue {
  readonly path: string;
  readonly message: string;
}

/**
 * Thrown for bad budget input; `path` says where (e.g. "rows[2].maturity"), `detail` says what,
 * and the message joins the two. `rowKey` is the key of the budget row at fault, when one is.
 */
export class BudgetInputError extends RangeError {
  constructor(
    readonly path: string,
    readonly detail: string,
    readonly rowKey?: string,
  ) {
    super(`${path}: ${detail}`);
    this.name = 'BudgetInputError';
  }
}
