import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { LineChart } from '@/components/ui/line-chart';
import { AppText } from '@/components/ui/text';
import { colors, space } from '@/components/ui/theme';
import { formatQuantity } from '@/shared/format/quantity';
import { AnalysisCard, AnalysisProblems } from '@/components/sizing/analyses/analysis-card';
import { FilmThicknessAnalysis } from '@/components/sizing/analyses/film-thickness-trade';
import type { SheetSnapshot } from '@/components/sizing/use-sheet-session';
import { coneAngleSeries, roleSweep, temperatureVersusDistance, type RoleSeries } from '@/shared/analyses';
import type { AnalysisResult } from '@/shared/engine';
import { sheetTemplate, type TemplatePlot } from '@/shared/templates';
import { TemplateCaveats } from '../summary/template-notes';
import { axisTitle, chartNumber, lineColor } from '@/components/sizing/analyses/chart-text';

/** The errors that keep an analysis from running, each naming its row or role. */
function problemsOf<T>(result: AnalysisResult<T>): string[] {
  return result.ok ? [] : result.errors.map((error) => error.message);
}

type ConeQuantity = 'force' | 'acceleration';

function ConeAnglePlot({ snapshot }: { snapshot: SheetSnapshot }) {
  const [quantity, setQuantity] = useState<ConeQuantity>('force');
  const result = useMemo(() => coneAngleSeries(snapshot.sheet), [snapshot.sheet]);
  return (
    <AnalysisCard
      title="Force and acceleration versus cone angle"
      summary="The sheet's radiation-pressure forces, and the accelerations they give the predicted mass, as the sail pitches from facing the Sun (0°) to edge-on (90°)."
      testID="plot-cone-angle"
    >
      {result.ok ? (
        <>
          <ChoiceChips
            label="Show"
            choices={[
              { value: 'force', label: 'Force' },
              { value: 'acceleration', label: 'Acceleration' },
            ]}
            value={quantity}
            onChange={setQuantity}
          />
          <ConeChart
            series={quantity === 'force' ? result.result.forces : result.result.accelerations}
            coneAngle={result.result.coneAngle}
            quantity={quantity}
            best={result.result.best?.coneAngle}
          />
          {result.result.best !== undefined ? (
            <AppText variant="mono" style={styles.figure} testID="plot-cone-angle-best">
              Largest force across the sun line: {formatQuantity(result.result.best.force, result.result.best.forceUnit)} at{' '}
              {formatQuantity(result.result.best.coneAngle, result.result.best.unit)}
            </AppText>
          ) : null}
        </>
      ) : (
        <AnalysisProblems problems={problemsOf(result)} testID="plot-cone-angle-problems" />
      )}
    </AnalysisCard>
  );
}

function ConeChart({
  series,
  coneAngle,
  quantity,
  best,
}: {
  series: readonly RoleSeries[];
  coneAngle: RoleSeries;
  quantity: ConeQuantity;
  best: number | undefined;
}) {
  const unit = series[0]?.unit ?? '';
  const name = quantity === 'force' ? 'Force' : 'Acceleration';
  return (
    <LineChart
      title={`${name} versus cone angle`}
      x={coneAngle.values}
      series={series.map((line, i) => ({
        label: line.label,
        color: lineColor(i),
        values: line.values,
        dashed: line.role === 'srp_force',
      }))}
      xLabel={axisTitle(coneAngle.label, coneAngle.unit)}
      yLabel={axisTitle(name, unit)}
      marker={best === undefined ? undefined : { x: best, label: 'Largest force across the sun line' }}
      formatValue={chartNumber}
      testID={`plot-cone-angle-${quantity}`}
    />
  );
}

function TemperaturePlot({ snapshot }: { snapshot: SheetSnapshot }) {
  const result = useMemo(() => temperatureVersusDistance(snapshot.sheet), [snapshot.sheet]);
  if (!result.ok) {
    return (
      <AnalysisCard title="Temperature versus distance" summary="The sheet's film temperature from 0.1 to 2 AU." testID="plot-temperature">
        <AnalysisProblems problems={problemsOf(result)} testID="plot-temperature-problems" />
      </AnalysisCard>
    );
  }
  const { distance, temperature, limit, closestSafe } = result.result;
  return (
    <AnalysisCard
      title="Temperature versus distance"
      summary="The sheet's film temperature from 0.1 to 2 AU at its cone angle, with the film's temperature limit."
      testID="plot-temperature"
    >
      <LineChart
        title="Sail film temperature versus distance from the Sun"
        x={distance.values}
        series={[{ label: temperature.label, color: colors.film, values: temperature.values }]}
        xLabel={axisTitle(distance.label, distance.unit)}
        yLabel={axisTitle(temperature.label, temperature.unit)}
        reference={limit === undefined ? undefined : { y: limit.kelvin, label: `Film limit ${formatQuantity(limit.kelvin, 'K')}` }}
        formatValue={chartNumber}
        testID="plot-temperature-chart"
      />
      {closestSafe?.status === 'found' ? (
        <AppText variant="mono" style={styles.figure} testID="plot-temperature-closest">
          Closest safe distance: {formatQuantity(closestSafe.distance, closestSafe.unit)}
        </AppText>
      ) : closestSafe?.status === 'none' ? (
        <AppText variant="error">{closestSafe.message}</AppText>
      ) : (
        <AppText variant="muted">The sheet has no film temperature limit, so no limit is marked.</AppText>
      )}
    </AnalysisCard>
  );
}

type SweepPlotSpec = Extract<TemplatePlot, { kind: 'sweep' }>;

/** The test id of a declared sweep: its input and output roles. */
export function sweepPlotID(plot: SweepPlotSpec): string {
  return `plot-${plot.input}-${plot.outputs.join('-')}`;
}

/** A sweep a template declares: its output rows along its input row, on the compiled sheet. */
function SweepPlot({ snapshot, plot }: { snapshot: SheetSnapshot; plot: SweepPlotSpec }) {
  const result = useMemo(
    () => roleSweep(snapshot.sheet, { input: plot.input, outputs: plot.outputs, from: plot.from, to: plot.to, steps: 40 }),
    [snapshot.sheet, plot],
  );
  const testID = sweepPlotID(plot);
  return (
    <AnalysisCard title={plot.title} summary={plot.summary} testID={testID}>
      {result.ok ? (
        <LineChart
          title={plot.title}
          x={result.result.input.values}
          series={result.result.outputs.map((line, k) => ({ label: line.label, color: lineColor(k), values: line.values }))}
          xLabel={axisTitle(result.result.input.label, result.result.input.unit)}
          yLabel={axisTitle(result.result.outputs[0]?.label ?? '', result.result.outputs[0]?.unit ?? '')}
          formatValue={chartNumber}
          testID={`${testID}-chart`}
        />
      ) : (
        <AnalysisProblems problems={problemsOf(result)} testID={`${testID}-problems`} />
      )}
    </AnalysisCard>
  );
}

function PlotOf({ snapshot, plot }: { snapshot: SheetSnapshot; plot: TemplatePlot }) {
  switch (plot.kind) {
    case 'cone-angle':
      return <ConeAnglePlot snapshot={snapshot} />;
    case 'film-thickness':
      return <FilmThicknessAnalysis sheet={snapshot.sheet} testID="plot-film-trade" />;
    case 'temperature':
      return <TemperaturePlot snapshot={snapshot} />;
    case 'sweep':
      return <SweepPlot snapshot={snapshot} plot={plot} />;
  }
}

/**
 * The charts of the template the sheet follows, where people would rather look than read (the square sail's:
 * force and acceleration versus cone angle, the film thickness trade, temperature versus distance with the film
 * limit marked, and its torques), under the template's caveats.
 */
export function SheetPlots({ snapshot }: { snapshot: SheetSnapshot }) {
  const template = useMemo(() => sheetTemplate(snapshot.sheet), [snapshot.sheet]);
  return (
    <View style={styles.plots} testID="sheet-plots">
      <TemplateCaveats caveats={template.roles.caveats} testID="sheet-plots-caveats" />
      {template.roles.plots.map((plot) => (
        <PlotOf key={plot.kind === 'sweep' ? sweepPlotID(plot) : plot.kind} snapshot={snapshot} plot={plot} />
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  plots: { gap: space.lg },
  figure: { color: colors.ink },
});
