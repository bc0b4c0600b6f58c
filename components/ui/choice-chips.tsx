import { Pressable, StyleSheet, View } from 'react-native';
import { AppText } from './text';
import { colors, fonts, radii, space, touchTarget } from './theme';

export type Choice<T extends string> = { value: T; label: string };

export type ChoiceChipsProps<T extends string> = {
  /** Names the group for screen readers. */
  label: string;
  choices: readonly Choice<T>[];
  value: T | null;
  onChange: (value: T) => void;
  testID?: string;
};

/** A single-choice group drawn as chips; works as a radio group for assistive technology. */
export function ChoiceChips<T extends string>({ label, choices, value, onChange, testID }: ChoiceChipsProps<T>) {
  return (
    <View style={styles.field}>
      <AppText variant="label">{label}</AppText>
      <View role="radiogroup" aria-label={label} style={styles.row} testID={testID}>
        {choices.map((choice) => {
          const selected = choice.value === value;
          return (
            <Pressable
              key={choice.value}
              role="radio"
              aria-checked={selected}
              aria-label={choice.label}
              onPress={() => onChange(choice.value)}
              style={[styles.chip, selected && styles.selected]}
            >
              <AppText style={[styles.text, selected && styles.selectedText]}>{choice.label}</AppText>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  field: { gap: space.xs },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  chip: {
    minHeight: touchTarget,
    justifyContent: 'center',
    paddingHorizontal: space.md,
    borderRadius: radii.pill,
    borderWidth: 1,
    borderColor: colors.rule,
    backgroundColor: colors.panel,
  },
  selected: { borderColor: colors.ink, backgroundColor: colors.ink },
  text: { fontFamily: fonts.medium, color: colors.ink },
  selectedText: { color: colors.panel },
});
