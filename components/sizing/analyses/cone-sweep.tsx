import { useMemo } from 'react';
import { AppText } from '@/components/ui/text';
import { colors } from '@/components/ui/theme';
import { sweep, type SweepResult } from '@/shared/engine';
import { IDEAL_BEST_TRANSVERSE_CONE_ANGLE } from '@/shared/sail';
import type { Sheet } from '@/shared/schemas/sheet';
import { formatNumber, formatQuantity, formatUnit } from '../format';
import { AnalysisCard, AnalysisProblems, ResultFigure } from './analysis-card';
import { LineChart } from './line-chart';
import { angleInRadians, degrees } from './sheet-values';

const forceSeries = [
  { key: 'srp_force_normal', label: 'Normal (optical)', color: colors.ink },
  { key: 'srp_force_transverse', label: 'In-plane (optical)', color: colors.inkFaint },
  { key: 'srp_force_optical', label: 'Total (optical)', color: colors.accent },
  { key: 'srp_force', label: 'Ideal sail', color: colors.success, dashed: true },
] as const;

/** Across the sun line, the component that changes orbital energy: F_n sin α − F_t cos α (flat-sail geometry). */
const acrossLabel = 'Across sun line (optical)';

/** The sweep of the sheet's forces over cone angles 0–90° in 1° steps, with the compiled sheet. */
export function coneAngleSweep(sheet: Sheet) {
  return sweep(
    sheet,
    { key: 'cone_angle', from: '0 deg', to: '90 deg', steps: 91 },
    forceSeries.map((line) => line.key),
  );
}

/**
 * The force across the sun line at each swept cone angle and the angle where it is largest: the
 * largest sample refined by the vertex of the parabola through it and its neighbours.
 * @returns the series (same unit as the forces) and the angle in the cone angle row's unit
 */
export function acrossSunLine(result: SweepResult): { values: number[]; best: number | undefined } {
  const angles = Array.from(result.input.values);
  // Angle units are plain multiples of the radian, so one conversion factor serves every point.
  const radiansPerUnit = angleInRadians(1, result.input.unit);
  const [normal, transverse] = [result.outputs[0]?.values, result.outputs[1]?.values];
  const values = angles.map((angle, i) => {
    const alpha = angle * radiansPerUnit;
    return (normal?.[i] ?? Number.NaN) * Math.sin(alpha) - (transverse?.[i] ?? Number.NaN) * Math.cos(alpha);
  });
  let top = -1;
  values.forEach((value, i) => {
    if (Number.isFinite(value) && (top < 0 || value > (values[top] ?? Number.NaN))) top = i;
  });
  const [before, at, after] = [values[top - 1], values[top], values[top + 1]];
  const angle = angles[top];
  if (angle === undefined || at === undefined) return { values, best: undefined };
  if (before === undefined || after === undefined) return { values, best: angle };
  const step = (angles[1] ?? 0) - (angles[0] ?? 0);
  const curvature = before - 2 * at + after;
  return { values, best: curvature < 0 ? angle + (0.5 * (before - after) * step) / curvature : angle };
}

/** Force versus cone angle on the current sheet, with the cone angle of largest force across the sun line. */
export function ConeSweepAnalysis({ sheet }: { sheet: Sheet }) {
  const swept = useMemo(() => {
    const result = coneAngleSweep(sheet);
    return result.ok ? { ok: true as const, result: result.result, across: acrossSunLine(result.result) } : result;
  }, [sheet]);
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
            x={Array.from(swept.result.input.values)}
            series={[
              ...forceSeries.map((line, k) => ({ ...line, values: Array.from(swept.result.outputs[k]?.values ?? []) })),
              { label: acrossLabel, color: colors.focus, values: swept.across.values },
            ]}
            xLabel={`Cone angle (${formatUnit(swept.result.input.unit)})`}
            yLabel={`Force (${formatUnit(swept.result.outputs[0]?.unit ?? '')})`}
            marker={swept.across.best === undefined ? undefined : { x: swept.across.best, label: 'Largest force across the sun line' }}
          />
          <ResultFigure
            label="Cone angle of largest force across the sun line (optical model)"
            value={swept.across.best === undefined ? '—' : formatQuantity(swept.across.best, swept.result.input.unit)}
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
