import { useMemo } from 'react';
import { AppText } from '@/components/ui/text';
import { colors } from '@/components/ui/theme';
import { coneAngleSeries, type RoleSeries } from '@/shared/analyses';
import { IDEAL_BEST_TRANSVERSE_CONE_ANGLE } from '@/shared/sail';
import type { Sheet } from '@/shared/schemas/sheet';
import type { RowRole } from '@/shared/templates';
import { formatNumber, formatQuantity, formatUnit } from '@/shared/format/quantity';
import { AnalysisCard, AnalysisProblems, ResultFigure } from './analysis-card';
import { LineChart } from '@/components/ui/line-chart';
import { degrees } from './sheet-values';

/** How each force row is drawn; the ideal sail dashed, as an idealised model. */
const lineStyles: Partial<Record<RowRole, { color: string; dashed?: boolean }>> = {
  srp_force_normal: { color: colors.ink },
  srp_force_transverse: { color: colors.inkFaint },
  srp_force_optical: { color: colors.film },
  srp_force: { color: colors.nominal, dashed: true },
  srp_force_circumferential: { color: colors.focusRing },
};

/** The accelerations drawn: the whole force of each model. */
const accelerationRoles: readonly RowRole[] = ['srp_force_optical', 'srp_force'];

function chartLines(series: readonly RoleSeries[]) {
  return series.map((line) => ({
    label: line.label,
    color: lineStyles[line.role]?.color ?? colors.ink,
    dashed: lineStyles[line.role]?.dashed,
    values: line.values,
  }));
}

/** Force and acceleration versus cone angle on the current sheet, with the cone angle of largest force across the sun line. */
export function ConeSweepAnalysis({ sheet }: { sheet: Sheet }) {
  const swept = useMemo(() => coneAngleSeries(sheet), [sheet]);
  return (
    <AnalysisCard
      title="Force versus cone angle"
      summary="The sheet's radiation-pressure forces as the sail pitches from facing the Sun (0°) to edge-on (90°)."
      caveat="A flat sail at one distance. A real membrane billows and wrinkles, which lowers the force and turns it towards the sun line (common practice)."
      testID="analysis-cone-sweep"
    >
      {swept.ok ? (
        <>
          <LineChart
            title="Solar radiation pressure force versus cone angle"
            x={swept.result.coneAngle.values}
            series={chartLines(swept.result.forces)}
            xLabel={`Cone angle (${formatUnit(swept.result.coneAngle.unit)})`}
            yLabel={`Force (${formatUnit(swept.result.forces[0]?.unit ?? '')})`}
            marker={
              swept.result.best === undefined ? undefined : { x: swept.result.best.coneAngle, label: 'Largest force across the sun line' }
            }
          />
          <LineChart
            title="Acceleration versus cone angle"
            x={swept.result.coneAngle.values}
            series={chartLines(swept.result.accelerations.filter((line) => accelerationRoles.includes(line.role)))}
            xLabel={`Cone angle (${formatUnit(swept.result.coneAngle.unit)})`}
            yLabel={`Acceleration (${formatUnit(swept.result.accelerations[0]?.unit ?? '')})`}
          />
          <ResultFigure
            label="Cone angle of largest force across the sun line (optical model)"
            value={swept.result.best === undefined ? '—' : formatQuantity(swept.result.best.coneAngle, swept.result.best.unit)}
            testID="best-transverse-cone-angle"
          />
          <AppText variant="muted">
            An ideal flat reflector has it at tan α = 1/√2, α = {formatNumber(degrees(IDEAL_BEST_TRANSVERSE_CONE_ANGLE), 4)}° (McInnes 1999,
            Solar Sailing, ch. 2).
          </AppText>
          {swept.result.invalidPoints > 0 ? (
            <AppText variant="error">{swept.result.invalidPoints} swept points have no finite force and are left out of the chart.</AppText>
          ) : null}
        </>
      ) : (
        <AnalysisProblems problems={swept.errors.map((error) => error.message)} testID="analysis-cone-sweep-error" />
      )}
    </AnalysisCard>
  );
}
