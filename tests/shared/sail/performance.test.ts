import { ASTRONOMICAL_UNIT, SOLAR_GM } from '@/shared/sail/constants';
import { REFERENCE_SAIL_OPTICS } from '@/shared/sail/optics';
import {
  characteristicAcceleration,
  characteristicAccelerationFromLightness,
  criticalSailLoading,
  lightnessNumber,
  opticalCharacteristicAcceleration,
  sailLoading,
  solarGravityAt1AU,
} from '@/shared/sail/performance';

describe('sizing figures', () => {
  it('g0 is about 5.93e-3 m/s^2', () => {
    // McInnes 1999, ch. 2: g0 = GM_sun / AU^2 ≈ 5.93e-3 m/s^2
    expect(solarGravityAt1AU()).toBeCloseTo(5.93e-3, 5);
  });

  it('critical sail loading is 1.53 g/m^2', () => {
    // McInnes 1999, ch. 2: σ* = 1.53 g/m^2
    expect(criticalSailLoading() * 1000).toBeCloseTo(1.53, 2);
  });

  it('a sail at the critical loading has lightness number 1', () => {
    // McInnes 1999, ch. 2: β = 1 at σ = σ*
    expect(lightnessNumber(characteristicAcceleration(criticalSailLoading()))).toBeCloseTo(1, 12);
    expect(lightnessNumber(characteristicAcceleration(criticalSailLoading(0.9), 0.9))).toBeCloseTo(1, 12);
  });

  it('characteristic acceleration is 2 η P(1 AU) / σ', () => {
    // McInnes 1999, ch. 2: a_c = 2 η P / σ; 9.08e-6 N/m^2 on 10 g/m^2 gives 0.908 mm/s^2
    expect(characteristicAcceleration(0.01) * 1000).toBeCloseTo(0.908, 3);
    expect(characteristicAcceleration(0.01, 0.85)).toBeCloseTo(0.85 * characteristicAcceleration(0.01), 15);
  });

  it('the optical sail reaches 0.908 of the ideal characteristic acceleration', () => {
    // McInnes 1999 after Wright 1992 (from memory): F_n(0) / (2 P A) ≈ 0.908 with the tabulated coefficients
    const ratio =
      opticalCharacteristicAcceleration(0.01, REFERENCE_SAIL_OPTICS) / characteristicAcceleration(0.01);
    expect(ratio).toBeCloseTo(0.908, 3);
    expect(() => opticalCharacteristicAcceleration(-1, REFERENCE_SAIL_OPTICS)).toThrow(
      /opticalCharacteristicAcceleration: loading/,
    );
  });

  it('a_c = β GM_sun / AU^2 inverts the lightness number', () => {
    // McInnes 1999, ch. 2: a_c = β GM_sun / r_E^2
    const au = ASTRONOMICAL_UNIT.value;
    expect(characteristicAccelerationFromLightness(0.17)).toBeCloseTo(
      (0.17 * SOLAR_GM.value) / (au * au),
      15,
    );
    expect(lightnessNumber(characteristicAccelerationFromLightness(0.17))).toBeCloseTo(0.17, 12);
  });

  it('sail loading is mass over area', () => {
    // common practice: 100 kg on 10 000 m^2 is 10 g/m^2
    expect(sailLoading(100, 10_000)).toBe(0.01);
  });

  it('names bad inputs', () => {
    expect(() => sailLoading(10, 0)).toThrow(/sailLoading: area must be greater than 0, got 0/);
    expect(() => sailLoading(-1, 10)).toThrow(/sailLoading: mass must not be negative/);
    expect(() => characteristicAcceleration(0)).toThrow(/characteristicAcceleration: loading/);
    expect(() => lightnessNumber(Number.NaN)).toThrow(
      /lightnessNumber: acceleration must be a finite number, got NaN/,
    );
    expect(() => criticalSailLoading(0)).toThrow(/criticalSailLoading: efficiency must be in \(0, 1\]/);
  });
});
