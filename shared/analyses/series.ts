import {
  applyOverrides,
  compileSheet,
  findMaximum,
  solveForTarget,
  sweep,
  type AnalysisResult,
  type TargetSolveResult,
  type Series,
  type SweepResult,
} from '@/shared/engine';
import { rowError } from '@/shared/engine/errors';
import { fromSI, parseUnit, toSI } from '@/shared/engine/units';
import type { Sheet } from '@/shared/schemas/sheet';
import { sheetTemplate, sizingRange, sizingTargetRoles, type TemplateDefinition } from '@/shared/templates';
import { rowRoleDefinitions, sheetRoles, type RowRole } from '@/shared/templates/roles';
import { findRoleRows, missingRole, type RoleRow } from '@/shared/analyses/roles';

/** One row's values along an analysis, in the row's own display unit (what a chart draws). */
export interface RoleSeries {
  readonly role: RowRole;
  readonly key: string;
  readonly label: string;
  readonly unit: string;
  readonly values: number[];
}

function roleSeries(row: RoleRow, series: Series | undefined): RoleSeries {
  return {
    role: row.role,
    key: row.key,
    label: row.label,
    unit: series?.unit ?? row.parameter.unit,
    values: Array.from(series?.values ?? []),
  };
}

/** A value in a unit converted to another unit of the same dimension (NaN when either does not parse). */
function convert(value: number, from: string, to: string): number {
  const source = parseUnit(from);
  const target = parseUnit(to);
  return source.ok && target.ok ? fromSI(toSI(value, source.value), target.value) : Number.NaN;
}

/**
 * The default range of a sized role, the sheet's own template's first, as text with the template's unit ("5 m"),
 * so a row in another unit converts it.
 */
function defaultRange(role: RowRole, template: TemplateDefinition): { from: string; to: string } | undefined {
  const range = sizingRange(role, template);
  return range === undefined ? undefined : { from: `${range.min} ${range.unit}`, to: `${range.max} ${range.unit}` };
}

// ---------------------------------------------------------------------------------------------- cone angle

/** The force rows a cone-angle chart draws, when the sheet has them, in drawing order. */
const coneForceRoles = ['srp_force_normal', 'srp_force_transverse', 'srp_force_optical', 'srp_force', 'srp_force_circumferential'] as const;

/** Force and acceleration versus cone angle, and the cone angle of largest force across the sun line. */
export interface ConeAngleSeries {
  /** The swept cone angles, in the cone-angle row's unit. */
  readonly coneAngle: RoleSeries;
  /** Each force row of the sheet at each angle, in its unit. */
  readonly forces: RoleSeries[];
  /** Each force over the predicted mass, in the characteristic-acceleration row's unit (m/s^2 without one). */
  readonly accelerations: RoleSeries[];
  /** The numerical maximum of the sheet's force across the sun line; undefined when it has no finite value. */
  readonly best: { readonly coneAngle: number; readonly unit: string; readonly force: number; readonly forceUnit: string } | undefined;
  /** Swept points at which some output has no finite value. */
  readonly invalidPoints: number;
}

/**
 * Force and acceleration versus cone angle from 0 to 90° (`steps` points, default 91) on the compiled
 * sheet, and the cone angle at which the sheet's own force-across-the-sun-line row is largest (a
 * numerical maximum over the cone-angle row, not a restated formula).
 */
export function coneAngleSeries(sheet: Sheet, options: { readonly steps?: number } = {}): AnalysisResult<ConeAngleSeries> {
  const required = findRoleRows(sheet, ['cone_angle', 'srp_force_circumferential', 'predicted_mass']);
  if (!required.ok) return required;
  const roles = sheetRoles(sheet);
  const present = coneForceRoles.filter((role) => roles[role] !== undefined);
  const forceRows = findRoleRows(sheet, present);
  if (!forceRows.ok) return forceRows;
  const forces = present.map((role) => forceRows.result[role]);
  const { cone_angle: cone, srp_force_circumferential: across, predicted_mass: mass } = required.result;
  const range = { from: '0 deg', to: '90 deg' };
  const swept = sweep(sheet, { key: cone.key, ...range, steps: options.steps ?? 91 }, [...forces.map((row) => row.key), mass.key]);
  if (!swept.ok) return swept;
  const maximum = findMaximum(sheet, { input: cone.key, ...range, output: across.key });
  if (!maximum.ok) return maximum;
  const accelerationUnit = sheet.parameters.find((parameter) => parameter.key === roles.characteristic_acceleration)?.unit ?? 'm/s^2';
  const massSeries = swept.result.outputs[forces.length];
  const accelerations = forces.map((row, k) => {
    const force = swept.result.outputs[k];
    const values = Array.from(force?.values ?? [], (value, point) => {
      const newtons = convert(value, force?.unit ?? '', 'N');
      const kilograms = convert(massSeries?.values[point] ?? Number.NaN, massSeries?.unit ?? '', 'kg');
      return convert(newtons / kilograms, 'm/s^2', accelerationUnit);
    });
    return { role: row.role, key: row.key, label: row.label, unit: accelerationUnit, values };
  });
  const found = maximum.result.status === 'found' ? maximum.result : undefined;
  return {
    ok: true,
    result: {
      coneAngle: roleSeries(cone, swept.result.input),
      forces: forces.map((row, k) => roleSeries(row, swept.result.outputs[k])),
      accelerations,
      best:
        found === undefined
          ? undefined
          : { coneAngle: found.input.value, unit: found.input.unit, force: found.output.value, forceUnit: found.output.unit },
      invalidPoints: swept.result.invalidPoints,
    },
  };
}

// ------------------------------------------------------------------------------------------ film thickness

/** Characteristic acceleration versus sail side, one line per film thickness. */
export interface FilmThicknessTrade {
  /** The swept sail sides, in the side row's unit. */
  readonly side: RoleSeries;
  /** One line per thickness: the thickness in µm and the characteristic acceleration at each side, in its row's unit. */
  readonly lines: { readonly thicknessUm: number; readonly acceleration: RoleSeries }[];
  readonly invalidPoints: number;
}

/**
 * Characteristic acceleration versus sail side over the side's sizing range, for three film
 * thicknesses (default: the sheet's own, half and double it), each evaluated on the compiled sheet.
 * @param thicknessesUm film thicknesses in µm
 */
export function filmThicknessTrade(
  sheet: Sheet,
  thicknessesUm?: readonly number[],
  options: { readonly steps?: number } = {},
): AnalysisResult<FilmThicknessTrade> {
  const rows = findRoleRows(sheet, ['film_thickness', 'sail_side', 'characteristic_acceleration']);
  if (!rows.ok) return rows;
  const { film_thickness: film, sail_side: side, characteristic_acceleration: acceleration } = rows.result;
  const own = film.parameter.value === undefined ? Number.NaN : convert(film.parameter.value, film.parameter.unit, 'um');
  const thicknesses = thicknessesUm ?? [own / 2, own, own * 2];
  if (!thicknesses.every((thickness) => Number.isFinite(thickness) && thickness > 0)) {
    const detail = thicknessesUm === undefined ? 'the film thickness is not an input with a value' : `got ${thicknesses.join(', ')} µm`;
    return { ok: false, errors: [rowError(film.key, 'invalid_value', `a thickness trade needs film thicknesses above 0: ${detail}`)] };
  }
  const sideValue = side.parameter.value ?? Number.NaN;
  const range = defaultRange('sail_side', sheetTemplate(sheet)) ?? { from: sideValue / 2, to: sideValue * 2 };
  const lines: FilmThicknessTrade['lines'][number][] = [];
  let invalidPoints = 0;
  let sides: RoleSeries | undefined;
  for (const thicknessUm of thicknesses) {
    const overridden = applyOverrides(sheet, { [film.key]: `${thicknessUm} um` });
    if (overridden.errors.length > 0) return { ok: false, errors: overridden.errors };
    const swept: AnalysisResult<SweepResult> = sweep(overridden.sheet, { key: side.key, ...range, steps: options.steps ?? 60 }, [
      acceleration.key,
    ]);
    if (!swept.ok) return swept;
    sides ??= roleSeries(side, swept.result.input);
    const output = swept.result.outputs[0];
    if (output !== undefined) lines.push({ thicknessUm, acceleration: roleSeries(acceleration, output) });
    invalidPoints += swept.result.invalidPoints;
  }
  if (sides === undefined) return { ok: false, errors: [missingRole('sail_side')] };
  return { ok: true, result: { side: sides, lines, invalidPoints } };
}

// ----------------------------------------------------------------------------------------- temperature

/** Sail temperature versus distance from the Sun, and the closest safe approach for a film limit. */
export interface TemperatureVersusDistance {
  /** The swept distances, in the distance row's unit. */
  readonly distance: RoleSeries;
  /** The sheet's temperature row at each distance, in its unit. */
  readonly temperature: RoleSeries;
  /** The limit used (K): given, or the sheet's film-temperature-limit row; undefined when neither exists. */
  readonly limit: { readonly kelvin: number; readonly from: 'given' | 'sheet' } | undefined;
  /**
   * The distance at which the temperature row reaches the limit (solving for a target on the sheet's own row),
   * in the distance row's unit and in metres; or why there is none; undefined without a limit.
   */
  readonly closestSafe:
    | { readonly status: 'found'; readonly distance: number; readonly unit: string; readonly metres: number }
    | { readonly status: 'none'; readonly message: string }
    | undefined;
}

/**
 * The sheet's temperature row versus the distance row (default 0.1 to 2 AU in 39 points), and the
 * closest safe approach: the distance where the temperature row equals the film limit (`limitK`, or
 * the value of the sheet's film-temperature-limit row).
 */
export function temperatureVersusDistance(
  sheet: Sheet,
  options: { readonly limitK?: number; readonly fromAu?: number; readonly toAu?: number; readonly steps?: number } = {},
): AnalysisResult<TemperatureVersusDistance> {
  const rows = findRoleRows(sheet, ['distance', 'sail_temperature']);
  if (!rows.ok) return rows;
  const { distance, sail_temperature: temperature } = rows.result;
  const swept = sweep(
    sheet,
    { key: distance.key, from: `${options.fromAu ?? 0.1} AU`, to: `${options.toAu ?? 2} AU`, steps: options.steps ?? 39 },
    [temperature.key],
  );
  if (!swept.ok) return swept;
  const limit = temperatureLimit(sheet, options.limitK);
  return {
    ok: true,
    result: {
      distance: roleSeries(distance, swept.result.input),
      temperature: roleSeries(temperature, swept.result.outputs[0]),
      limit,
      closestSafe: limit === undefined ? undefined : closestSafeApproach(sheet, distance, temperature, limit.kelvin),
    },
  };
}

function temperatureLimit(sheet: Sheet, limitK: number | undefined): TemperatureVersusDistance['limit'] {
  if (limitK !== undefined) return { kelvin: limitK, from: 'given' };
  const kelvin = sheetFilmLimitK(sheet);
  return kelvin === undefined ? undefined : { kelvin, from: 'sheet' };
}

/** The value (K) of the sheet's film-temperature-limit row, an input, a material or a formula; undefined without one. */
export function sheetFilmLimitK(sheet: Sheet): number | undefined {
  const key = sheetRoles(sheet).film_temperature_limit;
  if (key === undefined) return undefined;
  // Its SI value (kelvin) from the compiled sheet, whatever unit the row shows.
  const compiled = compileSheet(sheet);
  const index = compiled.analysis.indexOf.get(key);
  const kelvin = index === undefined ? Number.NaN : (compiled.base[index] ?? Number.NaN);
  return Number.isFinite(kelvin) ? kelvin : undefined;
}

function closestSafeApproach(
  sheet: Sheet,
  distance: RoleRow,
  temperature: RoleRow,
  kelvin: number,
): TemperatureVersusDistance['closestSafe'] {
  if (!Number.isFinite(kelvin) || kelvin <= 0) {
    return { status: 'none', message: `film_temperature_limit: must be a temperature above 0 K, got ${kelvin} K` };
  }
  // Far enough out that any sail is cold, close enough in that a film limit of a few thousand kelvin is reached.
  const solved = solveForTarget(sheet, {
    input: distance.key,
    from: '0.005 AU',
    to: '50 AU',
    output: temperature.key,
    target: `${kelvin} K`,
    samples: 2000,
  });
  if (!solved.ok) return { status: 'none', message: solved.errors.map((error) => error.message).join('; ') };
  if (solved.result.status === 'no_solution') return { status: 'none', message: solved.result.message };
  const { value, unit } = solved.result.input;
  return { status: 'found', distance: value, unit, metres: convert(value, unit, 'm') };
}

// ------------------------------------------------------------------------------------ sizing by role

/** What to size: an input role, an output role and the target (a number in the output row's unit, or text with a unit). */
export interface SizeToTargetRequest {
  readonly input: RowRole;
  readonly output: RowRole;
  readonly target: number | string;
  /** The search range; default the templates' sizing range of the input role. */
  readonly from?: number | string;
  readonly to?: number | string;
}

/** Sizing to a target by role: the value of the input role's row at which the output role's row reaches the target. */
export function sizeToTarget(sheet: Sheet, request: SizeToTargetRequest): AnalysisResult<TargetSolveResult> {
  const rows = findRoleRows(sheet, [request.input, request.output]);
  if (!rows.ok) return rows;
  const range = rangeOf(sheet, request.input, request);
  if (!range.ok) return range;
  return solveForTarget(sheet, {
    input: rows.result[request.input].key,
    output: rows.result[request.output].key,
    target: request.target,
    ...range.result,
  });
}

/** A sweep of one input role reading output roles. */
export interface RoleSweepRequest {
  readonly input: RowRole;
  readonly outputs: readonly RowRole[];
  /** The range; default the templates' sizing range of the input role. */
  readonly from?: number | string;
  readonly to?: number | string;
  /** Points, default 50. */
  readonly steps?: number;
}

/** The swept input and each output along it, in their rows' units. */
export interface RoleSweepResult {
  readonly input: RoleSeries;
  readonly outputs: RoleSeries[];
  readonly invalidPoints: number;
}

/** Sweeps the row of an input role over its range on the compiled sheet, reading the rows of the output roles. */
export function roleSweep(sheet: Sheet, request: RoleSweepRequest): AnalysisResult<RoleSweepResult> {
  const rows = findRoleRows(sheet, [request.input, ...request.outputs]);
  if (!rows.ok) return rows;
  const range = rangeOf(sheet, request.input, request);
  if (!range.ok) return range;
  const input = rows.result[request.input];
  const outputs = request.outputs.map((role) => rows.result[role]);
  const swept = sweep(
    sheet,
    { key: input.key, ...range.result, steps: request.steps ?? 50 },
    outputs.map((row) => row.key),
  );
  if (!swept.ok) return swept;
  return {
    ok: true,
    result: {
      input: roleSeries(input, swept.result.input),
      outputs: outputs.map((row, k) => roleSeries(row, swept.result.outputs[k])),
      invalidPoints: swept.result.invalidPoints,
    },
  };
}

function rangeOf(
  sheet: Sheet,
  role: RowRole,
  given: { readonly from?: number | string; readonly to?: number | string },
): AnalysisResult<{ from: number | string; to: number | string }> {
  const fallback = defaultRange(role, sheetTemplate(sheet));
  const from = given.from ?? fallback?.from;
  const to = given.to ?? fallback?.to;
  if (from === undefined || to === undefined) {
    return {
      ok: false,
      errors: [rowError(role, 'invalid_argument', `no sizing range is declared for ${rowRoleDefinitions[role].label}: give from and to`)],
    };
  }
  return { ok: true, result: { from, to } };
}

/** An input a screen offers to size: the role, its row and label, and its default range as text. */
export interface SizingChoice {
  readonly role: RowRole;
  readonly key: string;
  readonly label: string;
  readonly from: string;
  readonly to: string;
}

/** The sheet's input rows that the templates declare a sizing range for, with that range (a formula row is not sized). */
export function sizingChoices(sheet: Sheet): SizingChoice[] {
  const keys = sheetRoles(sheet);
  const template = sheetTemplate(sheet);
  const inputs = new Set(sheet.parameters.flatMap((parameter) => (parameter.value === undefined ? [] : [parameter.key])));
  return (Object.keys(keys) as RowRole[]).flatMap((role) => {
    const key = keys[role];
    const range = defaultRange(role, template);
    return key === undefined || range === undefined || !inputs.has(key)
      ? []
      : [{ role, key, label: rowRoleDefinitions[role].label, ...range }];
  });
}

/** The sizing targets the sheet has rows for, in the contract's order (the first is a screen's default). */
export function sizingTargets(sheet: Sheet): RowRole[] {
  const keys = sheetRoles(sheet);
  return sizingTargetRoles.filter((role) => keys[role] !== undefined);
}
