import type { MergeSide } from '../schemas/revisions';
import type { Parameter } from '../schemas/sheet';

/**
 * The row-by-row three-way merge that promotes a study into the working draft. Rows are matched by key;
 * base is the study's source as it was when the study was opened, ours the draft now, theirs the study.
 * A row changed only in the study is taken, a row changed only in the draft stays, a row changed in both
 * to different content is a conflict that a person resolves (keep the draft's, take the study's). A row
 * added or removed on one side is a change like any other; a rename is the removal of the old key and
 * the addition of the new one. Content is everything a row says (label, unit, value or formula or
 * material, mass, note, source, protection, role, subsystem by id); the order of rows is not merged.
 */

/** A row as the merge compares it: the parameter, and its subsystem by id (a subsystem's name may change). */
export type MergeRow = Parameter & { readonly subsystemId: string };

/** A row changed in both the draft and the study since the study was opened, to different content; null: absent there. */
export interface MergeConflict {
  readonly key: string;
  readonly base: MergeRow | null;
  readonly draft: MergeRow | null;
  readonly study: MergeRow | null;
}

/** One change to make to the draft. */
export type MergeStep =
  | { readonly action: 'create'; readonly key: string; readonly row: MergeRow }
  | { readonly action: 'update'; readonly key: string; readonly from: MergeRow; readonly row: MergeRow }
  | { readonly action: 'delete'; readonly key: string; readonly from: MergeRow };

/** The merge before resolutions: the changes that apply by themselves, and the conflicts. */
export interface MergePlan {
  readonly steps: readonly MergeStep[];
  readonly conflicts: readonly MergeConflict[];
}

/** The fields a row's content is compared on, in a fixed order; absent and false protection are the same. */
function contentKey(row: MergeRow | null): string {
  if (row === null) return 'null';
  return JSON.stringify([
    row.label,
    row.unit,
    row.value ?? null,
    row.formula ?? null,
    row.material ? [row.material.id, row.material.property] : null,
    row.mass ? [row.mass.maturity, row.mass.category] : null,
    row.note ?? null,
    row.source ?? null,
    row.protected === true,
    row.role ?? null,
    row.subsystemId,
  ]);
}

/** Whether two rows (or absences) say the same thing. */
export function sameContent(a: MergeRow | null, b: MergeRow | null): boolean {
  return contentKey(a) === contentKey(b);
}

/** The step that turns the draft's row (or its absence) into the study's. */
function stepTowards(key: string, draft: MergeRow | null, study: MergeRow | null): MergeStep | undefined {
  if (draft === null && study !== null) return { action: 'create', key, row: study };
  if (draft !== null && study === null) return { action: 'delete', key, from: draft };
  if (draft !== null && study !== null) return { action: 'update', key, from: draft, row: study };
  return undefined;
}

/** Keys of the three sides: the draft's in its order, then the study's new ones, then those only the base had. */
function unionOfKeys(...sides: readonly (readonly MergeRow[])[]): string[] {
  return [...new Set(sides.flatMap((rows) => rows.map((row) => row.key)))];
}

/** The three-way merge of the study into the draft against the base; pure. */
export function threeWayMerge(base: readonly MergeRow[], draft: readonly MergeRow[], study: readonly MergeRow[]): MergePlan {
  const byKey = (rows: readonly MergeRow[]) => new Map(rows.map((row) => [row.key, row]));
  const [baseRows, draftRows, studyRows] = [byKey(base), byKey(draft), byKey(study)];
  const steps: MergeStep[] = [];
  const conflicts: MergeConflict[] = [];
  for (const key of unionOfKeys(draft, study, base)) {
    const [was, ours, theirs] = [baseRows.get(key) ?? null, draftRows.get(key) ?? null, studyRows.get(key) ?? null];
    if (sameContent(ours, theirs) || sameContent(was, theirs)) continue;
    if (sameContent(was, ours)) {
      const step = stepTowards(key, ours, theirs);
      if (step) steps.push(step);
    } else {
      conflicts.push({ key, base: was, draft: ours, study: theirs });
    }
  }
  return { steps, conflicts };
}

/** What resolving a merge gives: every change to make, or what is missing or wrong in the resolutions. */
export type ResolvedMerge =
  | { readonly ok: true; readonly steps: readonly MergeStep[] }
  | { readonly ok: false; readonly unresolved: readonly MergeConflict[]; readonly notConflicts: readonly string[] };

/**
 * The plan's steps plus, for each conflict resolved to the study, the step that takes the study's row.
 * Fails when a conflict has no resolution or a resolution names a row that is not in conflict.
 */
export function resolveMerge(plan: MergePlan, resolutions: Readonly<Record<string, MergeSide>>): ResolvedMerge {
  const conflictKeys = new Set(plan.conflicts.map((conflict) => conflict.key));
  const unresolved = plan.conflicts.filter((conflict) => resolutions[conflict.key] === undefined);
  const notConflicts = Object.keys(resolutions).filter((key) => !conflictKeys.has(key));
  if (unresolved.length > 0 || notConflicts.length > 0) return { ok: false, unresolved, notConflicts };
  const taken = plan.conflicts.flatMap((conflict) => {
    const step = resolutions[conflict.key] === 'study' ? stepTowards(conflict.key, conflict.draft, conflict.study) : undefined;
    return step ? [step] : [];
  });
  return { ok: true, steps: [...plan.steps, ...taken] };
}

/**
 * The draft's keys after the steps, in order: the draft's rows where they were, the new rows after the last
 * row before them in the study that the draft keeps (at the start when there is none), in the study's order.
 */
export function mergedOrder(draftKeys: readonly string[], studyKeys: readonly string[], steps: readonly MergeStep[]): string[] {
  const deleted = new Set(steps.filter((step) => step.action === 'delete').map((step) => step.key));
  const created = new Set(steps.filter((step) => step.action === 'create').map((step) => step.key));
  const kept = draftKeys.filter((key) => !deleted.has(key));
  const keptSet = new Set(kept);
  // New rows gathered behind the last kept row before them in the study ('' for the start), in the study's order.
  const followers = new Map<string, string[]>();
  let anchor = '';
  for (const key of studyKeys) {
    if (keptSet.has(key)) anchor = key;
    else if (created.has(key)) {
      const behind = followers.get(anchor) ?? [];
      behind.push(key);
      followers.set(anchor, behind);
    }
  }
  return [...(followers.get('') ?? []), ...kept.flatMap((key) => [key, ...(followers.get(key) ?? [])])];
}
