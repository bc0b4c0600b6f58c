import { StyleSheet, useWindowDimensions, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { AppText } from '@/components/ui/text';
import { space } from '@/components/ui/theme';
import type { Sheet } from '@/shared/schemas/sheet';
import { AnalysesSection } from './analyses/analyses-section';
import { KeyFigures } from './key-figures';
import { ParameterList } from './parameter-list';
import { useSheetSession } from './use-sheet-session';

// From this window width the key figures sit beside the parameter list (the side navigation takes 232 px).
const twoColumnWidth = 1100;

export type SizingWorkspaceProps = {
  /** The sheet to size: the template today, a craft's sheet later. Keep it stable between renders. */
  sheet: Sheet;
  /** The label of the button that starts again from `sheet`, e.g. "Reset to template". */
  resetLabel: string;
};

/** Live sizing of a sheet in the browser: undo, redo and reset, the key figures and the editable rows. */
export function SizingWorkspace({ sheet, resetLabel }: SizingWorkspaceProps) {
  const { state, setInput, undo, redo, reset } = useSheetSession(sheet);
  const { width } = useWindowDimensions();
  const wide = width >= twoColumnWidth;

  if (state.status === 'starting') return <LoadingState label="Starting the sizing engine…" />;
  if (state.status === 'failed') {
    return <ErrorState title="The sizing engine could not run this sheet" message={state.message} onRetry={reset} />;
  }
  const { snapshot, rejected, recomputed } = state;
  if (snapshot.sheet.parameters.length === 0) {
    return <EmptyState title="No rows to size" message="This sheet has no parameters yet." />;
  }
  return (
    <View style={styles.workspace}>
      <View style={styles.toolbar}>
        <Button label="Undo" tone="secondary" disabled={!snapshot.canUndo} onPress={undo} testID="undo" />
        <Button label="Redo" tone="secondary" disabled={!snapshot.canRedo} onPress={redo} testID="redo" />
        <Button label={resetLabel} tone="quiet" onPress={reset} testID="reset-template" />
        <AppText variant="muted" aria-live="polite" style={styles.status}>
          {recomputed === undefined
            ? 'Edit an input to recompute.'
            : `Last edit recomputed ${recomputed} ${recomputed === 1 ? 'row' : 'rows'}.`}
        </AppText>
      </View>
      <View style={[styles.columns, wide && styles.columnsWide]}>
        <View style={wide ? styles.figuresWide : undefined}>
          <KeyFigures snapshot={snapshot} />
        </View>
        <View style={wide ? styles.listWide : undefined}>
          <ParameterList
            snapshot={snapshot}
            rejected={rejected}
            wide={wide}
            onCommit={(key, text) => {
              setInput(key, text);
            }}
          />
          <AnalysesSection snapshot={snapshot} onSetInput={(key, text) => setInput(key, text)} />
        </View>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  workspace: { gap: space.lg },
  toolbar: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  status: { flexBasis: 220, flexGrow: 1 },
  columns: { gap: space.xl },
  columnsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  figuresWide: { width: 340 },
  listWide: { flex: 1, minWidth: 0 },
});
