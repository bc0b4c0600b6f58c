import { mayOnRow, whyNotOnRow, type Who } from '@/shared/access/permissions';
import { findPreset } from '@/shared/budget/presets';
import type { AllowancePreset } from '@/shared/budget/types';
import type { RevisionDetail } from '@/shared/schemas/revisions';

/** A subsystem's rows in sheet order, as the screen groups them. */
export interface SheetGroup {
  readonly subsystem: string;
  readonly keys: readonly string[];
}

/** What the person may do with one row, from the permission table, and why not when they may not edit it. */
export interface RowAccess {
  readonly editable: boolean;
  readonly manage: boolean;
  readonly readOnlyReason: string | undefined;
}

/** The revision's rows by subsystem: the craft's subsystems in their order, then any other subsystem named by a row. */
export function groupRows(detail: RevisionDetail): SheetGroup[] {
  const groups = new Map<string, string[]>(
    [...detail.subsystems].sort((a, b) => a.position - b.position).map((subsystem) => [subsystem.name, []]),
  );
  for (const row of detail.sheet.parameters) groups.set(row.subsystem, [...(groups.get(row.subsystem) ?? []), row.key]);
  return [...groups].filter(([, keys]) => keys.length > 0).map(([subsystem, keys]) => ({ subsystem, keys }));
}

/**
 * Who the person is on this revision, for the permission table: their role, the subsystems they may edit,
 * and their id (a study's owner edits all of it).
 */
export function whoOn(detail: RevisionDetail, role: Who['role'], isOrgAdmin: boolean, userId: string | undefined): Who {
  return { role, isOrgAdmin, subsystemIds: detail.abilities.editableSubsystemIds, userId };
}

/**
 * Each row's access. A reason is given only where the person may edit some rows but not this one: when
 * nothing is editable the screen says why once, above the sheet.
 */
export function rowAccess(detail: RevisionDetail, who: Who): Record<string, RowAccess> {
  const standing = detail.revision;
  const access: Record<string, RowAccess> = {};
  const editsSome = detail.sheet.parameters.some((row) => mayOnRow('editRow', who, row, standing));
  for (const row of detail.sheet.parameters) {
    const place = { subsystemId: row.subsystemId, subsystemName: row.subsystem };
    const editable = mayOnRow('editRow', who, row, standing);
    const protectedRow = row.protected === true ? 'a protected constant: it is read, not edited' : undefined;
    access[row.key] = {
      editable: editable && row.protected !== true,
      manage: mayOnRow('manageRow', who, row, standing),
      readOnlyReason: editsSome ? (protectedRow ?? whyNotOnRow('editRow', who, place, standing)) : undefined,
    };
  }
  return access;
}

/**
 * The reason every row of a group is read-only for the person, when it is the same for all of them (a
 * subsystem they do not own, protected constants): the screen says it once, at the group.
 */
export function groupReadOnlyReason(group: SheetGroup, access: Readonly<Record<string, RowAccess>>): string | undefined {
  const reasons = new Set(group.keys.map((key) => access[key]?.readOnlyReason));
  const [reason] = reasons;
  return reasons.size === 1 ? reason : undefined;
}

/** Why nothing in the revision can be edited by the person, or undefined when something can. */
export function sheetReadOnlyReason(detail: RevisionDetail, who: Who): string | undefined {
  const first = detail.sheet.parameters[0];
  if (first === undefined || detail.sheet.parameters.some((row) => mayOnRow('editRow', who, row, detail.revision))) return undefined;
  return whyNotOnRow('editRow', who, { subsystemId: first.subsystemId, subsystemName: first.subsystem }, detail.revision);
}

/**
 * The maturities a mass row may take: those of the craft's own allowance table when it has one, else of the
 * revision's preset, in their order (none without either).
 */
export function maturitiesOf(detail: RevisionDetail, ownTable?: AllowancePreset | null): { id: string; label: string }[] {
  const preset = ownTable ?? (detail.sheet.budget === undefined ? undefined : findPreset(detail.sheet.budget.preset));
  return (preset?.maturities ?? []).map((maturity) => ({ id: maturity.id as string, label: maturity.label }));
}

/** The label of a maturity id among these maturities (the id itself when they do not list it). */
export function maturityLabeller(maturities: readonly { id: string; label: string }[]): (maturity: string) => string {
  const labels = new Map(maturities.map((maturity) => [maturity.id, maturity.label]));
  return (maturity) => labels.get(maturity) ?? maturity;
}
