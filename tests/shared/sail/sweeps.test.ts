import { ASTRONOMICAL_UNIT } from '@/shared/sail/constants';
import { linspace } from '@/shared/sail/numeric';
import { REFERENCE_SAIL_OPTICS } from '@/shared/sail/optics';
import { idealSailForce, sailForce, type SailForceModel } from '@/shared/sail/sail-force';
import {
  bestTransverseConeAngle,
  IDEAL_BEST_TRANSVERSE_CONE_ANGLE,
  performanceVersusConeAngle,
  performanceVersusDistance,
} from '@/shared/sail/sweeps';

const AU = ASTRONOMICAL_UNIT.value;
const ideal: SailForceModel = { kind: 'ideal', efficiency: 1 };
const optical: SailForceModel = { kind: 'optical', optics: REFERENCE_SAIL_OPTICS };
const toDegrees = (rad: number): number => (rad * 180) / Math.PI;

describe('performanceVersusConeAngle', () => {
  it('gives force and acceleration at each cone angle in order', () => {
    const angles = linspace(0, Math.PI / 2, 7);
    const series = performanceVersusConeAngle({ model: ideal, area: 640_000, mass: 200 }, AU, angles);
    expect(series.map((p) => p.coneAngle)).toEqual(angles);
    const first = series[0];
    // common practice check: an 800 m square sail facing the sun at 1 AU, ideal 5.8 N
    expect(first?.magnitude).toBeCloseTo(5.8, 1);
    expect(first?.acceleration).toBeCloseTo(idealSailForce(640_000, 0, AU) / 200, 15);
    expect(series[6]?.magnitude).toBeCloseTo(0, 12);
  });

  it('refuses a mass of zero', () => {
    expect(() => performanceVersusConeAngle({ model: ideal, area: 1, mass: 0 }, AU, [0])).toThrow(
      /performanceVersusConeAngle: mass must be greater than 0/,
    );
  });
});

describe('performanceVersusDistance', () => {
  it('follows the inverse square of distance', () => {
    // McInnes 1999, ch. 2: P(r) ∝ 1 / r^2
    const series = performanceVersusDistance({ model: optical, area: 100, mass: 1 }, 0.3, [
      AU,
      2 * AU,
      4 * AU,
    ]);
    const [near, mid, far] = series;
    expect((mid?.acceleration ?? 0) / (near?.acceleration ?? 1)).toBeCloseTo(0.25, 12);
    expect((far?.circumferentialAcceleration ?? 0) / (near?.circumferentialAcceleration ?? 1)).toBeCloseTo(
      1 / 16,
      12,
    );
    expect(near?.radialAcceleration).toBeCloseTo(sailForce(optical, 100, 0.3, AU).radial, 15);
  });

  it('names a bad distance', () => {
    expect(() => performanceVersusDistance({ model: ideal, area: 1, mass: 1 }, 0, [AU, -AU])).toThrow(
      /radiationPressure: distance must be greater than 0/,
    );
  });
});

describe('bestTransverseConeAngle', () => {
  it('is 35.26° (tan α = 1/√2) for the ideal sail', () => {
    // McInnes 1999, ch. 4: the transverse force of an ideal sail is largest at tan α = 1/√2, α ≈ 35.26°
    expect(toDegrees(IDEAL_BEST_TRANSVERSE_CONE_ANGLE)).toBeCloseTo(35.26, 2);
    expect(bestTransverseConeAngle(ideal)).toBeCloseTo(IDEAL_BEST_TRANSVERSE_CONE_ANGLE, 8);
  });

  it('is found numerically for the optical model, near the ideal optimum', () => {
    const best = bestTransverseConeAngle(optical);
    const transverse = (a: number): number => sailForce(optical, 1, a, AU).circumferential;
    expect(transverse(best)).toBeGreaterThan(transverse(best - 1e-3));
    expect(transverse(best)).toBeGreaterThan(transverse(best + 1e-3));
    expect(Math.abs(toDegrees(best) - 35.26)).toBeLessThan(1);
  });

  it('refuses an ideal sail of zero efficiency', () => {
    expect(() => bestTransverseConeAngle({ kind: 'ideal', efficiency: 0 })).toThrow(
      /efficiency must be greater than 0/,
    );
  });
});
