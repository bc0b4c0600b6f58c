import { memo, useMemo } from 'react';
import { Platform, ScrollView, StyleSheet, useWindowDimensions, View, type ViewStyle } from 'react-native';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { AppText } from '@/components/ui/text';
import { colors, fonts, sideNavBreakpoint, space } from '@/components/ui/theme';
import { formatNumber, formatQuantity } from '@/shared/format/quantity';
import { SizingCaution } from '@/components/sizing/sizing-caution';
import type { SheetSnapshot } from '@/components/sizing/use-sheet-session';
import { headlineFigures, type HeadlineFigure } from '@/shared/analyses';
import { standardHeadline } from '@/shared/templates';

// On the web the card stays in view while the sheet scrolls under it; `sticky` is a web-only position.
const stickyOnWeb = (Platform.OS === 'web' ? { position: 'sticky', top: 0, zIndex: 2 } : {}) as ViewStyle;

/** The margin's share of the allocation and the required share, from the budget roll-up. */
function marginDetail(snapshot: SheetSnapshot): string | undefined {
  if (!snapshot.budget.ok) return undefined;
  const { percentOfAllocation, requiredPercent } = snapshot.budget.result.systemMargin;
  return `${formatNumber(percentOfAllocation, 3)} % of allocation · required ${formatNumber(requiredPercent, 3)} %`;
}

/** The text with a capital first letter, as a badge reads. */
function sentence(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

type FigureProps = { figure: HeadlineFigure; detail: string | undefined; compact: boolean };

/** Whether a figure would read the same: each edit makes new figures, most of them unchanged. */
function sameFigure(a: FigureProps, b: FigureProps): boolean {
  return (
    a.detail === b.detail &&
    a.compact === b.compact &&
    a.figure.label === b.figure.label &&
    a.figure.value === b.figure.value &&
    a.figure.unit === b.figure.unit &&
    a.figure.flag === b.figure.flag &&
    a.figure.problem === b.figure.problem
  );
}

const Figure = memo(function Figure({ figure, detail, compact }: FigureProps) {
  const flagged = figure.flag !== undefined;
  return (
    <View
      style={[styles.figure, compact && styles.compactFigure, flagged && styles.flaggedFigure]}
      testID={`summary-figure-${figure.role}`}
    >
      <AppText variant="label">{figure.label}</AppText>
      <AppText style={[styles.value, figure.value === undefined && styles.missing, flagged && styles.flaggedValue]}>
        {figure.value === undefined ? '—' : formatQuantity(figure.value, figure.unit)}
      </AppText>
      {detail !== undefined ? <AppText variant="mono">{detail}</AppText> : null}
      {figure.flag !== undefined ? <Badge label={sentence(figure.flag)} strong /> : null}
      {figure.problem !== undefined ? <AppText variant="error">{figure.problem}</AppText> : null}
    </View>
  );
}, sameFigure);

/**
 * The sheet's headline figures, found by role in shared code: areal density, characteristic
 * acceleration, lightness number, force, temperature, predicted mass and margin, the margin in the
 * warning style below the required margin. Stays in view as the sheet scrolls, with the caution.
 */
export function SheetSummary({ snapshot }: { snapshot: SheetSnapshot }) {
  // The live sheet rolled the budget up with this state already: the margin's flag reads that roll-up.
  const figures = useMemo(
    () => headlineFigures(snapshot.sheet, { values: snapshot.values, errors: [...snapshot.errors] }, standardHeadline, snapshot.budget),
    [snapshot],
  );
  const flagged = figures.some((figure) => figure.flag !== undefined);
  // A phone keeps the card short, so the sheet stays visible under it: one row that scrolls sideways.
  const compact = useWindowDimensions().width < sideNavBreakpoint;
  const items = figures.map((figure) => (
    <Figure
      key={figure.role}
      figure={figure}
      detail={figure.role === 'system_margin' ? marginDetail(snapshot) : undefined}
      compact={compact}
    />
  ));
  return (
    <Card style={[styles.card, stickyOnWeb, flagged && styles.flaggedCard]} testID="sheet-summary">
      <AppText variant="heading">Summary</AppText>
      {compact ? (
        // Focusable, so the figures scrolled out of view can be reached from the keyboard too.
        <ScrollView horizontal contentContainerStyle={styles.row} tabIndex={0} aria-label="Summary figures">
          {items}
        </ScrollView>
      ) : (
        <View style={styles.grid}>{items}</View>
      )}
      {/* A phone keeps the sticky card to the figures: the screen shows the caution under it. */}
      {compact ? null : <SizingCaution testID="sheet-summary-caution" />}
    </Card>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.sm },
  flaggedCard: { borderColor: colors.fault },
  grid: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg, rowGap: space.sm },
  row: { columnGap: space.lg },
  figure: { flexGrow: 1, flexBasis: 110, minWidth: 110, gap: 2 },
  compactFigure: { flexGrow: 0, flexBasis: 'auto' },
  flaggedFigure: { borderLeftWidth: 3, borderLeftColor: colors.fault, paddingLeft: space.sm, backgroundColor: colors.faultWash },
  value: { fontFamily: fonts.monoMedium, fontSize: 17, lineHeight: 24, color: colors.ink, fontVariant: ['tabular-nums'] },
  missing: { color: colors.inkFaint },
  flaggedValue: { color: colors.fault },
});
