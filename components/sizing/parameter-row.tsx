import { useState } from 'react';
import { StyleSheet, TextInput, View } from 'react-native';
import { Disclosure } from '@/components/ui/disclosure';
import { AppText } from '@/components/ui/text';
import { colors, fonts, fontSizes, radii, space, touchTarget } from '@/components/ui/theme';
import type { EngineError, EvaluatedValue } from '@/shared/engine';
import type { Parameter } from '@/shared/schemas/sheet';
import { editText, formatQuantity, formatUnit } from '@/shared/format/quantity';
import type { Rejection } from './use-sheet-session';

// Constants are read for their exact digits; results only to the precision a sizing estimate has.
const constantDigits = 10;

export type ParameterRowProps = {
  parameter: Parameter;
  /** The row's value, absent when the row has an error. */
  value: EvaluatedValue | undefined;
  /** The engine's error for this row, if it cannot be evaluated. */
  error: EngineError | undefined;
  /** The last edit of this row that the engine refused. */
  rejection: Rejection | undefined;
  /** Side by side (label left, value right) rather than stacked. */
  wide: boolean;
  onCommit: (key: string, text: string) => void;
};

function InputField({ parameter, value, rejection, onCommit }: Pick<ParameterRowProps, 'parameter' | 'value' | 'rejection' | 'onCommit'>) {
  // While typing, the field holds a draft; otherwise it shows the refused text or the row's value.
  const [draft, setDraft] = useState<string | null>(null);
  const current = value?.value ?? parameter.value;
  const source = rejection?.text ?? (current === undefined ? '' : editText(current));
  const unit = formatUnit(parameter.unit);
  const commit = () => {
    if (draft !== null && draft.trim() !== source.trim()) onCommit(parameter.key, draft);
    setDraft(null);
  };
  return (
    // The unit sits inside the field's frame, so the number and its unit read as one quantity.
    <View style={[styles.field, rejection !== undefined && styles.fieldError]}>
      <TextInput
        value={draft ?? source}
        onChangeText={setDraft}
        onBlur={commit}
        aria-label={unit === '' ? parameter.label : `${parameter.label}, in ${unit}`}
        aria-invalid={rejection !== undefined}
        autoCapitalize="none"
        autoCorrect={false}
        spellCheck={false}
        enterKeyHint="done"
        testID={`param-input-${parameter.key}`}
        style={styles.input}
      />
      {unit === '' ? null : <AppText style={styles.unit}>{unit}</AppText>}
    </View>
  );
}

function ValueBlock({ parameter, value, rejection, onCommit }: Pick<ParameterRowProps, 'parameter' | 'value' | 'rejection' | 'onCommit'>) {
  if (parameter.protected === true) {
    return (
      <View style={styles.valueBlock}>
        <AppText style={styles.number}>{value === undefined ? '—' : formatQuantity(value.value, value.unit, constantDigits)}</AppText>
        {parameter.source !== undefined ? (
          <AppText variant="muted" style={styles.small}>
            Source: {parameter.source}
          </AppText>
        ) : null}
      </View>
    );
  }
  if (parameter.formula !== undefined) {
    return (
      <View style={styles.valueBlock}>
        <AppText variant="mono" style={styles.formula}>
          {parameter.formula}
        </AppText>
        <AppText style={styles.number}>{value === undefined ? '—' : formatQuantity(value.value, value.unit)}</AppText>
      </View>
    );
  }
  return (
    <View style={styles.valueBlock}>
      <InputField parameter={parameter} value={value} rejection={rejection} onCommit={onCommit} />
      {parameter.material !== undefined ? (
        <AppText variant="mono">
          materials library: {parameter.material.id} · {parameter.material.property}
        </AppText>
      ) : null}
    </View>
  );
}

/**
 * One row of a sheet: label and key, then an editable field (inputs and library values), the formula and
 * its result, or a read-only constant with its source; errors beside it, the note on request.
 */
export function ParameterRow({ parameter, value, error, rejection, wide, onCommit }: ParameterRowProps) {
  const problems = [
    rejection === undefined ? undefined : `${rejection.error.message}. Kept ${keptText(parameter, value)}.`,
    error?.message,
  ].filter((message): message is string => message !== undefined);
  const notes = parameter.protected === true ? [parameter.note] : [parameter.note, parameter.source && `Source: ${parameter.source}`];
  const noteLines = notes.filter((line): line is string => line !== undefined && line !== '');
  const heading = (
    <>
      <AppText style={styles.label}>{parameter.label}</AppText>
      <AppText variant="mono" style={styles.key}>
        {parameter.key}
      </AppText>
    </>
  );
  return (
    <View style={[styles.row, wide && styles.rowWide]} testID={`param-${parameter.key}`}>
      <View style={[styles.heading, wide && styles.headingWide]}>
        {noteLines.length > 0 ? (
          <Disclosure label="Note" summary={heading} testID={`param-note-${parameter.key}`}>
            {noteLines.map((line) => (
              <AppText key={line} variant="muted" style={styles.small}>
                {line}
              </AppText>
            ))}
          </Disclosure>
        ) : (
          heading
        )}
      </View>
      <View style={[styles.side, wide && styles.sideWide]}>
        <ValueBlock parameter={parameter} value={value} rejection={rejection} onCommit={onCommit} />
        {problems.length > 0 ? (
          <AppText variant="error" role="alert" testID={`param-error-${parameter.key}`}>
            {problems.join('\n')}
          </AppText>
        ) : null}
      </View>
    </View>
  );
}

function keptText(parameter: Parameter, value: EvaluatedValue | undefined): string {
  const current = value?.value ?? parameter.value;
  return current === undefined ? 'no value' : formatQuantity(current, parameter.unit, constantDigits);
}

const styles = StyleSheet.create({
  row: { paddingHorizontal: space.lg, paddingVertical: space.sm, gap: space.xs },
  rowWide: { flexDirection: 'row', alignItems: 'flex-start', gap: space.lg },
  heading: { gap: 2 },
  headingWide: { flex: 1 },
  label: { fontFamily: fonts.medium },
  key: { fontSize: 12, lineHeight: 16, color: colors.inkFaint },
  side: { gap: space.xs },
  sideWide: { width: 260 },
  valueBlock: { gap: space.xs },
  number: { fontFamily: fonts.mono, fontSize: fontSizes.body, color: colors.ink },
  formula: { color: colors.inkMuted },
  small: { fontSize: fontSizes.small, lineHeight: 18 },
  field: {
    flexDirection: 'row',
    alignItems: 'center',
    minHeight: touchTarget,
    borderColor: colors.rule,
    borderWidth: 1,
    borderRadius: radii.md,
    backgroundColor: colors.panel,
    paddingRight: space.md,
    gap: space.sm,
  },
  fieldError: { borderColor: colors.fault, backgroundColor: colors.faultWash },
  input: {
    flex: 1,
    minWidth: 0,
    alignSelf: 'stretch',
    paddingLeft: space.md,
    color: colors.ink,
    fontFamily: fonts.mono,
    fontSize: fontSizes.body,
  },
  unit: { fontFamily: fonts.mono, fontSize: fontSizes.body, color: colors.inkMuted },
});
