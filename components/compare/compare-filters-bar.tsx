import { StyleSheet, View } from 'react-native';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { TextField } from '@/components/ui/text-field';
import { AppText } from '@/components/ui/text';
import { Toggle } from '@/components/ui/toggle';
import { space } from '@/components/ui/theme';
import type { CompareFilters } from './compare-view';

// Subsystem names are never empty, so the empty string can stand for "every subsystem".
const everySubsystem = '';

export type CompareFiltersBarProps = {
  filters: CompareFilters;
  /** The subsystems to offer, in sheet order. */
  subsystems: readonly string[];
  onChange: (filters: CompareFilters) => void;
};

/** Narrows a comparison: changed outputs only, one subsystem, outputs whose name or key contains some text. */
export function CompareFiltersBar({ filters, subsystems, onChange }: CompareFiltersBarProps) {
  return (
    <View style={styles.bar} testID="compare-filters">
      <View style={styles.toggle}>
        <Toggle
          label="Changed outputs only"
          value={filters.changedOnly}
          onChange={(changedOnly) => onChange({ ...filters, changedOnly })}
          testID="compare-changed-only"
        />
        <AppText>Changed outputs only</AppText>
      </View>
      <ChoiceChips
        label="Subsystem"
        choices={[{ value: everySubsystem, label: 'All subsystems' }, ...subsystems.map((name) => ({ value: name, label: name }))]}
        value={filters.subsystem ?? everySubsystem}
        onChange={(value) => onChange({ ...filters, subsystem: value === everySubsystem ? null : value })}
        testID="compare-subsystem"
      />
      <TextField
        label="Find an output"
        placeholder="Name or key"
        value={filters.outputSearch}
        onChangeText={(outputSearch) => onChange({ ...filters, outputSearch })}
        autoCapitalize="none"
        autoCorrect={false}
        testID="compare-output-search"
      />
    </View>
  );
}

const styles = StyleSheet.create({
  bar: { gap: space.md },
  toggle: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
});
