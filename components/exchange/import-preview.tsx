import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/text';
import { colors, radii, space } from '@/components/ui/theme';
import type { ImportPreview } from '@/shared/schemas/exchange';

function Group({ title, count, children, testID }: { title: string; count: number; children: ReactNode; testID: string }) {
  if (count === 0) return null;
  return (
    <View style={styles.group} testID={testID}>
      <AppText variant="heading">
        {title} ({count})
      </AppText>
      {children}
    </View>
  );
}

function Entry({ children, tone = 'plain' }: { children: ReactNode; tone?: 'plain' | 'fault' | 'muted' }) {
  return <View style={[styles.entry, tone === 'fault' && styles.fault, tone === 'muted' && styles.muted]}>{children}</View>;
}

function RowTitle({ keyText, label, cell }: { keyText: string; label?: string; cell?: string }) {
  return (
    <View style={styles.titleRow}>
      <AppText style={styles.grow}>
        {label !== undefined && label !== '' ? `${label} ` : ''}
        <AppText variant="mono">{keyText}</AppText>
      </AppText>
      {cell !== undefined ? <AppText variant="mono">{cell}</AppText> : null}
    </View>
  );
}

/**
 * What an imported workbook would change, before anything is written: rows changed (each field old → new, values
 * with their units), added and removed, the rows that cannot be taken (with the cell and the reason) and those the
 * importer may not change.
 */
export function ImportPreviewView({ preview }: { preview: ImportPreview }) {
  const { changed, added, removed, problems, ignored } = preview;
  const formulasChanged = changed.filter((row) => row.changes.some((change) => change.field === 'formula')).length;
  const nothing = changed.length + added.length + removed.length === 0;
  return (
    <View style={styles.preview} testID="import-preview">
      <AppText variant="muted">
        {nothing
          ? 'The workbook changes nothing that can be taken.'
          : `${changed.length} changed (${formulasChanged} with a new formula), ${added.length} added, ${removed.length} removed.`}
      </AppText>
      <Group title="Changed" count={changed.length} testID="import-changed">
        {changed.map((row) => (
          <Entry key={row.key}>
            <RowTitle keyText={row.key} label={row.label} cell={row.cell} />
            {row.changes.map((change) => (
              <AppText key={change.field} style={styles.change}>
                <AppText variant="label">{change.field} </AppText>
                <AppText variant="mono">{change.from ?? '—'}</AppText>
                {' → '}
                <AppText variant="mono" style={styles.after}>
                  {change.to ?? '—'}
                </AppText>
              </AppText>
            ))}
          </Entry>
        ))}
      </Group>
      <Group title="Added" count={added.length} testID="import-added">
        {added.map((row) => (
          <Entry key={row.key}>
            <RowTitle keyText={row.key} label={row.label} cell={row.cell} />
            <AppText variant="mono">
              {row.subsystem}: {row.definition}
            </AppText>
          </Entry>
        ))}
      </Group>
      <Group title="Removed" count={removed.length} testID="import-removed">
        {removed.map((row) => (
          <Entry key={row.key}>
            <RowTitle keyText={row.key} label={row.label} />
          </Entry>
        ))}
      </Group>
      <Group title="Problems: left out" count={problems.length} testID="import-problems">
        {problems.map((problem) => (
          <Entry key={`${problem.cell}-${problem.code}`} tone="fault">
            <RowTitle keyText={problem.key ?? '(no key)'} cell={problem.cell} />
            <AppText variant="error">{problem.message}</AppText>
          </Entry>
        ))}
      </Group>
      <Group title="Ignored: not yours to change" count={ignored.length} testID="import-ignored">
        {ignored.map((row) => (
          <Entry key={`${row.cell}-${row.key}`} tone="muted">
            <RowTitle keyText={row.key} cell={row.cell} />
            <AppText variant="muted">{row.reason}</AppText>
          </Entry>
        ))}
      </Group>
    </View>
  );
}

const styles = StyleSheet.create({
  preview: { gap: space.md },
  group: { gap: space.sm },
  entry: {
    gap: space.xs,
    padding: space.md,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: colors.rule,
    backgroundColor: colors.panel,
  },
  fault: { borderColor: colors.fault, backgroundColor: colors.faultWash },
  muted: { backgroundColor: colors.recess },
  titleRow: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'baseline' },
  grow: { flexGrow: 1, flexShrink: 1 },
  change: { flexWrap: 'wrap' },
  after: { color: colors.ink },
});
