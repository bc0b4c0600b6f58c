/**
 * Analyses and figure selection on a sheet, by role and in SI: the one place screens, the server and
 * the CLI read headline figures, the mass budget and the sizing series from.
 */
export { siValues, roleValuesSI, findRoleRows, type RoleRow } from '@/shared/analyses/roles';
export {
  headlineFigures,
  massAllocation,
  sheetMassBudget,
  templateChecks,
  BELOW_REQUIRED_MARGIN,
  type CheckResult,
  type HeadlineFigure,
} from '@/shared/analyses/headline';
export {
  coneAngleSeries,
  filmThicknessTrade,
  temperatureVersusDistance,
  sheetFilmLimitK,
  sizeToTarget,
  roleSweep,
  sizingChoices,
  sizingTargets,
  type ConeAngleSeries,
  type FilmThicknessTrade,
  type TemperatureVersusDistance,
  type SizeToTargetRequest,
  type RoleSweepRequest,
  type RoleSweepResult,
  type RoleSeries,
  type SizingChoice,
} from '@/shared/analyses/series';
