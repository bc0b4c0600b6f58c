import { useMemo } from 'react';
import { LineChart } from '@/components/ui/line-chart';
import { filmThicknessTrade } from '@/shared/analyses';
import type { Sheet } from '@/shared/schemas/sheet';
import { formatQuantity } from '@/shared/format/quantity';
import { AnalysisCard, AnalysisProblems } from './analysis-card';
import { axisTitle, chartNumber, lineColor } from './chart-text';

/**
 * Characteristic acceleration versus sail side for the sheet's film thickness, half and double it: the trade
 * chart of the sandbox screen and of a craft's plots. `testID` names the card; its chart and problems add
 * `-chart` and `-problems`.
 */
export function FilmThicknessAnalysis({ sheet, testID }: { sheet: Sheet; testID: string }) {
  const trade = useMemo(() => filmThicknessTrade(sheet), [sheet]);
  return (
    <AnalysisCard
      title="Film thickness trade"
      summary="Characteristic acceleration versus sail side for half, the same and double the sheet's film thickness, everything else as on the sheet."
      testID={testID}
    >
      {trade.ok ? (
        <LineChart
          title="Characteristic acceleration versus sail side for three film thicknesses"
          x={trade.result.side.values}
          series={trade.result.lines.map((line, index) => ({
            label: `${formatQuantity(line.thicknessUm, 'um', 3)} film`,
            color: lineColor(index),
            values: line.acceleration.values,
          }))}
          xLabel={axisTitle(trade.result.side.label, trade.result.side.unit)}
          yLabel={axisTitle(
            trade.result.lines[0]?.acceleration.label ?? 'Characteristic acceleration',
            trade.result.lines[0]?.acceleration.unit ?? '',
          )}
          formatValue={chartNumber}
          testID={`${testID}-chart`}
        />
      ) : (
        <AnalysisProblems problems={trade.errors.map((error) => error.message)} testID={`${testID}-problems`} />
      )}
    </AnalysisCard>
  );
}
