import type { Sequelize } from 'sequelize';
import { withAllowanceTable } from '@/shared/budget/craft-table';
import { headlineFigures, sheetMassBudget } from '@/shared/analyses';
import { SIZING_CAUTION } from '@/shared/analyses/caution';
import { evaluateSheet } from '@/shared/engine';
import { formatNumber, formatQuantity } from '@/shared/format/quantity';
import { compareSheets, evaluatePair } from '@/shared/revisions/compare';
import type { FieldChange, OutputChange } from '@/shared/schemas/compare';
import type { Parameter } from '@/shared/schemas/sheet';
import { renderReviewPack, type ReviewChange, type ReviewPackContent } from '../documents/review-pack';
import { HttpError } from '../http-error';
import type { User } from '../models';
import { readRevision } from './revisions';
import { selectRevisions } from './sheet-store';
import { craftAllowanceTable } from './allowance-tables';

type RevisionRecord = Awaited<ReturnType<typeof selectRevisions>>[number];

/** The outputs that moved most are listed; the full list is the compare screen's. */
const OUTPUTS_LISTED = 25;

/** The nearest baseline the revision descends from (for a baseline, the one before it); undefined for the first. */
function previousBaseline(revisions: readonly RevisionRecord[], revisionId: string): RevisionRecord | undefined {
  const byId = new Map(revisions.map((revision) => [revision.id, revision]));
  const seen = new Set<string>([revisionId]);
  let parentId = byId.get(revisionId)?.parentId ?? null;
  while (parentId !== null && !seen.has(parentId)) {
    seen.add(parentId);
    const parent = byId.get(parentId);
    if (parent === undefined) return undefined;
    if (parent.kind === 'baseline') return parent;
    parentId = parent.parentId;
  }
  return undefined;
}

function definitionText(parameter: Parameter): string {
  if (parameter.formula !== undefined) return parameter.formula;
  if (parameter.value !== undefined) return formatQuantity(parameter.value, parameter.unit, 6);
  return parameter.material === undefined ? '' : `${parameter.material.id} ${parameter.material.property}`;
}

function fieldText(change: FieldChange, side: 'from' | 'to'): string {
  if (change.field === 'value') {
    const value = side === 'from' ? change.from : change.to;
    return value === null ? '—' : formatQuantity(value, side === 'from' ? change.fromUnit : change.toUnit, 6);
  }
  return (side === 'from' ? change.from : change.to) ?? '—';
}

function outputText(output: OutputChange): ReviewChange {
  const percent =
    output.changePercent === null ? '' : ` (${output.changePercent > 0 ? '+' : ''}${formatNumber(output.changePercent, 3)} %)`;
  return {
    key: output.key,
    label: output.label,
    what: output.change === null ? 'no value' : `${output.change > 0 ? '+' : ''}${formatQuantity(output.change, output.unit)}${percent}`,
    from: output.from === null ? '—' : formatQuantity(output.from, output.fromUnit),
    to: output.to === null ? '—' : formatQuantity(output.to, output.unit),
  };
}

/**
 * The review pack of a revision as a PDF (for a design review, usually a baseline): its headline figures and
 * mass budget evaluated here with the shared engine, and its changes since the previous baseline. Only for
 * readers of every row (a partner would see rows not shared with them); 403 otherwise, 404 as for the revision.
 */
export async function reviewPack(
  sequelize: Sequelize,
  user: User,
  craftId: string,
  revisionId: string,
): Promise<{ pdf: Buffer; fileName: string }> {
  const readable = await readRevision(user, craftId, revisionId);
  if (!readable.seesEveryRow)
    throw new HttpError(403, 'forbidden', 'The review pack holds every row of the sheet; it is for those who read the whole sheet');
  const table = await craftAllowanceTable(craftId);
  const sheet = withAllowanceTable(readable.sheet(), table);
  const evaluation = evaluateSheet(sheet);
  const budget = sheetMassBudget(sheet, evaluation);
  const { revision } = readable;

  let changes: ReviewPackContent['changes'];
  const previous = previousBaseline(await selectRevisions(sequelize, craftId), revision.id);
  if (previous !== undefined) {
    const comparison = compareSheets(evaluatePair(withAllowanceTable((await readRevision(user, craftId, previous.id)).sheet(), table), sheet));
    const rows: ReviewChange[] = [
      ...comparison.rows.added.map((row) => ({ key: row.key, label: row.label, what: 'added', from: '—', to: definitionText(row) })),
      ...comparison.rows.removed.map((row) => ({ key: row.key, label: row.label, what: 'removed', from: definitionText(row), to: '—' })),
      ...comparison.rows.changed.flatMap((row) =>
        row.changes.map((change) => ({
          key: row.key,
          label: row.label,
          what: change.field,
          from: fieldText(change, 'from'),
          to: fieldText(change, 'to'),
        })),
      ),
    ];
    const moved = comparison.outputs
      .filter((output) => output.change !== 0)
      .sort((a, b) => Math.abs(b.changePercent ?? Infinity) - Math.abs(a.changePercent ?? Infinity))
      .slice(0, OUTPUTS_LISTED);
    changes = { since: `baseline "${previous.label}"`, rows, outputs: moved.map(outputText) };
  }

  const pdf = await renderReviewPack({
    craftName: readable.who.craft.name,
    revision: {
      label: revision.label,
      kind: revision.kind,
      note: revision.note,
      lockedBy: revision.lockedByName,
      lockedAt: revision.lockedAt,
    },
    generatedBy: user.name,
    generatedAt: new Date(),
    headline: headlineFigures(sheet, evaluation, undefined, budget),
    rowLabels: Object.fromEntries(sheet.parameters.map((parameter) => [parameter.key, parameter.label])),
    budget: budget.ok ? { ok: true, result: budget.result } : { ok: false, problems: budget.errors.map((error) => error.message) },
    changes,
    caution: SIZING_CAUTION,
  });
  const safe = (text: string) => text.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^-+|-+$/g, '') || 'revision';
  return { pdf, fileName: `${safe(readable.who.craft.name)}-${safe(revision.label)}-review.pdf` };
}
