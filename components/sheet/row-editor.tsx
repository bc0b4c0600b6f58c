import { useState } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { formatUnit } from '@/shared/format/quantity';
import { useLiveRow } from '@/components/sizing/use-sheet-session';
import { Button } from '@/components/ui/button';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { AppText } from '@/components/ui/text';
import { TextField } from '@/components/ui/text-field';
import { fonts, space } from '@/components/ui/theme';
import { compatibleUnits, fromSI, parseUnit, toSI } from '@/shared/engine';
import { parameterKeyProblem, type Parameter } from '@/shared/schemas/sheet';
import { EvidenceSection } from './evidence/evidence-section';
import { MaturityPicker } from './evidence/maturity-picker';
import { computedText, RowNotices, statusText } from './row-feedback';
import { RowHistory } from './row-history';
import { SheetPanel } from './sheet-panel';
import type { RowBinding } from './row-binding';
import type { SheetGroup } from './sheet-rows';
import type { RowFields } from './use-sheet-editor';
import { definitionText, ValueInput } from './value-input';

export type RowEditorProps = RowBinding & {
  /** Where the row's history is read. */
  craftId: string;
  revisionId: string;
  groups: readonly SheetGroup[];
  maturities: readonly { id: string; label: string }[];
  /** On a phone the edit sheet holds the value field too; on a wide screen the table does. */
  withValue: boolean;
  onClose: () => void;
};

/** The fields that change a row's unit: an input keeps its quantity (40 m becomes 0.04 km), a formula just reads out in the new unit. */
export function unitChange(parameter: Parameter, unit: string): RowFields {
  if (parameter.value === undefined) return { unit };
  const from = parseUnit(parameter.unit);
  const to = parseUnit(unit);
  if (!from.ok || !to.ok) return { unit };
  return { unit, value: Number(fromSI(toSI(parameter.value, from.value), to.value).toPrecision(12)) };
}

/** Where the row goes to move one place up or down in its subsystem: the `before` of the PATCH. */
export function movedBefore(groups: readonly SheetGroup[], key: string, step: -1 | 1): string | null | undefined {
  const keys = groups.find((group) => group.keys.includes(key))?.keys ?? [];
  const index = keys.indexOf(key);
  if (index < 0 || index + step < 0 || index + step >= keys.length) return undefined;
  return step === -1 ? (keys[index - 1] ?? null) : (keys[index + 2] ?? null);
}

function RenameField({ parameter, onRename }: { parameter: Parameter; onRename: (key: string) => void }) {
  const [key, setKey] = useState(parameter.key);
  const problem = key === parameter.key ? undefined : parameterKeyProblem(key);
  return (
    <View style={styles.inline}>
      <View style={styles.grow}>
        <TextField
          label="Key (formulas that use it are rewritten)"
          value={key}
          onChangeText={setKey}
          autoCapitalize="none"
          autoCorrect={false}
          error={problem === undefined ? undefined : `The key ${problem}`}
          testID="row-rename-key"
        />
      </View>
      <Button
        label="Rename"
        tone="secondary"
        disabled={key === parameter.key || problem !== undefined}
        onPress={() => onRename(key)}
        testID="row-rename"
      />
    </View>
  );
}

/**
 * The edit sheet of one row (a panel over the screen): its value on a phone, its unit among those of the
 * same dimension, label and maturity for those who edit it; key, subsystem, order and deletion for those
 * who manage rows; its evidence and history for everyone who sees it.
 */
export function RowEditor(props: RowEditorProps) {
  const { craftId, revisionId, rowKey, rows, actions, access, message, conflict, groups, maturities, withValue, onClose } = props;
  const live = useLiveRow(rows, rowKey);
  const [confirmDelete, setConfirmDelete] = useState(false);
  const { parameter } = live;
  const editable = access?.editable === true;
  const manage = access?.manage === true;
  const status = statusText(live);
  return (
    <SheetPanel label={parameter?.label ?? rowKey} onClose={onClose} testID="sheet-row-editor">
      <View style={styles.heading}>
        <View style={styles.grow}>
          <AppText variant="heading">{parameter?.label ?? rowKey}</AppText>
          <AppText variant="mono">{rowKey}</AppText>
        </View>
        <Button label="Done" tone="secondary" onPress={onClose} testID="sheet-row-editor-close" />
      </View>
      {parameter === undefined ? (
        <AppText variant="muted">This row is no longer in the sheet.</AppText>
      ) : (
        <ScrollView contentContainerStyle={styles.body}>
          {withValue ? (
            <View style={styles.section}>
              <AppText variant="label">{parameter.formula !== undefined ? 'Formula' : 'Value'}</AppText>
              {editable ? (
                <ValueInput parameter={parameter} computed={live.value?.value} invalid={live.rejection !== undefined} actions={actions} />
              ) : (
                <AppText style={styles.mono}>{definitionText(parameter)}</AppText>
              )}
              <AppText style={styles.mono}>= {computedText(live)}</AppText>
              <AppText variant={status.ok ? 'muted' : 'error'}>{status.text}</AppText>
              <RowNotices rowKey={rowKey} message={message} readOnlyReason={access?.readOnlyReason} conflict={conflict} actions={actions} />
            </View>
          ) : null}
          {editable ? (
            <>
              <ChoiceChips
                label={`Unit (${formatUnit(parameter.unit) || 'pure number'})`}
                choices={compatibleUnits(parameter.unit).map((unit) => ({ value: unit, label: formatUnit(unit) || 'pure number' }))}
                value={parameter.unit}
                onChange={(unit) => unit !== parameter.unit && actions.save(rowKey, unitChange(parameter, unit))}
                testID="row-unit-picker"
              />
              {parameter.mass !== undefined ? (
                <MaturityPicker
                  craftId={craftId}
                  revisionId={revisionId}
                  rowKey={rowKey}
                  maturities={maturities}
                  value={parameter.mass.maturity}
                  onChange={(maturity) => parameter.mass && actions.save(rowKey, { mass: { ...parameter.mass, maturity } })}
                />
              ) : null}
            </>
          ) : null}
          {manage ? (
            <View style={styles.section}>
              <RenameField key={parameter.key} parameter={parameter} onRename={(key) => actions.save(rowKey, { key })} />
              <ChoiceChips
                label="Subsystem"
                choices={groups.map((group) => ({ value: group.subsystem, label: group.subsystem }))}
                value={parameter.subsystem}
                onChange={(subsystem) => subsystem !== parameter.subsystem && actions.save(rowKey, { subsystem })}
                testID="row-subsystem"
              />
              <View style={styles.inline}>
                {([-1, 1] as const).map((step) => {
                  const before = movedBefore(groups, rowKey, step);
                  return (
                    <Button
                      key={step}
                      label={step === -1 ? 'Move up' : 'Move down'}
                      tone="secondary"
                      disabled={before === undefined}
                      onPress={() => before !== undefined && actions.save(rowKey, { before })}
                      testID={step === -1 ? 'row-move-up' : 'row-move-down'}
                    />
                  );
                })}
              </View>
              {confirmDelete ? (
                <View style={styles.inline}>
                  <Button
                    label={`Delete ${rowKey}`}
                    tone="danger"
                    onPress={() => {
                      actions.remove(rowKey);
                      onClose();
                    }}
                    testID="row-delete-confirm"
                  />
                  <Button label="Keep it" tone="quiet" onPress={() => setConfirmDelete(false)} />
                </View>
              ) : (
                <Button label="Delete row…" tone="quiet" style={styles.start} onPress={() => setConfirmDelete(true)} testID="row-delete" />
              )}
            </View>
          ) : null}
          <EvidenceSection craftId={craftId} revisionId={revisionId} rowKey={rowKey} />
          <RowHistory craftId={craftId} revisionId={revisionId} rowKey={rowKey} />
        </ScrollView>
      )}
    </SheetPanel>
  );
}

const styles = StyleSheet.create({
  heading: { flexDirection: 'row', alignItems: 'flex-start', gap: space.md },
  grow: { flex: 1, minWidth: 0 },
  body: { gap: space.lg, paddingBottom: space.lg },
  section: { gap: space.sm },
  inline: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-end', gap: space.sm },
  mono: { fontFamily: fonts.mono },
  start: { alignSelf: 'flex-start' },
});
