import { useEffect, useMemo, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { ScrollView, StyleSheet, useWindowDimensions, View } from 'react-native';
import { formatQuantity } from '@/shared/format/quantity';
import { SizingCaution } from '@/components/sizing/sizing-caution';
import { UncertaintyPanel } from '@/components/sizing/uncertainty/uncertainty-panel';
import { useFollowingSheetSession } from '@/components/sizing/use-sheet-session';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { AppText } from '@/components/ui/text';
import { colors, fonts, sideNavBreakpoint, space } from '@/components/ui/theme';
import { mayOnAnyRow, mayOnCraft } from '@/shared/access/permissions';
import { withAllowanceTable } from '@/shared/budget/craft-table';
import type { Craft } from '@/shared/schemas/crafts';
import type { RevisionDetail } from '@/shared/schemas/revisions';
import { AddRowForm } from './add-row-form';
import { MassBudgetView } from './budget/mass-budget-view';
import { allowanceTableOptions } from './budget/queries';
import { LiveStatusBadge } from './live-status';
import type { LiveStatus } from './queries';
import { toSheet } from './revision-cache';
import { bindRow, type SheetRowsProps } from './row-binding';
import { RowEditor } from './row-editor';
import { SheetPhoneList } from './sheet-phone-list';
import { SheetPlots } from './plots/sheet-plots';
import { groupRows, maturitiesOf, maturityLabeller, rowAccess, sheetReadOnlyReason, whoOn, type SheetGroup } from './sheet-rows';
import { SheetTable } from './sheet-table';
import { SheetSizing } from './sizing/sheet-sizing';
import { SheetSummary } from './summary/sheet-summary';
import { SubsystemsPanel } from './subsystems-panel';
import { useSheetEditor } from './use-sheet-editor';

type SheetView = 'rows' | 'budget' | 'plots' | 'sizing' | 'uncertainty';

const views: readonly { value: SheetView; label: string }[] = [
  { value: 'rows', label: 'Rows' },
  { value: 'budget', label: 'Mass budget' },
  { value: 'plots', label: 'Plots' },
  { value: 'sizing', label: 'Sizing' },
  { value: 'uncertainty', label: 'Uncertainty' },
];

export type SheetWorkspaceProps = {
  craft: Craft;
  detail: RevisionDetail;
  liveStatus: LiveStatus;
  isOrgAdmin: boolean;
  /** The signed-in person's id: the owner of a study edits all of it. */
  userId: string | undefined;
};

/** The groups change only when rows are added, removed, moved or renamed: the table keeps its props across value edits. */
function useStableGroups(detail: RevisionDetail): SheetGroup[] {
  const { groups, signature } = useMemo(() => {
    const grouped = groupRows(detail);
    return { groups: grouped, signature: JSON.stringify(grouped) };
  }, [detail]);
  // eslint-disable-next-line react-hooks/exhaustive-deps -- the signature stands for the groups
  return useMemo(() => groups, [signature]);
}

function rowCountsBySubsystem(detail: RevisionDetail): Map<string, number> {
  const counts = new Map<string, number>();
  for (const row of detail.sheet.parameters) counts.set(row.subsystemId, (counts.get(row.subsystemId) ?? 0) + 1);
  return counts;
}

/** Headline figures computed on the server, for partners who see only the rows shared with them. */
function HeadlineFigures({ figures }: { figures: NonNullable<RevisionDetail['headlineFigures']> }) {
  return (
    <Card testID="sheet-headline-figures">
      <AppText variant="heading">Headline figures</AppText>
      {figures.map((figure) => (
        <View key={figure.role} style={styles.figure} testID={`sheet-headline-${figure.role}`}>
          <AppText style={styles.grow}>{figure.label}</AppText>
          <View style={styles.figureValue}>
            <AppText style={styles.mono}>{figure.value === null ? '—' : formatQuantity(figure.value, figure.unit)}</AppText>
            {figure.value === null && figure.problem !== undefined ? <AppText variant="muted">{figure.problem}</AppText> : null}
            {figure.flag !== undefined ? <AppText variant="error">{figure.flag}</AppText> : null}
          </View>
        </View>
      ))}
      <SizingCaution />
    </Card>
  );
}

/**
 * The craft's sheet at work: the live engine session on the server's rows, the table (wide) or the list and
 * edit sheets (phone), saving, undo and redo, others' edits as they arrive, and the panels on the results.
 */
export function SheetWorkspace({ craft, detail, liveStatus, isOrgAdmin, userId }: SheetWorkspaceProps) {
  // The budget rolls up with the craft's own allowance table once it has one (the sheet's preset until then).
  const allowanceTable = useQuery(allowanceTableOptions(craft.id)).data?.table;
  const sheet = useMemo(() => withAllowanceTable(toSheet(detail), allowanceTable), [detail, allowanceTable]);
  const live = useFollowingSheetSession(sheet);
  const editor = useSheetEditor(craft.id, detail, live);
  const { follow } = live;
  const { pinned } = editor;
  useEffect(() => follow(sheet, pinned), [follow, sheet, pinned]);

  const { width } = useWindowDimensions();
  const wide = width >= sideNavBreakpoint;
  const [view, setView] = useState<SheetView>('rows');
  const [openKey, setOpenKey] = useState<string>();
  const [adding, setAdding] = useState(false);
  const [managingSubsystems, setManagingSubsystems] = useState(false);

  const who = useMemo(() => whoOn(detail, craft.myRole, isOrgAdmin, userId), [detail, craft.myRole, isOrgAdmin, userId]);
  const access = useMemo(() => rowAccess(detail, who), [detail, who]);
  const readOnly = useMemo(() => sheetReadOnlyReason(detail, who), [detail, who]);
  const groups = useStableGroups(detail);
  const maturities = useMemo(() => maturitiesOf(detail, allowanceTable), [detail, allowanceTable]);
  const maturityLabel = useMemo(() => maturityLabeller(maturities), [maturities]);
  const canManage = mayOnAnyRow('manageRow', who, detail.revision);
  const canEdit = mayOnAnyRow('editRow', who, detail.revision);
  const wholeSheet = detail.abilities.wholeSheet;

  if (live.state.status === 'starting') return <LoadingState label="Starting the sizing engine…" />;
  if (live.state.status === 'failed') {
    return <ErrorState title="The sizing engine could not run this sheet" message={live.state.message} onRetry={live.reset} />;
  }
  const { snapshot } = live.state;

  const toolbar = (
    <View style={styles.toolbar}>
      {canEdit ? (
        <>
          <Button label="Undo" tone="secondary" disabled={!editor.canUndo} onPress={editor.undo} testID="sheet-undo" />
          <Button label="Redo" tone="secondary" disabled={!editor.canRedo} onPress={editor.redo} testID="sheet-redo" />
        </>
      ) : null}
      {canManage ? <Button label="Add row" onPress={() => setAdding(true)} testID="sheet-add-row" /> : null}
      {detail.abilities.manageSubsystems ? (
        <Button label="Subsystems" tone="secondary" onPress={() => setManagingSubsystems(true)} testID="sheet-subsystems" />
      ) : null}
      <View style={styles.grow} />
      <LiveStatusBadge status={liveStatus} />
    </View>
  );

  const rowsProps: SheetRowsProps = {
    groups,
    rows: live.rows,
    actions: editor.actions,
    access,
    messages: editor.messages,
    conflicts: editor.conflicts,
    onOpenRow: setOpenKey,
  };
  const rowsView =
    detail.sheet.parameters.length === 0 ? (
      <EmptyState title="No rows yet" message={canManage ? 'Add the first row of this sheet.' : 'This sheet has no rows yet.'} />
    ) : wide ? (
      <SheetTable {...rowsProps} maturityLabel={maturityLabel} />
    ) : (
      <SheetPhoneList {...rowsProps} openKey={openKey} />
    );

  const results = {
    budget: () => <MassBudgetView snapshot={snapshot} craftId={craft.id} canEditTable={mayOnCraft('editAllowanceTable', who)} />,
    plots: () => <SheetPlots snapshot={snapshot} />,
    sizing: () => <SheetSizing snapshot={snapshot} canApply={canEdit} onApply={editor.actions.commit} />,
    uncertainty: () => <UncertaintyPanel snapshot={snapshot} />,
  };
  const panel = view === 'rows' ? rowsView : results[view]();

  const header = (
    <View style={styles.header}>
      {toolbar}
      {readOnly !== undefined ? (
        <AppText variant="muted" testID="sheet-read-only">
          Read-only: {readOnly}.
        </AppText>
      ) : null}
      {/* The summary and the headline figures carry the caution, but for a phone's sticky summary, kept to the figures. */}
      {!wide && wholeSheet ? <SizingCaution testID="sheet-caution" /> : null}
      {wholeSheet ? <ChoiceChips label="Show" choices={views} value={view} onChange={setView} testID="sheet-views" /> : null}
    </View>
  );

  const side = wholeSheet ? <SheetSummary snapshot={snapshot} /> : <HeadlineFigures figures={detail.headlineFigures ?? []} />;

  return (
    <View style={styles.root}>
      {wide ? (
        <View style={styles.columns}>
          <View style={styles.main}>
            {header}
            {view === 'rows' ? panel : <ScrollView contentContainerStyle={styles.scrolled}>{panel}</ScrollView>}
          </View>
          <ScrollView style={styles.side} contentContainerStyle={styles.scrolled}>
            {side}
          </ScrollView>
        </View>
      ) : (
        // The summary stays in view on a phone; a partner's longer list of headline figures scrolls with the rows.
        <ScrollView stickyHeaderIndices={wholeSheet ? [0] : []} contentContainerStyle={styles.phone}>
          <View style={styles.sticky}>{side}</View>
          {header}
          {panel}
        </ScrollView>
      )}
      {openKey !== undefined ? (
        <RowEditor
          {...bindRow(rowsProps, openKey)}
          craftId={craft.id}
          revisionId={detail.revision.id}
          groups={groups}
          maturities={maturities}
          withValue={!wide}
          onClose={() => setOpenKey(undefined)}
        />
      ) : null}
      {managingSubsystems ? (
        <SubsystemsPanel
          craftId={craft.id}
          subsystems={detail.subsystems}
          rowCounts={rowCountsBySubsystem(detail)}
          onClose={() => setManagingSubsystems(false)}
        />
      ) : null}
      {adding ? (
        <AddRowForm subsystems={detail.subsystems.map((subsystem) => subsystem.name)} onAdd={editor.add} onClose={() => setAdding(false)} />
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1 },
  columns: { flex: 1, flexDirection: 'row', gap: space.lg, padding: space.lg },
  main: { flex: 1, minWidth: 0, gap: space.md },
  side: { width: 300, flexGrow: 0 },
  scrolled: { gap: space.lg, paddingBottom: space.xl },
  phone: { gap: space.md, padding: space.md, paddingBottom: space.xxl },
  sticky: { backgroundColor: colors.ground, paddingBottom: space.sm },
  header: { gap: space.sm },
  toolbar: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  grow: { flex: 1 },
  figure: { flexDirection: 'row', alignItems: 'baseline', gap: space.md },
  figureValue: { alignItems: 'flex-end', flexShrink: 1 },
  mono: { fontFamily: fonts.mono, textAlign: 'right' },
});
