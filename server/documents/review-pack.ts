import path from 'node:path';
import PDFDocument from 'pdfkit';
import type { HeadlineFigure } from '@/shared/analyses';
import type { BudgetRollUp } from '@/shared/budget';
import { formatMoment } from '@/shared/format/moment';
import { formatNumber, formatQuantity } from '@/shared/format/quantity';

/** One changed row or output since the previous baseline, already in words and units. */
export interface ReviewChange {
  readonly key: string;
  readonly label: string;
  /** What changed: "value", "formula", "added", "removed", or an output's relative change. */
  readonly what: string;
  readonly from: string;
  readonly to: string;
}

/** Everything a review pack shows, gathered and computed before any drawing. */
export interface ReviewPackContent {
  readonly craftName: string;
  readonly revision: {
    readonly label: string;
    readonly kind: string;
    readonly note: string;
    readonly lockedBy: string | null;
    readonly lockedAt: Date | null;
  };
  readonly generatedBy: string;
  readonly generatedAt: Date;
  readonly headline: readonly HeadlineFigure[];
  /** Each row's label by key, for the budget lines. */
  readonly rowLabels: Readonly<Record<string, string>>;
  /** The mass budget, or why it cannot be rolled up. */
  readonly budget: { ok: true; result: BudgetRollUp } | { ok: false; problems: readonly string[] };
  /** Changes since the previous baseline; undefined when there is none before this revision. */
  readonly changes?: { readonly since: string; readonly rows: readonly ReviewChange[]; readonly outputs: readonly ReviewChange[] };
  readonly caution: string;
}

const fontFiles = {
  regular: ['inter', '400Regular', 'Inter_400Regular.ttf'],
  semibold: ['inter', '600SemiBold', 'Inter_600SemiBold.ttf'],
  mono: ['roboto-mono', '400Regular', 'RobotoMono_400Regular.ttf'],
} as const;

/** The app's own typefaces (Inter, Roboto Mono), from the font packages the web app ships. */
function fontPath([family, weight, file]: readonly [string, string, string]): string {
  return path.join(path.dirname(require.resolve(`@expo-google-fonts/${family}/package.json`)), weight, file);
}

const ink = '#14244A';
const muted = '#4A5775';
const rule = '#CDD4E0';
const accent = '#8A5A00';
const danger = '#A32A1F';
const page = { margin: 50, footer: 40 };

type Doc = InstanceType<typeof PDFDocument>;

interface Column {
  readonly title: string;
  readonly width: number;
  readonly align?: 'left' | 'right';
  readonly mono?: boolean;
}

/** Keeps `needed` points of room on the page, starting a new page (with the column titles again) when short. */
function ensureRoom(doc: Doc, needed: number, repeatTitles?: () => void): void {
  if (doc.y + needed <= doc.page.height - page.margin - page.footer) return;
  doc.addPage();
  repeatTitles?.();
}

function heading(doc: Doc, text: string): void {
  ensureRoom(doc, 60);
  doc.moveDown(0.8).font('semibold').fontSize(13).fillColor(ink).text(text, page.margin);
  doc.moveDown(0.3);
}

/** A table with titled columns; long tables continue on the next page under their titles again. */
function table(
  doc: Doc,
  columns: readonly Column[],
  rows: readonly (readonly string[])[],
  emphasised: (index: number) => boolean = () => false,
) {
  const rowHeight = 16;
  const titles = () => {
    let x = page.margin;
    doc.font('semibold').fontSize(8.5).fillColor(muted);
    for (const column of columns) {
      doc.text(column.title, x, doc.y, { width: column.width - 6, align: column.align ?? 'left', lineBreak: false });
      x += column.width;
    }
    doc.moveDown(0.4);
    const y = doc.y;
    doc
      .moveTo(page.margin, y)
      .lineTo(page.margin + columns.reduce((sum, column) => sum + column.width, 0), y)
      .strokeColor(rule)
      .lineWidth(0.7)
      .stroke();
    doc.y = y + 4;
  };
  titles();
  rows.forEach((cells, index) => {
    ensureRoom(doc, rowHeight, titles);
    const y = doc.y;
    let x = page.margin;
    columns.forEach((column, columnIndex) => {
      const font = column.mono === true ? 'mono' : emphasised(index) ? 'semibold' : 'regular';
      doc
        .font(font)
        .fontSize(9)
        .fillColor(ink)
        .text(cells[columnIndex] ?? '', x, y, {
          width: column.width - 6,
          align: column.align ?? 'left',
          height: rowHeight,
          ellipsis: true,
        });
      x += column.width;
    });
    doc.y = y + rowHeight;
  });
}

function headlineSection(doc: Doc, figures: readonly HeadlineFigure[]): void {
  heading(doc, 'Headline figures');
  table(
    doc,
    [
      { title: 'Figure', width: 220 },
      { title: 'Value', width: 140, align: 'right', mono: true },
      { title: 'Note', width: 135 },
    ],
    figures.map((figure) => [
      figure.label,
      figure.value === undefined ? '—' : formatQuantity(figure.value, figure.unit),
      figure.flag ?? figure.problem ?? '',
    ]),
  );
}

/** Shares of the predicted mass by subsystem as horizontal bars, then the predicted total against the allocation. */
function budgetChart(doc: Doc, budget: BudgetRollUp): void {
  const total = budget.total.predicted;
  const barLeft = page.margin + 130;
  const barWidth = 280;
  ensureRoom(doc, 20 * budget.bySubsystem.length + 60);
  doc.moveDown(0.6).font('semibold').fontSize(9).fillColor(muted).text('Share of the predicted mass', page.margin);
  doc.moveDown(0.3);
  for (const line of budget.bySubsystem) {
    const share = total > 0 ? line.predicted / total : 0;
    const y = doc.y;
    doc
      .font('regular')
      .fontSize(9)
      .fillColor(ink)
      .text(line.subsystem, page.margin, y + 2, { width: 124, lineBreak: false, ellipsis: true });
    doc.rect(barLeft, y + 2, Math.max(barWidth * share, 0.5), 10).fill(ink);
    doc
      .font('mono')
      .fontSize(8.5)
      .fillColor(ink)
      .text(`${formatNumber(share * 100, 3)} %`, barLeft + barWidth * share + 6, y + 3, { lineBreak: false });
    doc.y = y + 16;
  }
  const allocation = total + budget.systemMargin.kg;
  if (allocation > 0) {
    const y = doc.y + 8;
    const scale = barWidth / Math.max(allocation, total);
    doc
      .font('regular')
      .fontSize(9)
      .fillColor(ink)
      .text('Predicted vs allocation', page.margin, y + 2, { width: 124, lineBreak: false });
    doc
      .rect(barLeft, y, allocation * scale, 14)
      .strokeColor(muted)
      .lineWidth(0.8)
      .stroke();
    doc.rect(barLeft, y + 3, total * scale, 8).fill(budget.systemMargin.belowRequired ? danger : accent);
    const required = allocation * (1 - budget.systemMargin.requiredPercent / 100) * scale;
    doc
      .moveTo(barLeft + required, y - 3)
      .lineTo(barLeft + required, y + 17)
      .dash(2, { space: 2 })
      .strokeColor(ink)
      .stroke()
      .undash();
    doc.y = y + 22;
    doc
      .font('regular')
      .fontSize(8.5)
      .fillColor(muted)
      .text(
        `Margin ${formatQuantity(budget.systemMargin.kg, 'kg')} (${formatNumber(budget.systemMargin.percentOfAllocation, 3)} % of the allocation of ${formatQuantity(allocation, 'kg')}; required ${formatNumber(budget.systemMargin.requiredPercent, 3)} %, the dashed line).`,
        page.margin,
      );
  }
}

function budgetSection(doc: Doc, budget: ReviewPackContent['budget'], rowLabels: ReviewPackContent['rowLabels']): void {
  heading(doc, 'Mass budget');
  if (!budget.ok) {
    doc
      .font('regular')
      .fontSize(9)
      .fillColor(danger)
      .text(`The budget cannot be rolled up: ${budget.problems.join('; ')}`, page.margin);
    return;
  }
  const { result } = budget;
  const total = result.total.predicted;
  const lines: string[][] = [];
  const subsystemLines = new Set<number>();
  for (const group of result.bySubsystem) {
    subsystemLines.add(lines.length);
    lines.push([
      group.subsystem,
      formatNumber(group.cbe),
      '',
      formatNumber(group.predicted),
      `${formatNumber((group.predicted / total) * 100, 3)} %`,
    ]);
    for (const row of result.rows.filter((candidate) => candidate.subsystem === group.subsystem)) {
      lines.push([
        `   ${rowLabels[row.key] ?? row.key}`,
        formatNumber(row.cbe),
        `${formatNumber(row.allowance * 100, 3)} %`,
        formatNumber(row.predicted),
        '',
      ]);
    }
  }
  subsystemLines.add(lines.length);
  lines.push(['Total', formatNumber(result.total.cbe), '', formatNumber(total), '100 %']);
  table(
    doc,
    [
      { title: 'Subsystem / row', width: 175 },
      { title: 'Basic mass (kg)', width: 85, align: 'right', mono: true },
      { title: 'Allowance', width: 70, align: 'right', mono: true },
      { title: 'Predicted (kg)', width: 85, align: 'right', mono: true },
      { title: 'Share', width: 80, align: 'right', mono: true },
    ],
    lines,
    (index) => subsystemLines.has(index),
  );
  budgetChart(doc, result);
}

function changesSection(doc: Doc, changes: ReviewPackContent['changes']): void {
  heading(doc, changes === undefined ? 'Changes since the previous baseline' : `Changes since ${changes.since}`);
  if (changes === undefined) {
    doc
      .font('regular')
      .fontSize(9)
      .fillColor(muted)
      .text('This is the first baseline of the craft: there is no earlier one to compare with.', page.margin);
    return;
  }
  if (changes.rows.length === 0 && changes.outputs.length === 0) {
    doc.font('regular').fontSize(9).fillColor(muted).text('No row and no output changed.', page.margin);
    return;
  }
  const columns = (subject: string, what: string): Column[] => [
    { title: subject, width: 150 },
    { title: what, width: 85 },
    { title: 'Before', width: 130, mono: true },
    { title: 'After', width: 130, mono: true },
  ];
  const cells = (change: ReviewChange) => [`${change.label} (${change.key})`, change.what, change.from, change.to];
  if (changes.rows.length > 0) table(doc, columns('Row', 'What'), changes.rows.map(cells));
  if (changes.outputs.length > 0) {
    doc.moveDown(0.6).font('semibold').fontSize(9).fillColor(muted).text('Outputs that moved', page.margin);
    doc.moveDown(0.3);
    table(doc, columns('Output', 'Change'), changes.outputs.map(cells));
  }
}

/** The caution and "page i of n" at the foot of every page, written once all pages exist. */
function footers(doc: Doc, content: ReviewPackContent): void {
  const range = doc.bufferedPageRange();
  for (let index = range.start; index < range.start + range.count; index += 1) {
    doc.switchToPage(index);
    const y = doc.page.height - page.margin - page.footer + 8;
    const width = doc.page.width - 2 * page.margin;
    // Writing in the bottom margin: lift the margin so pdfkit does not start a page for it.
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc
      .font('regular')
      .fontSize(7.5)
      .fillColor(accent)
      .text(content.caution, page.margin, y, { width: width - 70 });
    doc
      .font('regular')
      .fontSize(8)
      .fillColor(muted)
      .text(`Page ${index - range.start + 1} of ${range.count}`, page.margin + width - 70, y, { width: 70, align: 'right' });
    doc.page.margins.bottom = bottom;
  }
}

/**
 * The design review pack of a revision as a PDF: craft, label, who locked it and when; headline figures;
 * the mass budget table and chart; changes since the previous baseline; the preliminary-estimate caution
 * and page numbers on every page.
 */
export function renderReviewPack(content: ReviewPackContent): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margins: { top: page.margin, bottom: page.margin, left: page.margin, right: page.margin },
    bufferPages: true,
    info: { Title: `${content.craftName}: ${content.revision.label}`, Author: content.generatedBy, Creator: 'Trimsheet' },
  });
  doc.registerFont('regular', fontPath(fontFiles.regular));
  doc.registerFont('semibold', fontPath(fontFiles.semibold));
  doc.registerFont('mono', fontPath(fontFiles.mono));
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const { revision } = content;
  doc.font('semibold').fontSize(9).fillColor(accent).text('DESIGN REVIEW PACK');
  doc.moveDown(0.2).font('semibold').fontSize(20).fillColor(ink).text(content.craftName);
  doc.font('regular').fontSize(13).fillColor(ink).text(revision.label);
  doc.moveDown(0.4).font('regular').fontSize(9).fillColor(muted);
  doc.text(
    revision.lockedAt === null
      ? `${revision.kind === 'draft' ? 'Working draft' : 'Study'}, not locked: its figures may still change.`
      : `Locked by ${revision.lockedBy ?? 'someone no longer in the organisation'} on ${formatMoment(revision.lockedAt.toISOString())}.`,
  );
  if (revision.note.trim() !== '') doc.text(`Note: ${revision.note}`);
  doc.text(`Generated by ${content.generatedBy} on ${formatMoment(content.generatedAt.toISOString())}.`);

  headlineSection(doc, content.headline);
  budgetSection(doc, content.budget, content.rowLabels);
  changesSection(doc, content.changes);
  footers(doc, content);
  doc.end();
  return done;
}
