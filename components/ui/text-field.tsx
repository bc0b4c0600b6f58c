import { useId } from 'react';
import { StyleSheet, TextInput, View, type TextInputProps } from 'react-native';
import { AppText } from './text';
import { colors, fonts, fontSizes, radii, space, touchTarget } from './theme';

export type TextFieldProps = Omit<TextInputProps, 'style'> & {
  label: string;
  /** What is wrong with the value, shown beside the field and announced with it. */
  error?: string;
};

/** A labelled text input that shows its error right under it. */
export function TextField({ label, error, multiline, testID, ...props }: TextFieldProps) {
  const errorId = useId();
  return (
    <View style={styles.field}>
      <AppText variant="label">{label}</AppText>
      <TextInput
        aria-label={label}
        aria-invalid={Boolean(error)}
        aria-describedby={error ? errorId : undefined}
        multiline={multiline}
        placeholderTextColor={colors.inkFaint}
        testID={testID}
        style={[styles.input, multiline && styles.multiline, Boolean(error) && styles.inputError]}
        {...props}
      />
      {error ? (
        <AppText variant="error" nativeID={errorId} role="alert" testID={testID ? `${testID}-error` : undefined}>
          {error}
        </AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  field: { gap: space.xs },
  input: {
    minHeight: touchTarget,
    borderColor: colors.rule,
    borderWidth: 1,
    borderRadius: radii.md,
    backgroundColor: colors.panel,
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
    color: colors.ink,
    fontFamily: fonts.regular,
    fontSize: fontSizes.body,
  },
  multiline: { minHeight: 88, textAlignVertical: 'top' },
  inputError: { borderColor: colors.fault, backgroundColor: colors.faultWash },
});
