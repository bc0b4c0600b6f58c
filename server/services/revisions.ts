import type { Sequelize } from 'sequelize';
import { withAllowanceTable } from '@/shared/budget/craft-table';
import { mayOnAnyRow, mayOnCraft, mayOnRow, standingOf, type RevisionStanding, type Who } from '@/shared/access/permissions';
import { headlineFigures, sheetMassBudget } from '@/shared/analyses';
import { evaluateSheet } from '@/shared/engine';
import type {
  EvaluationResponse,
  Revision as RevisionDto,
  RevisionAbilities,
  RevisionDetail,
  RevisionParameter,
} from '@/shared/schemas/revisions';
import type { Sheet } from '@/shared/schemas/sheet';
import type { User } from '../models';
import { authorizeCraft, type CraftAccess } from './craft-access';
import {
  revisionAlongWithCraft,
  revisionDetailJson,
  revisionFromAlong,
  selectRevisions,
  sheetHeaderOf,
  sheetOfParameters,
  toRevisionDto,
  type SubsystemRecord,
} from './sheet-store';
import { craftAllowanceTable } from './allowance-tables';

/** The craft's revisions (draft, baselines, studies), oldest first. */
export async function listRevisions(sequelize: Sequelize, user: User, craftId: string): Promise<RevisionDto[]> {
  await authorizeCraft(user, craftId, 'viewCraft');
  return (await selectRevisions(sequelize, craftId)).map(toRevisionDto);
}

/** What the person may do in a revision of this standing, from the permission table. */
export function abilitiesIn(who: Who, standing: RevisionStanding, subsystems: readonly SubsystemRecord[]): RevisionAbilities {
  return {
    editableSubsystemIds: subsystems
      .filter((subsystem) => mayOnRow('editRow', who, { subsystemId: subsystem.id }, standing))
      .map((s) => s.id),
    manageRows: mayOnAnyRow('manageRow', who, standing),
    manageSubsystems: mayOnCraft('manageSubsystems', who),
    wholeSheet: mayOnCraft('viewWholeSheet', who),
  };
}

/** A revision loaded for reading, with who reads it and the rows they may see. */
export interface ReadableRevision {
  who: CraftAccess;
  standing: RevisionStanding;
  revision: Awaited<ReturnType<typeof revisionFromAlong>>['revision'];
  /** Every row in the API's format, as UTF-8 JSON text written by PostgreSQL. */
  parametersJson: Buffer;
  /** Whether the person may see the rows of every subsystem of the craft, and so every row. */
  seesEveryRow: boolean;
  /** Every row, parsed on demand (the detail for a reader of every row sends `parametersJson` as it is). */
  rows: () => RevisionParameter[];
  visibleRows: () => RevisionParameter[];
  /** The whole sheet in the documented format, built on demand. */
  sheet: () => Sheet;
}

/** Loads a revision for reading: craft access, the revision, its subsystems and rows in one query. */
export async function readRevision(user: User, craftId: string, revisionId: string): Promise<ReadableRevision> {
  const who = await authorizeCraft(user, craftId, 'viewCraft', revisionAlongWithCraft(revisionId));
  const { revision, parametersJson } = await revisionFromAlong(who.extra);
  const standing = standingOf(revision);
  // Every row belongs to one of the craft's subsystems (writes name them by the craft's own ids).
  const seesEveryRow = (revision.subsystems ?? []).every((subsystem) => mayOnRow('viewRow', who, { subsystemId: subsystem.id }, standing));
  let parsed: RevisionParameter[] | undefined;
  const rows = () => (parsed ??= JSON.parse(parametersJson.toString()) as RevisionParameter[]);
  const visibleRows = () => (seesEveryRow ? rows() : rows().filter((row) => mayOnRow('viewRow', who, row, standing)));
  return { who, standing, revision, parametersJson, seesEveryRow, rows, visibleRows, sheet: () => sheetOfParameters(revision, rows()) };
}

/**
 * What a reader who does not see every row gets computed here over the whole sheet: the headline figures,
 * and the values of the rows they see (so their formulas show numbers, not references to rows they cannot see).
 */
function partialReaderFigures(
  sheet: Sheet,
  visibleRows: readonly RevisionParameter[],
): Pick<RevisionDetail, 'headlineFigures' | 'serverValues'> {
  const evaluation = evaluateSheet(sheet);
  return {
    headlineFigures: headlineFigures(sheet, evaluation).map(({ value, ...figure }) => ({ ...figure, value: value ?? null })),
    serverValues: Object.fromEntries(
      visibleRows.flatMap((row) => {
        const value = evaluation.values[row.key];
        return value === undefined ? [] : [[row.key, value]];
      }),
    ),
  };
}

/**
 * The revision and its sheet in the documented format, each row with its version, as UTF-8 JSON (a
 * `RevisionDetail`); partners get only the rows shared with them and the headline figures computed on the
 * server. Whoever sees every row gets the rows as PostgreSQL wrote them, without parsing them here.
 */
export async function getRevisionDetail(user: User, craftId: string, revisionId: string): Promise<Buffer> {
  const readable = await readRevision(user, craftId, revisionId);
  const { who, standing, revision } = readable;
  const subsystems = revision.subsystems ?? [];
  const abilities = abilitiesIn(who, standing, subsystems);
  const visibleSubsystems = abilities.wholeSheet ? subsystems : subsystems.filter((subsystem) => who.subsystemIds?.includes(subsystem.id));
  const detail = {
    revision: toRevisionDto(revision),
    sheet: sheetHeaderOf(revision),
    subsystems: visibleSubsystems,
    abilities,
    ...(abilities.wholeSheet ? {} : partialReaderFigures(readable.sheet(), readable.visibleRows())),
  };
  return revisionDetailJson(detail, readable.seesEveryRow ? readable.parametersJson : Buffer.from(JSON.stringify(readable.visibleRows())));
}

/**
 * The revision evaluated on the server with the shared engine, in the CLI's JSON shape plus the mass budget;
 * a partner gets only the values, errors and budget lines of the rows they see (the totals stay: they are
 * headline figures).
 */
export async function getRevisionEvaluation(user: User, craftId: string, revisionId: string): Promise<EvaluationResponse> {
  const readable = await readRevision(user, craftId, revisionId);
  const rows = readable.rows();
  const visibleRows = readable.visibleRows();
  const sheet = withAllowanceTable(readable.sheet(), await craftAllowanceTable(craftId));
  const evaluation = evaluateSheet(sheet);
  const budget = sheetMassBudget(sheet, evaluation);
  const response: EvaluationResponse = {
    values: evaluation.values,
    errors: evaluation.errors,
    budget: budget.ok
      ? { ok: true, result: { ...budget.result, rows: [...budget.result.rows], bySubsystem: [...budget.result.bySubsystem] } }
      : budget,
  };
  if (visibleRows.length === rows.length) return response;
  const visibleKeys = new Set(visibleRows.map((row) => row.key));
  const visibleSubsystemNames = new Set(visibleRows.map((row) => row.subsystem));
  return {
    values: Object.fromEntries(Object.entries(response.values).filter(([key]) => visibleKeys.has(key))),
    errors: response.errors.filter((error) => visibleKeys.has(error.key)),
    budget: response.budget.ok
      ? {
          ok: true,
          result: {
            ...response.budget.result,
            rows: response.budget.result.rows.filter((line) => visibleKeys.has(line.key)),
            bySubsystem: response.budget.result.bySubsystem.filter((line) => visibleSubsystemNames.has(line.subsystem)),
          },
        }
      : { ok: false, errors: response.budget.errors.filter((error) => visibleKeys.has(error.key)) },
  };
}
