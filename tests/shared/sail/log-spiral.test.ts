import { ASTRONOMICAL_UNIT, SOLAR_GM } from '@/shared/sail/constants';
import {
  largestSpiralLightnessNumber,
  LOG_SPIRAL_CAVEAT,
  logSpiralTransfer,
  spiralLightnessNumber,
  IDEAL_BEST_TRANSVERSE_CONE_ANGLE,
} from '@/shared/sail/log-spiral';

const AU = ASTRONOMICAL_UNIT.value;
const MU = SOLAR_GM.value;
const alpha = IDEAL_BEST_TRANSVERSE_CONE_ANGLE;

function transfer(beta: number, r0 = AU, r1 = 1.524 * AU, coneAngle = alpha) {
  const result = logSpiralTransfer({
    lightnessNumber: beta,
    coneAngle,
    departureRadius: r0,
    arrivalRadius: r1,
  });
  if (!result.ok) throw new Error(result.reason);
  return result;
}

/**
 * Integrates the planar equations of motion of an ideal sail at constant cone angle (RK4) from the
 * spiral's own starting velocity and returns the time to reach r1: an independent check of the
 * closed-form time.
 */
function integratedTime(beta: number, coneAngle: number, spiralAngle: number, r0: number, r1: number): number {
  const ca = Math.cos(coneAngle);
  const sa = Math.sin(coneAngle);
  // McInnes 1999, ch. 4: on the spiral v^2 r = 2 β μ cos^2 α sin α / (sin γ cos γ)
  const v = Math.sqrt((2 * beta * MU * ca * ca * sa) / (Math.sin(spiralAngle) * Math.cos(spiralAngle) * r0));
  type State = readonly [number, number, number];
  const add = (a: State, b: State, h: number): State => [a[0] + h * b[0], a[1] + h * b[1], a[2] + h * b[2]];
  const derivative = ([r, rDot, thetaDot]: State): State => [
    rDot,
    r * thetaDot * thetaDot - MU / (r * r) + (beta * MU * ca * ca * ca) / (r * r),
    ((beta * MU * ca * ca * sa) / (r * r) - 2 * rDot * thetaDot) / r,
  ];
  let state: State = [r0, v * Math.sin(spiralAngle), (v * Math.cos(spiralAngle)) / r0];
  const dt = 2000;
  let t = 0;
  for (;;) {
    const k1 = derivative(state);
    const k2 = derivative(add(state, k1, dt / 2));
    const k3 = derivative(add(state, k2, dt / 2));
    const k4 = derivative(add(state, k3, dt));
    const slope = add(add(add(k1, k2, 2), k3, 2), k4, 1);
    const next = add(state, slope, dt / 6);
    if (next[0] >= r1) return t + (dt * (r1 - state[0])) / (next[0] - state[0]);
    state = next;
    t += dt;
  }
}

describe('spiralLightnessNumber', () => {
  it('peaks at tan γ = √2 for every cone angle', () => {
    // McInnes 1999, ch. 4 relation: dβ/dγ = 0 where tan γ = √2, whatever the cone angle
    for (const cone of [0.1, 0.6, 1.2]) {
      const peak = largestSpiralLightnessNumber(cone);
      expect(spiralLightnessNumber(Math.atan(Math.SQRT2) - 1e-3, cone)).toBeLessThan(peak);
      expect(spiralLightnessNumber(Math.atan(Math.SQRT2) + 1e-3, cone)).toBeLessThan(peak);
    }
  });

  it('names an out-of-range angle', () => {
    expect(() => spiralLightnessNumber(0.1, 0)).toThrow(/spiralLightnessNumber: coneAngle must be in \(0, 1.57/);
    expect(() => spiralLightnessNumber(-0.1, 0.5)).toThrow(/spiralLightnessNumber: spiralAngle must be in \[0/);
  });
});

describe('logSpiralTransfer', () => {
  it('solves a spiral angle that satisfies the spiral relation', () => {
    // McInnes 1999, ch. 4: β = sin γ cos γ / [cos^3 α sin γ cos γ + cos^2 α sin α (2 − sin^2 γ)]
    const result = transfer(0.17);
    expect(spiralLightnessNumber(result.spiralAngle, alpha)).toBeCloseTo(0.17, 10);
    expect(result.direction).toBe('outward');
    expect(result.caveat).toBe(LOG_SPIRAL_CAVEAT);
    expect(result.caveat).toMatch(/First-order estimate/);
  });

  it('matches an integration of the equations of motion from the spiral start', () => {
    // Newtonian two-body motion plus the ideal sail acceleration β μ cos^2 α / r^2 (McInnes 1999, ch. 2)
    const result = transfer(0.17);
    const integrated = integratedTime(0.17, alpha, result.spiralAngle, AU, 1.524 * AU);
    expect(integrated / result.time).toBeCloseTo(1, 4);
  });

  it('tends to Δ(r^(3/2)) / (3 β cos^2 α sin α √μ) for a small lightness number', () => {
    // small-γ limit of McInnes 1999, ch. 4: tan γ ≈ γ ≈ 2 β cos^2 α sin α
    const beta = 1e-4;
    const ca = Math.cos(alpha);
    const limit = (Math.pow(1.524 * AU, 1.5) - Math.pow(AU, 1.5)) / (3 * beta * ca * ca * Math.sin(alpha) * Math.sqrt(MU));
    expect(transfer(beta).time / limit).toBeCloseTo(1, 3);
  });

  it('is shorter for a lighter sail and zero for equal radii', () => {
    expect(transfer(0.3).time).toBeLessThan(transfer(0.1).time);
    expect(transfer(0.1, AU, AU).time).toBe(0);
  });

  it('takes the same time inward as outward between the same radii', () => {
    const inward = transfer(0.1, 1.524 * AU, AU);
    expect(inward.direction).toBe('inward');
    expect(inward.time).toBeCloseTo(transfer(0.1).time, 3);
  });

  it('reaches tan γ = √2 at the largest lightness number and refuses more', () => {
    const betaMax = largestSpiralLightnessNumber(alpha);
    expect(Math.tan(transfer(betaMax).spiralAngle)).toBeCloseTo(Math.SQRT2, 9);
    const result = logSpiralTransfer({
      lightnessNumber: betaMax * 1.01,
      coneAngle: alpha,
      departureRadius: AU,
      arrivalRadius: 2 * AU,
    });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.reason).toMatch(/the largest for which a logarithmic spiral exists at cone angle 35.26°/);
    expect(result.caveat).toBe(LOG_SPIRAL_CAVEAT);
  });

  it('throws a RangeError naming a negative distance or an impossible cone angle', () => {
    const input = { lightnessNumber: 0.1, coneAngle: alpha, departureRadius: AU, arrivalRadius: 2 * AU };
    expect(() => logSpiralTransfer({ ...input, departureRadius: -AU })).toThrow(
      /logSpiralTransfer: departureRadius must be greater than 0/,
    );
    expect(() => logSpiralTransfer({ ...input, lightnessNumber: 0 })).toThrow(/logSpiralTransfer: lightnessNumber/);
    expect(() => logSpiralTransfer({ ...input, coneAngle: Math.PI / 2 })).toThrow(/logSpiralTransfer: coneAngle must be in \(0/);
  });
});

describe('IDEAL_BEST_TRANSVERSE_CONE_ANGLE', () => {
  it('is 35.26 deg, tan(alpha) = 1/sqrt(2)', () => {
    // McInnes 1999 ch. 2: the ideal sail's force across the sun line is largest at tan(alpha) = 1/sqrt(2), 35.26 deg.
    expect((IDEAL_BEST_TRANSVERSE_CONE_ANGLE * 180) / Math.PI).toBeCloseTo(35.26, 2);
    expect(Math.tan(IDEAL_BEST_TRANSVERSE_CONE_ANGLE)).toBeCloseTo(Math.SQRT1_2, 15);
  });
});
