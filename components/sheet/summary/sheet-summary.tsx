import { memo, useMemo } from 'react';
import { Platform, ScrollView, StyleSheet, useWindowDimensions, View, type ViewStyle } from 'react-native';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { AppText } from '@/components/ui/text';
import { colors, fonts, sideNavBreakpoint, space } from '@/components/ui/theme';
import { formatNumber, formatQuantity } from '@/shared/format/quantity';
import { SizingCaution } from '@/components/sizing/sizing-caution';
import type { SheetSnapshot } from '@/components/sizing/use-sheet-session';
import { headlineFigures, templateChecks, type CheckResult, type HeadlineFigure } from '@/shared/analyses';
import { sheetTemplate } from '@/shared/templates';
import { CheckLine, TemplateCaveats } from './template-notes';

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

type FigureProps = {
  figure: HeadlineFigure;
  detail: string | undefined;
  compact: boolean;
  /** The checks shown in the figure; `failing` also flags a figure whose failing checks are listed elsewhere. */
  checks: readonly CheckResult[];
  failing: boolean;
};

/** Whether a figure would read the same: each edit makes new figures, most of them unchanged. */
function sameFigure(a: FigureProps, b: FigureProps): boolean {
  return (
    a.detail === b.detail &&
    a.compact === b.compact &&
    a.failing === b.failing &&
    a.figure.label === b.figure.label &&
    a.figure.value === b.figure.value &&
    a.figure.unit === b.figure.unit &&
    a.figure.flag === b.figure.flag &&
    a.figure.problem === b.figure.problem &&
    a.checks.length === b.checks.length &&
    a.checks.every((check, k) => check.status === b.checks[k]?.status && check.message === b.checks[k]?.message)
  );
}

const Figure = memo(function Figure({ figure, detail, compact, checks, failing }: FigureProps) {
  const flagged = figure.flag !== undefined || failing;
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
      {checks.map((check) => (
        <CheckLine key={check.role} check={check} />
      ))}
    </View>
  );
}, sameFigure);

/**
 * The headline figures of the template the sheet follows, found by role in shared code (the square sail's:
 * areal density, characteristic acceleration, lightness number, force, temperature, predicted mass and
 * margin), the margin in the warning style below the required margin, the template's checks beside the figure
 * they qualify (or under the figures) and its caveats. Stays in view as the sheet scrolls, with the caution.
 */
export function SheetSummary({ snapshot }: { snapshot: SheetSnapshot }) {
  const template = useMemo(() => sheetTemplate(snapshot.sheet), [snapshot.sheet]);
  // The live sheet rolled the budget up with this state already: the margin's flag reads that roll-up.
  const { figures, checks } = useMemo(() => {
    const evaluation = { values: snapshot.values, errors: [...snapshot.errors] };
    return {
      figures: headlineFigures(snapshot.sheet, evaluation, template.roles.headline, snapshot.budget),
      checks: templateChecks(snapshot.sheet, evaluation, template.roles.checks),
    };
  }, [snapshot, template]);
  const shownRoles = new Set(figures.map((figure) => figure.role));
  const besideFigure = (role: string) => checks.filter((check) => check.beside === role);
  const otherChecks = checks.filter((check) => check.beside === undefined || !shownRoles.has(check.beside));
  const flagged = figures.some((figure) => figure.flag !== undefined) || checks.some((check) => check.status === 'fails');
  // A phone keeps the card short, so the sheet stays visible under it: one row that scrolls sideways.
  const compact = useWindowDimensions().width < sideNavBreakpoint;
  const items = figures.map((figure) => (
    <Figure
      key={figure.role}
      figure={figure}
      detail={figure.role === 'system_margin' ? marginDetail(snapshot) : undefined}
      compact={compact}
      // A phone's figures scroll sideways in one row: their checks are listed under it, where the words wrap.
      checks={compact ? [] : besideFigure(figure.role)}
      failing={besideFigure(figure.role).some((check) => check.status === 'fails')}
    />
  ));
  // A phone's sticky card keeps only the checks that fail; the plots view carries the caveats there.
  const listedChecks = compact ? checks.filter((check) => check.status === 'fails') : otherChecks;
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
      {listedChecks.map((check) => (
        <CheckLine key={check.role} check={check} />
      ))}
      {compact ? null : <TemplateCaveats caveats={template.roles.caveats} testID="sheet-summary-caveats" />}
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
