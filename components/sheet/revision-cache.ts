import type { CreateParameterBody, RevisionDetail, RevisionParameter, UpdateParameterBody } from '@/shared/schemas/revisions';
import type { Parameter, Sheet } from '@/shared/schemas/sheet';

/**
 * Changes to a cached revision made before the server answers (optimistic updates), and the sheet the engine
 * reads from it. Pure functions: each returns a new detail and leaves untouched rows as the same objects.
 */

/** A stored row as the documented sheet format has it, without version and authorship. */
export function toParameter(row: RevisionParameter): Parameter {
  const { version: _version, subsystemId: _subsystemId, updatedBy: _updatedBy, updatedAt: _updatedAt, ...parameter } = row;
  return parameter;
}

/**
 * The revision's rows as a sheet for the engine. A reader who sees only some rows (a partner) gets their
 * formula rows as the values the server computed over the whole sheet: those formulas read rows they cannot see.
 */
export function toSheet(detail: RevisionDetail): Sheet {
  const { serverValues } = detail;
  const parameters = detail.sheet.parameters.map(toParameter).map((parameter): Parameter => {
    const computed = serverValues?.[parameter.key];
    if (computed === undefined || parameter.formula === undefined) return parameter;
    const { formula: _formula, ...input } = parameter;
    return { ...input, value: computed.value, unit: computed.unit };
  });
  return { ...detail.sheet, parameters };
}

function withRows(detail: RevisionDetail, parameters: RevisionParameter[]): RevisionDetail {
  return { ...detail, sheet: { ...detail.sheet, parameters } };
}

function subsystemIdOf(detail: RevisionDetail, name: string, fallback: string): string {
  return detail.subsystems.find((subsystem) => subsystem.name === name)?.id ?? fallback;
}

const wholeWord = (key: string) => new RegExp(`\\b${key}\\b`, 'g');

/** A row with the fields of a PATCH body applied (value and formula replace each other). */
export function applyFields(row: RevisionParameter, body: Omit<UpdateParameterBody, 'version'>, detail: RevisionDetail): RevisionParameter {
  let next: RevisionParameter = { ...row };
  if (body.value !== undefined && typeof body.value === 'number') {
    const { formula: _formula, material: _material, ...rest } = next;
    next = { ...rest, value: body.value } as RevisionParameter;
  }
  if (body.formula !== undefined) {
    const { value: _value, material: _material, ...rest } = next;
    next = { ...rest, formula: body.formula } as RevisionParameter;
  }
  if (body.mass === null) {
    const { mass: _mass, ...rest } = next;
    next = rest as RevisionParameter;
  } else if (body.mass !== undefined) next = { ...next, mass: body.mass };
  if (body.unit !== undefined) next = { ...next, unit: body.unit };
  if (body.label !== undefined) next = { ...next, label: body.label };
  if (body.note !== undefined) next = { ...next, note: body.note };
  if (body.source !== undefined) next = { ...next, source: body.source };
  if (body.key !== undefined) next = { ...next, key: body.key };
  if (body.subsystem !== undefined) {
    next = { ...next, subsystem: body.subsystem, subsystemId: subsystemIdOf(detail, body.subsystem, row.subsystemId) };
  }
  return next;
}

/** Moves the row `key` before the row `before`, or to the end of its subsystem when `before` is null. */
function move(rows: RevisionParameter[], key: string, before: string | null): RevisionParameter[] {
  const row = rows.find((candidate) => candidate.key === key);
  if (row === undefined) return rows;
  const others = rows.filter((candidate) => candidate.key !== key);
  const target =
    before === null
      ? others.findLastIndex((candidate) => candidate.subsystem === row.subsystem) + 1
      : others.findIndex((candidate) => candidate.key === before);
  others.splice(target < 0 ? others.length : target, 0, row);
  return others;
}

/** The revision with a row changed as the PATCH body says; a rename also renames the key in other rows' formulas. */
export function applyUpdate(detail: RevisionDetail, key: string, body: UpdateParameterBody): RevisionDetail {
  const { version: _version, before, ...fields } = body;
  const renamed = fields.key !== undefined && fields.key !== key ? fields.key : undefined;
  let rows = detail.sheet.parameters.map((row) => {
    if (row.key === key) return applyFields(row, fields, detail);
    if (renamed !== undefined && row.formula !== undefined && wholeWord(key).test(row.formula)) {
      return { ...row, formula: row.formula.replace(wholeWord(key), renamed) };
    }
    return row;
  });
  if (before !== undefined) rows = move(rows, renamed ?? key, before);
  return withRows(detail, rows);
}

/** The revision with a new row, before `before` or at the end of its subsystem. */
export function applyCreate(detail: RevisionDetail, { parameter, before }: CreateParameterBody): RevisionDetail {
  const row: RevisionParameter = {
    ...parameter,
    subsystemId: subsystemIdOf(detail, parameter.subsystem, ''),
    version: 1,
    updatedBy: null,
    updatedAt: new Date().toISOString(),
  };
  return withRows(detail, move([...detail.sheet.parameters, row], row.key, before ?? null));
}

/** The revision without the row `key`. */
export function applyDelete(detail: RevisionDetail, key: string): RevisionDetail {
  return withRows(
    detail,
    detail.sheet.parameters.filter((row) => row.key !== key),
  );
}

/**
 * The rows named by `keys` put back as they were in `previous` (position included), rows that did not exist
 * then removed; every other row stays as it is now.
 */
export function restoreRows(detail: RevisionDetail, previous: RevisionDetail, keys: readonly string[]): RevisionDetail {
  const named = new Set(keys);
  const kept = new Map(detail.sheet.parameters.filter((row) => !named.has(row.key)).map((row) => [row.key, row]));
  const rows = previous.sheet.parameters.flatMap((row) => {
    if (named.has(row.key)) return [row];
    const now = kept.get(row.key);
    kept.delete(row.key);
    return now === undefined ? [] : [now];
  });
  // Rows that arrived from the server since are kept, at the end.
  return withRows(detail, [...rows, ...kept.values()]);
}

/** The revision with one row replaced by the server's copy of it (its answer to a save, or the row now after a version conflict). */
export function replaceRow(detail: RevisionDetail, key: string, current: RevisionParameter): RevisionDetail {
  return withRows(
    detail,
    detail.sheet.parameters.map((row) => (row.key === key ? current : row)),
  );
}
