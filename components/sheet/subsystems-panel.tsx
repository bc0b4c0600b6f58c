import { useState } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { ApiError } from '@/components/api/client';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { AppText } from '@/components/ui/text';
import { space } from '@/components/ui/theme';
import type { Subsystem } from '@/shared/schemas/revisions';
import { useChangeSubsystem, type SubsystemChange } from './queries';
import { SheetPanel } from './sheet-panel';

/** The server's refusal in words; a subsystem still holding rows names them. */
function refusalText(error: Error): string {
  if (error instanceof ApiError && error.code === 'in_use') {
    const keys = (error.details as { keys?: unknown } | undefined)?.keys;
    if (Array.isArray(keys) && keys.length > 0) return `${error.message} Rows in it: ${keys.join(', ')}.`;
  }
  return error.message;
}

type SubsystemLineProps = {
  subsystem: Subsystem;
  rowCount: number;
  busy: boolean;
  onChange: (change: SubsystemChange) => Promise<void>;
};

/** One subsystem: its name to edit, renamed on "Rename"; deleted only when no row is in it. */
function SubsystemLine({ subsystem, rowCount, busy, onChange }: SubsystemLineProps) {
  const [name, setName] = useState(subsystem.name);
  const renamed = name.trim() !== '' && name.trim() !== subsystem.name;
  return (
    <View style={styles.line} testID={`subsystem-${subsystem.name}`}>
      <View style={styles.grow}>
        <TextField label={`${subsystem.name} (${rowCount} ${rowCount === 1 ? 'row' : 'rows'})`} value={name} onChangeText={setName} />
      </View>
      <View style={styles.buttons}>
        <Button
          label="Rename"
          tone="secondary"
          disabled={!renamed || busy}
          onPress={() => void onChange({ id: subsystem.id, name: name.trim() })}
          testID={`subsystem-rename-${subsystem.name}`}
        />
        <Button
          label="Delete"
          tone="quiet"
          disabled={busy}
          onPress={() => void onChange({ id: subsystem.id })}
          testID={`subsystem-delete-${subsystem.name}`}
        />
      </View>
    </View>
  );
}

export type SubsystemsPanelProps = {
  craftId: string;
  subsystems: readonly Subsystem[];
  /** How many rows of the revision each subsystem holds, by id. */
  rowCounts: ReadonlyMap<string, number>;
  onClose: () => void;
};

/**
 * The craft's subsystems for systems and chief engineers: add, rename (rows and owners stay with it, as they
 * name it by id) and delete one that no row is in. The server says why it refuses, shown here.
 */
export function SubsystemsPanel({ craftId, subsystems, rowCounts, onClose }: SubsystemsPanelProps) {
  const change = useChangeSubsystem(craftId);
  const [newName, setNewName] = useState('');
  const [problem, setProblem] = useState<string>();
  const apply = async (subsystemChange: SubsystemChange) => {
    setProblem(undefined);
    try {
      await change.mutateAsync(subsystemChange);
      if (subsystemChange.id === undefined) setNewName('');
    } catch (error) {
      setProblem(refusalText(error instanceof Error ? error : new Error(String(error))));
    }
  };
  return (
    <SheetPanel label="Subsystems" onClose={onClose} testID="sheet-subsystems-panel">
      <AppText variant="heading">Subsystems</AppText>
      <ScrollView contentContainerStyle={styles.body}>
        {subsystems.map((subsystem) => (
          <SubsystemLine
            key={subsystem.id}
            subsystem={subsystem}
            rowCount={rowCounts.get(subsystem.id) ?? 0}
            busy={change.isPending}
            onChange={apply}
          />
        ))}
        <View style={styles.line}>
          <View style={styles.grow}>
            <TextField label="New subsystem" value={newName} onChangeText={setNewName} testID="subsystem-new-name" />
          </View>
          <Button
            label="Add"
            disabled={newName.trim() === '' || change.isPending}
            onPress={() => void apply({ name: newName.trim() })}
            testID="subsystem-add"
          />
        </View>
        {problem !== undefined ? (
          <AppText variant="error" role="alert" testID="subsystems-problem">
            {problem}
          </AppText>
        ) : null}
        <Button label="Done" tone="secondary" onPress={onClose} testID="subsystems-done" />
      </ScrollView>
    </SheetPanel>
  );
}

const styles = StyleSheet.create({
  body: { gap: space.md, paddingBottom: space.lg },
  line: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-end', gap: space.sm },
  grow: { flexGrow: 1, flexBasis: 220 },
  buttons: { flexDirection: 'row', gap: space.sm },
});
