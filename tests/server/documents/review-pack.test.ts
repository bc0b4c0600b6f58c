import { headlineFigures, sheetMassBudget } from '@/shared/analyses';
import { SIZING_CAUTION } from '@/shared/analyses/caution';
import { evaluateSheet } from '@/shared/engine';
import { formatQuantity } from '@/shared/format/quantity';
import { squareSailTemplate } from '@/shared/templates';
import { renderReviewPack, type ReviewPackContent } from '@/server/documents/review-pack';
import { pdfPages } from '../helpers/pdf-text';

function contentOf(sheet = squareSailTemplate()): ReviewPackContent {
  const evaluation = evaluateSheet(sheet);
  const budget = sheetMassBudget(sheet, evaluation);
  if (!budget.ok) throw new Error('the template rolls up');
  return {
    craftName: 'Kestrel pathfinder',
    revision: {
      label: 'PDR baseline',
      kind: 'baseline',
      note: 'For the preliminary design review.',
      lockedBy: 'Rhea Calder',
      lockedAt: new Date('2026-11-30T14:05:00Z'),
    },
    generatedBy: 'Rhea Calder',
    generatedAt: new Date('2026-12-01T09:00:00Z'),
    headline: headlineFigures(sheet, evaluation),
    rowLabels: Object.fromEntries(sheet.parameters.map((parameter) => [parameter.key, parameter.label])),
    budget: { ok: true, result: budget.result },
    changes: {
      since: 'SRR baseline',
      rows: [{ key: 'sail_side', label: 'Sail side length', what: 'value', from: '40 m', to: '45 m' }],
      outputs: [{ key: 'sail_area', label: 'Sail area', what: '+26.56 %', from: '1600 m²', to: '2025 m²' }],
    },
    caution: SIZING_CAUTION,
  };
}

describe('renderReviewPack', () => {
  it('writes the label, who locked it, the headline figures, the budget and the changes, readable back as text', async () => {
    const content = contentOf();
    const text = pdfPages(await renderReviewPack(content)).join('\n');
    expect(text).toContain('Kestrel pathfinder');
    expect(text).toContain('PDR baseline');
    expect(text).toContain('Locked by Rhea Calder on 2026-11-30 14:05 UTC');
    for (const figure of content.headline) {
      expect(text).toContain(figure.label);
      if (figure.value !== undefined) expect(text).toContain(formatQuantity(figure.value, figure.unit));
    }
    expect(text).toContain('Mass budget');
    expect(text).toContain('Membrane mass');
    expect(text).toContain('Changes since SRR baseline');
    expect(text).toContain('Sail side length (sail_side)');
  });

  it('puts the caution and "page i of n" on every page, however long the budget', async () => {
    const template = squareSailTemplate();
    // Forty more mass rows push the budget table over several pages.
    const extra = Array.from({ length: 40 }, (_, index) => ({
      key: `bracket_${String.fromCharCode(97 + (index % 26))}${String.fromCharCode(97 + Math.floor(index / 26))}`,
      label: `Bracket ${index + 1}`,
      subsystem: 'Spacecraft',
      unit: 'kg',
      value: 0.1,
      mass: { maturity: 'estimated', category: 'structure' },
    }));
    const pages = pdfPages(await renderReviewPack(contentOf({ ...template, parameters: [...template.parameters, ...extra] })));
    expect(pages.length).toBeGreaterThan(1);
    pages.forEach((pageText, index) => {
      expect(pageText.replace(/\s+/g, ' ')).toContain(SIZING_CAUTION.slice(0, 40));
      expect(pageText).toContain(`Page ${index + 1} of ${pages.length}`);
    });
  });

  it('says so when there is no earlier baseline, and when the budget cannot be rolled up', async () => {
    const text = pdfPages(
      await renderReviewPack({ ...contentOf(), changes: undefined, budget: { ok: false, problems: ['no mass allocation row'] } }),
    ).join('\n');
    expect(text).toContain('first baseline of the craft');
    expect(text).toContain('no mass allocation row');
  });
});
