import { useMemo, useState } from 'react';
import { TextField } from '@/components/ui/text-field';
import { AppText } from '@/components/ui/text';
import { roleValuesSI } from '@/shared/analyses';
import { valueInRowUnit } from '@/shared/engine';
import {
  ASTRONOMICAL_UNIT,
  DRAG_CROSSOVER_CAVEAT,
  IDEAL_BEST_TRANSVERSE_CONE_ANGLE,
  LOG_SPIRAL_CAVEAT,
  dragCrossoverAltitude,
  logSpiralTransfer,
} from '@/shared/sail';
import { sheetRoles } from '@/shared/templates';
import { formatNumber, formatQuantity } from '@/shared/format/quantity';
import type { SheetSnapshot } from '../use-sheet-session';
import { AnalysisCard, AnalysisProblems, ResultFigure } from './analysis-card';
import { degrees, evaluationOf, messageOf, radians } from './sheet-values';

/** Mean orbital radius of Mars, 1.524 AU (from memory). */
export const MARS_ORBIT_AU = 1.524;

const secondsPerDay = 86_400;
const spiralConeKey = 'spiral_cone_angle';

/** The Earth-orbit altitude above which radiation pressure on the sheet's sail exceeds drag. */
export function DragCrossoverAnalysis({ snapshot }: { snapshot: SheetSnapshot }) {
  const crossover = useMemo(() => {
    const read = roleValuesSI(snapshot.sheet, evaluationOf(snapshot), ['sail_efficiency']);
    if (!read.ok) return { ok: false as const, problems: read.errors.map((error) => error.message) };
    try {
      const result = dragCrossoverAltitude({ efficiency: read.result.sail_efficiency });
      return result.ok ? { ok: true as const, result } : { ok: false as const, problems: [result.reason] };
    } catch (error) {
      return { ok: false as const, problems: [`sail_efficiency: ${messageOf(error)}`] };
    }
  }, [snapshot]);
  return (
    <AnalysisCard
      title="Drag crossover altitude"
      summary="Circular Earth orbit, sail facing the Sun: where radiation pressure 2ηP(1 AU) overtakes drag ½ρv²C_D."
      caveat={DRAG_CROSSOVER_CAVEAT}
      testID="analysis-drag-crossover"
    >
      {crossover.ok ? (
        <>
          <ResultFigure
            label="Radiation pressure exceeds drag above"
            value={formatQuantity(crossover.result.altitude / 1000, 'km')}
            testID="drag-crossover-altitude"
          />
          <AppText variant="label">
            Density {formatQuantity(crossover.result.density, 'kg/m^3', 3)}, orbital speed{' '}
            {formatQuantity(crossover.result.orbitalSpeed / 1000, 'km/s')}, pressure{' '}
            {formatQuantity(crossover.result.radiationPressure, 'N/m^2', 3)}. Density table: {crossover.result.tableSource}
          </AppText>
        </>
      ) : (
        <AnalysisProblems problems={crossover.problems} testID="drag-crossover-error" />
      )}
    </AnalysisCard>
  );
}

/** The logarithmic-spiral transfer time from Earth to Mars for the sheet's lightness number at a chosen cone angle. */
export function SpiralAnalysis({ snapshot }: { snapshot: SheetSnapshot }) {
  const [coneText, setConeText] = useState(`${formatNumber(degrees(IDEAL_BEST_TRANSVERSE_CONE_ANGLE), 4)} deg`);
  const transfer = useMemo(() => {
    const read = roleValuesSI(snapshot.sheet, evaluationOf(snapshot), ['lightness_number']);
    const cone = valueInRowUnit({ key: spiralConeKey, label: 'Cone angle', subsystem: 'Trajectory', unit: 'deg', value: 0 }, coneText);
    const problems = [...(read.ok ? [] : read.errors.map((error) => error.message)), ...(cone.ok ? [] : [cone.error.message])];
    if (!read.ok || !cone.ok) return { ok: false as const, problems };
    const beta = read.result.lightness_number;
    if (beta <= 0) {
      const key = sheetRoles(snapshot.sheet).lightness_number ?? 'lightness_number';
      return {
        ok: false as const,
        problems: [`${key}: is ${formatNumber(beta, 4)}; a spiral needs a sail that gives thrust, a lightness number above 0`],
      };
    }
    try {
      const result = logSpiralTransfer({
        lightnessNumber: beta,
        coneAngle: radians(cone.value),
        departureRadius: ASTRONOMICAL_UNIT.value,
        arrivalRadius: MARS_ORBIT_AU * ASTRONOMICAL_UNIT.value,
      });
      return result.ok ? { ok: true as const, result, beta } : { ok: false as const, problems: [result.reason] };
    } catch (error) {
      return { ok: false as const, problems: [`${spiralConeKey}: ${messageOf(error)}`] };
    }
  }, [snapshot, coneText]);
  return (
    <AnalysisCard
      title="Spiral transfer, Earth to Mars"
      summary={`Logarithmic spiral from 1 AU to ${MARS_ORBIT_AU} AU at a constant cone angle, with the sheet's lightness number (McInnes 1999, ch. 4).`}
      caveat={LOG_SPIRAL_CAVEAT}
      testID="analysis-spiral"
    >
      <TextField
        label="Cone angle (° unless a unit is typed)"
        value={coneText}
        onChangeText={setConeText}
        autoCapitalize="none"
        testID="spiral-cone-angle"
      />
      {transfer.ok ? (
        <>
          <ResultFigure
            label="Transfer time"
            value={formatQuantity(transfer.result.time / secondsPerDay, 'days')}
            testID="spiral-transfer-time"
          />
          <AppText variant="label">
            Lightness number {formatNumber(transfer.beta, 4)}, spiral angle {formatQuantity(degrees(transfer.result.spiralAngle), 'deg', 3)}
            .
          </AppText>
        </>
      ) : (
        <AnalysisProblems problems={transfer.problems} testID="spiral-error" />
      )}
    </AnalysisCard>
  );
}
