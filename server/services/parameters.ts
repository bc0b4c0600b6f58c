import type { Sequelize, Transaction } from 'sequelize';
import { withAllowanceTable } from '@/shared/budget/craft-table';
import { mayOnRow, standingOf, whyNotOnRow, type RevisionStanding, type RowAction } from '@/shared/access/permissions';
import { evaluateSheet, parseUnit, valueInRowUnit, type EngineError, type EngineErrorCode } from '@/shared/engine';
import { parseFormula, referencedKeys } from '@/shared/engine/formula-parser';
import type { CreateParameterBody, RevisionParameter, UpdateParameterBody } from '@/shared/schemas/revisions';
import { parameterSchema, type Parameter, type Sheet } from '@/shared/schemas/sheet';
import { HttpError, notFound } from '../http-error';
import type { User } from '../models';
import {
  deleteRow,
  insertRows,
  recordChanges,
  selectRows,
  setOrder,
  toParameter,
  updateRow,
  type RowChange,
  type StoredRow,
} from '../models/sheet-rows';
import { requireMeasuredEvidence } from './attachments';
import { authorizeCraft, type CraftAccess } from './craft-access';
import { notifyRowOwners } from './notifications';
import { announce } from './sheet-events';
import { craftAllowanceTable } from './allowance-tables';
import { selectRevision, selectSubsystems, sheetHeaderOf, toRevisionParameter, type SubsystemRecord } from './sheet-store';

/** Engine errors a write may not introduce: the row (or a row it breaks) would not mean anything. */
const refusedCodes: ReadonlySet<EngineErrorCode> = new Set([
  'syntax_error',
  'unknown_key',
  'unknown_unit',
  'dimension_mismatch',
  'cycle',
  'unknown_function',
  'wrong_argument_count',
  'invalid_argument',
  'unknown_material',
  'budget_error',
  'invalid_key',
  'duplicate_key',
]);

/** The sheet of a revision as a write sees it, with the revision locked for the transaction. */
interface WriteContext {
  sequelize: Sequelize;
  transaction: Transaction;
  user: User;
  who: CraftAccess;
  standing: RevisionStanding;
  header: Omit<Sheet, 'parameters'>;
  rows: StoredRow[];
  subsystems: SubsystemRecord[];
}

/** What a write did: the history entries, the keys to announce (with their subsystems) and its answer. */
interface WriteOutcome<T> {
  changes: RowChange[];
  /** Each changed key (a renamed row under its old and new key) and the subsystem its row is in. */
  subsystemOf: Record<string, string>;
  result: T;
}

/**
 * Runs a write on one revision in a transaction: locks the revision (writes to it run one at a time, so the
 * version check and the sheet-wide checks see the current sheet), lets `work` check and change rows, records
 * each change in the history and announces it at commit.
 */
async function writeRevision<T>(
  sequelize: Sequelize,
  user: User,
  craftId: string,
  revisionId: string,
  work: (context: WriteContext) => Promise<WriteOutcome<T>>,
): Promise<T> {
  const who = await authorizeCraft(user, craftId, 'viewCraft');
  return sequelize.transaction(async (transaction) => {
    const revision = await selectRevision(sequelize, craftId, revisionId, { transaction, lock: true });
    const rows = await selectRows(sequelize, revisionId, transaction);
    const subsystems = await selectSubsystems(sequelize, craftId, transaction);
    const context: WriteContext = {
      sequelize,
      transaction,
      user,
      who,
      standing: standingOf(revision),
      // The craft's own allowance table decides which maturities and categories a mass row may name.
      header: withAllowanceTable(sheetHeaderOf(revision), await craftAllowanceTable(craftId, transaction)),
      rows,
      subsystems,
    };
    const outcome = await work(context);
    if (outcome.changes.length === 0) return outcome.result;
    await recordChanges(sequelize, revisionId, outcome.changes, user.id, transaction);
    // Owners hear of changes to their rows in the working draft; a study is a trial of its own.
    if (revision.kind === 'draft') {
      await notifyRowOwners(sequelize, transaction, { craftId, actor: user, changes: outcome.changes, subsystemOf: outcome.subsystemOf });
    }
    await sequelize.query('UPDATE revisions SET updated_at = now() WHERE id = $1', { bind: [revisionId], transaction });
    await announce(
      sequelize,
      transaction,
      {
        type: 'parameters_changed',
        craftId,
        revisionId,
        keys: Object.keys(outcome.subsystemOf),
        by: { id: user.id, name: user.name },
        at: new Date().toISOString(),
      },
      outcome.subsystemOf,
    );
    return outcome.result;
  });
}

/** The row with this key, 404 when there is none or the person may not see it (its existence does not leak). */
function findRow(context: WriteContext, key: string): StoredRow {
  const row = context.rows.find((candidate) => candidate.key === key);
  if (!row || !mayOnRow('viewRow', context.who, row, context.standing)) throw notFound(`Parameter "${key}"`);
  return row;
}

/** 403 with the permission table's reason unless the person may take the action on a row of this subsystem. */
function requireOnRow(context: WriteContext, action: RowAction, subsystem: SubsystemRecord) {
  const why = whyNotOnRow(action, context.who, { subsystemId: subsystem.id, subsystemName: subsystem.name }, context.standing);
  if (why !== undefined) throw new HttpError(403, 'forbidden', why);
}

function subsystemOfRow(row: StoredRow): SubsystemRecord {
  return { id: row.subsystemId, name: row.subsystemName, position: 0 };
}

/** The subsystem of this name, 400 when the craft has none. */
function subsystemNamed(context: WriteContext, name: string, field: string): SubsystemRecord {
  const subsystem = context.subsystems.find((candidate) => candidate.name === name);
  if (!subsystem) {
    throw new HttpError(400, 'unknown_subsystem', `The craft has no subsystem "${name}"; add it first`, [
      { path: field, message: `no subsystem "${name}"` },
    ]);
  }
  return subsystem;
}

function refuseProtected(row: StoredRow) {
  if (row.protected) throw new HttpError(403, 'protected', `Row "${row.key}" is protected: people read it but do not change it`);
}

function requireVersion(row: StoredRow, version: number) {
  if (row.version !== version) {
    throw new HttpError(
      409,
      'version_conflict',
      `Row "${row.key}" was changed by someone else (now version ${row.version}, you read ${version})`,
      {
        current: toRevisionParameter(row),
      },
    );
  }
}

/** 400 naming the row and field when the parameter does not satisfy the sheet format. */
function checkParameter(parameter: Parameter, field: string): Parameter {
  const parsed = parameterSchema.safeParse(parameter);
  if (parsed.success) return parsed.data;
  const message = parsed.error.issues.map((issue) => issue.message).join('; ');
  throw new HttpError(400, 'invalid_parameter', `Row "${parameter.key}": ${message}`, [{ path: field, message }]);
}

/**
 * Evaluates the sheet before and after a change with the shared engine: the first error of the refused
 * kinds that the change introduces, in a changed row or in a row it breaks; undefined when there is none.
 */
export function introducedError(before: Sheet, after: Sheet): EngineError | undefined {
  const existing = new Set(evaluateSheet(before).errors.map((error) => `${error.key}\u0000${error.code}`));
  return evaluateSheet(after).errors.find((error) => refusedCodes.has(error.code) && !existing.has(`${error.key}\u0000${error.code}`));
}

/** Refuses (400, the engine's code, naming the row) a change that introduces an error of the refused kinds. */
function refuseNewErrors(before: Sheet, after: Sheet, field: string) {
  const introduced = introducedError(before, after);
  if (introduced) throw new HttpError(400, introduced.code, introduced.message, [{ path: field, message: introduced.message }]);
}

/** Keys in sheet order with `key` placed before `before` (null: at the end). */
function orderWith(keys: readonly string[], key: string, before: string | null, field: string): string[] {
  const others = keys.filter((candidate) => candidate !== key);
  if (before === null) return [...others, key];
  const at = others.indexOf(before);
  if (at < 0)
    throw new HttpError(400, 'unknown_key', `No row "${before}" to place "${key}" before`, [
      { path: field, message: `no row "${before}"` },
    ]);
  return [...others.slice(0, at), key, ...others.slice(at)];
}

const NAME_OR_NUMBER = /(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?|[A-Za-z_][A-Za-z0-9_.]*/g;

/**
 * The formula with every reference to `from` renamed to `to`: names as the formula parser reads them
 * (numbers such as 1e5 are skipped, a name followed by "(" is a function), compared without case as the
 * engine compares names. Undefined when the parsed formula does not refer to `from`.
 */
export function renameReference(formula: string, from: string, to: string): string | undefined {
  let references: string[];
  try {
    references = referencedKeys(parseFormula(formula)).map((key) => key.toLowerCase());
  } catch {
    return undefined;
  }
  if (!references.includes(from.toLowerCase())) return undefined;
  return formula.replace(NAME_OR_NUMBER, (token, offset: number) => {
    if (token.toLowerCase() !== from.toLowerCase()) return token;
    const following = formula.slice(offset + token.length).trimStart();
    return following.startsWith('(') ? token : to;
  });
}

/** Keys of the other rows whose formulas use the row. */
function usersOf(rows: readonly StoredRow[], key: string): string[] {
  return rows
    .filter((row) => row.key !== key && row.formula !== null && renameReference(row.formula, key, key) !== undefined)
    .map((row) => row.key);
}

const withSheet = (context: WriteContext, parameters: Parameter[]): Sheet => ({ ...context.header, parameters });

/** The row's value, formula or material replaced per the body; the value converted into the row's (new) unit. */
function applyContent(current: Parameter, body: UpdateParameterBody): Parameter {
  let next: Parameter = { ...current };
  if (body.unit !== undefined && body.unit !== current.unit) {
    const unit = parseUnit(body.unit);
    if (!unit.ok)
      throw new HttpError(400, 'unknown_unit', `${current.key}: ${unit.message}`, [{ path: 'body.unit', message: unit.message }]);
    next.unit = body.unit;
    // An input keeps its quantity in the new unit (40 m becomes 0.04 km) unless the body gives a new value.
    if (current.value !== undefined && body.value === undefined) {
      const kept = valueInRowUnit(next, `${current.value} ${current.unit}`);
      if (!kept.ok) throw new HttpError(400, kept.error.code, kept.error.message, [{ path: 'body.unit', message: kept.error.message }]);
      next.value = kept.value;
    }
  }
  if (body.value !== undefined) {
    const converted = valueInRowUnit(next, body.value);
    if (!converted.ok)
      throw new HttpError(400, converted.error.code, converted.error.message, [{ path: 'body.value', message: converted.error.message }]);
    const { formula: _formula, material: _material, ...rest } = next;
    next = { ...rest, value: converted.value };
  }
  if (body.formula !== undefined) {
    const { value: _value, material: _material, ...rest } = next;
    next = { ...rest, formula: body.formula };
  }
  if (body.label !== undefined) next.label = body.label;
  if (body.note !== undefined) next.note = body.note;
  if (body.source !== undefined) next.source = body.source;
  if (body.mass === null) delete next.mass;
  else if (body.mass !== undefined) next.mass = body.mass;
  return next;
}

/** The body field a refusal of the computation is filed under. */
function computedField(body: UpdateParameterBody): string {
  if (body.formula !== undefined) return 'body.formula';
  if (body.value !== undefined) return 'body.value';
  if (body.unit !== undefined) return 'body.unit';
  if (body.mass !== undefined) return 'body.mass';
  return 'body.key';
}

/**
 * Changes a row: content (value, formula, unit, label, note, source, mass) needs `editRow` on its subsystem;
 * renaming, moving and reordering need `manageRow`. A rename rewrites the formulas that use the row (each
 * of those rows gets a new version). 409 version_conflict with the current row when `version` is stale.
 */
export async function updateParameter(
  sequelize: Sequelize,
  user: User,
  craftId: string,
  revisionId: string,
  key: string,
  body: UpdateParameterBody,
): Promise<RevisionParameter> {
  return writeRevision(sequelize, user, craftId, revisionId, async (context) => {
    const row = findRow(context, key);
    const subsystem = subsystemOfRow(row);
    const changesContent = (['value', 'formula', 'unit', 'label', 'note', 'source', 'mass'] as const).some(
      (field) => body[field] !== undefined,
    );
    const changesPlace = body.key !== undefined || body.before !== undefined || body.subsystem !== undefined;
    if (changesContent) requireOnRow(context, 'editRow', subsystem);
    if (changesPlace) requireOnRow(context, 'manageRow', subsystem);
    refuseProtected(row);
    requireVersion(row, body.version);

    const before = toParameter(row);
    let next = applyContent(before, body);
    let target = subsystem;
    if (body.subsystem !== undefined && body.subsystem !== row.subsystemName) {
      target = subsystemNamed(context, body.subsystem, 'body.subsystem');
      requireOnRow(context, 'manageRow', target);
      next.subsystem = target.name;
    }
    const renamed = body.key !== undefined && body.key !== key ? body.key : undefined;
    if (renamed !== undefined) {
      if (context.rows.some((other) => other.key === renamed)) {
        throw new HttpError(409, 'duplicate_key', `A row "${renamed}" exists already`, [
          { path: 'body.key', message: 'is used by another row' },
        ]);
      }
      next.key = renamed;
    }
    next = checkParameter(next, computedField(body));
    await requireMeasuredEvidence(context.sequelize, context.transaction, {
      parameterId: row.id,
      key: next.key,
      maturityBefore: before.mass?.maturity,
      maturityAfter: next.mass?.maturity,
      field: 'body.mass.maturity',
    });

    // Rows whose formulas use the renamed row, rewritten to the new key.
    const rewritten = new Map<string, Parameter>();
    if (renamed !== undefined) {
      for (const other of context.rows) {
        const formula = other.formula === null || other.key === key ? undefined : renameReference(other.formula, key, renamed);
        if (formula !== undefined) rewritten.set(other.key, { ...toParameter(other), formula });
      }
    }
    const touchesComputation = ['value', 'formula', 'unit', 'mass', 'key'].some(
      (field) => body[field as keyof UpdateParameterBody] !== undefined,
    );
    if (touchesComputation) {
      const current = context.rows.map(toParameter);
      const after = current.map((parameter) => (parameter.key === key ? next : (rewritten.get(parameter.key) ?? parameter)));
      refuseNewErrors(withSheet(context, current), withSheet(context, after), computedField(body));
    }

    const keys = context.rows.map((candidate) => candidate.key);
    const order = body.before !== undefined ? orderWith(keys, key, body.before, 'body.before') : keys;
    const position = body.before !== undefined ? order.indexOf(key) + 1 : row.position;
    const contentChanged = JSON.stringify(next) !== JSON.stringify(before) || target.id !== row.subsystemId;
    // A write that changes nothing (the same value again) is accepted without a new version or a history entry.
    if (!contentChanged && body.before === undefined) return { changes: [], subsystemOf: {}, result: toRevisionParameter(row) };
    if (contentChanged) {
      const stored = await updateRow(
        context.sequelize,
        row.id,
        row.version,
        { parameter: next, subsystemId: target.id, position },
        context.user.id,
        context.transaction,
      );
      if (!stored) throw new Error(`row ${key} changed under the revision lock`);
    }
    for (const other of context.rows) {
      const formulaNow = rewritten.get(other.key);
      if (formulaNow === undefined) continue;
      const content = { parameter: formulaNow, subsystemId: other.subsystemId, position: other.position };
      if (!(await updateRow(context.sequelize, other.id, other.version, content, context.user.id, context.transaction))) {
        throw new Error(`row ${other.key} changed under the revision lock`);
      }
    }
    if (body.before !== undefined) {
      await setOrder(
        context.sequelize,
        revisionId,
        order.map((candidate) => (candidate === key ? next.key : candidate)),
        context.transaction,
      );
    }

    const action: RowChange['action'] = renamed !== undefined ? 'rename' : contentChanged && changesContent ? 'update' : 'move';
    const changes: RowChange[] = [
      {
        key: next.key,
        action,
        before: { ...before, version: row.version },
        after: { ...next, version: contentChanged ? row.version + 1 : row.version },
      },
      ...context.rows.flatMap((other) => {
        const after = rewritten.get(other.key);
        return after
          ? [
              {
                key: other.key,
                action: 'update' as const,
                before: { ...toParameter(other), version: other.version },
                after: { ...after, version: other.version + 1 },
              },
            ]
          : [];
      }),
    ];
    const subsystemOf: Record<string, string> = { [next.key]: target.id, [key]: row.subsystemId };
    for (const other of context.rows) if (rewritten.has(other.key)) subsystemOf[other.key] = other.subsystemId;
    const stored = (await selectRows(context.sequelize, revisionId, context.transaction)).find((candidate) => candidate.key === next.key);
    if (!stored) throw notFound(`Parameter "${next.key}"`);
    return { changes, subsystemOf, result: toRevisionParameter(stored) };
  });
}

/**
 * Adds a row in the sheet format to a subsystem the craft has, before `before` or after the last row of its
 * subsystem; `manageRow`. 409 duplicate_key; 400 when the engine would refuse the row.
 */
export async function createParameter(
  sequelize: Sequelize,
  user: User,
  craftId: string,
  revisionId: string,
  body: CreateParameterBody,
): Promise<RevisionParameter> {
  return writeRevision(sequelize, user, craftId, revisionId, async (context) => {
    const { parameter } = body;
    const subsystem = subsystemNamed(context, parameter.subsystem, 'body.parameter.subsystem');
    requireOnRow(context, 'manageRow', subsystem);
    if (context.rows.some((row) => row.key === parameter.key)) {
      throw new HttpError(409, 'duplicate_key', `A row "${parameter.key}" exists already`, [
        { path: 'body.parameter.key', message: 'is used by another row' },
      ]);
    }
    await requireMeasuredEvidence(context.sequelize, context.transaction, {
      parameterId: null,
      key: parameter.key,
      maturityBefore: undefined,
      maturityAfter: parameter.mass?.maturity,
      field: 'body.parameter.mass.maturity',
    });
    const current = context.rows.map(toParameter);
    refuseNewErrors(withSheet(context, current), withSheet(context, [...current, parameter]), 'body.parameter');

    const keys = context.rows.map((row) => row.key);
    const lastOfSubsystem = context.rows.filter((row) => row.subsystemId === subsystem.id).at(-1);
    const after = lastOfSubsystem ? keys.indexOf(lastOfSubsystem.key) + 1 : keys.length;
    const order =
      body.before !== undefined
        ? orderWith(keys, parameter.key, body.before, 'body.before')
        : [...keys.slice(0, after), parameter.key, ...keys.slice(after)];
    await insertRows(
      context.sequelize,
      revisionId,
      [{ parameter, subsystemId: subsystem.id, position: keys.length + 1 }],
      context.user.id,
      context.transaction,
    );
    await setOrder(context.sequelize, revisionId, order, context.transaction);
    const stored = (await selectRows(context.sequelize, revisionId, context.transaction)).find((row) => row.key === parameter.key);
    if (!stored) throw notFound(`Parameter "${parameter.key}"`);
    return {
      changes: [{ key: parameter.key, action: 'create', before: null, after: { ...parameter, version: 1 } }],
      subsystemOf: { [parameter.key]: subsystem.id },
      result: toRevisionParameter(stored),
    };
  });
}

/** Deletes a row read at `version`; `manageRow`. 409 in_use (listing the rows) while other formulas use it. */
export async function deleteParameter(
  sequelize: Sequelize,
  user: User,
  craftId: string,
  revisionId: string,
  key: string,
  version: number,
): Promise<void> {
  await writeRevision(sequelize, user, craftId, revisionId, async (context) => {
    const row = findRow(context, key);
    requireOnRow(context, 'manageRow', subsystemOfRow(row));
    refuseProtected(row);
    requireVersion(row, version);
    const users = usersOf(context.rows, key);
    if (users.length > 0) {
      throw new HttpError(409, 'in_use', `Row "${key}" is used by ${users.join(', ')}; change those formulas first`, { keys: users });
    }
    await deleteRow(context.sequelize, row.id, context.transaction);
    return {
      changes: [{ key, action: 'delete', before: { ...toParameter(row), version: row.version }, after: null }],
      subsystemOf: { [key]: row.subsystemId },
      result: undefined,
    };
  });
}
