import { ANGLE, DIMENSIONLESS, MASS, formatDimension, parseUnit, sameDimension, type Dimension } from '@/shared/engine/units';
import type { FormulaNode } from '@/shared/engine/formula-parser';
import { densityModels } from '@/shared/sail/atmosphere-density';
import { orbitalDecayTime } from '@/shared/sail/orbital-decay';
import { beamSailBeta } from '@/shared/sail/beam-sail';

/**
 * The functions a sheet formula may call. Each knows its dimensional rule (so formulas are
 * checked before they run) and its plain-JS implementation (for the compiled evaluator, which
 * must agree with HyperFormula's built-in function of the same name).
 * PREDICTED, TOTAL_CBE and TOTAL_PREDICTED are ours: PREDICTED(mass_row) is that row's current best
 * estimate times (1 + its growth allowance from the sheet's allowance preset); TOTAL_CBE() and
 * TOTAL_PREDICTED() are written without arguments and the engine's analysis expands them into the
 * references of every mass row of the sheet (see sheet-model.ts), so they sum the rows the budget
 * roll-up sums, in the same order.
 */
export interface SheetFunction {
  readonly minArgs: number;
  readonly maxArgs: number;
  /** The result's dimension from the arguments', or a message saying which argument is wrong. */
  readonly dimension: (args: readonly Dimension[], nodes: readonly FormulaNode[]) => Dimension | string;
  readonly evaluate: (...args: number[]) => number;
  /**
   * JavaScript for the compiled evaluator, from the generated code of the arguments. Where given,
   * the call is written inline (V8 then optimises it like plain arithmetic); else `evaluate` is called.
   */
  readonly inline?: (args: readonly string[]) => string;
  /**
   * Set on the functions of our own that no spreadsheet has (HyperFormula gets them as a plugin): where the
   * relation it computes comes from.
   */
  readonly source?: string;
}

/** The functions written without arguments that the analysis expands into every mass row of the sheet. */
export const MASS_TOTAL_FUNCTIONS: ReadonlySet<string> = new Set(['TOTAL_CBE', 'TOTAL_PREDICTED']);

/** Functions whose arguments are mass rows read with their growth allowance: each reference gives (value, allowance). */
export const ALLOWANCE_FUNCTIONS: ReadonlySet<string> = new Set(['PREDICTED', 'TOTAL_PREDICTED']);

function mathCall(name: string) {
  return (args: readonly string[]): string => `Math.${name}(${args.join(',')})`;
}

function requireDimensionless(name: string) {
  return (args: readonly Dimension[]): Dimension | string => {
    const bad = args.findIndex((dimension) => !sameDimension(dimension, DIMENSIONLESS));
    return bad < 0
      ? DIMENSIONLESS
      : `${name} needs dimensionless arguments, argument ${bad + 1} is ${formatDimension(args[bad] ?? DIMENSIONLESS)}`;
  };
}

function sameAsFirst(name: string) {
  return (args: readonly Dimension[]): Dimension | string => {
    const first = args[0] ?? DIMENSIONLESS;
    const bad = args.findIndex((dimension) => !sameDimension(dimension, first));
    return bad < 0
      ? first
      : `${name} needs arguments of one dimension: argument 1 is ${formatDimension(first)}, argument ${bad + 1} is ${formatDimension(args[bad] ?? DIMENSIONLESS)}`;
  };
}

function trigonometric(name: string) {
  return (args: readonly Dimension[]): Dimension | string => {
    const arg = args[0] ?? DIMENSIONLESS;
    return sameDimension(arg, ANGLE) || sameDimension(arg, DIMENSIONLESS)
      ? DIMENSIONLESS
      : `${name} needs an angle, got ${formatDimension(arg)}`;
  };
}

function inverseTrigonometric(name: string) {
  const check = requireDimensionless(name);
  return (args: readonly Dimension[]): Dimension | string => {
    const result = check(args);
    return typeof result === 'string' ? result : ANGLE;
  };
}

/** Every argument must be a mass row: the result is a mass (also with no mass row at all, a total of 0 kg). */
function massRows(name: string) {
  return (args: readonly Dimension[], nodes: readonly FormulaNode[]): Dimension | string => {
    const bad = args.findIndex((dimension) => !sameDimension(dimension, MASS));
    if (bad < 0) return MASS;
    const node = nodes[bad];
    const row = node?.kind === 'ref' ? `the mass row ${node.key}` : `argument ${bad + 1}`;
    return `${name} sums mass rows, but ${row} is ${formatDimension(args[bad] ?? DIMENSIONLESS)}, not a mass`;
  };
}

function dimensionOfUnit(unit: string): Dimension {
  const parsed = parseUnit(unit);
  if (!parsed.ok) throw new Error(`a sheet function declares the unit "${unit}": ${parsed.message}`);
  return parsed.value.dimension;
}

/**
 * A function whose arguments each have a fixed dimension, given by a unit of it ('m', 'kg/m^2', '' for a
 * pure number), and whose result has the dimension of `result`.
 */
function fixedDimensions(name: string, argumentUnits: readonly string[], result: string) {
  const expected = argumentUnits.map(dimensionOfUnit);
  const resultDimension = dimensionOfUnit(result);
  return (args: readonly Dimension[]): Dimension | string => {
    const bad = args.findIndex((dimension, index) => !sameDimension(dimension, expected[index] ?? DIMENSIONLESS));
    return bad < 0
      ? resultDimension
      : `${name} needs argument ${bad + 1} in ${formatDimension(expected[bad] ?? DIMENSIONLESS)}, got ${formatDimension(args[bad] ?? DIMENSIONLESS)}`;
  };
}

/**
 * ORBITAL_LIFETIME(start_altitude, end_altitude, ballistic_coefficient, density_model): decay time of a circular
 * orbit under drag, NaN (a row error) for an altitude outside the model's table, a ballistic coefficient that is
 * not positive, or a model number that is not 1 or 2.
 */
function orbitalLifetime(startAltitude: number, endAltitude: number, ballisticCoefficient: number, model: number): number {
  const table = densityModels[model];
  if (table === undefined) return Number.NaN;
  try {
    return orbitalDecayTime(startAltitude, endAltitude, ballisticCoefficient, table);
  } catch (error) {
    if (error instanceof RangeError) return Number.NaN;
    throw error;
  }
}

/** Sum of (value, allowance) pairs as predicted masses, value × (1 + allowance), in order. */
function sumPredicted(...pairs: number[]): number {
  let total = 0;
  for (let index = 0; index + 1 < pairs.length; index += 2) total += (pairs[index] ?? Number.NaN) * (1 + (pairs[index + 1] ?? Number.NaN));
  return total;
}

/** The value of a formula made only of numbers, or undefined when it refers to anything else. */
export function constantValue(node: FormulaNode): number | undefined {
  switch (node.kind) {
    case 'number':
      return node.value;
    case 'unary': {
      const operand = constantValue(node.operand);
      return operand === undefined ? undefined : node.op === '-' ? -operand : operand;
    }
    case 'percent': {
      const operand = constantValue(node.operand);
      return operand === undefined ? undefined : operand / 100;
    }
    case 'binary': {
      const left = constantValue(node.left);
      const right = constantValue(node.right);
      if (left === undefined || right === undefined) return undefined;
      return applyArithmetic(node.op, left, right);
    }
    case 'call':
      return node.name === 'PI' && node.args.length === 0 ? Math.PI : undefined;
    case 'ref':
      return undefined;
  }
}

/** Arithmetic and comparison the way HyperFormula does them on numbers (true/false as 1/0). */
export function applyArithmetic(op: string, left: number, right: number): number {
  switch (op) {
    case '+':
      return left + right;
    case '-':
      return left - right;
    case '*':
      return left * right;
    case '/':
      return left / right;
    case '^':
      return Math.pow(left, right);
    case '=':
      return left === right ? 1 : 0;
    case '<>':
      return left !== right ? 1 : 0;
    case '<':
      return left < right ? 1 : 0;
    case '>':
      return left > right ? 1 : 0;
    case '<=':
      return left <= right ? 1 : 0;
    default:
      return left >= right ? 1 : 0;
  }
}

/** Dimension of a power: base^exponent needs a constant exponent unless the base is a pure number. */
export function powerDimension(base: Dimension, exponent: Dimension, exponentNode: FormulaNode | undefined): Dimension | string {
  if (!sameDimension(exponent, DIMENSIONLESS)) return `an exponent must be dimensionless, got ${formatDimension(exponent)}`;
  if (sameDimension(base, DIMENSIONLESS)) return DIMENSIONLESS;
  const power = exponentNode === undefined ? undefined : constantValue(exponentNode);
  if (power === undefined) {
    return `raising ${formatDimension(base)} to a power needs a constant exponent`;
  }
  return base.map((value) => value * power);
}

function round(digits: number, value: number, mode: (x: number) => number): number {
  const scale = Math.pow(10, Math.trunc(digits));
  return (Math.sign(value) * mode(Math.abs(value) * scale)) / scale;
}

/** ROUND, ROUNDUP or ROUNDDOWN: (value, digits = 0) with the magnitude rounded by `mode`. */
function rounding(name: string, mode: (x: number) => number): SheetFunction {
  return { minArgs: 1, maxArgs: 2, dimension: requireDimensionless(name), evaluate: (value, digits = 0) => round(digits, value, mode) };
}

/** Every function a sheet formula may call, by its upper-case name. */
export const sheetFunctions: Readonly<Record<string, SheetFunction>> = {
  SQRT: {
    minArgs: 1,
    maxArgs: 1,
    dimension: (args) => (args[0] ?? DIMENSIONLESS).map((value) => value / 2),
    evaluate: Math.sqrt,
    inline: mathCall('sqrt'),
  },
  POWER: {
    minArgs: 2,
    maxArgs: 2,
    dimension: (args, nodes) => powerDimension(args[0] ?? DIMENSIONLESS, args[1] ?? DIMENSIONLESS, nodes[1]),
    evaluate: Math.pow,
    inline: mathCall('pow'),
  },
  EXP: { minArgs: 1, maxArgs: 1, dimension: requireDimensionless('EXP'), evaluate: Math.exp, inline: mathCall('exp') },
  LN: { minArgs: 1, maxArgs: 1, dimension: requireDimensionless('LN'), evaluate: Math.log, inline: mathCall('log') },
  LOG10: { minArgs: 1, maxArgs: 1, dimension: requireDimensionless('LOG10'), evaluate: Math.log10, inline: mathCall('log10') },
  LOG: {
    minArgs: 1,
    maxArgs: 2,
    dimension: requireDimensionless('LOG'),
    evaluate: (value, base = 10) => Math.log(value) / Math.log(base),
  },
  ABS: { minArgs: 1, maxArgs: 1, dimension: sameAsFirst('ABS'), evaluate: Math.abs, inline: mathCall('abs') },
  SIGN: { minArgs: 1, maxArgs: 1, dimension: () => DIMENSIONLESS, evaluate: Math.sign },
  // Rounding depends on the unit a value is written in, and formulas run in SI: only pure numbers may be rounded.
  ROUND: rounding('ROUND', Math.round),
  ROUNDUP: rounding('ROUNDUP', Math.ceil),
  ROUNDDOWN: rounding('ROUNDDOWN', Math.floor),
  MIN: { minArgs: 1, maxArgs: 255, dimension: sameAsFirst('MIN'), evaluate: Math.min, inline: mathCall('min') },
  MAX: { minArgs: 1, maxArgs: 255, dimension: sameAsFirst('MAX'), evaluate: Math.max, inline: mathCall('max') },
  SUM: { minArgs: 1, maxArgs: 255, dimension: sameAsFirst('SUM'), evaluate: (...values) => values.reduce((sum, value) => sum + value, 0) },
  AVERAGE: {
    minArgs: 1,
    maxArgs: 255,
    dimension: sameAsFirst('AVERAGE'),
    evaluate: (...values) => values.reduce((sum, value) => sum + value, 0) / values.length,
  },
  SIN: { minArgs: 1, maxArgs: 1, dimension: trigonometric('SIN'), evaluate: Math.sin, inline: mathCall('sin') },
  COS: { minArgs: 1, maxArgs: 1, dimension: trigonometric('COS'), evaluate: Math.cos, inline: mathCall('cos') },
  TAN: { minArgs: 1, maxArgs: 1, dimension: trigonometric('TAN'), evaluate: Math.tan, inline: mathCall('tan') },
  ASIN: { minArgs: 1, maxArgs: 1, dimension: inverseTrigonometric('ASIN'), evaluate: Math.asin, inline: mathCall('asin') },
  ACOS: { minArgs: 1, maxArgs: 1, dimension: inverseTrigonometric('ACOS'), evaluate: Math.acos, inline: mathCall('acos') },
  ATAN: { minArgs: 1, maxArgs: 1, dimension: inverseTrigonometric('ATAN'), evaluate: Math.atan, inline: mathCall('atan') },
  // Spreadsheet order: ATAN2(x, y) is the angle of the point (x, y).
  ATAN2: {
    minArgs: 2,
    maxArgs: 2,
    dimension: (args) => {
      const same = sameAsFirst('ATAN2')(args);
      return typeof same === 'string' ? same : ANGLE;
    },
    evaluate: (x, y) => Math.atan2(y, x),
  },
  PI: { minArgs: 0, maxArgs: 0, dimension: () => DIMENSIONLESS, evaluate: () => Math.PI, inline: () => 'Math.PI' },
  IF: {
    minArgs: 3,
    maxArgs: 3,
    dimension: (args) => sameAsFirst('IF (its two results)')(args.slice(1)),
    evaluate: (condition, whenTrue, whenFalse) => (condition !== 0 ? whenTrue : whenFalse),
    inline: ([condition, whenTrue, whenFalse]) => `(${condition ?? '0'}!==0?${whenTrue ?? 'NaN'}:${whenFalse ?? 'NaN'})`,
  },
  PREDICTED: {
    minArgs: 1,
    maxArgs: 1,
    dimension: (args) =>
      sameDimension(args[0] ?? DIMENSIONLESS, MASS) ? MASS : `PREDICTED needs a mass row, got ${formatDimension(args[0] ?? DIMENSIONLESS)}`,
    evaluate: (currentBestEstimate, allowance) => currentBestEstimate * (1 + allowance),
    inline: ([currentBestEstimate, allowance]) => `(${currentBestEstimate ?? 'NaN'}*(1+${allowance ?? 'NaN'}))`,
  },
  // Summed from 0 in sheet order, as the budget roll-up sums, so both give the same float.
  TOTAL_CBE: {
    minArgs: 0,
    maxArgs: Number.POSITIVE_INFINITY,
    dimension: massRows('TOTAL_CBE'),
    evaluate: (...values) => values.reduce((sum, value) => sum + value, 0),
    inline: (args) => `(${['0', ...args].join('+')})`,
  },
  TOTAL_PREDICTED: {
    minArgs: 0,
    maxArgs: Number.POSITIVE_INFINITY,
    dimension: massRows('TOTAL_PREDICTED'),
    evaluate: sumPredicted,
    inline: (args) => {
      const terms = ['0'];
      for (let index = 0; index + 1 < args.length; index += 2) terms.push(`${args[index] ?? 'NaN'}*(1+${args[index + 1] ?? 'NaN'})`);
      return `(${terms.join('+')})`;
    },
  },
  ORBITAL_LIFETIME: {
    minArgs: 4,
    maxArgs: 4,
    dimension: fixedDimensions('ORBITAL_LIFETIME', ['m', 'm', 'kg/m^2', ''], 's'),
    evaluate: orbitalLifetime,
    source:
      'Circular decay under drag, da/dt = −ρ(h) √(μ a) / B with B = m / (C_D A), integrated from the end altitude up to the start (Vallado 2013, §8.6; King-Hele 1987); density model 1: Vallado 2013 Table 8-4 exponential atmosphere, 2: U.S. Standard Atmosphere 1976',
  },
  // BEAM_SAIL_BETA(rest_acceleration, distance, reflectivity): speed over c after `distance` under a constant-power beam.
  BEAM_SAIL_BETA: {
    minArgs: 3,
    maxArgs: 3,
    dimension: fixedDimensions('BEAM_SAIL_BETA', ['m/s^2', 'm', ''], ''),
    evaluate: beamSailBeta,
    source:
      'Flat sail pushed from rest by a beam of constant power, force (P/c)(1 − β)[(1 − R) + 2R/(1 + β)] on the receding sail (Forward 1984, J. Spacecraft Rockets 21(2), for the force at rest), integrated in β to the distance',
  },
};
