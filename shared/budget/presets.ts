import type { AllowancePreset, HardwareCategory, LabelledId, Maturity } from '@/shared/budget/types';

/** The hardware categories every shipped preset uses. */
export const hardwareCategories: readonly (LabelledId & { readonly id: HardwareCategory })[] = [
  { id: 'structure', label: 'Structure' },
  { id: 'mechanism', label: 'Mechanisms' },
  { id: 'membrane', label: 'Sail membrane' },
  { id: 'boom', label: 'Booms' },
  { id: 'electrical', label: 'Electrical and electronic units' },
  { id: 'harness', label: 'Wiring harness' },
  { id: 'thermal', label: 'Thermal control' },
  { id: 'propulsion', label: 'Propulsion' },
  { id: 'payload', label: 'Payload and instruments' },
  { id: 'other', label: 'Other' },
];

/** Sail membranes and booms have no column in the standards' tables: these columns are ours, extrapolated. */
export const EXTRAPOLATED = ' (our extrapolation)';

/** The categories of the AIAA-style preset, its sail columns marked as extrapolated. */
const aiaaCategories: readonly LabelledId[] = hardwareCategories.map((category) =>
  category.id === 'membrane' || category.id === 'boom' ? { ...category, label: `${category.label}${EXTRAPOLATED}` } : category,
);

/** AIAA S-120A-style design maturity categories, most mature last. */
export const aiaaMaturities: readonly (LabelledId & { readonly id: Maturity })[] = [
  { id: 'estimated', label: 'Estimated' },
  { id: 'layout', label: 'Layout' },
  { id: 'pre_release_drawings', label: 'Pre-release drawings' },
  { id: 'released_drawings', label: 'Released drawings' },
  { id: 'existing_hardware', label: 'Existing hardware' },
  { id: 'measured', label: 'Actual (measured)' },
  { id: 'customer_furnished', label: 'Customer-furnished' },
];

/** Percentages by maturity, in the order of `hardwareCategories`. */
type PercentRow = readonly [number, number, number, number, number, number, number, number, number, number];

function percentTable(rows: Readonly<Record<string, PercentRow>>): Record<string, Record<string, number>> {
  const table: Record<string, Record<string, number>> = {};
  for (const [maturity, percents] of Object.entries(rows)) {
    const row: Record<string, number> = {};
    hardwareCategories.forEach((category, index) => {
      row[category.id] = (percents[index] ?? 0) / 100;
    });
    table[maturity] = row;
  }
  return table;
}

function uniformRow(percent: number): PercentRow {
  return [percent, percent, percent, percent, percent, percent, percent, percent, percent, percent];
}

/**
 * AIAA S-120A-2015 (R2019) pattern, from memory: about 18–35 % for estimated hardware, falling to
 * 1–3 % for existing hardware, 0 % measured, wiring harness highest. Customer-furnished items carry
 * the allowance their supplier states, 0 % here.
 */
const aiaaPreset: AllowancePreset = {
  id: 'aiaa-s120a',
  name: 'AIAA S-120A-style mass growth allowances',
  source: 'AIAA S-120A-2015 (R2019), Mass Properties Control for Space Systems, with SAWE RP A-3 (from memory)',
  caveat:
    'From memory, verify against the standard: the cells follow the recalled pattern of the AIAA S-120A allowance table (18–35 % estimated, 1–3 % existing hardware, 0 % measured, harness 50 % when estimated) and are not copied from it. The sail membrane and boom columns are our extrapolation: the standard has no such categories. The system margin of 15 % of the allocation is common practice; S-120A leaves it to the programme.',
  notice:
    "These allowances are not the AIAA S-120A table: they follow its recalled pattern, and the sail membrane and boom columns are our extrapolation. Load your team's own table (from your licensed copy of the standard) to replace them.",
  maturities: aiaaMaturities,
  categories: aiaaCategories,
  table: percentTable({
    // Columns in the order of hardwareCategories: structure, mechanism, membrane, boom, electrical,
    // harness, thermal, propulsion, payload, other.
    estimated: [18, 18, 25, 25, 30, 50, 18, 18, 35, 25],
    layout: [12, 14, 18, 18, 20, 30, 12, 12, 25, 18],
    pre_release_drawings: [8, 10, 12, 12, 12, 20, 8, 8, 15, 12],
    released_drawings: [4, 5, 6, 6, 6, 10, 4, 4, 8, 6],
    existing_hardware: [1, 2, 3, 3, 2, 3, 1, 1, 3, 3],
    measured: uniformRow(0),
    customer_furnished: uniformRow(0),
  }),
  systemMarginPercent: 15,
  systemMarginBasis: 'allocation',
};

/** ESA SRE-PA/2011.097 maturities, with the words of the margin philosophy (ids kept from earlier sheets). */
const esaMaturities: readonly LabelledId[] = [
  { id: 'off_the_shelf', label: 'Off-the-shelf' },
  { id: 'modified', label: 'Minor modification' },
  { id: 'new_design', label: 'New design or major modification' },
];

/** ESA margin philosophy for science assessment studies: equipment margins by maturity, any category. */
const esaPreset: AllowancePreset = {
  id: 'esa-margin',
  name: 'ESA margin philosophy (science assessment studies)',
  source: 'ESA, Margin philosophy for science assessment studies, SRE-PA/2011.097',
  caveat:
    'Equipment margins of 5 % (off-the-shelf), 10 % (minor modification) and 20 % (new design or major modification) apply to every category. The system margin is 20 % of the nominal dry mass including the equipment margins (the predicted mass): the allocation must be at least 1.2 × the predicted mass, a margin of 16.7 % of the allocation.',
  maturities: esaMaturities,
  categories: hardwareCategories,
  table: percentTable({
    off_the_shelf: uniformRow(5),
    modified: uniformRow(10),
    new_design: uniformRow(20),
  }),
  systemMarginPercent: 20,
  systemMarginBasis: 'predicted',
};

/** The shipped allowance presets. */
export const allowancePresets: readonly AllowancePreset[] = [aiaaPreset, esaPreset];

/**
 * A shipped preset by id.
 * @param id preset id ('aiaa-s120a' or 'esa-margin')
 * @returns the preset, or undefined when no preset has that id
 */
export function findPreset(id: string): AllowancePreset | undefined {
  return allowancePresets.find((preset) => preset.id === id);
}
