import { useRef, useState } from 'react';
import { Platform, StyleSheet, TextInput, type NativeSyntheticEvent, type TextInputKeyPressEventData, type TextStyle } from 'react-native';
import { editText, formatUnit } from '@/shared/format/quantity';
import { colors, fonts, fontSizes, radii, space } from '@/components/ui/theme';
import type { Parameter } from '@/shared/schemas/sheet';
import type { SheetActions } from './use-sheet-editor';

/** How keyboard focus moves between the value fields of the table. */
export interface CellNavigation {
  register(key: string, input: TextInput | null): void;
  /** Focuses the value field `step` editable rows away from `key` (−1: the row above). */
  move(key: string, step: number): void;
}

/**
 * The text a row's value field shows when nobody is typing in it: its formula, or its value in the row's
 * unit (for a value from the materials library, the value the library gives).
 */
export function savedText(parameter: Parameter, computed: number | undefined): string {
  if (parameter.formula !== undefined) return parameter.formula;
  const value = parameter.value ?? computed;
  return value === undefined ? '' : editText(value);
}

/** A row's definition as read-only text: its formula, its input value, or where the materials library takes it from. */
export function definitionText(parameter: Parameter): string {
  if (parameter.material !== undefined) return `library: ${parameter.material.id} · ${parameter.material.property}`;
  return savedText(parameter, undefined);
}

export type ValueInputProps = {
  parameter: Parameter;
  /** The row's computed value, shown for rows that take theirs from the materials library. */
  computed: number | undefined;
  /** Whether the engine refused the text last typed (the field is marked). */
  invalid: boolean;
  actions: SheetActions;
  navigation?: CellNavigation;
  /** Fills its cell in the table; a full-width field in the edit sheet. */
  compact?: boolean;
};

/**
 * The editable value or formula of a row: every keystroke goes to the live engine, Enter (or leaving the
 * field) saves, Escape goes back to the saved definition; in the table, Enter then moves to the next row
 * and arrow up and down move to the neighbouring rows (left and right move within the text being edited).
 */
export function ValueInput({ parameter, computed, invalid, actions, navigation, compact = false }: ValueInputProps) {
  const { key } = parameter;
  const [draft, setDraft] = useState<string | null>(null);
  // Enter blurs the field in the same event as it commits: the ref stops the blur committing a second time.
  const typed = useRef<string | null>(null);
  const source = savedText(parameter, computed);

  const type = (text: string) => {
    typed.current = text;
    setDraft(text);
    actions.change(key, text);
  };
  const finish = (save: boolean) => {
    const text = typed.current;
    typed.current = null;
    setDraft(null);
    if (text === null) return;
    // The live row already holds the typed text, so whether it differs from the saved row is the editor's call.
    if (save && text.trim() !== '') actions.commit(key, text);
    else actions.cancel(key);
  };
  const onKeyPress = (event: NativeSyntheticEvent<TextInputKeyPressEventData>) => {
    const pressed = event.nativeEvent.key;
    if (pressed === 'Escape') finish(false);
    else if (navigation !== undefined && (pressed === 'ArrowUp' || pressed === 'ArrowDown')) {
      event.preventDefault();
      navigation.move(key, pressed === 'ArrowUp' ? -1 : 1);
    }
  };
  const unit = formatUnit(parameter.unit);
  return (
    <TextInput
      ref={(input) => navigation?.register(key, input)}
      value={draft ?? source}
      onChangeText={type}
      onSubmitEditing={() => {
        finish(true);
        // In the table, Enter saves and goes on to the next row, as down the column of a ledger.
        navigation?.move(key, 1);
      }}
      blurOnSubmit={navigation === undefined}
      onBlur={() => finish(true)}
      onKeyPress={onKeyPress}
      placeholder={parameter.material === undefined ? undefined : `${parameter.material.id} · ${parameter.material.property}`}
      aria-label={`${parameter.label}: ${parameter.formula !== undefined ? 'formula' : unit === '' ? 'value' : `value in ${unit}`}`}
      aria-invalid={invalid}
      autoCapitalize="none"
      autoCorrect={false}
      spellCheck={false}
      enterKeyHint="done"
      testID={`sheet-input-${key}`}
      style={[
        styles.input,
        parameter.formula !== undefined && styles.formula,
        compact ? styles.compact : styles.full,
        invalid && styles.invalid,
      ]}
    />
  );
}

const styles = StyleSheet.create({
  input: {
    borderColor: colors.rule,
    borderWidth: 1,
    borderRadius: radii.sm,
    backgroundColor: colors.panel,
    color: colors.ink,
    fontFamily: fonts.mono,
    fontSize: fontSizes.small,
    paddingHorizontal: space.sm,
    textAlign: 'right',
  },
  // Numbers line up on the right; a formula reads from the left.
  formula: { textAlign: 'left' },
  // In the table the field's size never follows its text: contained, typing lays out the field alone (web).
  compact: { minHeight: 32, width: '100%', ...((Platform.OS === 'web' ? { contain: 'size layout' } : {}) as TextStyle) },
  full: { minHeight: 44, fontSize: fontSizes.body },
  invalid: { borderColor: colors.fault, backgroundColor: colors.faultWash },
});
