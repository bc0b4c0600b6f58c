import { ANGLE, DIMENSIONLESS, parseUnit, sameDimension, toSI } from '@/shared/engine/units';
import type { OpticalCoefficients } from '@/shared/sail';
import type { SheetSnapshot } from '../use-sheet-session';

/** Values read from the evaluated sheet, or what keeps each missing one from having a value. */
export type ReadValues<K extends string> = { ok: true; values: Record<K, number> } | { ok: false; problems: string[] };

/**
 * Reads rows of the evaluated sheet in their own units. A row without a value is reported with the
 * engine's error for it (which names the key), or as missing from the sheet.
 */
export function readValues<K extends string>(snapshot: SheetSnapshot, keys: readonly K[]): ReadValues<K> {
  const problems: string[] = [];
  const values: Partial<Record<K, number>> = {};
  for (const key of keys) {
    const value = snapshot.values[key];
    if (value !== undefined && Number.isFinite(value.value)) {
      values[key] = value.value;
      continue;
    }
    const error = snapshot.errors.find((candidate) => candidate.key === key);
    const present = snapshot.sheet.parameters.some((parameter) => parameter.key === key);
    problems.push(error?.message ?? (present ? `${key}: has no value` : `${key}: the sheet has no row with this key`));
  }
  return problems.length > 0 ? { ok: false, problems } : { ok: true, values: values as Record<K, number> };
}

/** The sheet row each optical coefficient is read from. */
const opticsRows: Readonly<Record<keyof OpticalCoefficients, string>> = {
  reflectivity: 'reflectivity',
  specularFraction: 'specular_fraction',
  emissivityFront: 'emissivity_front',
  emissivityBack: 'emissivity_back',
  nonLambertianFront: 'nonlambertian_front',
  nonLambertianBack: 'nonlambertian_back',
};

/** The sail's optical coefficients from the sheet's current values. */
export function readOptics(snapshot: SheetSnapshot): { ok: true; optics: OpticalCoefficients } | { ok: false; problems: string[] } {
  const read = readValues(snapshot, Object.values(opticsRows));
  if (!read.ok) return read;
  const { values } = read;
  const coefficient = (name: keyof OpticalCoefficients) => values[opticsRows[name]] ?? Number.NaN;
  return {
    ok: true,
    optics: {
      reflectivity: coefficient('reflectivity'),
      specularFraction: coefficient('specularFraction'),
      emissivityFront: coefficient('emissivityFront'),
      emissivityBack: coefficient('emissivityBack'),
      nonLambertianFront: coefficient('nonLambertianFront'),
      nonLambertianBack: coefficient('nonLambertianBack'),
    },
  };
}

/** The message of anything a physics function throws (they throw RangeErrors naming the argument). */
export function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

/** A row's value in its own unit ("deg", "rad", "arcmin", …) as an angle in radians; NaN when the unit is not an angle. */
export function angleInRadians(value: number, unit: string): number {
  const parsed = parseUnit(unit);
  if (!parsed.ok) return Number.NaN;
  const { dimension } = parsed.value;
  return sameDimension(dimension, ANGLE) || sameDimension(dimension, DIMENSIONLESS) ? toSI(value, parsed.value) : Number.NaN;
}

/** Degrees to radians. */
export function radians(degrees: number): number {
  return (degrees * Math.PI) / 180;
}

/** Radians to degrees. */
export function degrees(rad: number): number {
  return (rad * 180) / Math.PI;
}
