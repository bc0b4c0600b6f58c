import { ASTRONOMICAL_UNIT } from '@/shared/sail/constants';
import { materialProperty } from '@/shared/sail/materials';
import { REFERENCE_SAIL_OPTICS } from '@/shared/sail/optics';
import { closestSafeDistance, sailTemperature, temperatureVersusDistance } from '@/shared/sail/temperature';

const AU = ASTRONOMICAL_UNIT.value;

describe('sailTemperature', () => {
  it('is about 263 K at 1 AU facing the sun with the tabulated coefficients', () => {
    // McInnes 1999, ch. 2 (coefficients after Wright 1992, from memory): about 263 K at 1 AU, α = 0
    expect(sailTemperature(AU, 0, REFERENCE_SAIL_OPTICS)).toBeCloseTo(263, 0);
  });

  it('scales as r^(-1/2) and cos^(1/4) α', () => {
    // McInnes 1999, ch. 2: T ∝ (cos α / r^2)^(1/4)
    const t1 = sailTemperature(AU, 0, REFERENCE_SAIL_OPTICS);
    expect(sailTemperature(0.25 * AU, 0, REFERENCE_SAIL_OPTICS)).toBeCloseTo(2 * t1, 9);
    expect(sailTemperature(AU, Math.PI / 3, REFERENCE_SAIL_OPTICS)).toBeCloseTo(t1 * Math.pow(0.5, 0.25), 9);
  });

  it('refuses an edge-on or back-lit sail and a bad distance', () => {
    expect(() => sailTemperature(AU, Math.PI / 2, REFERENCE_SAIL_OPTICS)).toThrow(
      /sailTemperature: coneAngle must be in \(-1.57\d+, 1.57\d+\) rad, got 1.57/,
    );
    expect(() => sailTemperature(-AU, 0, REFERENCE_SAIL_OPTICS)).toThrow(/distance must be greater than 0/);
  });
});

describe('temperatureVersusDistance', () => {
  it('gives one point per distance in order', () => {
    const series = temperatureVersusDistance([AU, 0.5 * AU], 0, REFERENCE_SAIL_OPTICS);
    expect(series.map((p) => p.distance)).toEqual([AU, 0.5 * AU]);
    expect(series[1]?.temperature).toBeCloseTo(Math.SQRT2 * (series[0]?.temperature ?? 0), 9);
  });
});

describe('closestSafeDistance', () => {
  it('inverts the equilibrium temperature', () => {
    const distance = closestSafeDistance(500, 0.2, REFERENCE_SAIL_OPTICS);
    expect(sailTemperature(distance, 0.2, REFERENCE_SAIL_OPTICS)).toBeCloseTo(500, 9);
  });

  it('brings a polyimide sail closer than a PET one', () => {
    // Kapton HN and Mylar datasheets (from memory): about 400 °C and 150 °C service limits
    const polyimide = materialProperty('polyimide', 'temperatureLimit');
    const pet = materialProperty('pet', 'temperatureLimit');
    expect(polyimide?.unit).toBe('K');
    const polyimideClosest = closestSafeDistance(polyimide?.value ?? 0, 0, REFERENCE_SAIL_OPTICS);
    const petClosest = closestSafeDistance(pet?.value ?? 0, 0, REFERENCE_SAIL_OPTICS);
    expect(polyimideClosest).toBeLessThan(petClosest);
    // Radiative equilibrium with the tabulated coefficients: (263 K / 673 K)^2 AU ≈ 0.153 AU
    expect(polyimideClosest / AU).toBeCloseTo(0.153, 3);
  });

  it('names a bad limit', () => {
    expect(() => closestSafeDistance(0, 0, REFERENCE_SAIL_OPTICS)).toThrow(
      /closestSafeDistance: temperatureLimit must be greater than 0/,
    );
  });
});
