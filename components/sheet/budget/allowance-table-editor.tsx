import { useMemo, useState } from 'react';
import { ScrollView, StyleSheet, TextInput, View } from 'react-native';
import { ApiError } from '@/components/api/client';
import { Button } from '@/components/ui/button';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { AppText } from '@/components/ui/text';
import { TextField } from '@/components/ui/text-field';
import { colors, fonts, radii, space } from '@/components/ui/theme';
import { EXTRAPOLATED, systemMarginBases, type AllowancePreset, type SystemMarginBasis } from '@/shared/budget';
import { formatNumber } from '@/shared/format/quantity';
import type { AllowanceTable } from '@/shared/schemas/allowance-tables';
import { useSaveAllowanceTable } from './queries';

export interface AllowanceTableEditorProps {
  readonly craftId: string;
  /** The table the budget reads now: the craft's own, or the preset the sheet names. */
  readonly current: AllowancePreset;
  /** Whether `current` is the craft's own table (else a shipped preset the team starts from). */
  readonly own: boolean;
  /** Whether the person may save the craft's table (systems and chief engineers). */
  readonly canEdit: boolean;
}

type Cells = Record<string, Record<string, string>>;

const percentText = (fraction: number | undefined): string => (fraction === undefined ? '' : formatNumber(fraction * 100, 6));

function cellsOf(preset: AllowancePreset): Cells {
  return Object.fromEntries(
    preset.maturities.map((maturity) => [
      maturity.id,
      Object.fromEntries(preset.categories.map((category) => [category.id, percentText(preset.table[maturity.id]?.[category.id])])),
    ]),
  );
}

/** A percentage typed in a cell as a fraction, or undefined when it is not a number. */
function fractionOf(text: string): number | undefined {
  const value = Number(text.replace('%', '').trim());
  return text.trim() === '' || !Number.isFinite(value) ? undefined : value / 100;
}

/**
 * The allowance table the budget reads, as a grid of percentages by maturity and category with the required
 * system margin. Engineers edit the cells and save them as the craft's own table; a shipped preset is the
 * starting point until then (its extrapolated columns lose that mark once the team's cells replace them).
 */
export function AllowanceTableEditor({ craftId, current, own, canEdit }: AllowanceTableEditorProps) {
  const [cells, setCells] = useState<Cells>(() => cellsOf(current));
  const [margin, setMargin] = useState(formatNumber(current.systemMarginPercent, 6));
  const [basis, setBasis] = useState<SystemMarginBasis>(current.systemMarginBasis);
  const [problem, setProblem] = useState<string>();
  const save = useSaveAllowanceTable(craftId);
  const categories = useMemo(
    () => current.categories.map((category) => ({ ...category, label: own ? category.label : category.label.replace(EXTRAPOLATED, '') })),
    [current, own],
  );
  const serverProblems = save.error instanceof ApiError ? save.error.fieldErrors : [];

  const submit = () => {
    const table: Record<string, Record<string, number>> = {};
    for (const maturity of current.maturities) {
      const row: Record<string, number> = {};
      for (const category of categories) {
        const fraction = fractionOf(cells[maturity.id]?.[category.id] ?? '');
        if (fraction === undefined) {
          setProblem(`${maturity.label} × ${category.label}: type a percentage`);
          return;
        }
        row[category.id] = fraction;
      }
      table[maturity.id] = row;
    }
    const marginPercent = Number(margin);
    if (margin.trim() === '' || !Number.isFinite(marginPercent)) {
      setProblem('System margin: type a percentage');
      return;
    }
    setProblem(undefined);
    const saved: AllowanceTable = {
      id: own ? current.id : `${current.id}-own`,
      name: own ? current.name : `${current.name} (the team's own cells)`,
      source: own ? current.source : "The team's own table",
      caveat: own ? current.caveat : 'Cells entered by the team from its own copy of the standard; check each against it.',
      maturities: current.maturities.map(({ id, label }) => ({ id, label })),
      categories: categories.map(({ id, label }) => ({ id, label })),
      table,
      systemMarginPercent: marginPercent,
      systemMarginBasis: basis,
    };
    save.mutate(saved);
  };

  return (
    <View style={styles.editor} testID="allowance-table-editor">
      <AppText variant="muted">
        {own ? "The craft's own table" : `Preset: ${current.name}`} · {current.source}
      </AppText>
      <ScrollView horizontal>
        <View>
          <View style={styles.row}>
            <AppText variant="label" style={styles.rowLabel}>
              Maturity \ category (%)
            </AppText>
            {categories.map((category) => (
              <AppText key={category.id} variant="label" style={styles.cellLabel}>
                {category.label}
              </AppText>
            ))}
          </View>
          {current.maturities.map((maturity) => (
            <View key={maturity.id} style={styles.row}>
              <AppText style={styles.rowLabel}>{maturity.label}</AppText>
              {categories.map((category) => (
                <TextInput
                  key={category.id}
                  aria-label={`${maturity.label}, ${category.label} (%)`}
                  editable={canEdit}
                  value={cells[maturity.id]?.[category.id] ?? ''}
                  onChangeText={(text) =>
                    setCells((before) => ({ ...before, [maturity.id]: { ...before[maturity.id], [category.id]: text } }))
                  }
                  inputMode="decimal"
                  style={styles.cell}
                  testID={`allowance-cell-${maturity.id}-${category.id}`}
                />
              ))}
            </View>
          ))}
        </View>
      </ScrollView>
      <TextField
        label="Required system margin (%)"
        value={margin}
        onChangeText={setMargin}
        editable={canEdit}
        inputMode="decimal"
        testID="allowance-margin"
      />
      <ChoiceChips
        label="The margin is a share"
        choices={(Object.keys(systemMarginBases) as SystemMarginBasis[]).map((value) => ({ value, label: systemMarginBases[value] }))}
        value={basis}
        onChange={(value) => canEdit && setBasis(value)}
        testID="allowance-basis"
      />
      {problem !== undefined ? (
        <AppText variant="error" role="alert" testID="allowance-problem">
          {problem}
        </AppText>
      ) : null}
      {serverProblems.map((issue) => (
        <AppText key={issue.path} variant="error" role="alert">
          {issue.path.replace(/^body\.table\./, '')}: {issue.message}
        </AppText>
      ))}
      {save.error !== null && serverProblems.length === 0 ? <AppText variant="error">{save.error.message}</AppText> : null}
      {canEdit ? (
        <Button label="Save as the craft's table" busy={save.isPending} onPress={submit} testID="allowance-save" />
      ) : (
        <AppText variant="muted">{"Systems and chief engineers edit the craft's allowance table."}</AppText>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  editor: { gap: space.sm },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.xs, paddingVertical: 2 },
  rowLabel: { width: 170, fontSize: 14 },
  cellLabel: { width: 76, fontSize: 12 },
  cell: {
    width: 76,
    borderWidth: 1,
    borderColor: colors.rule,
    borderRadius: radii.sm,
    paddingHorizontal: space.xs,
    paddingVertical: 4,
    fontFamily: fonts.mono,
    color: colors.ink,
    backgroundColor: colors.panel,
    textAlign: 'right',
  },
});
