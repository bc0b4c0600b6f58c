import { StyleSheet, View } from 'react-native';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { AppText } from '@/components/ui/text';
import { space } from '@/components/ui/theme';
import { needsWeighingReport, whyNotMeasured } from '@/shared/budget/measured-evidence';
import { useRowEvidence } from './use-row-evidence';

export type MaturityPickerProps = {
  craftId: string;
  revisionId: string;
  rowKey: string;
  maturities: readonly { id: string; label: string }[];
  value: string;
  onChange: (maturity: string) => void;
};

/**
 * A mass row's maturity. The measured maturity is offered only once a weighing report is attached to the
 * row; until then a line says why (the server refuses it too).
 */
export function MaturityPicker({ craftId, revisionId, rowKey, maturities, value, onChange }: MaturityPickerProps) {
  const { weighingReports } = useRowEvidence(craftId, revisionId, rowKey);
  const locked = (maturity: string) => maturity !== value && whyNotMeasured(rowKey, maturity, weighingReports ?? 0) !== undefined;
  const held = maturities.find((maturity) => needsWeighingReport(maturity.id) && locked(maturity.id));
  return (
    <View style={styles.field}>
      <ChoiceChips
        label="Maturity"
        choices={maturities.filter((maturity) => !locked(maturity.id)).map((maturity) => ({ value: maturity.id, label: maturity.label }))}
        value={value}
        onChange={(maturity) => maturity !== value && onChange(maturity)}
        testID="row-maturity"
      />
      {held === undefined ? null : (
        <AppText variant="muted" testID="row-maturity-measured-note">
          {held.label} is offered once a weighing report of this item is attached (see Evidence below).
        </AppText>
      )}
    </View>
  );
}

const styles = StyleSheet.create({ field: { gap: space.xs } });
