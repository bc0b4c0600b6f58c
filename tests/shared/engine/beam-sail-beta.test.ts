import { compileSheet, evaluateSheet, sweep } from '@/shared/engine';
import type { Sheet } from '@/shared/schemas/sheet';
import { beamSailBeta } from '@/shared/sail/beam-sail';
import { SPEED_OF_LIGHT } from '@/shared/sail/constants';

const c = SPEED_OF_LIGHT.value;

function sheetWith(formula: string, accelerationUnit = 'm/s^2'): Sheet {
  return {
    name: 'Beam',
    parameters: [
      { key: 'rest_acceleration', label: 'a0', subsystem: 'Beam', unit: accelerationUnit, value: 6.67e5 },
      { key: 'distance', label: 'L', subsystem: 'Beam', unit: 'm', value: 1.88e9 },
      { key: 'reflectivity', label: 'R', subsystem: 'Beam', unit: '', value: 1 },
      { key: 'speed', label: 'beta', subsystem: 'Beam', unit: '', formula },
    ],
  };
}

describe('BEAM_SAIL_BETA', () => {
  // Low-speed limit: the Doppler factor tends to 1 and the speed to sqrt(2 a0 L) / c (kinematics).
  it('meets sqrt(2 a L) / c for a slow sail', () => {
    expect(beamSailBeta(1, 1e6, 1) / (Math.sqrt(2 * 1e6) / c)).toBeCloseTo(1, 4);
  });

  // For R = 1 the equation of motion d(gamma beta)/dt = (a0/c)(1 - beta)/(1 + beta) has a closed-form distance:
  // with the Doppler factor t = sqrt((1 + beta)/(1 - beta)), dx = (c^2/a0) (t^2 - 1)/2 dt, so
  // x(beta) = (c^2/a0) (t^3/6 - t/2 + 1/3) (derived here; the template test checks it by time integration).
  it('inverts the closed-form distance of a perfect reflector', () => {
    for (const beta of [0.01, 0.15, 0.5, 0.9]) {
      const a0 = 1e5;
      const t = Math.sqrt((1 + beta) / (1 - beta));
      const x = ((c * c) / a0) * (t ** 3 / 6 - t / 2 + 1 / 3);
      expect(beamSailBeta(a0, x, 1)).toBeCloseTo(beta, 8);
    }
  });

  it('is 0 at the start, never reaches c, and NaN outside its domain', () => {
    expect(beamSailBeta(1e5, 0, 1)).toBe(0);
    expect(beamSailBeta(1e9, 1e15, 1)).toBeLessThan(1);
    expect(beamSailBeta(-1, 1, 1)).toBeNaN();
    expect(beamSailBeta(1, -1, 1)).toBeNaN();
    expect(beamSailBeta(1, 1, 1.5)).toBeNaN();
  });

  it('evaluates in a sheet, live and compiled alike', () => {
    const sheet = sheetWith('=BEAM_SAIL_BETA(rest_acceleration, distance, reflectivity)');
    const live = evaluateSheet(sheet);
    expect(live.errors).toEqual([]);
    const expected = beamSailBeta(6.67e5, 1.88e9, 1);
    expect(live.values.speed?.value).toBeCloseTo(expected, 12);
    const swept = sweep(sheet, { key: 'distance', from: '1.88e9 m', to: '1.88e9 m', steps: 2 }, ['speed']);
    expect(swept.ok && swept.result.outputs[0]?.values[0]).toBeCloseTo(expected, 12);
    expect(compileSheet(sheet)).toBeDefined();
  });

  it('refuses arguments of the wrong dimension, naming the argument', () => {
    const { errors } = evaluateSheet(sheetWith('=BEAM_SAIL_BETA(rest_acceleration, distance, reflectivity)', 'm/s'));
    expect(errors).toEqual([
      expect.objectContaining({ key: 'speed', message: expect.stringContaining('BEAM_SAIL_BETA needs argument 1') }),
    ]);
  });
});
