import type { Sequelize } from 'sequelize';
import { mayOnAnyRow, mayOnCraft, mayOnRow, type RevisionStanding, type Who } from '@/shared/access/permissions';
import { headlineFigures, sheetMassBudget } from '@/shared/analyses';
import { evaluateSheet } from '@/shared/engine';
import type { EvaluationResponse, Revision as RevisionDto, RevisionAbilities, RevisionDetail } from '@/shared/schemas/revisions';
import type { Sheet } from '@/shared/schemas/sheet';
import type { User } from '../models';
import { rowsFromJson, type StoredRow } from '../models/sheet-rows';
import { authorizeCraft, type CraftAccess } from './craft-access';
import {
  revisionFromJson,
  revisionJsonColumn,
  selectRevisions,
  sheetOf,
  toRevisionDto,
  toRevisionParameter,
  type SubsystemRecord,
} from './sheet-store';

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

interface ReadableRevision {
  who: CraftAccess;
  standing: RevisionStanding;
  revision: ReturnType<typeof revisionFromJson>;
  rows: StoredRow[];
  visibleRows: StoredRow[];
  /** The whole sheet in the documented format, built on demand (the detail of a full reader does not need it). */
  sheet: () => Sheet;
}

/** Loads a revision for reading: craft access, the revision, its subsystems and rows in one query. */
async function readRevision(user: User, craftId: string, revisionId: string): Promise<ReadableRevision> {
  const who = await authorizeCraft(user, craftId, 'viewCraft', { sql: revisionJsonColumn('$4'), binds: [revisionId] });
  const revision = revisionFromJson(who.extra);
  const rows = rowsFromJson(revision.rows ?? []);
  const standing = { kind: revision.kind, state: revision.state };
  const visibleRows = rows.filter((row) => mayOnRow('viewRow', who, row, standing));
  return { who, standing, revision, rows, visibleRows, sheet: () => sheetOf(revision, rows) };
}

/**
 * What a reader who does not see every row gets computed here over the whole sheet: the headline figures,
 * and the values of the rows they see (so their formulas show numbers, not references to rows they cannot see).
 */
function partialReaderFigures(sheet: Sheet, visibleRows: readonly StoredRow[]): Pick<RevisionDetail, 'headlineFigures' | 'serverValues'> {
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
 * The revision and its sheet in the documented format, each row with its version; partners get only the
 * rows shared with them and the headline figures computed on the server.
 */
export async function getRevisionDetail(user: User, craftId: string, revisionId: string): Promise<RevisionDetail> {
  const readable = await readRevision(user, craftId, revisionId);
  const { who, standing, revision, visibleRows } = readable;
  const subsystems = revision.subsystems ?? [];
  const abilities = abilitiesIn(who, standing, subsystems);
  const visibleSubsystems = abilities.wholeSheet ? subsystems : subsystems.filter((subsystem) => who.subsystemIds?.includes(subsystem.id));
  return {
    revision: toRevisionDto(revision),
    sheet: { ...sheetOf(revision, []), parameters: visibleRows.map(toRevisionParameter) },
    subsystems: visibleSubsystems,
    abilities,
    ...(abilities.wholeSheet ? {} : partialReaderFigures(readable.sheet(), visibleRows)),
  };
}

/**
 * The revision evaluated on the server with the shared engine, in the CLI's JSON shape plus the mass budget;
 * a partner gets only the values, errors and budget lines of the rows they see (the totals stay: they are
 * headline figures).
 */
export async function getRevisionEvaluation(user: User, craftId: string, revisionId: string): Promise<EvaluationResponse> {
  const readable = await readRevision(user, craftId, revisionId);
  const { rows, visibleRows } = readable;
  const sheet = readable.sheet();
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
  const visibleSubsystemNames = new Set(visibleRows.map((row) => row.subsystemName));
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
