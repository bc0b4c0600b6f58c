import { StyleSheet, View } from 'react-native';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { Disclosure } from '@/components/ui/disclosure';
import { AppText } from '@/components/ui/text';
import { colors, fonts, space } from '@/components/ui/theme';
import { findPreset } from '@/shared/budget';
import { formatNumber, formatQuantity } from './format';
import { SizingCaution } from './sizing-caution';
import type { SheetSnapshot } from './use-sheet-session';

/** The performance rows a sizing review looks at first, by the template's keys. */
const rowFigures = [
  { key: 'sail_area', label: 'Sail area' },
  { key: 'areal_density', label: 'Areal density' },
  { key: 'characteristic_acceleration', label: 'Characteristic acceleration' },
  { key: 'lightness_number', label: 'Lightness number' },
  { key: 'srp_force', label: 'SRP force (ideal sail)' },
  { key: 'srp_force_optical', label: 'SRP force (optical model)' },
  { key: 'sail_temperature', label: 'Sail temperature' },
] as const;

type FigureProps = {
  figureKey: string;
  label: string;
  value: string;
  detail?: string;
  /** Why there is no value. */
  problem?: string;
  /** A warning about the value, e.g. a margin below the required one. */
  flag?: string;
  wide?: boolean;
};

function Figure({ figureKey, label, value, detail, problem, flag, wide = false }: FigureProps) {
  return (
    <View style={[styles.figure, wide && styles.wide]} testID={`key-figure-${figureKey}`}>
      <AppText variant="label">{label}</AppText>
      <AppText style={[styles.value, problem !== undefined && styles.missing, flag !== undefined && styles.flagged]}>{value}</AppText>
      {detail !== undefined ? <AppText variant="mono">{detail}</AppText> : null}
      {flag !== undefined ? <Badge label={flag} strong /> : null}
      {problem !== undefined ? <AppText variant="error">{problem}</AppText> : null}
    </View>
  );
}

function MassFigures({ snapshot }: { snapshot: SheetSnapshot }) {
  const { budget } = snapshot;
  if (!budget.ok) {
    const problem = budget.errors.map((error) => error.message).join('\n') || 'the mass budget cannot be rolled up';
    return (
      <>
        <Figure figureKey="total_mass" label="Total mass (CBE)" value="—" />
        <Figure figureKey="predicted_mass" label="Predicted mass" value="—" />
        <Figure figureKey="system_margin" label="System margin" value="—" problem={problem} wide />
      </>
    );
  }
  const { total, systemMargin } = budget.result;
  const share = `${formatNumber(systemMargin.percentOfAllocation, 3)} % of allocation\nrequired: ${formatNumber(systemMargin.requiredPercent, 3)} %`;
  return (
    <>
      <Figure figureKey="total_mass" label="Total mass (CBE)" value={formatQuantity(total.cbe, 'kg')} />
      <Figure figureKey="predicted_mass" label="Predicted mass" value={formatQuantity(total.predicted, 'kg')} />
      <Figure
        figureKey="system_margin"
        label="System margin"
        value={formatQuantity(systemMargin.kg, 'kg')}
        detail={share}
        flag={systemMargin.belowRequired ? 'Below the required margin' : undefined}
        wide
      />
    </>
  );
}

function AllowanceNote({ presetId }: { presetId: string | undefined }) {
  const preset = presetId === undefined ? undefined : findPreset(presetId);
  if (preset === undefined) return null;
  return (
    <Disclosure label={`Growth allowances: ${preset.name}`} testID="allowance-note">
      <AppText variant="muted">Source: {preset.source}</AppText>
      <AppText variant="muted">{preset.caveat}</AppText>
    </Disclosure>
  );
}

/** The sizing results at a glance: performance figures from the sheet's rows and the mass budget roll-up. */
export function KeyFigures({ snapshot }: { snapshot: SheetSnapshot }) {
  const present = rowFigures.filter((figure) => snapshot.sheet.parameters.some((parameter) => parameter.key === figure.key));
  return (
    <Card testID="key-figures">
      <AppText variant="heading">Key figures</AppText>
      <SizingCaution testID="key-figures-caution" />
      <View style={styles.grid}>
        {present.map((figure) => {
          const value = snapshot.values[figure.key];
          const error = snapshot.errors.find((candidate) => candidate.key === figure.key);
          return (
            <Figure
              key={figure.key}
              figureKey={figure.key}
              label={figure.label}
              value={value === undefined ? '—' : formatQuantity(value.value, value.unit)}
              problem={value === undefined ? (error?.message ?? 'no value') : undefined}
            />
          );
        })}
        <MassFigures snapshot={snapshot} />
      </View>
      <AllowanceNote presetId={snapshot.sheet.budget?.preset} />
    </Card>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg, rowGap: space.md, paddingTop: space.xs },
  figure: { flexGrow: 1, flexBasis: 120, minWidth: 120, gap: 2 },
  wide: { flexBasis: '100%' },
  value: { fontFamily: fonts.monoMedium, fontSize: 18, lineHeight: 24, color: colors.ink },
  missing: { color: colors.inkFaint },
  flagged: { color: colors.danger },
});
