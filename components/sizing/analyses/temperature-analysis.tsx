import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Disclosure } from '@/components/ui/disclosure';
import { DividedList } from '@/components/ui/divided-list';
import { TextField } from '@/components/ui/text-field';
import { AppText } from '@/components/ui/text';
import { colors, space } from '@/components/ui/theme';
import { sheetFilmLimitK, temperatureVersusDistance } from '@/shared/analyses';
import { valueInRowUnit } from '@/shared/engine';
import type { Sheet } from '@/shared/schemas/sheet';
import { sheetRoles } from '@/shared/templates';
import { formatNumber, formatQuantity, formatUnit } from '@/shared/format/quantity';
import { AnalysisCard, AnalysisProblems, ResultFigure } from './analysis-card';
import { LineChart } from '@/components/ui/line-chart';

/** Distances listed in the table (AU); each is a point of the swept curve (0.1 to 2 AU in 0.05 AU steps). */
const tableAu = [0.1, 0.2, 0.3, 0.5, 0.7, 1, 1.5, 2];
const limitKey = 'film_temperature_limit';

/** Parses a temperature typed in K (bare numbers) or °C, to kelvin. */
function parseLimit(text: string): { ok: true; value: number } | { ok: false; message: string } {
  const parsed = valueInRowUnit({ key: limitKey, label: 'Film temperature limit', subsystem: 'Sail membrane', unit: 'K', value: 0 }, text);
  return parsed.ok ? parsed : { ok: false, message: parsed.error.message };
}

/** The sheet's own film limit (from its film-temperature-limit row), as the text the field starts with. */
function sheetLimitText(sheet: Sheet): string {
  const kelvin = sheetFilmLimitK(sheet);
  return kelvin === undefined ? '' : `${formatNumber(kelvin, 5)} K`;
}

/** Sail temperature from 0.1 to 2 AU from the sheet's own temperature row, and the closest safe approach for a film limit. */
export function TemperatureAnalysis({ sheet }: { sheet: Sheet }) {
  const [limitText, setLimitText] = useState(() => sheetLimitText(sheet));
  const limit = useMemo(() => parseLimit(limitText), [limitText]);
  const result = useMemo(() => temperatureVersusDistance(sheet, limit.ok ? { limitK: limit.value } : {}), [sheet, limit]);
  const closest = result.ok && limit.ok ? result.result.closestSafe : undefined;
  const limitRow = sheet.parameters.find((parameter) => parameter.key === sheetRoles(sheet).film_temperature_limit);
  const fieldError = !limit.ok ? limit.message : closest?.status === 'none' ? closest.message : undefined;
  return (
    <AnalysisCard
      title="Temperature versus distance"
      summary="Equilibrium film temperature from the sheet's own temperature row, as the distance from the Sun changes (McInnes 1999, ch. 2)."
      caveat="Equilibrium of a flat, opaque film radiating from both faces. Wrinkles, seams and hot spots run hotter, so keep a margin below the limit (common practice)."
      testID="analysis-temperature"
    >
      {result.ok ? (
        <>
          <LineChart
            title="Sail film temperature versus heliocentric distance"
            x={result.result.distance.values}
            series={[{ label: 'Film temperature', color: colors.film, values: result.result.temperature.values }]}
            xLabel={`Distance from the Sun (${formatUnit(result.result.distance.unit)})`}
            yLabel={`Temperature (${formatUnit(result.result.temperature.unit)})`}
            reference={limit.ok && result.result.temperature.unit === 'K' ? { y: limit.value, label: 'Temperature limit' } : undefined}
          />
          <Disclosure label="Temperatures as a table" testID="temperature-table-toggle">
            <DividedList testID="temperature-table">
              {tableAu.map((au) => {
                const index = Math.round((au - 0.1) / 0.05);
                return (
                  <View key={au} style={styles.row}>
                    <AppText variant="mono">{formatQuantity(au, 'AU')}</AppText>
                    <AppText variant="mono" style={styles.value}>
                      {formatQuantity(result.result.temperature.values[index] ?? Number.NaN, result.result.temperature.unit)}
                    </AppText>
                  </View>
                );
              })}
            </DividedList>
          </Disclosure>
        </>
      ) : (
        <AnalysisProblems problems={result.errors.map((error) => error.message)} testID="analysis-temperature-error" />
      )}
      <TextField
        label="Film temperature limit (K, or °C with its unit)"
        value={limitText}
        onChangeText={setLimitText}
        autoCapitalize="none"
        error={fieldError}
        testID="temperature-limit"
      />
      {limitRow !== undefined ? (
        <AppText variant="label">
          The sheet&apos;s limit is its row {limitRow.key}
          {limitRow.material === undefined ? '' : ` (materials library: ${limitRow.material.id})`}.
        </AppText>
      ) : (
        <AppText variant="label">{'The sheet has no film temperature limit row: type one.'}</AppText>
      )}
      {closest?.status === 'found' ? (
        <ResultFigure
          label="Closest safe distance from the Sun"
          value={formatQuantity(closest.distance, closest.unit)}
          testID="closest-safe-distance"
        />
      ) : null}
    </AnalysisCard>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', justifyContent: 'space-between', paddingVertical: space.xs, paddingHorizontal: space.md },
  value: { color: colors.ink },
});
