import { useMemo } from 'react';
import { StyleSheet, View } from 'react-native';
import { BarChart } from '@/components/ui/bar-chart';
import { Card } from '@/components/ui/card';
import { Disclosure } from '@/components/ui/disclosure';
import { DividedList } from '@/components/ui/divided-list';
import { MarginBar } from '@/components/ui/margin-bar';
import { AppText } from '@/components/ui/text';
import { colors, fonts, space } from '@/components/ui/theme';
import { formatNumber, formatQuantity } from '@/shared/format/quantity';
import { SizingCaution } from '@/components/sizing/sizing-caution';
import type { SheetSnapshot } from '@/components/sizing/use-sheet-session';
import { massAllocation } from '@/shared/analyses';
import { systemMarginBases, type BudgetRollUp } from '@/shared/budget';
import { sheetPreset } from '@/shared/engine/sheet-model';
import { AllowanceTableEditor } from './allowance-table-editor';

// The subsystems' bars cycle through the palette's inks and accent so neighbours differ.
const barColors = [colors.ink, colors.film, colors.inkMuted, colors.nominal, colors.focusRing, colors.filmPressed];

/** A share of the total as "42.1 %"; "—" when there is no total. */
function share(part: number, total: number): string {
  return total > 0 ? `${formatNumber((part / total) * 100, 3)} %` : '—';
}

/** A mass in kg as the table's cells show it: the unit is in the column's heading. */
function kilograms(value: number): string {
  return formatNumber(value);
}

/** An allowance fraction (0.2) as "20 %". */
function allowancePercent(fraction: number): string {
  return `${formatNumber(fraction * 100, 3)} %`;
}

type Cells = readonly [string, string, string, string, string];

function BudgetLine({
  cells,
  strong = false,
  header = false,
  testID,
}: {
  cells: Cells;
  strong?: boolean;
  header?: boolean;
  testID?: string;
}) {
  const [name, ...numbers] = cells;
  return (
    <View style={styles.line} testID={testID}>
      <AppText variant={header ? 'label' : 'body'} style={[styles.name, strong && styles.strong]}>
        {name}
      </AppText>
      {numbers.map((text, i) => (
        <AppText key={i} variant={header ? 'label' : 'mono'} style={[styles.number, strong && styles.strongNumber]}>
          {text}
        </AppText>
      ))}
    </View>
  );
}

function BudgetTable({ budget, labelOf }: { budget: BudgetRollUp; labelOf: (key: string) => string }) {
  const total = budget.total.predicted;
  return (
    <DividedList testID="mass-budget-table">
      <BudgetLine cells={['Subsystem / row', 'Basic mass (kg)', 'Allowance', 'Predicted (kg)', 'Share']} header />
      {budget.bySubsystem.flatMap((subsystem) => [
        <BudgetLine
          key={subsystem.subsystem}
          strong
          testID={`budget-subsystem-${subsystem.subsystem}`}
          cells={[
            subsystem.subsystem,
            kilograms(subsystem.cbe),
            // The subsystem's allowance is the growth its rows add together.
            subsystem.cbe > 0 ? allowancePercent(subsystem.predicted / subsystem.cbe - 1) : '—',
            kilograms(subsystem.predicted),
            share(subsystem.predicted, total),
          ]}
        />,
        ...budget.rows
          .filter((row) => row.subsystem === subsystem.subsystem)
          .map((row) => (
            <BudgetLine
              key={row.key}
              testID={`budget-row-${row.key}`}
              cells={[
                `  ${labelOf(row.key)}`,
                kilograms(row.cbe),
                allowancePercent(row.allowance),
                kilograms(row.predicted),
                share(row.predicted, total),
              ]}
            />
          )),
      ])}
      <BudgetLine
        strong
        testID="budget-total"
        cells={['Total', kilograms(budget.total.cbe), '', kilograms(budget.total.predicted), share(total, total)]}
      />
    </DividedList>
  );
}

/** The required margin in the words of its basis: "20 % of the predicted mass (16.7 % of the allocation)". */
function requiredMarginText(margin: BudgetRollUp['systemMargin']): string {
  const stated = `${formatNumber(margin.requiredPercentOfBasis, 3)} % ${systemMarginBases[margin.requiredBasis]}`;
  return margin.requiredBasis === 'allocation' ? stated : `${stated} (${formatNumber(margin.requiredPercent, 3)} % of the allocation)`;
}

export interface MassBudgetViewProps {
  readonly snapshot: SheetSnapshot;
  /** The craft whose own allowance table the editor saves. */
  readonly craftId: string;
  /** Whether the person may save the craft's allowance table. */
  readonly canEditTable: boolean;
}

/**
 * The mass budget by subsystem: basic mass, growth allowance, predicted mass and share of the total,
 * a chart of the shares, and the predicted mass against the allocation with the required margin; the
 * allowance table it reads (the craft's own, or the sheet's preset with what it is not) and its editor.
 */
export function MassBudgetView({ snapshot, craftId, canEditTable }: MassBudgetViewProps) {
  const { budget, sheet } = snapshot;
  const allocation = useMemo(() => (budget.ok ? massAllocation(sheet, budget.result) : undefined), [sheet, budget]);
  const preset = useMemo(() => sheetPreset(sheet.budget), [sheet.budget]);
  const ownTable = sheet.budget?.table !== undefined;
  const labelOf = (key: string) => sheet.parameters.find((parameter) => parameter.key === key)?.label ?? key;

  return (
    <Card testID="mass-budget-view">
      <AppText variant="heading">Mass budget</AppText>
      {preset.ok && !ownTable && preset.value.notice !== undefined ? (
        <AppText variant="muted" role="note" testID="mass-budget-preset-notice">
          {preset.value.notice}
        </AppText>
      ) : null}
      {!budget.ok ? (
        <View role="alert" style={styles.problems} testID="mass-budget-problems">
          {budget.errors.map((error) => (
            <AppText key={`${error.key}${error.message}`} variant="error">
              {error.message}
            </AppText>
          ))}
        </View>
      ) : (
        <>
          <BudgetTable budget={budget.result} labelOf={labelOf} />
          <BarChart
            title="Share of the predicted mass by subsystem"
            bars={budget.result.bySubsystem.map((subsystem, i) => ({
              label: subsystem.subsystem,
              value: budget.result.total.predicted > 0 ? (subsystem.predicted / budget.result.total.predicted) * 100 : Number.NaN,
              color: barColors[i % barColors.length] ?? colors.ink,
            }))}
            valueLabel="Share of the predicted mass (%)"
            categoryLabel="Subsystem"
            formatValue={(value) => `${formatNumber(value, 3)} %`}
            testID="mass-budget-shares"
          />
          {allocation !== undefined ? (
            <MarginBar
              title={`Predicted mass against the ${allocation.label.toLowerCase()}`}
              allocation={allocation.kg}
              predicted={budget.result.total.predicted}
              requiredMargin={(allocation.kg * budget.result.systemMargin.requiredPercent) / 100}
              belowRequired={budget.result.systemMargin.belowRequired}
              valueLabel="Mass (kg)"
              formatValue={(value) => formatQuantity(value, 'kg')}
              testID="mass-budget-margin"
            />
          ) : null}
          <AppText
            variant={budget.result.systemMargin.belowRequired ? 'error' : 'muted'}
            role={budget.result.systemMargin.belowRequired ? 'alert' : undefined}
            testID="mass-budget-margin-text"
          >
            System margin {formatQuantity(budget.result.systemMargin.kg, 'kg')} (
            {formatNumber(budget.result.systemMargin.percentOfAllocation, 3)} % of the allocation); required{' '}
            {requiredMarginText(budget.result.systemMargin)}
            {budget.result.systemMargin.belowRequired ? ': below the required margin.' : '.'}
          </AppText>
        </>
      )}
      {preset.ok ? (
        <Disclosure label={ownTable ? "Allowance table (the craft's own)" : 'Allowance table'} testID="mass-budget-table-toggle">
          <AllowanceTableEditor
            key={JSON.stringify(preset.value)}
            craftId={craftId}
            current={preset.value}
            own={ownTable}
            canEdit={canEditTable}
          />
        </Disclosure>
      ) : null}
      <SizingCaution testID="mass-budget-caution" />
    </Card>
  );
}

const styles = StyleSheet.create({
  problems: { gap: space.xs },
  line: { flexDirection: 'row', alignItems: 'center', gap: space.sm, paddingVertical: space.xs, paddingHorizontal: space.md },
  name: { flex: 1.6, minWidth: 84, fontSize: 14 },
  strong: { fontFamily: fonts.semibold },
  number: { flex: 1, minWidth: 44, textAlign: 'right', color: colors.ink, fontVariant: ['tabular-nums'] },
  strongNumber: { fontFamily: fonts.monoMedium },
});
