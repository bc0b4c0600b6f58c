import { StyleSheet, View } from 'react-native';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { Disclosure } from '@/components/ui/disclosure';
import { AppText } from '@/components/ui/text';
import { colors, fonts, space } from '@/components/ui/theme';
import { headlineFigures } from '@/shared/analyses';
import { findPreset } from '@/shared/budget';
import { formatNumber, formatQuantity } from '@/shared/format/quantity';
import { evaluationOf } from './analyses/sheet-values';
import { SizingCaution } from './sizing-caution';
import type { SheetSnapshot } from './use-sheet-session';

type FigureProps = {
  figureKey: string;
  label: string;
  value: string;
  detail?: string;
  /** Why there is no value. */
  problem?: string;
  /** A warning about the value, e.g. a margin below the required one. */
  flag?: string;
  wide?: boolean;
};

function Figure({ figureKey, label, value, detail, problem, flag, wide = false }: FigureProps) {
  return (
    <View style={[styles.figure, wide && styles.wide]} testID={`key-figure-${figureKey}`}>
      <AppText variant="label">{label}</AppText>
      <AppText style={[styles.value, problem !== undefined && styles.missing, flag !== undefined && styles.flagged]}>{value}</AppText>
      {detail !== undefined ? <AppText variant="mono">{detail}</AppText> : null}
      {flag !== undefined ? <Badge label={flag} strong /> : null}
      {problem !== undefined ? <AppText variant="error">{problem}</AppText> : null}
    </View>
  );
}

/** The margin's share of the allocation and the share required, from the budget roll-up. */
function marginDetail(snapshot: SheetSnapshot): string | undefined {
  if (!snapshot.budget.ok) return undefined;
  const { systemMargin } = snapshot.budget.result;
  return `${formatNumber(systemMargin.percentOfAllocation, 3)} % of allocation\nrequired: ${formatNumber(systemMargin.requiredPercent, 3)} %`;
}

/** Why the budget cannot be rolled up, shown under the margin (each message names its row). */
function budgetProblem(snapshot: SheetSnapshot): string | undefined {
  if (snapshot.budget.ok) return undefined;
  return snapshot.budget.errors.map((error) => error.message).join('\n') || 'the mass budget cannot be rolled up';
}

function joinProblems(...problems: (string | undefined)[]): string | undefined {
  const present = problems.filter((problem): problem is string => problem !== undefined);
  return present.length === 0 ? undefined : present.join('\n');
}

function sentenceCase(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

function AllowanceNote({ presetId }: { presetId: string | undefined }) {
  const preset = presetId === undefined ? undefined : findPreset(presetId);
  if (preset === undefined) return null;
  return (
    <Disclosure label={`Growth allowances: ${preset.name}`} testID="allowance-note">
      <AppText variant="muted">Source: {preset.source}</AppText>
      <AppText variant="muted">{preset.caveat}</AppText>
    </Disclosure>
  );
}

/** The sizing results at a glance: the sheet's headline figures, found by role, and the budget roll-up's margin. */
export function KeyFigures({ snapshot }: { snapshot: SheetSnapshot }) {
  const figures = headlineFigures(snapshot.sheet, evaluationOf(snapshot));
  return (
    <Card testID="key-figures">
      <AppText variant="heading">Key figures</AppText>
      <SizingCaution testID="key-figures-caution" />
      <View style={styles.grid}>
        {figures.map((figure) => {
          const margin = figure.role === 'system_margin';
          return (
            <Figure
              key={figure.role}
              figureKey={figure.key}
              label={figure.label}
              value={figure.value === undefined ? '—' : formatQuantity(figure.value, figure.unit)}
              detail={margin ? marginDetail(snapshot) : undefined}
              problem={joinProblems(figure.problem, margin ? budgetProblem(snapshot) : undefined)}
              flag={figure.flag === undefined ? undefined : sentenceCase(figure.flag)}
              wide={margin}
            />
          );
        })}
      </View>
      <AllowanceNote presetId={snapshot.sheet.budget?.preset} />
    </Card>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg, rowGap: space.md, paddingTop: space.xs },
  figure: { flexGrow: 1, flexBasis: 120, minWidth: 120, gap: 2 },
  wide: { flexBasis: '100%' },
  value: { fontFamily: fonts.monoMedium, fontSize: 18, lineHeight: 24, color: colors.ink },
  missing: { color: colors.inkFaint },
  flagged: { color: colors.fault },
});
