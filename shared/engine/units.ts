import { ASTRONOMICAL_UNIT } from '@/shared/sail/constants';

/**
 * Trimsheet's unit notation, documented in docs/units.md: SI symbols and prefixes (BIPM, The International
 * System of Units, 9th edition, 2019) written in ASCII, the non-SI units the SI accepts, a few named extras
 * and the customary units engineers still meet in data sheets. Exactly the units listed here are accepted;
 * tests/shared/engine/units.test.ts holds this list equal to the documented one.
 */

/** The base quantities, in the order of a Dimension's exponents; each with its SI unit as written in a dimension. */
const BASE_SYMBOLS = ['kg', 'm', 's', 'A', 'K', 'cd', 'mol', 'rad'] as const;
type BaseSymbol = (typeof BASE_SYMBOLS)[number];

/** Exponents of the base quantities: mass, length, time, current, temperature, luminous intensity, amount, plane angle. */
export type Dimension = readonly number[];

function dimension(exponents: Partial<Record<BaseSymbol, number>>): Dimension {
  return BASE_SYMBOLS.map((symbol) => exponents[symbol] ?? 0);
}

/** The dimension of a pure number. */
export const DIMENSIONLESS: Dimension = dimension({});

/** The dimension of an angle: plane angle is kept as a base quantity, so that degrees and radians convert and are checked. */
export const ANGLE: Dimension = dimension({ rad: 1 });

/** The dimension of a mass. */
export const MASS: Dimension = dimension({ kg: 1 });

/** An SI prefix: its ASCII spelling and its factor (SI Brochure, Table 7). */
export interface UnitPrefix {
  readonly ascii: string;
  readonly factor: number;
}

/** The SI prefixes of the 9th edition, "u" standing for the micro sign. */
export const siPrefixes: readonly UnitPrefix[] = [
  { ascii: 'Y', factor: 1e24 },
  { ascii: 'Z', factor: 1e21 },
  { ascii: 'E', factor: 1e18 },
  { ascii: 'P', factor: 1e15 },
  { ascii: 'T', factor: 1e12 },
  { ascii: 'G', factor: 1e9 },
  { ascii: 'M', factor: 1e6 },
  { ascii: 'k', factor: 1e3 },
  { ascii: 'h', factor: 1e2 },
  { ascii: 'da', factor: 1e1 },
  { ascii: 'd', factor: 1e-1 },
  { ascii: 'c', factor: 1e-2 },
  { ascii: 'm', factor: 1e-3 },
  { ascii: 'u', factor: 1e-6 },
  { ascii: 'n', factor: 1e-9 },
  { ascii: 'p', factor: 1e-12 },
  { ascii: 'f', factor: 1e-15 },
  { ascii: 'a', factor: 1e-18 },
  { ascii: 'z', factor: 1e-21 },
  { ascii: 'y', factor: 1e-24 },
];

/** One unit of the list: its ASCII spellings, its value in SI (SI value = factor × value + offset) and whether it takes prefixes. */
export interface UnitDefinition {
  readonly spellings: readonly string[];
  readonly factor: number;
  readonly offset?: number;
  readonly dimension: Dimension;
  readonly prefixes: boolean;
}

const degree = Math.PI / 180;
// International yard and pound (1959): 1 yd = 0.9144 m, 1 lb = 0.453 592 37 kg exactly.
const inch = 0.0254;
const pound = 0.453_592_37;
// Standard acceleration of gravity, 9.806 65 m/s^2 exactly (3rd CGPM, 1901): the pound-force is a pound under it.
const poundForce = pound * 9.806_65;

/** Every unit Trimsheet accepts, in the order of docs/units.md. */
export const unitDefinitions: readonly UnitDefinition[] = [
  // SI base units (SI Brochure, Table 2). Prefixes go on the gram, never on the kilogram.
  { spellings: ['m'], factor: 1, dimension: dimension({ m: 1 }), prefixes: true },
  { spellings: ['g'], factor: 1e-3, dimension: MASS, prefixes: true },
  { spellings: ['s'], factor: 1, dimension: dimension({ s: 1 }), prefixes: true },
  { spellings: ['A'], factor: 1, dimension: dimension({ A: 1 }), prefixes: true },
  { spellings: ['K'], factor: 1, dimension: dimension({ K: 1 }), prefixes: true },
  { spellings: ['mol'], factor: 1, dimension: dimension({ mol: 1 }), prefixes: true },
  { spellings: ['cd'], factor: 1, dimension: dimension({ cd: 1 }), prefixes: true },
  // SI derived units with special names (SI Brochure, Table 4).
  { spellings: ['rad'], factor: 1, dimension: ANGLE, prefixes: true },
  { spellings: ['sr'], factor: 1, dimension: dimension({ rad: 2 }), prefixes: true },
  { spellings: ['Hz'], factor: 1, dimension: dimension({ s: -1 }), prefixes: true },
  { spellings: ['N'], factor: 1, dimension: dimension({ kg: 1, m: 1, s: -2 }), prefixes: true },
  { spellings: ['Pa'], factor: 1, dimension: dimension({ kg: 1, m: -1, s: -2 }), prefixes: true },
  { spellings: ['J'], factor: 1, dimension: dimension({ kg: 1, m: 2, s: -2 }), prefixes: true },
  { spellings: ['W'], factor: 1, dimension: dimension({ kg: 1, m: 2, s: -3 }), prefixes: true },
  { spellings: ['C'], factor: 1, dimension: dimension({ s: 1, A: 1 }), prefixes: true },
  { spellings: ['V'], factor: 1, dimension: dimension({ kg: 1, m: 2, s: -3, A: -1 }), prefixes: true },
  { spellings: ['F'], factor: 1, dimension: dimension({ kg: -1, m: -2, s: 4, A: 2 }), prefixes: true },
  { spellings: ['ohm'], factor: 1, dimension: dimension({ kg: 1, m: 2, s: -3, A: -2 }), prefixes: true },
  { spellings: ['S'], factor: 1, dimension: dimension({ kg: -1, m: -2, s: 3, A: 2 }), prefixes: true },
  { spellings: ['Wb'], factor: 1, dimension: dimension({ kg: 1, m: 2, s: -2, A: -1 }), prefixes: true },
  { spellings: ['T'], factor: 1, dimension: dimension({ kg: 1, s: -2, A: -1 }), prefixes: true },
  { spellings: ['H'], factor: 1, dimension: dimension({ kg: 1, m: 2, s: -2, A: -2 }), prefixes: true },
  { spellings: ['degC'], factor: 1, offset: 273.15, dimension: dimension({ K: 1 }), prefixes: false },
  { spellings: ['lm'], factor: 1, dimension: dimension({ cd: 1, rad: 2 }), prefixes: true },
  { spellings: ['lx'], factor: 1, dimension: dimension({ cd: 1, rad: 2, m: -2 }), prefixes: true },
  { spellings: ['Bq'], factor: 1, dimension: dimension({ s: -1 }), prefixes: true },
  { spellings: ['Gy'], factor: 1, dimension: dimension({ m: 2, s: -2 }), prefixes: true },
  { spellings: ['Sv'], factor: 1, dimension: dimension({ m: 2, s: -2 }), prefixes: true },
  { spellings: ['kat'], factor: 1, dimension: dimension({ mol: 1, s: -1 }), prefixes: true },
  // Non-SI units accepted for use with the SI (SI Brochure, Table 8).
  { spellings: ['min'], factor: 60, dimension: dimension({ s: 1 }), prefixes: false },
  { spellings: ['h'], factor: 3600, dimension: dimension({ s: 1 }), prefixes: false },
  { spellings: ['d', 'day'], factor: 86_400, dimension: dimension({ s: 1 }), prefixes: false },
  // Not in the SI's table: the Julian year of 365.25 days (IAU), for orbital lifetimes.
  { spellings: ['yr', 'year'], factor: 31_557_600, dimension: dimension({ s: 1 }), prefixes: false },
  { spellings: ['AU', 'au'], factor: ASTRONOMICAL_UNIT.value, dimension: dimension({ m: 1 }), prefixes: false },
  { spellings: ['deg'], factor: degree, dimension: ANGLE, prefixes: false },
  { spellings: ['arcmin'], factor: degree / 60, dimension: ANGLE, prefixes: false },
  { spellings: ['arcsec'], factor: degree / 3600, dimension: ANGLE, prefixes: false },
  { spellings: ['ha'], factor: 1e4, dimension: dimension({ m: 2 }), prefixes: false },
  { spellings: ['L'], factor: 1e-3, dimension: dimension({ m: 3 }), prefixes: true },
  { spellings: ['t', 'tonne'], factor: 1000, dimension: MASS, prefixes: false },
  { spellings: ['eV'], factor: 1.602_176_634e-19, dimension: dimension({ kg: 1, m: 2, s: -2 }), prefixes: true },
  // Named extras.
  { spellings: ['percent'], factor: 0.01, dimension: DIMENSIONLESS, prefixes: false },
  { spellings: ['ppm'], factor: 1e-6, dimension: DIMENSIONLESS, prefixes: false },
  // Angular speed of a spinning sail: revolutions per minute, 1 rpm = 360 deg/min.
  { spellings: ['rpm'], factor: (2 * Math.PI) / 60, dimension: dimension({ rad: 1, s: -1 }), prefixes: false },
  // Customary units, from the exact definitions above.
  { spellings: ['in'], factor: inch, dimension: dimension({ m: 1 }), prefixes: false },
  { spellings: ['ft'], factor: 12 * inch, dimension: dimension({ m: 1 }), prefixes: false },
  { spellings: ['mi'], factor: 5280 * 12 * inch, dimension: dimension({ m: 1 }), prefixes: false },
  { spellings: ['lb'], factor: pound, dimension: MASS, prefixes: false },
  { spellings: ['lbf'], factor: poundForce, dimension: dimension({ kg: 1, m: 1, s: -2 }), prefixes: false },
  { spellings: ['psi'], factor: poundForce / inch ** 2, dimension: dimension({ kg: 1, m: -1, s: -2 }), prefixes: false },
  { spellings: ['degF'], factor: 5 / 9, offset: (459.67 * 5) / 9, dimension: dimension({ K: 1 }), prefixes: false },
];

const bySpelling = new Map(unitDefinitions.flatMap((unit) => unit.spellings.map((spelling) => [spelling, unit] as const)));

/** A parsed unit: SI value = factor × value + offset (offset only for degC and degF standing alone). */
export interface ParsedUnit {
  readonly text: string;
  readonly factor: number;
  readonly offset: number;
  readonly dimension: Dimension;
}

/** Outcome of parsing user text: the value, or a message saying what is wrong. */
export type Parsed<T> = { ok: true; value: T } | { ok: false; message: string };

const superscriptDigits: Readonly<Record<string, string>> = {
  '⁰': '0',
  '¹': '1',
  '²': '2',
  '³': '3',
  '⁴': '4',
  '⁵': '5',
  '⁶': '6',
  '⁷': '7',
  '⁸': '8',
  '⁹': '9',
  '⁻': '-',
};

/**
 * Rewrites what engineers type into the ASCII notation: micro signs, the ohm and degree signs, superscript
 * exponents ("s⁻¹"), middle dots and multiplication signs. "1" and "" both mean a pure number.
 */
export function normalizeUnitText(text: string): string {
  return text
    .trim()
    .replace(/[µμ]/g, 'u')
    .replace(/[\u2126\u03A9]/g, 'ohm')
    .replace(/°C/g, 'degC')
    .replace(/°F/g, 'degF')
    .replace(/°/g, 'deg')
    .replace(/[⁻⁰¹²³⁴⁵⁶⁷⁸⁹]+/g, (exponent) => `^${[...exponent].map((sign) => superscriptDigits[sign] ?? '').join('')}`)
    .replace(/[·⋅×]/g, ' ')
    .replace(/\s+/g, ' ');
}

/** Why a unit text is refused; the parser throws it and `parseUnit` turns it into our message. */
class UnitProblem extends Error {}

interface Term {
  readonly factor: number;
  readonly dimension: Dimension;
  /** The one unit with an offset (degC, degF) when the term is exactly that unit. */
  readonly offsetUnit?: UnitDefinition;
}

const ONE: Term = { factor: 1, dimension: DIMENSIONLESS };

function power(term: Term, exponent: number): Term {
  return {
    factor: term.factor ** exponent,
    dimension: term.dimension.map((value) => value * exponent),
    ...(exponent === 1 && term.offsetUnit ? { offsetUnit: term.offsetUnit } : {}),
  };
}

function product(a: Term, b: Term): Term {
  return { factor: a.factor * b.factor, dimension: a.dimension.map((value, index) => value + (b.dimension[index] ?? 0)) };
}

/** A symbol of the list, with or without an SI prefix: exact spellings first, so "min" is a minute and "Pa" a pascal. */
function symbolTerm(symbol: string): Term {
  const exact = bySpelling.get(symbol);
  if (exact !== undefined) return { factor: exact.factor, dimension: exact.dimension, ...(exact.offset ? { offsetUnit: exact } : {}) };
  const readings = siPrefixes.flatMap((prefix) => {
    const unit = symbol.startsWith(prefix.ascii) ? bySpelling.get(symbol.slice(prefix.ascii.length)) : undefined;
    return unit === undefined ? [] : [{ prefix, unit }];
  });
  const prefixed = readings.find((reading) => reading.unit.prefixes);
  if (prefixed !== undefined) return { factor: prefixed.prefix.factor * prefixed.unit.factor, dimension: prefixed.unit.dimension };
  const unprefixable = readings[0]?.unit.spellings[0];
  if (unprefixable !== undefined) throw new UnitProblem(`"${unprefixable}" takes no prefix, so "${symbol}" is not a unit`);
  throw new UnitProblem(`"${symbol}" is not in Trimsheet's list of units`);
}

/**
 * Reads a unit text: factors (a symbol, "1" or a bracketed group, each with an optional "^" exponent) joined by
 * spaces or "*" (multiply) and "/" (divide by the next factor only), so "W/m^2 K" is W K m^-2 and W/(m^2 K) needs the brackets.
 */
class UnitReader {
  private at = 0;
  constructor(private readonly text: string) {}

  read(): Term {
    const term = this.product();
    this.skipSpaces();
    if (this.at < this.text.length) throw new UnitProblem(this.unexpected());
    return term;
  }

  private product(): Term {
    let term = this.factor();
    for (;;) {
      this.skipSpaces();
      const next = this.text.charAt(this.at);
      if (next === '*' || next === '/') {
        this.at += 1;
        this.skipSpaces();
        if (this.at >= this.text.length || this.text.charAt(this.at) === ')') throw new UnitProblem(`"${next}" must be followed by a unit`);
        const factor = this.factor();
        term = product(term, next === '/' ? power(factor, -1) : factor);
      } else if (/[A-Za-z(]/.test(next)) {
        term = product(term, this.factor());
      } else {
        return term;
      }
    }
  }

  private factor(): Term {
    const rest = this.text.slice(this.at);
    let term: Term;
    const symbol = /^[A-Za-z]+/.exec(rest)?.[0];
    if (symbol !== undefined) {
      this.at += symbol.length;
      term = symbolTerm(symbol);
    } else if (rest.startsWith('(')) {
      this.at += 1;
      this.skipSpaces();
      term = this.product();
      this.skipSpaces();
      if (this.text.charAt(this.at) !== ')') throw new UnitProblem('a "(" is not closed');
      this.at += 1;
    } else if (/^1(?![\d.])/.test(rest)) {
      this.at += 1;
      term = ONE;
    } else {
      throw new UnitProblem(this.unexpected());
    }
    this.skipSpaces();
    if (this.text.charAt(this.at) !== '^') return term;
    this.at += 1;
    this.skipSpaces();
    const exponent = /^[+-]?(?:\d+\.?\d*|\.\d+)/.exec(this.text.slice(this.at))?.[0];
    if (exponent === undefined) throw new UnitProblem('"^" must be followed by a number');
    this.at += exponent.length;
    return power(term, Number(exponent));
  }

  private skipSpaces() {
    while (this.text.charAt(this.at) === ' ') this.at += 1;
  }

  private unexpected(): string {
    return this.at >= this.text.length
      ? 'the unit ends too early'
      : `unexpected "${this.text.charAt(this.at)}" at character ${this.at + 1}`;
  }
}

const unitCache = new Map<string, Parsed<ParsedUnit>>();

/**
 * Parses a unit in Trimsheet's notation ("kg/m^3", "um", "W/(m^2 K^4)", "AU", "" for none). Results are cached:
 * sheets repeat their units.
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
      const term = new UnitReader(normalized).read();
      // A temperature scale with an offset converts as a point on its scale only when it stands alone.
      const offset = term.offsetUnit?.offset ?? 0;
      parsed = { ok: true, value: { text, factor: term.factor, offset, dimension: term.dimension } };
    } catch (error) {
      if (!(error instanceof UnitProblem)) throw error;
      parsed = { ok: false, message: `unknown unit "${text}": ${error.message}` };
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
 * Common engineering units a unit picker offers, grouped by dimension. Units outside this list still work
 * when typed; the list only sets what is offered.
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
  'yr',
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
  'W h',
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
