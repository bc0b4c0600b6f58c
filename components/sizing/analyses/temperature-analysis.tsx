import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Disclosure } from '@/components/ui/disclosure';
import { DividedList } from '@/components/ui/divided-list';
import { TextField } from '@/components/ui/text-field';
import { AppText } from '@/components/ui/text';
import { colors, space } from '@/components/ui/theme';
import { valueInRowUnit } from '@/shared/engine';
import { ASTRONOMICAL_UNIT, closestSafeDistance, linspace, materialProperty, temperatureVersusDistance } from '@/shared/sail';
import { formatNumber, formatQuantity } from '../format';
import type { SheetSnapshot } from '../use-sheet-session';
import { AnalysisCard, AnalysisProblems, ResultFigure } from './analysis-card';
import { LineChart } from './line-chart';
import { angleInRadians, messageOf, readOptics, readValues } from './sheet-values';

const distancesAu = linspace(0.1, 2, 39);
const tableAu = [0.1, 0.2, 0.3, 0.5, 0.7, 1, 1.5, 2];
const limitKey = 'temperature_limit';

/** The film's temperature limit from the materials library, for the material the sheet's film density row reads. */
export function filmTemperatureLimit(snapshot: SheetSnapshot): { value: number; materialId: string; source: string } | undefined {
  const materialId = snapshot.sheet.parameters.find((parameter) => parameter.key === 'film_density')?.material?.id;
  const limit = materialId === undefined ? undefined : materialProperty(materialId, 'temperatureLimit');
  return materialId === undefined || limit === undefined || limit.unit !== 'K'
    ? undefined
    : { value: limit.value, materialId, source: limit.source };
}

/** Parses a temperature typed in K (bare numbers) or °C. */
function parseLimit(text: string): { ok: true; value: number } | { ok: false; message: string } {
  const parsed = valueInRowUnit({ key: limitKey, label: 'Film temperature limit', subsystem: 'Sail membrane', unit: 'K', value: 0 }, text);
  return parsed.ok ? parsed : { ok: false, message: parsed.error.message };
}

function useTemperatures(snapshot: SheetSnapshot) {
  return useMemo(() => {
    const optics = readOptics(snapshot);
    const cone = readValues(snapshot, ['cone_angle'] as const);
    const problems = [...(optics.ok ? [] : optics.problems), ...(cone.ok ? [] : cone.problems)];
    if (!optics.ok || !cone.ok) return { ok: false as const, problems };
    const coneAngle = angleInRadians(cone.values.cone_angle, snapshot.values.cone_angle?.unit ?? '');
    try {
      const at = (au: readonly number[]) =>
        temperatureVersusDistance(
          au.map((distance) => distance * ASTRONOMICAL_UNIT.value),
          coneAngle,
          optics.optics,
        ).map((point) => point.temperature);
      return { ok: true as const, optics: optics.optics, coneAngle, curve: at(distancesAu), table: at(tableAu) };
    } catch (error) {
      return { ok: false as const, problems: [`cone_angle: ${messageOf(error)}`] };
    }
  }, [snapshot]);
}

/** Sail temperature from 0.1 to 2 AU with the sheet's optics and cone angle, and the closest safe approach. */
export function TemperatureAnalysis({ snapshot }: { snapshot: SheetSnapshot }) {
  const library = useMemo(() => filmTemperatureLimit(snapshot), [snapshot]);
  const [limitText, setLimitText] = useState(library === undefined ? '' : `${formatNumber(library.value, 5)} K`);
  const temperatures = useTemperatures(snapshot);
  const limit = useMemo(() => parseLimit(limitText), [limitText]);
  const closest = useMemo((): { ok: true; au: number } | { ok: false; message: string } | undefined => {
    if (!temperatures.ok) return undefined;
    if (!limit.ok) return limit;
    try {
      return { ok: true, au: closestSafeDistance(limit.value, temperatures.coneAngle, temperatures.optics) / ASTRONOMICAL_UNIT.value };
    } catch (error) {
      return { ok: false, message: `${limitKey}: ${messageOf(error)}` };
    }
  }, [temperatures, limit]);

  return (
    <AnalysisCard
      title="Temperature versus distance"
      summary="Equilibrium film temperature with the sheet's optical coefficients and cone angle (McInnes 1999, ch. 2)."
      caveat="Equilibrium of a flat, opaque film radiating from both faces. Wrinkles, seams and hot spots run hotter, so keep a margin below the limit (common practice)."
      testID="analysis-temperature"
    >
      {temperatures.ok ? (
        <>
          <LineChart
            title="Sail film temperature versus heliocentric distance"
            x={distancesAu}
            series={[{ label: 'Film temperature', color: colors.accent, values: temperatures.curve }]}
            xLabel="Distance from the Sun (AU)"
            yLabel="Temperature (K)"
            reference={limit.ok ? { y: limit.value, label: 'Temperature limit' } : undefined}
          />
          <Disclosure label="Temperatures as a table" testID="temperature-table-toggle">
            <DividedList testID="temperature-table">
              {tableAu.map((au, i) => (
                <View key={au} style={styles.row}>
                  <AppText variant="mono">{formatQuantity(au, 'AU')}</AppText>
                  <AppText variant="mono" style={styles.value}>
                    {formatQuantity(temperatures.table[i] ?? Number.NaN, 'K')}
                  </AppText>
                </View>
              ))}
            </DividedList>
          </Disclosure>
        </>
      ) : (
        <AnalysisProblems problems={temperatures.problems} testID="analysis-temperature-error" />
      )}
      <TextField
        label="Film temperature limit (K, or °C with its unit)"
        value={limitText}
        onChangeText={setLimitText}
        autoCapitalize="none"
        error={closest?.ok === false ? closest.message : undefined}
        testID="temperature-limit"
      />
      {library !== undefined ? (
        <AppText variant="label">
          Library limit for {library.materialId}: {formatQuantity(library.value, 'K', 5)}. Source: {library.source}
        </AppText>
      ) : (
        <AppText variant="label">{"The sheet's film material has no temperature limit in the library: type one."}</AppText>
      )}
      {closest?.ok === true ? (
        <ResultFigure label="Closest safe distance from the Sun" value={formatQuantity(closest.au, 'AU')} testID="closest-safe-distance" />
      ) : null}
    </AnalysisCard>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', justifyContent: 'space-between', paddingVertical: space.xs, paddingHorizontal: space.md },
  value: { color: colors.ink },
});
