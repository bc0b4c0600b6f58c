import { all, create, type Unit } from 'mathjs';
import { ASTRONOMICAL_UNIT } from '@/shared/sail/constants';

/**
 * Units in mathjs syntax. A private mathjs instance holds the units engineers need that
 * mathjs lacks; user text only ever reaches `unit()`, never the expression parser, so
 * nobody can define units or run code through a unit field.
 */
const math = create({ ...all });
math.createUnit('AU', `${ASTRONOMICAL_UNIT.value} m`);
math.createUnit('percent', '0.01');
math.createUnit('ppm', '1e-6');

/** Exponents of the base dimensions, in mathjs order (mass, length, time, current, temperature, luminous intensity, amount, angle, bit). */
export type Dimension = readonly number[];

const BASE_SYMBOLS = ['kg', 'm', 's', 'A', 'K', 'cd', 'mol', 'rad', 'bit'] as const;

/** The dimension of a pure number. */
export const DIMENSIONLESS: Dimension = BASE_SYMBOLS.map(() => 0);

/** The dimension of an angle: mathjs keeps angle as a base dimension so that degrees convert. */
export const ANGLE: Dimension = BASE_SYMBOLS.map((symbol) => (symbol === 'rad' ? 1 : 0));

/** The dimension of a mass. */
export const MASS: Dimension = BASE_SYMBOLS.map((symbol) => (symbol === 'kg' ? 1 : 0));

/** A parsed unit: SI value = factor × value + offset (offset only for degC and degF). */
export interface ParsedUnit {
  readonly text: string;
  readonly factor: number;
  readonly offset: number;
  readonly dimension: Dimension;
}

/** Outcome of parsing user text: the value, or a message saying what is wrong. */
export type Parsed<T> = { ok: true; value: T } | { ok: false; message: string };

/**
 * Rewrites what engineers type into mathjs syntax: micro signs, superscripts, middle dots.
 * "1" and "" both mean dimensionless.
 */
export function normalizeUnitText(text: string): string {
  return text
    .trim()
    .replace(/[µμ]/g, 'u')
    .replace(/²/g, '^2')
    .replace(/³/g, '^3')
    .replace(/⁴/g, '^4')
    .replace(/[·⋅×]/g, ' ')
    .replace(/\s+/g, ' ');
}

const unitCache = new Map<string, Parsed<ParsedUnit>>();

function siNumber(quantity: Unit): number {
  return quantity.toSI().toNumber();
}

/**
 * Parses a unit in mathjs syntax ("kg/m^3", "um", "W/(m^2 K^4)", "AU", "" for none).
 * Results are cached: parsing is slow and sheets repeat their units.
 */
export function parseUnit(text: string): Parsed<ParsedUnit> {
  const cached = unitCache.get(text);
  if (cached !== undefined) return cached;
  const normalized = normalizeUnitText(text);
  let parsed: Parsed<ParsedUnit>;
  if (normalized === '' || normalized === '1') {
    parsed = { ok: true, value: { text, factor: 1, offset: 0, dimension: DIMENSIONLESS } };
  } else {
    try {
      const zero = siNumber(math.unit(0, normalized));
      const one = siNumber(math.unit(1, normalized));
      const dimension = [...math.unit(normalized).dimensions];
      parsed = { ok: true, value: { text, factor: one - zero, offset: zero, dimension } };
    } catch (error) {
      parsed = { ok: false, message: `unknown unit "${text}": ${error instanceof Error ? error.message : String(error)}` };
    }
  }
  unitCache.set(text, parsed);
  return parsed;
}

/** Converts a value in `unit` to SI. */
export function toSI(value: number, unit: ParsedUnit): number {
  return value * unit.factor + unit.offset;
}

/** Converts an SI value to `unit`. */
export function fromSI(value: number, unit: ParsedUnit): number {
  return (value - unit.offset) / unit.factor;
}

/** True when both dimensions have the same exponents. */
export function sameDimension(a: Dimension, b: Dimension): boolean {
  return a.every((exponent, index) => Math.abs(exponent - (b[index] ?? 0)) < 1e-9);
}

/** Writes a dimension as SI base units, e.g. "kg m s^-2"; "dimensionless" for a pure number. */
export function formatDimension(dimension: Dimension): string {
  const parts = dimension.flatMap((exponent, index) => {
    if (Math.abs(exponent) < 1e-9) return [];
    const symbol = BASE_SYMBOLS[index] ?? '?';
    const rounded = Math.round(exponent * 1000) / 1000;
    return [rounded === 1 ? symbol : `${symbol}^${rounded}`];
  });
  return parts.length === 0 ? 'dimensionless' : parts.join(' ');
}

/**
 * Parses a quantity as typed on a command line or in a cell: "60 m", "2.5um", "-3", "1e-6 kg".
 * A bare number has no unit (undefined): the caller applies the parameter's own unit.
 */
export function parseQuantity(text: string): Parsed<{ value: number; unit: ParsedUnit | undefined }> {
  const match = /^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*?)\s*$/.exec(text);
  const numberText = match?.[1];
  if (match === null || numberText === undefined) {
    return { ok: false, message: `"${text}" is not a number with an optional unit` };
  }
  const value = Number(numberText);
  const unitText = match[2] ?? '';
  if (unitText === '') return { ok: true, value: { value, unit: undefined } };
  const unit = parseUnit(unitText);
  return unit.ok ? { ok: true, value: { value, unit: unit.value } } : unit;
}

/**
 * Common engineering units a unit picker offers, grouped by dimension (mathjs syntax). Units outside
 * this list still work when typed; the list only sets what is offered.
 */
const commonUnits: readonly string[] = [
  '',
  'percent',
  'ppm',
  'm',
  'km',
  'mm',
  'um',
  'nm',
  'AU',
  'ft',
  'in',
  'm^2',
  'km^2',
  'cm^2',
  'mm^2',
  'ft^2',
  'm^3',
  'cm^3',
  'L',
  'kg',
  'g',
  'mg',
  'tonne',
  'lb',
  's',
  'min',
  'h',
  'day',
  'm/s',
  'km/s',
  'km/h',
  'm/s^2',
  'mm/s^2',
  'um/s^2',
  'N',
  'mN',
  'uN',
  'kN',
  'lbf',
  'Pa',
  'N/m^2',
  'uPa',
  'kPa',
  'kg/m^3',
  'g/cm^3',
  'kg/m^2',
  'g/m^2',
  'kg/m',
  'g/m',
  'W',
  'kW',
  'mW',
  'W/m^2',
  'kW/m^2',
  'J',
  'kJ',
  'Wh',
  'K',
  'degC',
  'degF',
  'rad',
  'deg',
  'arcmin',
  'arcsec',
  'Hz',
  'kHz',
  'm^3/s^2',
  'km^3/s^2',
  'W/(m^2 K^4)',
];

/**
 * The units of the same dimension as `unit` that a unit picker offers: the row's own unit first, then
 * the common units of its dimension. Just `[unit]` when the unit is unknown or has no common sibling.
 */
export function compatibleUnits(unit: string): string[] {
  const own = parseUnit(unit);
  if (!own.ok) return [unit];
  const ownText = normalizeUnitText(unit);
  const siblings = commonUnits.filter((candidate) => {
    if (normalizeUnitText(candidate) === ownText || (ownText === '1' && candidate === '')) return false;
    const parsed = parseUnit(candidate);
    return parsed.ok && sameDimension(parsed.value.dimension, own.value.dimension);
  });
  return [unit, ...siblings];
}
