import { formatNumber, formatQuantity, formatUnit } from '@/shared/format/quantity';
import type { CompareResponse, FieldChange, OutputChange } from '@/shared/schemas/compare';
import type { Revision } from '@/shared/schemas/revisions';
import type { Parameter } from '@/shared/schemas/sheet';

const kindLabels: Readonly<Record<Revision['kind'], string>> = { draft: 'draft', baseline: 'baseline', study: 'study' };

/** A revision as a picker offers it: "PDR · baseline", "Working draft · draft". */
export function revisionChoiceLabel(revision: Revision): string {
  return `${revision.label} · ${kindLabels[revision.kind]}`;
}

/**
 * What a comparison starts from when the address names no revisions: the working draft against the latest
 * baseline, or against the draft's parent when nothing is locked yet. Undefined where there is no such revision.
 */
export function defaultPair(revisions: readonly Revision[]): { from: string | undefined; to: string | undefined } {
  const draft = revisions.find((revision) => revision.kind === 'draft');
  const baselines = revisions.filter((revision) => revision.kind === 'baseline');
  const latestBaseline = baselines.reduce<Revision | undefined>(
    (latest, revision) => (latest === undefined || (revision.lockedAt ?? '') > (latest.lockedAt ?? '') ? revision : latest),
    undefined,
  );
  const from = latestBaseline ?? revisions.find((revision) => revision.id === draft?.parentId);
  return { from: from?.id, to: draft?.id };
}

/** Whether an output differs between the two revisions: another value, a value on one side only, or another dimension. */
export function outputChanged(output: OutputChange): boolean {
  return output.dimensionChanged || output.from !== output.to;
}

/** What the person narrows the comparison to. */
export type CompareFilters = {
  changedOnly: boolean;
  /** A subsystem's name; null for every subsystem. */
  subsystem: string | null;
  /** Text an output's label or key contains (any case). */
  outputSearch: string;
};

/** The subsystems the comparison names, in the order they first appear. */
export function subsystemsOf(comparison: CompareResponse): string[] {
  const { added, removed, changed } = comparison.rows;
  return [...new Set([...added, ...removed, ...changed, ...comparison.outputs].map((item) => item.subsystem))];
}

/** The rows and outputs of a comparison that pass the filters: the subsystem applies to both, the rest to outputs. */
export function filterComparison(comparison: CompareResponse, filters: CompareFilters) {
  const inSubsystem = (item: { subsystem: string }) => filters.subsystem === null || item.subsystem === filters.subsystem;
  const search = filters.outputSearch.trim().toLowerCase();
  return {
    added: comparison.rows.added.filter(inSubsystem),
    removed: comparison.rows.removed.filter(inSubsystem),
    changed: comparison.rows.changed.filter(inSubsystem),
    outputs: comparison.outputs.filter(
      (output) =>
        inSubsystem(output) &&
        (!filters.changedOnly || outputChanged(output)) &&
        (search === '' || output.label.toLowerCase().includes(search) || output.key.toLowerCase().includes(search)),
    ),
  };
}

/** A change with its sign written out: "+12 kg", "−3 kg", "0 kg". */
export function signedQuantity(value: number, unit: string): string {
  return `${value > 0 ? '+' : ''}${formatQuantity(value, unit)}`;
}

/** A relative change: "+12.5 %"; "—" when there is none (no old value, or an old value of zero). */
export function percentText(percent: number | null): string {
  return percent === null ? '—' : `${percent > 0 ? '+' : ''}${formatNumber(percent, 3)} %`;
}

/** An output's old value, in the unit it had then. */
export function oldOutputText(output: OutputChange): string {
  return output.from === null ? '—' : formatQuantity(output.from, output.fromUnit);
}

/** An output's new value. */
export function newOutputText(output: OutputChange): string {
  return output.to === null ? '—' : formatQuantity(output.to, output.unit);
}

/** An output's absolute change; "—" when a side has no value or the dimension changed. */
export function outputChangeText(output: OutputChange): string {
  return output.change === null ? '—' : signedQuantity(output.change, output.unit);
}

/** Why an output has no change to show, when it has none: the engine's problem, or a unit of another dimension. */
export function outputNote(output: OutputChange): string | undefined {
  if (output.problem !== undefined) return output.problem;
  if (output.dimensionChanged) return `Its unit changed from ${formatUnit(output.fromUnit)} to ${formatUnit(output.unit)}: not comparable.`;
  return undefined;
}

const fieldLabels: Readonly<Record<FieldChange['field'], string>> = {
  value: 'Value',
  formula: 'Formula',
  material: 'Material',
  unit: 'Unit',
  maturity: 'Maturity',
  category: 'Category',
  subsystem: 'Subsystem',
  label: 'Label',
  note: 'Note',
  source: 'Source',
  role: 'Role',
  protected: 'Protected',
};

/** A changed field of a row as it reads: its name, and the old and new text (values with their units). */
export function fieldChangeText(change: FieldChange): { field: string; from: string; to: string } {
  const field = fieldLabels[change.field];
  if (change.field === 'value') {
    return {
      field,
      from: change.from === null ? 'none' : formatQuantity(change.from, change.fromUnit),
      to: change.to === null ? 'none' : formatQuantity(change.to, change.toUnit),
    };
  }
  if (change.field === 'unit') return { field, from: unitText(change.from), to: unitText(change.to) };
  return { field, from: change.from ?? 'none', to: change.to ?? 'none' };
}

function unitText(unit: string | null): string {
  return unit === null ? 'none' : formatUnit(unit) || 'no unit';
}

/** A whole row's definition, for rows added or removed: its formula, its value with the unit, or its material. */
export function definitionOf(parameter: Parameter): string {
  if (parameter.formula !== undefined) {
    const unit = formatUnit(parameter.unit);
    return unit === '' ? parameter.formula : `${parameter.formula} (${unit})`;
  }
  if (parameter.material !== undefined) return `library: ${parameter.material.id} · ${parameter.material.property}`;
  return parameter.value === undefined ? '—' : formatQuantity(parameter.value, parameter.unit);
}
