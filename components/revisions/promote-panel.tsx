import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { ApiError } from '@/components/api/client';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { FormError } from '@/components/ui/form';
import { AppText } from '@/components/ui/text';
import { fonts, space } from '@/components/ui/theme';
import { formatQuantity } from '@/shared/format/quantity';
import {
  mergeConflictDetailsSchema,
  type MergeConflictDto,
  type MergeSide,
  type Promotion,
  type Revision,
} from '@/shared/schemas/revisions';
import { usePromoteStudy } from './queries';

/** A row of a merge in words: absent, its formula, its value in its unit, or its material. */
function rowText(row: MergeConflictDto['base']): string {
  if (row === null) return 'absent';
  if (row.formula !== undefined) return row.formula;
  if (row.value !== undefined) return formatQuantity(row.value, row.unit, 10);
  return row.material === undefined ? '' : `${row.material.id} · ${row.material.property}`;
}

const sides: readonly { value: MergeSide; label: string }[] = [
  { value: 'draft', label: "Keep the draft's" },
  { value: 'study', label: "Take the study's" },
];

function ConflictChoice({
  conflict,
  side,
  onChoose,
}: {
  conflict: MergeConflictDto;
  side: MergeSide | undefined;
  onChoose: (side: MergeSide) => void;
}) {
  return (
    <View style={styles.conflict} testID={`promote-conflict-${conflict.key}`}>
      <AppText style={styles.key}>{conflict.key}</AppText>
      <View style={styles.versions}>
        <View style={styles.version}>
          <AppText variant="label">When the study was opened</AppText>
          <AppText style={styles.mono}>{rowText(conflict.base)}</AppText>
        </View>
        <View style={styles.version}>
          <AppText variant="label">Draft now</AppText>
          <AppText style={styles.mono}>{rowText(conflict.draft)}</AppText>
        </View>
        <View style={styles.version}>
          <AppText variant="label">Study</AppText>
          <AppText style={styles.mono}>{rowText(conflict.study)}</AppText>
        </View>
      </View>
      <ChoiceChips
        label={`Resolve ${conflict.key}`}
        choices={sides}
        value={side ?? null}
        onChange={onChoose}
        testID={`promote-resolve-${conflict.key}`}
      />
    </View>
  );
}

/**
 * Promotes a study into the working draft. The server merges row by row; rows changed in both since the study
 * was opened come back as conflicts, each resolved here (keep the draft's, take the study's) before anything
 * is written.
 */
export function PromotePanel({ craftId, study, onDone }: { craftId: string; study: Revision; onDone: () => void }) {
  const promote = usePromoteStudy(craftId);
  const [conflicts, setConflicts] = useState<MergeConflictDto[]>();
  const [resolutions, setResolutions] = useState<Record<string, MergeSide>>({});
  const [problem, setProblem] = useState<string>();
  const [done, setDone] = useState<Promotion>();

  const send = async () => {
    setProblem(undefined);
    try {
      setDone(await promote.mutateAsync({ studyId: study.id, body: { resolutions } }));
    } catch (error) {
      const details =
        error instanceof ApiError && error.code === 'merge_conflicts' ? mergeConflictDetailsSchema.safeParse(error.details) : undefined;
      if (details?.success === true) setConflicts(details.data.conflicts);
      else setProblem(error instanceof Error ? error.message : String(error));
    }
  };
  const unresolved = (conflicts ?? []).filter((conflict) => resolutions[conflict.key] === undefined).length;

  if (done !== undefined) {
    return (
      <Card testID="promote-done">
        <AppText variant="heading">“{study.label}” is promoted</AppText>
        <AppText>
          {done.applied.length === 0
            ? 'The draft already held every change of the study.'
            : `${done.applied.length} ${done.applied.length === 1 ? 'row' : 'rows'} of the draft changed.`}{' '}
          The study is now locked.
        </AppText>
        <Button label="Close" tone="secondary" onPress={onDone} testID="promote-close" />
      </Card>
    );
  }
  return (
    <Card testID="promote-panel">
      <AppText variant="heading">Promote “{study.label}” into the draft</AppText>
      {conflicts === undefined ? (
        <AppText variant="muted">
          Rows changed only in the study are applied; rows changed in both since it was opened are shown for you to resolve first.
        </AppText>
      ) : (
        <>
          <AppText role="alert">
            {conflicts.length} {conflicts.length === 1 ? 'row was' : 'rows were'} changed in both the draft and the study. Choose for each;
            nothing is written until all are resolved.
          </AppText>
          {conflicts.map((conflict) => (
            <ConflictChoice
              key={conflict.key}
              conflict={conflict}
              side={resolutions[conflict.key]}
              onChoose={(side) => setResolutions((now) => ({ ...now, [conflict.key]: side }))}
            />
          ))}
        </>
      )}
      <FormError message={problem} />
      <View style={styles.actions}>
        <Button
          label={conflicts === undefined ? 'Promote' : unresolved > 0 ? `Resolve ${unresolved} more` : 'Promote with these choices'}
          disabled={unresolved > 0}
          busy={promote.isPending}
          onPress={() => void send()}
          testID="promote-submit"
        />
        <Button label="Cancel" tone="quiet" onPress={onDone} />
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  conflict: { gap: space.sm, paddingVertical: space.sm },
  key: { fontFamily: fonts.mono },
  versions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  version: { flexBasis: 160, flexGrow: 1, gap: 2 },
  mono: { fontFamily: fonts.mono },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
