import { StyleSheet, View } from 'react-native';
import { DividedList } from '@/components/ui/divided-list';
import { AppText } from '@/components/ui/text';
import { space } from '@/components/ui/theme';
import type { Parameter } from '@/shared/schemas/sheet';
import { ParameterRow } from './parameter-row';
import { SizingCaution } from './sizing-caution';
import type { Rejection, SheetSnapshot } from './use-sheet-session';

export type ParameterListProps = {
  snapshot: SheetSnapshot;
  rejected: Readonly<Record<string, Rejection>>;
  /** Rows side by side (label left, value right) rather than stacked. */
  wide: boolean;
  onCommit: (key: string, text: string) => void;
};

/** The sheet's rows by subsystem, in the order each subsystem first appears. */
function bySubsystem(parameters: readonly Parameter[]): [string, Parameter[]][] {
  const groups = new Map<string, Parameter[]>();
  for (const parameter of parameters) groups.set(parameter.subsystem, [...(groups.get(parameter.subsystem) ?? []), parameter]);
  return [...groups];
}

/** Every row of the sheet, grouped by subsystem, with the caution over the results. */
export function ParameterList({ snapshot, rejected, wide, onCommit }: ParameterListProps) {
  return (
    <View style={styles.list} testID="parameter-list">
      <AppText variant="heading">Parameters</AppText>
      <SizingCaution testID="parameter-list-caution" />
      {bySubsystem(snapshot.sheet.parameters).map(([subsystem, parameters]) => (
        <View key={subsystem} style={styles.group} testID={`subsystem-${subsystem}`}>
          <AppText variant="label" role="heading" aria-level={3}>
            {subsystem}
          </AppText>
          <DividedList>
            {parameters.map((parameter) => (
              <ParameterRow
                key={parameter.key}
                parameter={parameter}
                value={snapshot.values[parameter.key]}
                error={snapshot.errors.find((error) => error.key === parameter.key)}
                rejection={rejected[parameter.key]}
                wide={wide}
                onCommit={onCommit}
              />
            ))}
          </DividedList>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.md },
  group: { gap: space.sm },
});
