/**
 * Input checks shared by the sail functions. Each throws a RangeError that names the
 * parameter, the function it was given to, and the value received.
 */

function shown(value: number): string {
  return Number.isNaN(value) ? 'NaN' : String(value);
}

/** Throws unless `value` is a finite number. Returns the value. */
export function requireFinite(where: string, name: string, value: number): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${where}: ${name} must be a finite number, got ${shown(value)}`);
  }
  return value;
}

/** Throws unless `value` is finite and > 0. Returns the value. */
export function requirePositive(where: string, name: string, value: number): number {
  requireFinite(where, name, value);
  if (value <= 0) throw new RangeError(`${where}: ${name} must be greater than 0, got ${shown(value)}`);
  return value;
}

/** Throws unless `value` is finite and >= 0. Returns the value. */
export function requireNonNegative(where: string, name: string, value: number): number {
  requireFinite(where, name, value);
  if (value < 0) throw new RangeError(`${where}: ${name} must not be negative, got ${shown(value)}`);
  return value;
}

/**
 * Throws unless `min <= value <= max` (or `< max` when `maxExclusive`). Returns the value.
 * `unit` is appended to the bounds in the message (e.g. 'rad').
 */
export function requireInRange(
  where: string,
  name: string,
  value: number,
  min: number,
  max: number,
  options: { maxExclusive?: boolean; minExclusive?: boolean; unit?: string } = {},
): number {
  requireFinite(where, name, value);
  const belowMin = options.minExclusive ? value <= min : value < min;
  const aboveMax = options.maxExclusive ? value >= max : value > max;
  if (belowMin || aboveMax) {
    const unit = options.unit ? ` ${options.unit}` : '';
    const open = options.minExclusive ? '(' : '[';
    const close = options.maxExclusive ? ')' : ']';
    throw new RangeError(`${where}: ${name} must be in ${open}${min}, ${max}${close}${unit}, got ${shown(value)}${unit}`);
  }
  return value;
}
